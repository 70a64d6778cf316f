/**
 * Named queries over site-walk revisions. Each takes a database or transaction handle first;
 * who may read or save a revision is decided by src/lib/revisions, never here.
 */
import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { assessments, consultantProfiles, leadRevisions, pipeRuns, user, type AssessmentStatus, type NewAssessment } from '../schema';

/** A stored revision with its author's name and firm. */
export type RevisionRow = Awaited<ReturnType<typeof listRevisions>>[number];

const revisionColumns = {
  id: leadRevisions.id,
  number: leadRevisions.number,
  baseNumber: leadRevisions.baseNumber,
  plantInput: leadRevisions.plantInput,
  resultSnapshot: leadRevisions.resultSnapshot,
  engineVersion: leadRevisions.engineVersion,
  reason: leadRevisions.reason,
  clientKey: leadRevisions.clientKey,
  createdAt: leadRevisions.createdAt,
  authorUserId: leadRevisions.authorUserId,
  authorName: user.name,
  authorFirm: consultantProfiles.firm,
};

/** Every revision of a lead, oldest first. */
export async function listRevisions(db: Executor, leadId: string) {
  return db
    .select(revisionColumns)
    .from(leadRevisions)
    .leftJoin(user, eq(user.id, leadRevisions.authorUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, leadRevisions.authorUserId))
    .where(eq(leadRevisions.assessmentId, leadId))
    .orderBy(asc(leadRevisions.number));
}

/** One revision of a lead by its number, or null. */
export async function findRevision(db: Executor, leadId: string, number: number): Promise<RevisionRow | null> {
  const [row] = await db
    .select(revisionColumns)
    .from(leadRevisions)
    .leftJoin(user, eq(user.id, leadRevisions.authorUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, leadRevisions.authorUserId))
    .where(and(eq(leadRevisions.assessmentId, leadId), eq(leadRevisions.number, number)));
  return row ?? null;
}

/** The revision a device's save already made (same client key), or null. */
export async function findRevisionByClientKey(db: Executor, leadId: string, clientKey: string): Promise<RevisionRow | null> {
  const [row] = await db
    .select(revisionColumns)
    .from(leadRevisions)
    .leftJoin(user, eq(user.id, leadRevisions.authorUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, leadRevisions.authorUserId))
    .where(and(eq(leadRevisions.assessmentId, leadId), eq(leadRevisions.clientKey, clientKey)));
  return row ?? null;
}

/** The owner's runs as the engine takes them, in their order. */
export async function listRunSpecs(db: Executor, leadId: string): Promise<unknown[]> {
  const rows = await db.select({ spec: pipeRuns.spec }).from(pipeRuns).where(eq(pipeRuns.assessmentId, leadId)).orderBy(asc(pipeRuns.position));
  return rows.map((r) => r.spec);
}

export type HeadlineUpdate = Pick<
  NewAssessment,
  'currency' | 'annualLossCost' | 'annualLossCostLow' | 'annualLossCostHigh' | 'annualSavingCost' | 'runCount' | 'hazardRunCount' | 'services'
>;

/**
 * Moves a lead's latest revision number from `baseNumber` to the next and its headline figures
 * to the new revision's — only if the lead is still at `baseNumber`, at one of `stages`, and
 * (when `holderUserId` is given) held by them. No row back means one of those no longer holds:
 * another save landed first, or the lead moved on.
 */
export async function advanceRevision(
  db: Executor,
  leadId: string,
  baseNumber: number,
  stages: readonly AssessmentStatus[],
  holderUserId: string | null,
  headline: HeadlineUpdate,
) {
  const [row] = await db
    .update(assessments)
    .set({ ...headline, revisionNumber: sql`${assessments.revisionNumber} + 1` })
    .where(
      and(
        eq(assessments.id, leadId),
        eq(assessments.revisionNumber, baseNumber),
        inArray(assessments.status, [...stages]),
        holderUserId ? eq(assessments.claimedByUserId, holderUserId) : undefined,
      ),
    )
    .returning({ revisionNumber: assessments.revisionNumber });
  return row ?? null;
}

export interface NewRevision {
  assessmentId: string;
  number: number;
  baseNumber: number;
  plantInput: unknown;
  resultSnapshot: unknown;
  engineVersion: string;
  authorUserId: string;
  reason: string;
  clientKey: string | null;
}

/** Stores a revision; call inside the transaction that advanced the lead's number. */
export async function insertRevision(db: Executor, revision: NewRevision): Promise<{ id: string; createdAt: Date }> {
  const [row] = await db.insert(leadRevisions).values(revision).returning({ id: leadRevisions.id, createdAt: leadRevisions.createdAt });
  if (!row) throw new Error('the revision was not stored');
  return row;
}
