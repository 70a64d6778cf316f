/**
 * The daily retention sweep: removes or anonymizes what the privacy page says goes, by the
 * periods in ./policy.ts. Stored files are deleted before the rows that name them, so a failed
 * sweep leaves at worst a row whose file is gone (and the next sweep finishes it), never a file
 * nobody can find to delete.
 */
import type { Database } from '../../db/client';
import {
  anonymiseAssessments,
  deleteAssessments,
  deleteExpiredLinksAndSessions,
  deleteOwnersWithoutAssessments,
  findInactiveNamed,
  findOldJunk,
} from '../../db/queries/retention';
import { deleteObjects } from '../storage/objects';
import { REMOVED, RETENTION } from './policy';

/** What one sweep did, for the worker's log and the tests. */
export interface SweepOutcome {
  junkDeleted: number;
  assessmentsAnonymised: number;
  filesDeleted: number;
  ownerAccountsDeleted: number;
  expiredLinksAndSessionsDeleted: number;
}

const DAY_MS = 24 * 3600 * 1000;

/** `months` calendar months before `now`. */
export function monthsBefore(now: Date, months: number): Date {
  const date = new Date(now);
  date.setUTCMonth(date.getUTCMonth() - months);
  return date;
}

export async function sweepRetention(db: Database, now: Date = new Date()): Promise<SweepOutcome> {
  const junk = await findOldJunk(db, new Date(now.getTime() - RETENTION.junkDays * DAY_MS));
  const inactive = await findInactiveNamed(db, monthsBefore(now, RETENTION.inactiveMonths), REMOVED);
  const files = [...junk, ...inactive].flatMap((a) => a.objectKeys);
  await deleteObjects(files);
  return db.transaction(async (tx) => {
    const junkDeleted = await deleteAssessments(tx, junk.map((a) => a.id));
    const assessmentsAnonymised = await anonymiseAssessments(tx, inactive.map((a) => a.id), REMOVED);
    const ownerAccountsDeleted = await deleteOwnersWithoutAssessments(tx);
    const expiredLinksAndSessionsDeleted = await deleteExpiredLinksAndSessions(tx, now);
    return { junkDeleted, assessmentsAnonymised, filesDeleted: files.length, ownerAccountsDeleted, expiredLinksAndSessionsDeleted };
  });
}
