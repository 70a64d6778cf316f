/**
 * The admin's consultants: invite one, send a link again or withdraw it, change a cap, deactivate
 * (choosing where the open leads go) and reactivate. Every change goes through the admin API and
 * the list is read again from the server afterwards.
 */
import { useState, type FormEvent } from 'react';
import {
  deactivateConsultant,
  fetchConsultants,
  inviteConsultant,
  reactivateConsultant,
  resendInvitation,
  updateConsultant,
  withdrawInvitation,
} from '../../lib/admin-client';
import type { ApiFailure } from '../../lib/api-client';
import type { ConsultantView } from '../../schemas/admin';
import { consultantStatusText } from '../../lib/admin/words';

export interface ConsultantsBoardProps {
  initial: ConsultantView[];
  regions: { id: string; name: string }[];
}

type Message = { tone: 'good' | 'error'; text: string } | null;

const dateText = (iso: string) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(iso));

function fieldErrors(failure: ApiFailure): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of failure.issues) out[issue.path.split('.')[0] ?? issue.path] ??= issue.message;
  return out;
}

function InviteForm({ regions, onDone }: { regions: ConsultantsBoardProps['regions']; onDone: (text: string) => void }) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    const cap = String(form.get('openClaimCap') ?? '').trim();
    setBusy(true);
    const answer = await inviteConsultant({
      email: String(form.get('email') ?? ''),
      name: String(form.get('name') ?? ''),
      firm: String(form.get('firm') ?? ''),
      phone: String(form.get('phone') ?? ''),
      regionIds: form.getAll('regionIds').map(String),
      ...(cap ? { openClaimCap: Number(cap) } : {}),
    });
    setBusy(false);
    if (!answer.ok) {
      setErrors(fieldErrors(answer));
      setProblem(answer.message);
      return;
    }
    setErrors({});
    setProblem(null);
    formElement.reset();
    const expires = answer.data.consultant.invitation?.expiresAt;
    onDone(`Invitation sent to ${answer.data.consultant.email}${expires ? `; the link works until ${dateText(expires)}` : ''}.`);
  }

  const field = (name: string, label: string, props: Record<string, unknown> = {}) => (
    <label className="admin-field">
      <span>{label}</span>
      <input name={name} aria-invalid={errors[name] ? true : undefined} aria-describedby={errors[name] ? `invite-${name}-error` : undefined} {...props} />
      {errors[name] && (
        <small id={`invite-${name}-error`} className="field-error">
          {errors[name]}
        </small>
      )}
    </label>
  );

  return (
    <form onSubmit={(e) => void submit(e)} className="admin-card grid gap-4 sm:grid-cols-2" aria-labelledby="invite-heading" noValidate>
      <h2 id="invite-heading" className="text-xl font-extrabold sm:col-span-2">
        Invite a consultant
      </h2>
      {field('email', 'E-mail address', { type: 'email', autoComplete: 'off', required: true })}
      {field('name', 'Name', { autoComplete: 'off', required: true })}
      {field('firm', 'Firm (owners are told it)', { autoComplete: 'off', required: true })}
      {field('phone', 'Phone (owners are told it)', { type: 'tel', autoComplete: 'off' })}
      {field('openClaimCap', 'Open leads they may hold at once', { type: 'number', min: 1, max: 100, step: 1, inputMode: 'numeric', placeholder: '5' })}
      <fieldset className="sm:col-span-2">
        <legend className="font-semibold">Regions they cover</legend>
        <div className="flex flex-wrap gap-x-5">
          {regions.map((r) => (
            <label key={r.id} className="filter-check">
              <input type="checkbox" name="regionIds" value={r.id} />
              <span>{r.name}</span>
            </label>
          ))}
        </div>
        {errors.regionIds && <small className="field-error">{errors.regionIds}</small>}
      </fieldset>
      {problem && (
        <p role="alert" className="notice notice-error sm:col-span-2">
          {problem}
        </p>
      )}
      <div className="sm:col-span-2">
        <button type="submit" className="btn btn-primary" disabled={busy}>
          {busy ? 'Sending…' : 'Send the invitation'}
        </button>
      </div>
    </form>
  );
}

function DeactivateForm({
  consultant,
  colleagues,
  onDone,
  onCancel,
}: {
  consultant: ConsultantView;
  colleagues: ConsultantView[];
  onDone: (text: string) => void;
  onCancel: () => void;
}) {
  const [mode, setMode] = useState<'reopen' | 'colleague'>('reopen');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const regionIds = new Set(consultant.regions.map((r) => r.id));
  const nearby = colleagues.filter((c) => c.regions.some((r) => regionIds.has(r.id)));

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    const answer = await deactivateConsultant(consultant.id, {
      leads: mode,
      ...(mode === 'colleague' ? { colleagueId: String(form.get('colleagueId') ?? '') } : {}),
      reason: String(form.get('reason') ?? ''),
    });
    setBusy(false);
    if (!answer.ok) {
      setError(answer.issues[0]?.message ?? answer.message);
      return;
    }
    const { leads } = answer.data;
    onDone(
      `${consultant.name} is deactivated and signed out everywhere. ${
        mode === 'colleague' ? `${leads.handedOver} open lead(s) handed over.` : `${leads.reopened} lead(s) open again for their region${leads.unrouted ? `, ${leads.unrouted} back among the leads with no region` : ''}.`
      }`,
    );
  }

  return (
    <form onSubmit={(e) => void submit(e)} className="action-form mt-3 border-t border-line pt-3">
      <fieldset className="grid gap-1">
        <legend className="font-semibold">
          Their {consultant.openClaims} open lead{consultant.openClaims === 1 ? '' : 's'}
        </legend>
        <label className="filter-check">
          <input type="radio" name="leads" value="reopen" checked={mode === 'reopen'} onChange={() => setMode('reopen')} />
          <span>Open again for the region (its other consultants are told)</span>
        </label>
        <label className="filter-check">
          <input type="radio" name="leads" value="colleague" checked={mode === 'colleague'} onChange={() => setMode('colleague')} disabled={nearby.length === 0} />
          <span>{nearby.length ? 'Hand to a colleague of the region' : 'Hand to a colleague (nobody else covers their regions)'}</span>
        </label>
      </fieldset>
      {mode === 'colleague' && (
        <label className="admin-field">
          <span>Colleague</span>
          <select name="colleagueId" required>
            {nearby.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
                {c.firm ? `, ${c.firm}` : ''} ({c.openClaims} of {c.openClaimCap} open)
              </option>
            ))}
          </select>
        </label>
      )}
      <label className="admin-field">
        <span>Why (kept in the activity log)</span>
        <input name="reason" maxLength={500} />
      </label>
      {error && (
        <p role="alert" className="notice notice-error">
          {error}
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn btn-primary" disabled={busy}>
          {busy ? 'Deactivating…' : `Deactivate ${consultant.name}`}
        </button>
        <button type="button" className="btn btn-quiet" onClick={onCancel}>
          Keep them
        </button>
      </div>
    </form>
  );
}

function CapForm({ consultant, onDone }: { consultant: ConsultantView; onDone: (text: string, ok: boolean) => void }) {
  const [value, setValue] = useState(String(consultant.openClaimCap));
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        void updateConsultant(consultant.id, { openClaimCap: Number(value) }).then((answer) =>
          onDone(answer.ok ? `${consultant.name} may now hold ${answer.data.consultant.openClaimCap} open leads.` : (answer.issues[0]?.message ?? answer.message), answer.ok),
        );
      }}
    >
      <label className="admin-field w-28">
        <span>Cap</span>
        <input type="number" min={1} max={100} step={1} inputMode="numeric" value={value} onChange={(e) => setValue(e.target.value)} aria-label={`Open leads ${consultant.name} may hold`} />
      </label>
      <button type="submit" className="btn btn-quiet">
        Set cap
      </button>
    </form>
  );
}

export default function ConsultantsBoard({ initial, regions }: ConsultantsBoardProps) {
  const [consultants, setConsultants] = useState(initial);
  const [message, setMessage] = useState<Message>(null);
  const [deactivating, setDeactivating] = useState<string | null>(null);

  async function reload(text: string, ok = true) {
    setMessage({ tone: ok ? 'good' : 'error', text });
    setDeactivating(null);
    const answer = await fetchConsultants();
    if (answer.ok) setConsultants(answer.data.consultants);
  }

  async function act(run: () => Promise<{ ok: boolean; message?: string }>, done: string) {
    const answer = await run();
    await reload(answer.ok ? done : (answer.message ?? 'That did not work.'), answer.ok);
  }

  const active = consultants.filter((c) => c.status === 'active');

  return (
    <div className="space-y-8">
      <InviteForm regions={regions} onDone={(text) => void reload(text)} />
      {message && (
        <p role={message.tone === 'error' ? 'alert' : 'status'} className={message.tone === 'error' ? 'notice notice-error' : 'notice notice-good'}>
          {message.text}
        </p>
      )}
      <section aria-labelledby="team-heading" className="space-y-4">
        <h2 id="team-heading" className="text-2xl font-extrabold">
          The consultants ({consultants.length})
        </h2>
        {consultants.length === 0 && <p>No consultants yet. Invite the first one above.</p>}
        <ul className="grid gap-4">
          {consultants.map((c) => (
            <li key={c.id} className="admin-card space-y-3" aria-label={c.name}>
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <div>
                  <p className="text-lg font-extrabold">
                    {c.name}
                    {c.firm ? <span className="font-semibold text-graphite-soft"> · {c.firm}</span> : null}
                  </p>
                  <p className="text-sm text-graphite-soft">
                    {c.email}
                    {c.phone ? ` · ${c.phone}` : ''}
                  </p>
                </div>
                <span className={`status-pill status-${c.status}`}>{consultantStatusText[c.status]}</span>
              </div>
              <p className="text-sm">
                {c.regions.length ? `Covers ${c.regions.map((r) => r.name).join(', ')}.` : 'Covers no region yet.'}{' '}
                <span className={c.overCap ? 'field-error' : undefined}>
                  Holds {c.openClaims} open lead{c.openClaims === 1 ? '' : 's'} of a cap of {c.openClaimCap}
                  {c.overCap ? ' (over the cap)' : ''}.
                </span>{' '}
                {c.lastSignInAt ? `Last signed in ${dateText(c.lastSignInAt)}.` : ''}
                {c.invitation
                  ? c.invitation.expired
                    ? ` Their link expired on ${dateText(c.invitation.expiresAt)}.`
                    : ` Their link works until ${dateText(c.invitation.expiresAt)} (sent ${c.invitation.sentCount} time${c.invitation.sentCount === 1 ? '' : 's'}).`
                  : ''}
                {c.deactivation?.reason ? ` Deactivated: ${c.deactivation.reason}` : ''}
              </p>
              <div className="flex flex-wrap items-end gap-3">
                {c.status === 'invited' && (
                  <>
                    <button type="button" className="btn btn-quiet" onClick={() => void act(() => resendInvitation(c.id), `A new link is on its way to ${c.email}; the old one no longer works.`)}>
                      Send a new link
                    </button>
                    <button type="button" className="btn btn-quiet" onClick={() => void act(() => withdrawInvitation(c.id), `The invitation to ${c.email} is withdrawn.`)}>
                      Withdraw the invitation
                    </button>
                  </>
                )}
                {c.status !== 'deactivated' && <CapForm consultant={c} onDone={(text, ok) => void reload(text, ok)} />}
                {c.status === 'active' && deactivating !== c.id && (
                  <button type="button" className="btn btn-quiet" onClick={() => setDeactivating(c.id)}>
                    Deactivate…
                  </button>
                )}
                {c.status === 'deactivated' && (
                  <button type="button" className="btn btn-quiet" onClick={() => void act(() => reactivateConsultant(c.id), `${c.name} can sign in again.`)}>
                    Reactivate
                  </button>
                )}
              </div>
              {deactivating === c.id && (
                <DeactivateForm
                  consultant={c}
                  colleagues={active.filter((o) => o.id !== c.id)}
                  onDone={(text) => void reload(text)}
                  onCancel={() => setDeactivating(null)}
                />
              )}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
