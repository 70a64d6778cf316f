/**
 * Claiming a lead: first claim wins. One transaction locks the claimant's account row (so their
 * own claims are counted one at a time against their cap), makes the one conditional UPDATE,
 * records the activity and queues the owner's "who will contact you" e-mail — all or nothing.
 */
import { getDb } from '../../db/client';
import { countOpenClaims, claimFreshLead, findLead, lockClaimant } from '../../db/queries/leads';
import { recordActivity } from '../../db/queries/assessments';
import { inTransaction } from '../../db/transaction';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import type { SessionUser } from '../session';
import { isLeadId, leadViewerOf, reachCondition, type LeadViewer } from './access';
import { openClaimStages, stageText } from './pipeline';
import { leadNotFound } from './read';

export interface ClaimedLead {
  id: string;
  reference: string;
  status: 'claimed';
  claimedAt: string;
}

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' });

/** Why a claim did not change the lead, worded for the one who tried. */
async function refusal(viewer: LeadViewer, leadId: string): Promise<DomainError> {
  const found = await findLead(getDb(), leadId, reachCondition(viewer));
  if (!found) return leadNotFound();
  const { lead } = found;
  if (lead.claimedByUserId && lead.claimedAt) {
    const firm = found.holderFirm ?? found.holderName ?? 'Another consultant';
    const at = lead.claimedAt.toISOString();
    const mine = lead.claimedByUserId === viewer.userId;
    return new DomainError(
      'ALREADY_CLAIMED',
      mine
        ? `You already hold this lead; you claimed it on ${when.format(lead.claimedAt)} UTC.`
        : `${firm} claimed this lead first, on ${when.format(lead.claimedAt)} UTC.`,
      undefined,
      { firm, claimedAt: at },
    );
  }
  return new DomainError('INVALID_TRANSITION', `This lead is “${stageText[lead.status].label}”, not open; it cannot be claimed.`);
}

/** Claims `leadId` for `user`. Throws NOT_FOUND, ALREADY_CLAIMED (with firm and time) or CLAIM_LIMIT. */
export async function claimLead(user: SessionUser, leadId: string | undefined): Promise<ClaimedLead> {
  if (!isLeadId(leadId)) throw leadNotFound();
  const viewer = leadViewerOf(user);
  const outcome = await inTransaction(async (tx, sqlRunner) => {
    const claimant = await lockClaimant(tx, user.id);
    if (!claimant) return { refused: 'gone' as const };
    const open = await countOpenClaims(tx, user.id, openClaimStages);
    if (open >= claimant.cap) return { refused: 'cap' as const, open, cap: claimant.cap };
    const claimed = await claimFreshLead(tx, leadId, user.id, reachCondition(viewer));
    if (!claimed || !claimed.claimedAt) return { refused: 'lost' as const };
    await recordActivity(tx, { assessmentId: claimed.id, actorUserId: user.id, action: 'lead.claimed', detail: { openClaims: open + 1, cap: claimant.cap } });
    await enqueue(
      jobNames.sendEmail,
      { email: { template: 'consultant-introduction', to: claimed.contactEmail, props: { assessmentId: claimed.id, consultantUserId: user.id } } },
      { sqlRunner },
    );
    return { claimed: { id: claimed.id, reference: claimed.reference, status: 'claimed' as const, claimedAt: claimed.claimedAt.toISOString() } };
  });
  if ('claimed' in outcome && outcome.claimed) return outcome.claimed;
  if (outcome.refused === 'cap') {
    // Past the cap, a lead someone else already took still says so: that is the more useful answer.
    const found = await findLead(getDb(), leadId, reachCondition(viewer));
    if (!found) throw leadNotFound();
    if (found.lead.status !== 'fresh') throw await refusal(viewer, leadId);
    throw new DomainError(
      'CLAIM_LIMIT',
      `You hold ${outcome.open} open lead${outcome.open === 1 ? '' : 's'} and your limit is ${outcome.cap}. Send a report, close a lead or hand one back, then claim this one.`,
      undefined,
      { openClaims: outcome.open, cap: outcome.cap },
    );
  }
  if (outcome.refused === 'gone') throw leadNotFound();
  throw await refusal(viewer, leadId);
}

