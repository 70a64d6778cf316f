/**
 * A transaction on one pooled connection that both Drizzle and raw-SQL libraries (pg-boss)
 * can write through, so a row and the job it triggers commit together or not at all.
 */
import { drizzle } from 'drizzle-orm/node-postgres';
import { getPool, type Database } from './client';
import { isDatabaseUnavailable } from './errors';
import * as schema from './schema';

/** pg-boss's `db` option: runs its SQL inside our transaction. */
export interface SqlRunner {
  executeSql(text: string, values: unknown[]): Promise<{ rows: any[] }>;
}

export async function inTransaction<T>(work: (tx: Database, sqlRunner: SqlRunner) => Promise<T>): Promise<T> {
  const client = await getPool().connect();
  let broken: Error | undefined;
  try {
    await client.query('BEGIN');
    const tx = drizzle(client, { schema });
    const result = await work(tx, { executeSql: (text, values) => client.query(text, values) });
    await client.query('COMMIT');
    return result;
  } catch (error) {
    // A connection that broke mid-transaction is dropped rather than handed to the next caller.
    if (isDatabaseUnavailable(error)) broken = error instanceof Error ? error : new Error(String(error));
    else await client.query('ROLLBACK').catch(() => {});
    throw error;
  } finally {
    client.release(broken);
  }
}
