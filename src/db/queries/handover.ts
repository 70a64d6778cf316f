/**
 * The admin's changes to who holds a lead: each one conditional UPDATE that applies only if the
 * lead is still as the admin saw it, so a claim or move made meanwhile is never overwritten.
 */
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { activityLog, assessments, type AssessmentStatus } from '../schema';
import { assessmentStatuses } from '../statuses';

/** Hands a lead to a consultant: a lead nobody holds becomes `claimed`; a held one keeps its stage. */
export async function handLead(
  db: Executor,
  leadId: string,
  expected: { status: AssessmentStatus; holderUserId: string | null },
  toUserId: string,
) {
  const status: AssessmentStatus = expected.status === 'fresh' || expected.status === 'unrouted' ? 'claimed' : expected.status;
  const [row] = await db
    .update(assessments)
    .set({ status, claimedByUserId: toUserId, claimedAt: sql`now()` })
    .where(
      and(
        eq(assessments.id, leadId),
        eq(assessments.status, expected.status),
        expected.holderUserId ? eq(assessments.claimedByUserId, expected.holderUserId) : isNull(assessments.claimedByUserId),
      ),
    )
    .returning({ id: assessments.id, status: assessments.status, contactEmail: assessments.contactEmail });
  return row ?? null;
}

/** Opens a held lead again: `fresh` for its region, or `unrouted` when it has none. */
export async function reopenHeldLead(db: Executor, leadId: string, expected: { status: AssessmentStatus; holderUserId: string }) {
  const [row] = await db
    .update(assessments)
    .set({
      status: sql`case when ${assessments.regionId} is null then 'unrouted'::assessment_status else 'fresh'::assessment_status end`,
      claimedByUserId: null,
      claimedAt: null,
    })
    .where(and(eq(assessments.id, leadId), eq(assessments.status, expected.status), eq(assessments.claimedByUserId, expected.holderUserId)))
    .returning({ id: assessments.id, status: assessments.status, regionId: assessments.regionId });
  return row ?? null;
}

/** Sets a lead aside as junk, or takes it back to `to`; only if it is still at `from`. */
export async function setLeadStatus(db: Executor, leadId: string, from: AssessmentStatus, to: AssessmentStatus, regionId?: string | null) {
  const [row] = await db
    .update(assessments)
    .set({ status: to, ...(regionId !== undefined ? { regionId } : {}) })
    .where(and(eq(assessments.id, leadId), eq(assessments.status, from)))
    .returning({ id: assessments.id, status: assessments.status, regionId: assessments.regionId });
  return row ?? null;
}

/** The stage a lead was at when it was last set aside as junk (its activity entry keeps it). */
export async function stageBeforeJunk(db: Executor, leadId: string): Promise<AssessmentStatus | null> {
  const [row] = await db
    .select({ detail: activityLog.detail })
    .from(activityLog)
    .where(and(eq(activityLog.assessmentId, leadId), eq(activityLog.action, 'lead.junked')))
    .orderBy(desc(activityLog.createdAt), desc(activityLog.id))
    .limit(1);
  const from = (row?.detail as { from?: unknown } | undefined)?.from;
  return typeof from === 'string' && (assessmentStatuses as readonly string[]).includes(from) ? (from as AssessmentStatus) : null;
}
