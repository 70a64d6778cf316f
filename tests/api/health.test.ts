import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { checkDatabase } from '../../src/db/health';
import packageJson from '../../package.json';
import { appFetch } from '../support/stack';

describe('GET /api/health', () => {
  it('answers 200 with the version when the database is up', async () => {
    const response = await appFetch('/api/health');
    expect(response.status).toBe(200);
    const body = (await response.json()) as { status: string; version: string; database: { ok: boolean } };
    expect(body).toMatchObject({ status: 'ok', version: packageJson.version, database: { ok: true } });
  });

  it('reports the database as unavailable, with a reason, when it does not answer', async () => {
    // A port nothing listens on: the same code path the endpoint takes when PostgreSQL is down.
    const pool = new pg.Pool({ connectionString: 'postgres://nobody:x@127.0.0.1:9/none', connectionTimeoutMillis: 1_000 });
    try {
      const health = await checkDatabase(drizzle(pool));
      expect(health.ok).toBe(false);
      if (!health.ok) expect(health.reason).toMatch(/^The database did not answer: /);
    } finally {
      await pool.end();
    }
  });
});
