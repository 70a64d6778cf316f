import { inArray, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { appSettings } from '../schema';

/** The stored value of each key asked for (keys never set are absent). */
export async function readSettingValues(db: Executor, keys: readonly string[]): Promise<Map<string, unknown>> {
  if (keys.length === 0) return new Map();
  const rows = await db.select({ key: appSettings.key, value: appSettings.value }).from(appSettings).where(inArray(appSettings.key, [...keys]));
  return new Map(rows.map((r) => [r.key, r.value]));
}

export async function writeSettingValue(db: Executor, key: string, value: unknown, userId: string): Promise<void> {
  await db
    .insert(appSettings)
    .values({ key, value, updatedByUserId: userId })
    .onConflictDoUpdate({ target: appSettings.key, set: { value: sql`excluded.value`, updatedByUserId: userId, updatedAt: sql`now()` } });
}
