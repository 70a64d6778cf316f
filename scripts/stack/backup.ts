/**
 * Backups of a Lagwise database with PostgreSQL's own tools: pg_dump's custom format (one file,
 * compressed, everything — our tables, better-auth's, pg-boss's jobs) and pg_restore into a
 * database, replacing what is there. Used by `npm run db:backup` / `npm run db:restore FILE`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { findBinDir } from './postgres.ts';
import { StackError } from './errors.ts';

function tool(name: 'pg_dump' | 'pg_restore' | 'psql'): string {
  const dir = findBinDir();
  const bin = dir ? `${dir}/${name}` : name;
  if (dir && !existsSync(bin)) throw new StackError(`${name} was not found beside PostgreSQL's other programs in ${dir}.`);
  return bin;
}

/** Connection settings from a URL, handed to the tools by environment (so no password shows in `ps`). */
function connectionEnv(databaseUrl: string): NodeJS.ProcessEnv {
  const url = new URL(databaseUrl);
  return {
    ...process.env,
    PGHOST: url.hostname,
    PGPORT: url.port || '5432',
    PGUSER: decodeURIComponent(url.username),
    PGPASSWORD: decodeURIComponent(url.password),
    PGDATABASE: decodeURIComponent(url.pathname.slice(1)),
  };
}

function runTool(bin: string, args: string[], databaseUrl: string, what: string): void {
  const result = spawnSync(bin, args, { env: connectionEnv(databaseUrl), encoding: 'utf8' });
  if (result.error) throw new StackError(`${what} could not run ${bin}: ${result.error.message}`);
  if (result.status !== 0) throw new StackError(`${what} failed:\n${(result.stderr || result.stdout).trim()}`);
}

/** Writes the whole database to `file` (custom format). */
export function backupDatabase(databaseUrl: string, file: string): void {
  runTool(tool('pg_dump'), ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`], databaseUrl, 'The backup');
}

/**
 * Empties the database: every schema of ours dropped (pg-boss's partitioned job tables defeat
 * pg_restore's own --clean), an empty public schema left for the backup to fill.
 */
const EMPTY_DATABASE = `
DO $$
DECLARE s text;
BEGIN
  FOR s IN SELECT nspname FROM pg_namespace WHERE nspname NOT LIKE 'pg\\_%' AND nspname <> 'information_schema' LOOP
    EXECUTE format('DROP SCHEMA %I CASCADE', s);
  END LOOP;
END $$;
CREATE SCHEMA public;
`;

/**
 * Replaces the database's contents with the backup's, in one transaction (all or nothing):
 * pg_restore turns the backup into SQL, psql runs it after emptying the database.
 */
export function restoreDatabase(databaseUrl: string, file: string): void {
  if (!existsSync(file)) throw new StackError(`There is no backup file at ${file}.`);
  const folder = mkdtempSync(path.join(tmpdir(), 'lagwise-restore-'));
  try {
    const script = path.join(folder, 'restore.sql');
    runTool(tool('pg_restore'), ['--no-owner', '--no-privileges', `--file=${script}`, file], databaseUrl, 'Reading the backup');
    writeFileSync(script, EMPTY_DATABASE + readFileSync(script, 'utf8'));
    runTool(tool('psql'), ['--no-psqlrc', '--quiet', '--single-transaction', '--set=ON_ERROR_STOP=1', `--file=${script}`], databaseUrl, 'The restore');
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
