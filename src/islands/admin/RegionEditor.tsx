/**
 * The admin's regions: a list, and one form to make or change a region. "Check" asks the server
 * for a dry run — which prefixes meet another region's and which one wins, and which open or
 * unrouted leads would move — before anything is saved; "Save" makes the same change for real.
 */
import { useState, type FormEvent } from 'react';
import { fetchRegions, retireRegion, saveRegion } from '../../lib/admin-client';
import type { ApiFailure } from '../../lib/api-client';
import type { RegionChangeResponse, RegionView } from '../../schemas/admin';

export interface RegionEditorProps {
  initial: RegionView[];
  countries: { code: string; name: string; hint: string }[];
  consultants: { id: string; name: string; firm: string | null; status: string }[];
}

interface Draft {
  id: string | null;
  name: string;
  countryCode: string;
  prefixes: string;
  consultantIds: string[];
}

const emptyDraft = (countryCode: string): Draft => ({ id: null, name: '', countryCode, prefixes: '', consultantIds: [] });

/** Prefixes as typed: separated by commas, spaces or new lines. */
function prefixList(text: string): string[] {
  return text
    .split(/[\s,;]+/)
    .map((p) => p.trim())
    .filter(Boolean);
}

function Outcome({ outcome }: { outcome: RegionChangeResponse }) {
  const { routing, overlaps } = outcome;
  const moves = routing.moved.filter((m) => m.count > 0);
  return (
    <div className="space-y-3" aria-live="polite">
      <h3 className="text-lg font-extrabold">{outcome.dryRun ? 'If you save' : 'Saved'}</h3>
      {overlaps.length === 0 ? (
        <p>No prefix meets another region’s.</p>
      ) : (
        <ul className="list-disc space-y-1 pl-5">
          {overlaps.map((o) => (
            <li key={`${o.prefix}-${o.otherPrefix}`}>
              <strong>{o.prefix}</strong> meets {o.otherRegion.name}’s <strong>{o.otherPrefix}</strong>: {o.explanation}
            </li>
          ))}
        </ul>
      )}
      <ul className="list-disc space-y-1 pl-5">
        <li>
          {routing.routedFromUnrouted} assessment{routing.routedFromUnrouted === 1 ? '' : 's'} with no region {outcome.dryRun ? 'would be' : 'were'} routed
          here{routing.routedFromUnrouted ? ' (its consultants alerted)' : ''}.
        </li>
        {moves.map((m) => (
          <li key={`${m.from}-${m.to}`}>
            {m.count} open lead{m.count === 1 ? '' : 's'} {outcome.dryRun ? 'would move' : 'moved'} from {m.from ?? 'no region'} to {m.to ?? 'no region'}.
          </li>
        ))}
        {routing.nowUnrouted > 0 && (
          <li className="field-error">
            {routing.nowUnrouted} open lead{routing.nowUnrouted === 1 ? '' : 's'} {outcome.dryRun ? 'would be left' : 'were left'} with no region.
          </li>
        )}
      </ul>
      {routing.leads.length > 0 && <p className="text-sm text-graphite-soft">Leads: {routing.leads.map((l) => l.reference).join(', ')}</p>}
    </div>
  );
}

export default function RegionEditor({ initial, countries, consultants }: RegionEditorProps) {
  const [regions, setRegions] = useState(initial);
  const [draft, setDraft] = useState<Draft>(emptyDraft(countries[0]?.code ?? 'US'));
  const [outcome, setOutcome] = useState<RegionChangeResponse | null>(null);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [retiring, setRetiring] = useState<string | null>(null);
  const country = countries.find((c) => c.code === draft.countryCode);
  const typed = prefixList(draft.prefixes);

  function edit(region: RegionView) {
    setDraft({ id: region.id, name: region.name, countryCode: region.countryCode, prefixes: region.prefixes.join(', '), consultantIds: region.consultants.map((c) => c.id) });
    setOutcome(null);
    setFailure(null);
    setNotice(null);
    document.getElementById('region-form')?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }

  async function reload() {
    const answer = await fetchRegions();
    if (answer.ok) setRegions(answer.data.regions);
  }

  async function run(dryRun: boolean) {
    setBusy(true);
    setNotice(null);
    const answer = await saveRegion(draft.id, { name: draft.name, countryCode: draft.countryCode, prefixes: typed, consultantIds: draft.consultantIds }, dryRun);
    setBusy(false);
    if (!answer.ok) {
      setFailure(answer);
      setOutcome(null);
      return;
    }
    setFailure(null);
    setOutcome(answer.data);
    if (!dryRun) {
      setNotice(`${answer.data.region.name} is saved.`);
      setDraft({ ...draft, id: answer.data.region.id });
      await reload();
    }
  }

  async function retire(region: RegionView) {
    setRetiring(null);
    const answer = await retireRegion(region.id);
    if (!answer.ok) {
      setNotice(answer.message);
      return;
    }
    setOutcome(answer.data);
    setNotice(`${region.name} is retired; its open leads went to the regions that now win their codes.`);
    if (draft.id === region.id) setDraft(emptyDraft(draft.countryCode));
    await reload();
  }

  const issueFor = (path: string) => failure?.issues.filter((i) => i.path === path || i.path.startsWith(`${path}.`)) ?? [];

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    void run(false);
  }

  const live = regions.filter((r) => !r.retiredAt);
  const retired = regions.filter((r) => r.retiredAt);

  return (
    <div className="space-y-8">
      <form id="region-form" onSubmit={submit} className="admin-card grid gap-4" noValidate aria-labelledby="region-form-heading">
        <h2 id="region-form-heading" className="text-xl font-extrabold">
          {draft.id ? `Change ${draft.name || 'the region'}` : 'Make a region'}
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <label className="admin-field">
            <span>Name</span>
            <input value={draft.name} onChange={(e) => setDraft({ ...draft, name: e.target.value })} aria-invalid={issueFor('name').length ? true : undefined} />
            {issueFor('name').map((i) => (
              <small key={i.path} className="field-error">
                {i.message}
              </small>
            ))}
          </label>
          <label className="admin-field">
            <span>Country</span>
            <select value={draft.countryCode} onChange={(e) => setDraft({ ...draft, countryCode: e.target.value })}>
              {countries.map((c) => (
                <option key={c.code} value={c.code}>
                  {c.name}
                </option>
              ))}
            </select>
          </label>
        </div>
        <label className="admin-field">
          <span>Postal-code prefixes it covers</span>
          <textarea
            rows={3}
            value={draft.prefixes}
            onChange={(e) => setDraft({ ...draft, prefixes: e.target.value })}
            aria-invalid={issueFor('prefixes').length ? true : undefined}
            aria-describedby="prefix-hint"
          />
          <small id="prefix-hint">
            Separate them with commas or spaces. In {country?.name ?? 'this country'} a prefix is {country?.hint ?? 'the start of a postal code'}. Where two
            regions’ prefixes overlap, the longer prefix wins.
          </small>
          {issueFor('prefixes').map((i) => (
            <small key={i.path} className="field-error">
              {i.message}
            </small>
          ))}
        </label>
        <fieldset>
          <legend className="font-semibold">Consultants who cover it</legend>
          <div className="flex flex-wrap gap-x-5">
            {consultants.map((c) => (
              <label key={c.id} className="filter-check">
                <input
                  type="checkbox"
                  checked={draft.consultantIds.includes(c.id)}
                  onChange={(e) =>
                    setDraft({ ...draft, consultantIds: e.target.checked ? [...draft.consultantIds, c.id] : draft.consultantIds.filter((id) => id !== c.id) })
                  }
                />
                <span>
                  {c.name}
                  {c.firm ? ` (${c.firm})` : ''}
                  {c.status !== 'active' ? ` — ${c.status}` : ''}
                </span>
              </label>
            ))}
          </div>
          {issueFor('consultantIds').map((i) => (
            <small key={i.path} className="field-error">
              {i.message}
            </small>
          ))}
        </fieldset>
        {failure && failure.issues.length === 0 && (
          <p role="alert" className="notice notice-error">
            {failure.message}
          </p>
        )}
        {failure && failure.issues.length > 0 && (
          <p role="alert" className="notice notice-error">
            Not saved: {failure.issues.length === 1 ? 'one field needs' : `${failure.issues.length} fields need`} a change (see above).
          </p>
        )}
        <div className="flex flex-wrap gap-3">
          <button type="button" className="btn btn-quiet" disabled={busy} onClick={() => void run(true)}>
            Check before saving
          </button>
          <button type="submit" className="btn btn-primary" disabled={busy}>
            {draft.id ? 'Save the changes' : 'Save the region'}
          </button>
          {draft.id && (
            <button type="button" className="btn btn-quiet" onClick={() => setDraft(emptyDraft(draft.countryCode))}>
              Make a new one instead
            </button>
          )}
        </div>
        {notice && (
          <p role="status" className="notice notice-good">
            {notice}
          </p>
        )}
        {outcome && <Outcome outcome={outcome} />}
      </form>

      <section aria-labelledby="regions-heading" className="space-y-4">
        <h2 id="regions-heading" className="text-2xl font-extrabold">
          Regions ({live.length})
        </h2>
        <ul className="grid gap-4 sm:grid-cols-2">
          {live.map((r) => (
            <li key={r.id} className="admin-card space-y-2" aria-label={r.name}>
              <p className="text-lg font-extrabold">
                {r.name} <span className="text-sm font-semibold text-graphite-soft">{r.countryName}</span>
              </p>
              <p className="text-sm">
                Prefixes: <span className="figure-num">{r.prefixes.length ? r.prefixes.join(', ') : 'none yet'}</span>
              </p>
              <p className="text-sm">
                {r.consultants.length ? r.consultants.map((c) => `${c.name}${c.active ? '' : ' (deactivated)'}`).join(', ') : 'No consultant covers it.'}
              </p>
              <p className="text-sm">
                {r.openLeads} open ({r.staleLeads} waiting too long), {r.heldLeads} held.
              </p>
              <div className="flex flex-wrap gap-3">
                <button type="button" className="btn btn-quiet" onClick={() => edit(r)} aria-label={`Change ${r.name}`}>
                  Change
                </button>
                {retiring === r.id ? (
                  <>
                    <button type="button" className="btn btn-primary" onClick={() => void retire(r)}>
                      Yes, retire {r.name}
                    </button>
                    <button type="button" className="btn btn-quiet" onClick={() => setRetiring(null)}>
                      Keep it
                    </button>
                  </>
                ) : (
                  <button type="button" className="btn btn-quiet" onClick={() => setRetiring(r.id)} aria-label={`Retire ${r.name}`}>
                    Retire…
                  </button>
                )}
              </div>
            </li>
          ))}
        </ul>
        {retired.length > 0 && (
          <details>
            <summary className="btn btn-quiet">Retired regions ({retired.length})</summary>
            <ul className="mt-3 list-disc pl-5">
              {retired.map((r) => (
                <li key={r.id}>
                  {r.name} ({r.countryName}), {r.heldLeads} lead{r.heldLeads === 1 ? '' : 's'} still held
                </li>
              ))}
            </ul>
          </details>
        )}
      </section>
    </div>
  );
}
