/**
 * Reading a lead's site-walk revisions: everyone who reaches the lead sees its states and the
 * diff (they carry no contact details); the reason each was saved — free text, like a note —
 * only the consultant holding the lead and admins.
 */
import { getDb } from '../../db/client';
import type { LeadRecord } from '../../db/queries/leads';
import type { RevisionListResponse } from '../../schemas/revisions';
import { leadPartsFor } from '../leads/access';
import { reachableLead } from '../leads/work';
import type { SessionUser } from '../session';
import { diffHistory } from './diff';
import { loadHistory, revisionView, type StoredState } from './states';

/** A lead's states and the diff of its original against its latest revision, as `user` may see them. */
export interface RevisionHistory {
  response: RevisionListResponse;
  /** The same states with their results typed, for pages that lay them out. */
  states: readonly StoredState[];
  /** The lead as the viewer reaches it (pages say who holds it, and its stage). */
  found: LeadRecord;
}

export async function getRevisionHistoryFor(user: SessionUser, leadId: string | undefined): Promise<RevisionHistory> {
  const { viewer, found, leadId: id } = await reachableLead(user, leadId);
  const parts = leadPartsFor(viewer, found.lead);
  const states = await loadHistory(getDb(), found.lead);
  const [original, ...revisions] = states;
  if (!original) throw new Error('a lead always has its original state');
  return {
    states,
    found,
    response: {
      lead: { id, reference: found.lead.reference, latestNumber: revisions.length ? revisions[revisions.length - 1]!.number : 0 },
      original: revisionView(original, parts.timeline),
      revisions: revisions.map((state) => revisionView(state, parts.timeline)),
      diff: revisions.length ? diffHistory(states) : null,
      allowed: { revise: parts.revise },
    },
  };
}

/** GET /api/leads/{id}/revisions. */
export async function getRevisionsFor(user: SessionUser, leadId: string | undefined): Promise<RevisionListResponse> {
  return (await getRevisionHistoryFor(user, leadId)).response;
}
