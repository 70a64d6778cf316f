import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { backupDatabase, restoreDatabase } from '../../scripts/stack/backup';
import { stack } from '../support/stack';

const tables = ['"user"', 'assessments', 'pipe_runs', 'regions', 'region_postal_prefixes', 'activity_log', 'pgboss.job'];

async function counts(url: string): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const result: Record<string, number> = {};
    for (const table of tables) result[table] = Number((await client.query(`select count(*) as n from ${table}`)).rows[0].n);
    return result;
  } finally {
    await client.end();
  }
}

describe('npm run db:backup / db:restore', () => {
  const folder = mkdtempSync(path.join(tmpdir(), 'lagwise-backup-'));
  const copyName = `lagwise_restore_${process.pid}`;
  const copyUrl = stack.databaseUrl.replace(/\/[^/]+$/, `/${copyName}`);
  const admin = () => new pg.Client({ connectionString: stack.databaseUrl.replace(/\/[^/]+$/, '/postgres') });

  afterAll(async () => {
    const client = admin();
    await client.connect();
    await client.query(`drop database if exists ${copyName} with (force)`);
    await client.end();
    rmSync(folder, { recursive: true, force: true });
  });

  it('round-trips the whole database: a restored copy holds the same rows, jobs included', async () => {
    const file = path.join(folder, 'lagwise.dump');
    const before = await counts(stack.databaseUrl);
    backupDatabase(stack.databaseUrl, file);
    expect(statSync(file).size).toBeGreaterThan(1000);
    const client = admin();
    await client.connect();
    await client.query(`drop database if exists ${copyName} with (force)`);
    await client.query(`create database ${copyName}`);
    await client.end();
    restoreDatabase(copyUrl, file);
    const after = await counts(copyUrl);
    // Other tests add rows meanwhile; the copy holds at least what was there before the dump.
    for (const table of tables) expect(after[table], table).toBeGreaterThanOrEqual(before[table]!);
    expect(after['"user"']).toBeGreaterThan(0);
    // Restoring again over the copy replaces it rather than doubling it.
    restoreDatabase(copyUrl, file);
    expect(await counts(copyUrl)).toEqual(after);
  });

  it('says so plainly when the file is missing', () => {
    expect(() => restoreDatabase(copyUrl, path.join(folder, 'nope.dump'))).toThrow(/There is no backup file at/);
  });
});
