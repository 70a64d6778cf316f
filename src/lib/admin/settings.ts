/**
 * The admin's settings: each key with its shape and default in one place. Stored values are
 * read through the same schema, so a value written by an older version falls back to the default.
 */
import type { z } from 'zod';
import type { Executor } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { readSettingValues, writeSettingValue } from '../../db/queries/settings';
import { inTransaction } from '../../db/transaction';
import type { SessionUser } from '../session';
import { settingShapes } from '../../schemas/admin';

/** An open lead nobody has claimed for this long needs a person (the attention list, the daily mail). */
export const DEFAULT_STALE_AFTER_HOURS = 48;


export type Settings = { [K in keyof typeof settingShapes]: z.output<(typeof settingShapes)[K]> };

export const defaultSettings: Settings = { staleAfterHours: DEFAULT_STALE_AFTER_HOURS };

const keys = Object.keys(settingShapes) as (keyof Settings)[];

export async function readSettings(db: Executor): Promise<Settings> {
  const stored = await readSettingValues(db, keys);
  const settings = { ...defaultSettings };
  for (const key of keys) {
    const parsed = settingShapes[key].safeParse(stored.get(key));
    if (parsed.success) settings[key] = parsed.data;
  }
  return settings;
}

/** Stores the given settings and logs what changed, in one transaction. */
export async function changeSettings(user: SessionUser, patch: Partial<Settings>): Promise<Settings> {
  return inTransaction(async (tx) => {
    const before = await readSettings(tx);
    for (const key of keys) {
      const value = patch[key];
      if (value === undefined || value === before[key]) continue;
      await writeSettingValue(tx, key, value, user.id);
      await recordActivity(tx, { actorUserId: user.id, action: 'settings.changed', detail: { key, from: before[key], to: value } });
    }
    return readSettings(tx);
  });
}
