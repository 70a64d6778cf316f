/**
 * Working a held lead: moving it along the pipeline, handing it back to the region, and notes.
 * Each is checked against the pipeline table (./pipeline), applied with a conditional UPDATE so
 * two changes made at once cannot both land, and recorded as an activity entry in the same
 * transaction as the jobs it causes.
 */
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { findConsultantProfile, findLead, moveHeldLead, releaseHeldLead, type LeadRecord } from '../../db/queries/leads';
import { activityLog } from '../../db/schema';
import { inTransaction } from '../../db/transaction';
import type { ActivityEntryView, MoveRequest, NoteRequest, ReleaseRequest } from '../../schemas/leads';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import type { SessionUser } from '../session';
import { isLeadId, leadPartsFor, leadViewerOf, reachCondition, type LeadViewer } from './access';
import { checkMove, checkRelease, isHeldStage, type HeldStage } from './pipeline';
import { leadNotFound } from './read';

/** The lead as `user` reaches it, after the id and reach checks every action starts with. */
export async function reachableLead(user: SessionUser, leadId: string | undefined): Promise<{ viewer: LeadViewer; found: LeadRecord; leadId: string }> {
  if (!isLeadId(leadId)) throw leadNotFound();
  const viewer = leadViewerOf(user);
  const found = await findLead(getDb(), leadId, reachCondition(viewer));
  if (!found) throw leadNotFound();
  return { viewer, found, leadId };
}

/** The refusal for someone who reaches a lead but does not hold it. */
export function notYours(found: LeadRecord): DomainError {
  const holder = found.holderFirm ?? found.holderName;
  return new DomainError(
    'FORBIDDEN',
    holder ? `${holder} holds this lead; only they (or an admin) can work on it.` : 'Claim this lead before working on it.',
  );
}

/** Whose lead it must still be when the change lands: the viewer's, unless they reach every lead. */
export function holderCondition(viewer: LeadViewer): string | null {
  return viewer.reach === 'all' ? null : viewer.userId;
}

export function changedMeanwhile(): DomainError {
  return new DomainError('CONFLICT', 'The lead changed while you were working on it; reload the page to see where it stands.');
}

/** Moves a held lead to another stage of the pipeline. */
export async function moveLead(user: SessionUser, leadId: string | undefined, move: MoveRequest): Promise<{ id: string; status: HeldStage }> {
  const { viewer, found, leadId: id } = await reachableLead(user, leadId);
  const from = found.lead.status;
  const verdict = checkMove(from, move.to);
  if (!verdict.ok) throw new DomainError('INVALID_TRANSITION', verdict.reason, 'to');
  if (!leadPartsFor(viewer, found.lead).moves.includes(move.to)) throw notYours(found);
  return inTransaction(async (tx) => {
    const moved = await moveHeldLead(tx, id, from, move.to, holderCondition(viewer));
    if (!moved || !isHeldStage(moved.status)) throw changedMeanwhile();
    await recordActivity(tx, {
      assessmentId: id,
      actorUserId: user.id,
      action: 'lead.moved',
      detail: { from, to: move.to, ...(move.reason ? { reason: move.reason } : {}), ...(move.note ? { note: move.note } : {}) },
    });
    return { id, status: moved.status };
  });
}

/**
 * Hands a held lead back to its region: `fresh` again, nobody holding it, and the region's other
 * consultants alerted anew through the queue.
 */
export async function releaseLead(user: SessionUser, leadId: string | undefined, release: ReleaseRequest): Promise<{ id: string; status: 'fresh' }> {
  const { viewer, found, leadId: id } = await reachableLead(user, leadId);
  const from = found.lead.status;
  const verdict = checkRelease(from);
  if (!verdict.ok) throw new DomainError('INVALID_TRANSITION', verdict.reason);
  if (!leadPartsFor(viewer, found.lead).release) throw notYours(found);
  const previousHolder = found.lead.claimedByUserId;
  return inTransaction(async (tx, sqlRunner) => {
    const released = await releaseHeldLead(tx, id, from, holderCondition(viewer));
    if (!released) throw changedMeanwhile();
    await recordActivity(tx, {
      assessmentId: id,
      actorUserId: user.id,
      action: 'lead.released',
      detail: { from, reason: release.reason, ...(release.note ? { note: release.note } : {}), previousHolderUserId: previousHolder },
    });
    if (released.regionId) {
      await enqueue(
        jobNames.alertConsultants,
        { assessmentId: id, reopened: true, excludeUserIds: previousHolder ? [previousHolder] : [] },
        { sqlRunner },
      );
    }
    return { id, status: 'fresh' as const };
  });
}

/** Adds a note to the lead's timeline. */
export async function addLeadNote(user: SessionUser, leadId: string | undefined, note: NoteRequest): Promise<ActivityEntryView> {
  const { viewer, found, leadId: id } = await reachableLead(user, leadId);
  if (!leadPartsFor(viewer, found.lead).note) throw notYours(found);
  const [row] = await getDb()
    .insert(activityLog)
    .values({ assessmentId: id, actorUserId: user.id, action: 'lead.noted', detail: { text: note.text } })
    .returning({ id: activityLog.id, at: activityLog.createdAt });
  if (!row) throw new Error('the note was not stored');
  const profile = await findConsultantProfile(getDb(), user.id);
  return { id: row.id, at: row.at.toISOString(), action: 'lead.noted', actor: { name: user.name, firm: profile?.firm ?? null }, detail: { text: note.text } };
}
