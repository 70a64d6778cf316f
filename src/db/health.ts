import { sql } from 'drizzle-orm';
import { getDb, type Database } from './client';

export type DatabaseHealth = { ok: true; latencyMs: number } | { ok: false; reason: string };

/** One round trip, bounded so a hung database answers "unavailable" instead of hanging the check. */
export async function checkDatabase(db: Database = getDb(), timeoutMs = 2_000): Promise<DatabaseHealth> {
  const started = performance.now();
  try {
    const probe = db.execute(sql`select 1`);
    const timeout = new Promise<never>((_, reject) =>
      setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs).unref(),
    );
    await Promise.race([probe, timeout]);
    return { ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch (error) {
    const reason = error instanceof Error ? error.message || error.name : String(error);
    return { ok: false, reason: `The database did not answer: ${reason}` };
  }
}
