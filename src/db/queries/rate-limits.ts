import { sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { rateLimitWindows } from '../schema';

/**
 * Counts one hit against `key` in the current fixed window and says whether it is within
 * `limit`. One upsert, so concurrent servers count together.
 */
export async function hitRateLimit(
  db: Executor,
  key: string,
  { limit, windowSeconds, now = new Date() }: { limit: number; windowSeconds: number; now?: Date },
): Promise<{ allowed: boolean; hits: number; retryAfterSeconds: number }> {
  const windowMs = windowSeconds * 1000;
  const windowStart = new Date(Math.floor(now.getTime() / windowMs) * windowMs);
  const [row] = await db
    .insert(rateLimitWindows)
    .values({ key, windowStart, hits: 1 })
    .onConflictDoUpdate({
      target: [rateLimitWindows.key, rateLimitWindows.windowStart],
      set: { hits: sql`${rateLimitWindows.hits} + 1` },
    })
    .returning({ hits: rateLimitWindows.hits });
  const hits = row?.hits ?? 1;
  const retryAfterSeconds = Math.ceil((windowStart.getTime() + windowMs - now.getTime()) / 1000);
  return { allowed: hits <= limit, hits, retryAfterSeconds };
}

/** Old windows are worthless; the worker's housekeeping calls this. */
export async function pruneRateLimits(db: Executor, olderThan: Date): Promise<void> {
  await db.delete(rateLimitWindows).where(sql`${rateLimitWindows.windowStart} < ${olderThan}`);
}
