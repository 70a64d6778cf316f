/**
 * Leads moved by the admin: handed to a consultant (by hand, or when their holder is
 * deactivated), opened again for the region, set aside as junk, or taken back from junk. Each
 * change is a conditional UPDATE recorded as an activity entry, with the mail it causes queued in
 * the same transaction.
 */
import type { Executor } from '../../db/client';
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { handLead, reopenHeldLead, setLeadStatus, stageBeforeJunk } from '../../db/queries/handover';
import { countOpenClaims, findLead, lockClaimant } from '../../db/queries/leads';
import { findRegionForPostalCode, lockRouting } from '../../db/queries/regions';
import { isActiveConsultant } from '../../db/queries/team';
import type { AssessmentStatus } from '../../db/schema';
import { inTransaction, type SqlRunner } from '../../db/transaction';
import type { AssignLeadRequest, JunkLeadRequest } from '../../schemas/admin';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import { isLeadId } from '../leads/access';
import { isHeldStage, openClaimStages, stageText } from '../leads/pipeline';
import { leadNotFound } from '../leads/read';
import { normalisePostalCode, isCountryCode } from '../routing/postal-code';
import type { SessionUser } from '../session';

export interface LeadAsSeen {
  id: string;
  status: AssessmentStatus;
  holderUserId: string | null;
}

function changedMeanwhile(): DomainError {
  return new DomainError('CONFLICT', 'The lead changed while you were looking at it; reload the page to see where it stands.');
}

/**
 * Hands a lead to `consultant`. The owner is told who will contact them and the consultant is
 * mailed; the admin may hand over past the consultant's cap (the attention list then shows it).
 */
export async function handLeadTo(
  tx: Executor,
  sqlRunner: SqlRunner,
  lead: LeadAsSeen,
  consultant: { id: string; name: string; email: string },
  actorUserId: string,
  reason: string,
): Promise<void> {
  const handed = await handLead(tx, lead.id, { status: lead.status, holderUserId: lead.holderUserId }, consultant.id);
  if (!handed) throw changedMeanwhile();
  await recordActivity(tx, {
    assessmentId: lead.id,
    actorUserId,
    subjectUserId: consultant.id,
    action: 'lead.assigned',
    detail: { from: lead.status, to: handed.status, previousHolderUserId: lead.holderUserId, reason },
  });
  await enqueue(
    jobNames.sendEmail,
    { email: { template: 'lead-assigned', to: consultant.email, props: { assessmentId: lead.id, consultantName: consultant.name, reason } } },
    { sqlRunner },
  );
  await enqueue(
    jobNames.sendEmail,
    { email: { template: 'consultant-introduction', to: handed.contactEmail, props: { assessmentId: lead.id, consultantUserId: consultant.id } } },
    { sqlRunner },
  );
}

/** Opens a held lead again; its region's consultants (but the one who held it) are alerted. */
export async function reopenLead(tx: Executor, sqlRunner: SqlRunner, lead: LeadAsSeen & { holderUserId: string }, actorUserId: string, reason: string) {
  const reopened = await reopenHeldLead(tx, lead.id, { status: lead.status, holderUserId: lead.holderUserId });
  if (!reopened) throw changedMeanwhile();
  await recordActivity(tx, {
    assessmentId: lead.id,
    actorUserId,
    subjectUserId: lead.holderUserId,
    action: 'lead.reopened',
    detail: { from: lead.status, to: reopened.status, previousHolderUserId: lead.holderUserId, reason },
  });
  if (reopened.status === 'fresh') {
    await enqueue(jobNames.alertConsultants, { assessmentId: lead.id, reopened: true, excludeUserIds: [lead.holderUserId] }, { sqlRunner });
  }
  return reopened.status;
}

async function adminLead(leadId: string | undefined) {
  if (!isLeadId(leadId)) throw leadNotFound();
  const found = await findLead(getDb(), leadId, undefined);
  if (!found) throw leadNotFound();
  return found;
}

/** Stages a lead can be handed over from: not yet held, or held and not finished. */
const handOverFrom: readonly AssessmentStatus[] = ['unrouted', 'fresh', 'claimed', 'in_touch', 'site_walk_booked', 'report_sent'];

/** POST /api/admin/leads/{id}/assign: hands a lead to a consultant by hand, with the reason. */
export async function assignLead(admin: SessionUser, leadId: string | undefined, request: AssignLeadRequest) {
  const found = await adminLead(leadId);
  const { lead } = found;
  if (!handOverFrom.includes(lead.status)) {
    throw new DomainError(
      'INVALID_TRANSITION',
      lead.status === 'junk'
        ? 'This lead is set aside as junk; take it back first.'
        : `This lead is “${stageText[lead.status].label}”; finished work is not handed over.`,
    );
  }
  if (lead.claimedByUserId === request.consultantId) {
    throw new DomainError('CONFLICT', 'This consultant holds the lead already.', 'consultantId');
  }
  const consultant = await isActiveConsultant(getDb(), request.consultantId);
  if (!consultant) throw new DomainError('INVALID_INPUT', 'Hand the lead to an active consultant who has joined.', 'consultantId');
  const overCap = await inTransaction(async (tx, sqlRunner) => {
    const claimant = await lockClaimant(tx, request.consultantId);
    await handLeadTo(tx, sqlRunner, { id: lead.id, status: lead.status, holderUserId: lead.claimedByUserId }, { id: request.consultantId, ...consultant }, admin.id, request.reason);
    const open = await countOpenClaims(tx, request.consultantId, openClaimStages);
    return claimant ? open > claimant.cap : false;
  });
  return { lead: await leadView(lead.id), overCap };
}

/** POST /api/admin/leads/{id}/junk: sets a lead aside; it leaves every consultant's view. */
export async function junkLead(admin: SessionUser, leadId: string | undefined, request: JunkLeadRequest) {
  const { lead } = await adminLead(leadId);
  if (lead.status === 'junk') throw new DomainError('CONFLICT', 'This lead is set aside already.');
  await inTransaction(async (tx) => {
    const changed = await setLeadStatus(tx, lead.id, lead.status, 'junk');
    if (!changed) throw changedMeanwhile();
    await recordActivity(tx, {
      assessmentId: lead.id,
      actorUserId: admin.id,
      subjectUserId: lead.claimedByUserId,
      action: 'lead.junked',
      detail: { from: lead.status, holderUserId: lead.claimedByUserId, reason: request.reason },
    });
  });
  return { lead: await leadView(lead.id), overCap: false };
}

/**
 * POST /api/admin/leads/{id}/restore: takes a lead back from junk. It goes where it was if it
 * was held; otherwise it is routed afresh by its postal code (and the region alerted).
 */
export async function restoreLead(admin: SessionUser, leadId: string | undefined, request: JunkLeadRequest) {
  const { lead } = await adminLead(leadId);
  if (lead.status !== 'junk') throw new DomainError('CONFLICT', 'Only a lead set aside as junk can be taken back.');
  await inTransaction(async (tx, sqlRunner) => {
    await lockRouting(tx, 'share');
    let to: AssessmentStatus;
    let regionId: string | null = lead.regionId;
    if (lead.claimedByUserId) {
      // Back to the stage it was set aside from, which its activity entry kept.
      const from = await stageBeforeJunk(tx, lead.id);
      to = from && isHeldStage(from) ? from : 'claimed';
    } else {
      const country = lead.countryCode;
      const postal = isCountryCode(country) ? normalisePostalCode(country, lead.postalCode) : null;
      const match = postal?.ok ? await findRegionForPostalCode(tx, country, postal.routingKey) : null;
      regionId = match?.regionId ?? null;
      to = match ? 'fresh' : 'unrouted';
    }
    const changed = await setLeadStatus(tx, lead.id, 'junk', to, regionId);
    if (!changed) throw changedMeanwhile();
    await recordActivity(tx, { assessmentId: lead.id, actorUserId: admin.id, action: 'lead.restored', detail: { to, regionId, reason: request.reason } });
    if (to === 'fresh') await enqueue(jobNames.alertConsultants, { assessmentId: lead.id }, { sqlRunner });
  });
  return { lead: await leadView(lead.id), overCap: false };
}

async function leadView(leadId: string) {
  const found = await findLead(getDb(), leadId, undefined);
  if (!found) throw leadNotFound();
  const { lead } = found;
  return {
    id: lead.id,
    reference: lead.reference,
    status: lead.status,
    holder: lead.claimedByUserId && found.holderName ? { id: lead.claimedByUserId, name: found.holderName, firm: found.holderFirm ?? null } : null,
    region: lead.regionId && found.regionName ? { id: lead.regionId, name: found.regionName } : null,
  };
}
