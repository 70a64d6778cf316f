/**
 * What a consultant can do with one lead: claim it, move it along the pipeline (closing asks
 * why), hand it back to the region, or add a note. Every action is checked again on the server;
 * this island only offers what the server said is allowed, and reloads the page after a change
 * so the contact details, stage and timeline come from the server.
 */
import { useState, type FormEvent } from 'react';
import { addLeadNote, claimLead, moveLead, releaseLead } from '../../lib/desk-client';
import type { ApiFailure } from '../../lib/api-client';
import { closeReasons, moveText, releaseReasons, stageText, type CloseReason, type MoveTarget, type ReleaseReason } from '../../lib/leads/pipeline';
import type { LeadDetail } from '../../schemas/leads';

export interface LeadActionsProps {
  leadId: string;
  reference: string;
  allowed: LeadDetail['allowed'];
}

function problemText(failure: ApiFailure): string {
  const issue = failure.issues[0];
  return issue && failure.status === 400 ? issue.message : failure.message;
}

export default function LeadActions({ leadId, reference, allowed }: LeadActionsProps) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [closing, setClosing] = useState(false);
  const [releasing, setReleasing] = useState(false);

  async function act(run: () => Promise<{ ok: true } | ApiFailure>, after = () => window.location.reload()) {
    setBusy(true);
    setProblem(null);
    const answer = await run();
    if (answer.ok) {
      after();
      return;
    }
    setBusy(false);
    setProblem(problemText(answer));
  }

  function submitClose(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const note = String(form.get('note') ?? '').trim();
    void act(() => moveLead(leadId, { to: 'closed', reason: String(form.get('reason') ?? '') as CloseReason, ...(note ? { note } : {}) }));
  }

  function submitRelease(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const note = String(form.get('note') ?? '').trim();
    void act(
      () => releaseLead(leadId, { reason: String(form.get('reason') ?? '') as ReleaseReason, ...(note ? { note } : {}) }),
      () => window.location.assign('/desk/mine?released=1'),
    );
  }

  function submitNote(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const text = String(new FormData(event.currentTarget).get('text') ?? '');
    void act(() => addLeadNote(leadId, { text }));
  }

  const forward = allowed.moves.filter((m): m is Exclude<MoveTarget, 'closed'> => m !== 'closed');
  const nothing = !allowed.claim && allowed.moves.length === 0 && !allowed.release && !allowed.note;
  if (nothing) return null;

  return (
    <section aria-labelledby="actions-heading" className="lead-actions space-y-5">
      <h2 id="actions-heading" className="text-xl font-extrabold">
        {allowed.claim ? 'Take it on' : 'Move it along'}
      </h2>
      {problem && (
        <p role="alert" className="notice notice-error">
          {problem}
        </p>
      )}
      {allowed.claim && (
        <div className="space-y-2">
          <button
            type="button"
            className="btn btn-primary"
            disabled={busy}
            onClick={() => void act(() => claimLead(leadId), () => window.location.assign(`/desk/leads/${leadId}?claimed=1`))}
          >
            {busy ? 'Claiming…' : `Claim ${reference}`}
          </button>
          <p className="text-sm text-graphite-soft">The first consultant to claim it takes it on. The owner is told who will call.</p>
        </div>
      )}
      {forward.length > 0 && (
        <div className="flex flex-wrap gap-3">
          {forward.map((to) => (
            <button key={to} type="button" className="btn btn-primary" disabled={busy} onClick={() => void act(() => moveLead(leadId, { to }))}>
              {moveText[to]}
            </button>
          ))}
        </div>
      )}
      {allowed.moves.includes('closed') &&
        (closing ? (
          <form onSubmit={submitClose} className="action-form">
            <label>
              <span>Why close it?</span>
              <select name="reason" required defaultValue="">
                <option value="" disabled>
                  Choose a reason
                </option>
                {closeReasons.map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.label}
                  </option>
                ))}
              </select>
            </label>
            <label>
              <span>Note (optional)</span>
              <textarea name="note" rows={2} maxLength={4000} />
            </label>
            <div className="flex flex-wrap gap-3">
              <button type="submit" className="btn btn-primary" disabled={busy}>
                Close as “{stageText.closed.label}”
              </button>
              <button type="button" className="btn btn-quiet" onClick={() => setClosing(false)}>
                Keep it open
              </button>
            </div>
          </form>
        ) : (
          <button type="button" className="btn btn-quiet" disabled={busy} onClick={() => setClosing(true)}>
            {moveText.closed}…
          </button>
        ))}
      {allowed.release &&
        (releasing ? (
          <form onSubmit={submitRelease} className="action-form">
            <label>
              <span>Why hand it back?</span>
              <select name="reason" required defaultValue="">
                <option value="" disabled>
                  Choose a reason
                </option>
                {releaseReasons.map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.label}
                  </option>
                ))}
              </select>
            </label>
            <label>
              <span>Note for the record (optional)</span>
              <textarea name="note" rows={2} maxLength={4000} />
            </label>
            <p className="text-sm text-graphite-soft">The lead opens again and the region’s other consultants are told.</p>
            <div className="flex flex-wrap gap-3">
              <button type="submit" className="btn btn-primary" disabled={busy}>
                Hand it back
              </button>
              <button type="button" className="btn btn-quiet" onClick={() => setReleasing(false)}>
                Keep it
              </button>
            </div>
          </form>
        ) : (
          <button type="button" className="btn btn-quiet" disabled={busy} onClick={() => setReleasing(true)}>
            Hand back to the region…
          </button>
        ))}
      {allowed.note && (
        <form onSubmit={submitNote} className="action-form">
          <label>
            <span>Add a note to the timeline</span>
            <textarea name="text" rows={3} maxLength={4000} required />
          </label>
          <div>
            <button type="submit" className="btn btn-quiet" disabled={busy}>
              Add note
            </button>
          </div>
        </form>
      )}
    </section>
  );
}
