import { inArray, lt, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { signInThrottles } from '../schema';

export interface ThrottleState {
  key: string;
  failures: number;
  lockedUntil: Date | null;
}

/** The current state of each key (keys never seen are absent). */
export async function readThrottles(db: Executor, keys: string[]): Promise<ThrottleState[]> {
  if (keys.length === 0) return [];
  return db
    .select({ key: signInThrottles.key, failures: signInThrottles.failures, lockedUntil: signInThrottles.lockedUntil })
    .from(signInThrottles)
    .where(inArray(signInThrottles.key, keys));
}

/**
 * Counts one more wrong password against `key` and locks it for `lockSeconds(failures)` from now.
 * A row whose last failure is older than `forgetAfterSeconds` starts again from one. One upsert,
 * so every server counts together.
 */
export async function recordFailure(
  db: Executor,
  key: string,
  lockSeconds: (failures: number) => number,
  forgetAfterSeconds: number,
  now = new Date(),
): Promise<ThrottleState> {
  const [row] = await db
    .insert(signInThrottles)
    .values({ key, failures: 1, lastFailureAt: now })
    .onConflictDoUpdate({
      target: signInThrottles.key,
      set: {
        failures: sql`case when ${signInThrottles.lastFailureAt} < ${new Date(now.getTime() - forgetAfterSeconds * 1000)} then 1 else ${signInThrottles.failures} + 1 end`,
        lastFailureAt: now,
      },
    })
    .returning({ key: signInThrottles.key, failures: signInThrottles.failures });
  const failures = row?.failures ?? 1;
  const seconds = lockSeconds(failures);
  const lockedUntil = seconds > 0 ? new Date(now.getTime() + seconds * 1000) : null;
  await db.update(signInThrottles).set({ lockedUntil }).where(sql`${signInThrottles.key} = ${key}`);
  return { key, failures, lockedUntil };
}

/** A right password clears the account's count (not the client's: one success does not excuse a spray). */
export async function clearThrottle(db: Executor, key: string): Promise<void> {
  await db.delete(signInThrottles).where(sql`${signInThrottles.key} = ${key}`);
}

/** Rows with nothing left to say; the worker's housekeeping calls this. */
export async function pruneThrottles(db: Executor, olderThan: Date): Promise<void> {
  await db.delete(signInThrottles).where(lt(signInThrottles.lastFailureAt, olderThan));
}
