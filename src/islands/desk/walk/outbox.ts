/**
 * Where a site-walk draft lives on the phone and how it leaves it. The draft is kept in
 * localStorage (one entry per lead) at every change, so a reload or a dropped connection loses
 * nothing. Saving marks it `waiting` first and then sends it; without a connection it stays
 * waiting — "saved on this phone, not yet sent" — and goes when the phone is back online. Its
 * client key makes a second send of the same save return the revision already made.
 */
import type { WritableAtom } from 'nanostores';
import { persistentAtom } from '@nanostores/persistent';
import { fetchRevisions, saveRevision } from '../../../lib/desk-client';
import type { ApiIssue } from '../../../lib/api-client';
import type { RevisionListResponse } from '../../../schemas/revisions';
import { isWalkDraft, revisionRequestOf, type WalkDraft } from './draft';

const KEY = 'lagwise:walk:v1:';
const stores = new Map<string, WritableAtom<WalkDraft | undefined>>();

/** The kept draft of one lead (undefined when there is none). */
export function draftStore(leadId: string): WritableAtom<WalkDraft | undefined> {
  let store = stores.get(leadId);
  if (!store) {
    store = persistentAtom<WalkDraft | undefined>(`${KEY}${leadId}`, undefined, {
      encode: (draft) => JSON.stringify(draft),
      decode: (encoded) => {
        try {
          const value: unknown = JSON.parse(encoded);
          return isWalkDraft(value, leadId) ? value : undefined;
        } catch {
          // A damaged entry is dropped: better a fresh start than a broken form.
          return undefined;
        }
      },
      // Two tabs on one lead would overwrite each other's typing; each keeps its own.
      listen: false,
    });
    stores.set(leadId, store);
  }
  return store;
}

/** What became of one attempt to send the draft. */
export type SendOutcome =
  | { readonly kind: 'saved'; readonly number: number }
  /** No answer: it stays on the phone, waiting. */
  | { readonly kind: 'offline' }
  /** Someone saved a newer revision since the draft's base; `history` is null when it could not be fetched. */
  | { readonly kind: 'conflict'; readonly message: string; readonly history: RevisionListResponse | null }
  /** The server found problems with what was typed; each names its field. */
  | { readonly kind: 'invalid'; readonly message: string; readonly issues: readonly ApiIssue[]; readonly runIds: readonly string[] }
  /** Refused for good (the lead was closed, handed back, or is no longer reachable). */
  | { readonly kind: 'refused'; readonly message: string };

/** Sends the draft once. */
export async function sendDraft(draft: WalkDraft): Promise<SendOutcome> {
  const { body, runIds } = revisionRequestOf(draft);
  const answer = await saveRevision(draft.leadId, body);
  if (answer.ok) return { kind: 'saved', number: answer.data.revision.number };
  if (answer.code === 'NETWORK' || answer.code === 'ABORTED' || answer.status >= 500) return { kind: 'offline' };
  if (answer.status === 409 && answer.code === 'CONFLICT') {
    const history = await fetchRevisions(draft.leadId);
    return { kind: 'conflict', message: answer.message, history: history.ok ? history.data : null };
  }
  if (answer.status === 400) return { kind: 'invalid', message: answer.message, issues: answer.issues, runIds };
  return { kind: 'refused', message: answer.message };
}
