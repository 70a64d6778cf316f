/**
 * Leads that need a person: hand one to a consultant (with the reason, which the log keeps), or
 * set it aside as junk. Consultants of the lead's region are offered first, each with how many
 * open leads they hold against their cap. The hours after which an open lead counts as waiting
 * too long are set here too.
 */
import { useState, type FormEvent } from 'react';
import { assignLead, fetchAttention, junkLead, saveSettings } from '../../lib/admin-client';
import type { AttentionLead, AttentionResponse } from '../../schemas/admin';
import { attentionReasonText, waitedText } from '../../lib/admin/words';
import { formatMoney } from '../../lib/presentation/money';

type Message = { tone: 'good' | 'error'; text: string } | null;

function LeadRow({ lead, consultants, onDone }: { lead: AttentionLead; consultants: AttentionResponse['consultants']; onDone: (m: Message) => void }) {
  const [mode, setMode] = useState<'assign' | 'junk' | null>(null);
  const [error, setError] = useState<string | null>(null);
  const inRegion = consultants.filter((c) => lead.region && c.regionIds.includes(lead.region.id) && c.id !== lead.holder?.id);
  const others = consultants.filter((c) => !inRegion.includes(c) && c.id !== lead.holder?.id);
  const reason = attentionReasonText[lead.reason];

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const why = String(form.get('reason') ?? '');
    const answer =
      mode === 'assign' ? await assignLead(lead.id, { consultantId: String(form.get('consultantId') ?? ''), reason: why }) : await junkLead(lead.id, why);
    if (!answer.ok) {
      setError(answer.issues[0]?.message ?? answer.message);
      return;
    }
    const holder = answer.data.lead.holder;
    onDone({
      tone: 'good',
      text:
        mode === 'assign'
          ? `${lead.reference} is now with ${holder?.name ?? 'the consultant'}${answer.data.overCap ? ', who is now over their cap' : ''}. The owner has been told.`
          : `${lead.reference} is set aside; no consultant sees it any more.`,
    });
  }

  const option = (c: AttentionResponse['consultants'][number]) => (
    <option key={c.id} value={c.id}>
      {c.name}
      {c.firm ? `, ${c.firm}` : ''} — {c.openClaims} of {c.cap} open
    </option>
  );

  return (
    <li className="admin-card space-y-2" aria-label={lead.reference}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-extrabold">
          <a href={`/desk/leads/${lead.id}`}>{lead.reference}</a> · {lead.plantType}
        </p>
        <span className={`status-pill ${lead.reason === 'stale' ? 'status-invited' : 'status-warn'}`} title={reason.hint}>
          {reason.label}
        </span>
      </div>
      <p className="text-sm">
        {lead.place} · {lead.region ? lead.region.name : 'no region'}
        {lead.holder ? ` · held by ${lead.holder.name}${lead.holder.firm ? ` (${lead.holder.firm})` : ''}` : ''} · waiting {waitedText(lead.waitingHours)} ·{' '}
        <span className="figure-num">{formatMoney(lead.annualLoss, lead.currency)}</span> lost a year
      </p>
      <p className="text-sm text-graphite-soft">{reason.hint}</p>
      {mode === null ? (
        <div className="flex flex-wrap gap-3">
          <button type="button" className="btn btn-quiet" onClick={() => setMode('assign')} disabled={consultants.length === 0}>
            Hand to a consultant…
          </button>
          <button type="button" className="btn btn-quiet" onClick={() => setMode('junk')}>
            Set aside as junk…
          </button>
        </div>
      ) : (
        <form onSubmit={(e) => void submit(e)} className="action-form border-t border-line pt-3">
          {mode === 'assign' && (
            <label className="admin-field">
              <span>Consultant</span>
              <select name="consultantId" required>
                {inRegion.length > 0 && <optgroup label={`Cover ${lead.region?.name ?? 'its region'}`}>{inRegion.map(option)}</optgroup>}
                {others.length > 0 && <optgroup label="Elsewhere">{others.map(option)}</optgroup>}
              </select>
            </label>
          )}
          <label className="admin-field">
            <span>{mode === 'assign' ? 'Why them (kept in the activity log)' : 'Why it is junk (kept in the activity log)'}</span>
            <input name="reason" required maxLength={500} />
          </label>
          {error && (
            <p role="alert" className="notice notice-error">
              {error}
            </p>
          )}
          <div className="flex flex-wrap gap-3">
            <button type="submit" className="btn btn-primary">
              {mode === 'assign' ? 'Hand it over' : 'Set it aside'}
            </button>
            <button type="button" className="btn btn-quiet" onClick={() => setMode(null)}>
              Not now
            </button>
          </div>
        </form>
      )}
    </li>
  );
}

export default function AttentionList({ initial }: { initial: AttentionResponse }) {
  const [data, setData] = useState(initial);
  const [message, setMessage] = useState<Message>(null);
  const [hours, setHours] = useState(String(initial.staleAfterHours));

  async function reload(next: Message) {
    setMessage(next);
    const answer = await fetchAttention();
    if (answer.ok) setData(answer.data);
  }

  async function saveHours(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const answer = await saveSettings({ staleAfterHours: Number(hours) });
    if (!answer.ok) {
      setMessage({ tone: 'error', text: answer.issues[0]?.message ?? answer.message });
      return;
    }
    await reload({ tone: 'good', text: `An open lead now needs a person after ${answer.data.settings.staleAfterHours} hours.` });
  }

  return (
    <div className="space-y-8">
      {message && (
        <p role={message.tone === 'error' ? 'alert' : 'status'} className={message.tone === 'error' ? 'notice notice-error' : 'notice notice-good'}>
          {message.text}
        </p>
      )}
      <section aria-labelledby="leads-heading" className="space-y-4">
        <h2 id="leads-heading" className="text-2xl font-extrabold">
          Leads ({data.leads.length})
        </h2>
        {data.leads.length === 0 ? (
          <p>Nothing waits for a person just now.</p>
        ) : (
          <ul className="grid gap-4">
            {data.leads.map((lead) => (
              <LeadRow key={lead.id} lead={lead} consultants={data.consultants} onDone={(m) => void reload(m)} />
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="cap-heading" className="space-y-3">
        <h2 id="cap-heading" className="text-2xl font-extrabold">
          Consultants over their cap ({data.overCap.length})
        </h2>
        {data.overCap.length === 0 ? (
          <p>Every consultant is within their cap.</p>
        ) : (
          <ul className="list-disc pl-5">
            {data.overCap.map((c) => (
              <li key={c.id}>
                {c.name}
                {c.firm ? ` (${c.firm})` : ''}: {c.openClaims} open leads, cap {c.cap}. <a href="/admin/consultants">Change the cap</a> or hand a lead on from the desk.
              </li>
            ))}
          </ul>
        )}
      </section>
      <form onSubmit={(e) => void saveHours(e)} className="admin-card flex flex-wrap items-end gap-3">
        <label className="admin-field">
          <span>An open lead needs a person after (hours)</span>
          <input type="number" min={1} max={1440} step={1} inputMode="numeric" value={hours} onChange={(e) => setHours(e.target.value)} />
        </label>
        <button type="submit" className="btn btn-quiet">
          Save
        </button>
      </form>
    </div>
  );
}
