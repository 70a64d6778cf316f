/**
 * Saving a site-walk revision: the consultant's corrected runs (and the rooms they sit in) on
 * top of the revision they started from, worked out by the engine and stored whole — the
 * revision, the lead's headline figures and the activity entry in one transaction, or nothing.
 *
 * Two saves made from the same base cannot both land: the lead's revision number moves by a
 * conditional UPDATE, and the loser is told who saved meanwhile (409), never overwritten. A save
 * sent again with the same client key (a phone retrying after a dropped connection) answers
 * with the revision it already made.
 */
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { advanceRevision, findRevision, findRevisionByClientKey, insertRevision } from '../../db/queries/revisions';
import { findLead } from '../../db/queries/leads';
import { isUniqueViolation } from '../../db/errors';
import { inTransaction } from '../../db/transaction';
import { ENGINE_VERSION, EngineError, engineIssuesOf, estimateParsedPlant, plantInputSchema } from '../../engine';
import type { RevisionRequest, RevisionSavedResponse } from '../../schemas/revisions';
import { headlineColumnsOf } from '../assessments/headline';
import { DomainError } from '../errors';
import { isHeldStage, revisableStages, stageText } from '../leads/pipeline';
import { leadPartsFor, reachCondition, type LeadViewer } from '../leads/access';
import { holderCondition, notYours, reachableLead, changedMeanwhile } from '../leads/work';
import type { LeadRecord } from '../../db/queries/leads';
import type { SessionUser } from '../session';
import { diffStates, diffSummary } from './diff';
import { loadOriginal, revisionState, revisionView, type StoredState } from './states';

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' });

/** Why `viewer` may not revise this lead. */
function refusal(viewer: LeadViewer, found: LeadRecord): DomainError {
  const status = found.lead.status;
  const inCharge = found.lead.claimedByUserId === viewer.userId || viewer.reach === 'all';
  if (isHeldStage(status) && inCharge) {
    return new DomainError('INVALID_TRANSITION', `The lead is “${stageText[status].label}”; its inventory is final and takes no more revisions.`);
  }
  if (!isHeldStage(status) && status !== 'fresh') {
    return new DomainError('INVALID_TRANSITION', `This lead is “${stageText[status].label}” and is not in anyone’s pipeline.`);
  }
  return notYours(found);
}

/** The 409 for a save made from a revision that is no longer the latest. */
function savedMeanwhile(latest: StoredState, yourBase: number): DomainError {
  const who = latest.author ? `${latest.author.name}${latest.author.firm ? ` (${latest.author.firm})` : ''}` : 'Someone';
  return new DomainError(
    'CONFLICT',
    `${who} saved revision ${latest.number} on ${when.format(latest.savedAt)} UTC, after the revision ${yourBase} you started from. Nothing was overwritten: look at their revision, then save your changes on top of it.`,
    'baseNumber',
    { latestNumber: latest.number, savedAt: latest.savedAt.toISOString(), author: latest.author },
  );
}

async function stateOf(leadId: string, found: LeadRecord, number: number): Promise<StoredState> {
  if (number === 0) return loadOriginal(getDb(), found.lead);
  const row = await findRevision(getDb(), leadId, number);
  if (!row) throw new Error(`revision ${number} of lead ${leadId} is missing`);
  return revisionState(row);
}

/** The revision this author's device already saved under `clientKey`, as the answer to the save sent again. */
async function replay(user: SessionUser, leadId: string, found: LeadRecord, clientKey: string): Promise<RevisionSavedResponse | null> {
  const earlier = await findRevisionByClientKey(getDb(), leadId, clientKey);
  if (!earlier || earlier.authorUserId !== user.id) return null;
  const saved = revisionState(earlier);
  const base = await stateOf(leadId, found, earlier.baseNumber);
  return { revision: revisionView(saved, true), diff: diffStates(base, saved), replayed: true };
}

/**
 * Saves a revision of `leadId` for `user` from `request`. Throws NOT_FOUND (out of reach),
 * FORBIDDEN (not the holder), INVALID_TRANSITION (closed or agreed), CONFLICT (a newer
 * revision was saved meanwhile), an engine INVALID_INPUT (each issue with its path).
 */
export async function saveRevision(user: SessionUser, leadId: string | undefined, request: RevisionRequest): Promise<RevisionSavedResponse> {
  const { viewer, found, leadId: id } = await reachableLead(user, leadId);
  const parts = leadPartsFor(viewer, found.lead);
  if (request.clientKey) {
    const earlier = await replay(user, id, found, request.clientKey);
    if (earlier) return earlier;
  }
  if (!parts.revise) throw refusal(viewer, found);

  const latestNumber = found.lead.revisionNumber;
  if (request.baseNumber > latestNumber) {
    throw new DomainError(
      'CONFLICT',
      `This lead has no revision ${request.baseNumber}; its latest is ${latestNumber === 0 ? 'the owner’s answers (0)' : latestNumber}. Reload the lead and start from that.`,
      'baseNumber',
      { latestNumber },
    );
  }
  if (request.baseNumber < latestNumber) throw savedMeanwhile(await stateOf(id, found, latestNumber), request.baseNumber);

  const base = await stateOf(id, found, request.baseNumber);
  const { runs: _runs, areas: _areas, ...plantAnswers } = base.plant as Record<string, unknown>;
  const parsed = plantInputSchema.safeParse({ ...plantAnswers, areas: request.areas, runs: request.runs });
  if (!parsed.success) {
    const issues = engineIssuesOf(parsed.error);
    throw new EngineError('INVALID_INPUT', issues.map((i) => i.message).join(' '), issues);
  }
  const result = estimateParsedPlant(parsed.data);
  const { photoCount: _photos, ...headline } = headlineColumnsOf(result, found.lead.photoCount);
  const next: StoredState = {
    number: request.baseNumber + 1,
    baseNumber: request.baseNumber,
    plant: parsed.data,
    result,
    engineVersion: ENGINE_VERSION,
    reading: { status: 'as-stored', result, computedBy: ENGINE_VERSION },
    savedAt: new Date(),
    author: null,
    reason: request.reason,
    clientKey: request.clientKey ?? null,
  };
  const diff = diffStates(base, next);

  let stored: { id: string; createdAt: Date } | 'lost';
  try {
    stored = await inTransaction(async (tx) => {
      const advanced = await advanceRevision(tx, id, request.baseNumber, revisableStages, holderCondition(viewer), headline);
      if (!advanced) return 'lost' as const;
      const row = await insertRevision(tx, {
        assessmentId: id,
        number: next.number,
        baseNumber: request.baseNumber,
        plantInput: parsed.data,
        resultSnapshot: result,
        engineVersion: ENGINE_VERSION,
        authorUserId: user.id,
        reason: request.reason,
        clientKey: request.clientKey ?? null,
      });
      await recordActivity(tx, {
        assessmentId: id,
        actorUserId: user.id,
        action: 'lead.revised',
        detail: { number: next.number, baseNumber: request.baseNumber, reason: request.reason, ...diffSummary(diff) },
      });
      return row;
    });
  } catch (error) {
    // The same key sent twice at once: the first stored it, so this one answers with it.
    if (request.clientKey && isUniqueViolation(error, 'client_key')) stored = 'lost';
    else throw error;
  }

  if (stored === 'lost') {
    if (request.clientKey) {
      const earlier = await replay(user, id, found, request.clientKey);
      if (earlier) return earlier;
    }
    const now = await findLead(getDb(), id, reachCondition(viewer));
    if (now && now.lead.revisionNumber !== request.baseNumber) throw savedMeanwhile(await stateOf(id, now, now.lead.revisionNumber), request.baseNumber);
    if (now && !leadPartsFor(viewer, now.lead).revise) throw refusal(viewer, now);
    throw changedMeanwhile();
  }

  const row = await findRevision(getDb(), id, next.number);
  if (!row) throw new Error(`revision ${next.number} of lead ${id} was stored but cannot be read`);
  return { revision: revisionView(revisionState(row), true), diff, replayed: false };
}
