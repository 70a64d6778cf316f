import { execFileSync } from 'node:child_process';
import { cpSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { jobNames, queuePolicies, STALE_CHECK_CRON } from '../../src/lib/jobs/names';
import { stack } from '../support/stack';

describe('migrations', () => {
  const scratch = mkdtempSync(path.join(tmpdir(), 'lagwise-drizzle-'));
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('match the schema module: regenerating from it writes nothing new', () => {
    cpSync('drizzle', scratch, { recursive: true });
    const before = readdirSync(scratch).sort();
    execFileSync(
      'node_modules/.bin/drizzle-kit',
      ['generate', '--dialect', 'postgresql', '--schema', './src/db/schema.ts', '--out', scratch, '--name', 'drift'],
      { encoding: 'utf8', stdio: 'pipe' },
    );
    expect(readdirSync(scratch).sort()).toEqual(before);
  });

  it('have been applied to the test database', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      const { rows } = await client.query<{ table_name: string }>(
        "select table_name from information_schema.tables where table_schema = 'public' order by table_name",
      );
      expect(rows.map((r) => r.table_name)).toEqual(
        expect.arrayContaining(['regions', 'region_postal_prefixes', 'assessments', 'pipe_runs', 'activity_log', 'user', 'session']),
      );
      const queues = await client.query<{ name: string }>('select name from pgboss.queue order by name');
      // pg-boss keeps queues of its own (__pgboss__…) for its cron; ours are the ones names.ts declares.
      expect(queues.rows.map((r) => r.name).filter((name) => !name.startsWith('__pgboss__'))).toEqual(Object.keys(queuePolicies(1)).sort());
      // The worker schedules the hourly check of stale leads when it starts.
      const schedules = await client.query<{ name: string; cron: string }>('select name, cron from pgboss.schedule');
      expect(schedules.rows).toContainEqual({ name: jobNames.checkStaleLeads, cron: STALE_CHECK_CRON });
    } finally {
      await client.end();
    }
  });
});
