/**
 * The one database handle of a server process. Queries take it (or a transaction) as an
 * argument; nothing else opens connections.
 */
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
/** A database handle or an open transaction: queries accept either. */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

let pool: pg.Pool | undefined;
let database: Database | undefined;

function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set; start the app with `npm start`, which sets it.');
  return url;
}

/**
 * A connection that breaks (PostgreSQL restarted, a backend killed) emits 'error' on its
 * client, and on the pool while it is idle. Unheard, either event ends the process; heard,
 * the broken connection is dropped and the next query opens a fresh one.
 */
function listenForBrokenConnections(created: pg.Pool): pg.Pool {
  created.on('error', (error) => console.error(`[db] idle connection lost: ${error.message}`));
  created.on('connect', (client) => {
    client.on('error', (error) => console.error(`[db] connection lost: ${error.message}`));
  });
  return created;
}

export function getPool(): pg.Pool {
  pool ??= listenForBrokenConnections(
    new pg.Pool({
      connectionString: databaseUrl(),
      max: Number(process.env.DATABASE_POOL_SIZE ?? 10),
      connectionTimeoutMillis: 5_000,
      idleTimeoutMillis: 30_000,
    }),
  );
  return pool;
}

export function getDb(): Database {
  database ??= drizzle(getPool(), { schema });
  return database;
}

export async function closeDb(): Promise<void> {
  await pool?.end();
  pool = undefined;
  database = undefined;
}
