/**
 * The report composer: per run the engine's suggestion first, the consultant free to change the
 * option, material, thickness, jacket, fitting covers and price (with a reason); incentives,
 * exclusions, notes, site-walk findings and photos; live totals and the ranked actions as the
 * draft is saved on the server after each change; a preview that is the owner's page itself;
 * and sending. Every figure comes from the server's answer through the one presentation.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import ReportDocument from '../../components/report/ReportDocument';
import { INSULATION_MATERIALS, OPTION_KINDS, type OptionKind } from '../../engine';
import { JACKET_GROUPS } from '../../lib/presentation/pick-lists';
import type { ApiFailure, ApiIssue } from '../../lib/api-client';
import { openDraft, saveDraft, sendReport } from '../../lib/report-client';
import { presentReport } from '../../lib/reports/present';
import { viewSource } from '../../lib/reports/source';
import { displayUnit } from '../../lib/units-display';
import { findingKinds, type Finding, type ReportComposition, type ReportPatch, type ReportView, type RunChoice } from '../../schemas/reports';

export interface ReportComposerProps {
  leadId: string;
  reference: string;
  /** The open draft, or null when none is open yet. */
  draft: ReportView | null;
  /** The latest version sent, when there is one (a new draft corrects it). */
  latestVersion: number;
  /** Whether the viewer may compose on this lead now. */
  canCompose: boolean;
}

const OPTION_WORDS: Record<OptionKind, string> = {
  leave: 'Leave as it is',
  repair: 'Repair the bare parts',
  insulate: 'Insulate',
  'add-layer': 'Add a layer',
  replace: 'Replace the insulation',
};

const FINDING_WORDS: Record<Finding['kind'], string> = {
  'burn-point': 'Burn point',
  sweating: 'Sweating over product',
  asbestos: 'Suspected asbestos',
  corrosion: 'Corrosion under insulation',
};

type Save = { kind: 'saved'; at: Date } | { kind: 'saving' } | { kind: 'failed'; message: string } | { kind: 'idle' };

function problem(failure: ApiFailure): string {
  return failure.issues[0] ? `${failure.issues[0].message}` : failure.message;
}

/** A typed number: undefined when empty, NaN kept so the server names the field. */
function typed(text: string): number | undefined {
  const trimmed = text.trim().replace(',', '.');
  return trimmed === '' ? undefined : Number(trimmed);
}

function issueAt(issues: readonly ApiIssue[], path: string): string | null {
  return issues.find((i) => i.path === path || i.path.startsWith(`${path}.`))?.message ?? null;
}

function FieldError({ text }: { text: string | null }) {
  return text ? (
    <span role="alert" className="field-error">
      {text}
    </span>
  ) : null;
}

export default function ReportComposer({ leadId, reference, draft: initial, latestVersion, canCompose }: ReportComposerProps) {
  const [view, setView] = useState<ReportView | null>(initial);
  const [composition, setComposition] = useState<ReportComposition | null>(initial?.composition ?? null);
  const [save, setSave] = useState<Save>({ kind: 'idle' });
  const [issues, setIssues] = useState<readonly ApiIssue[]>([]);
  const [preview, setPreview] = useState(false);
  const [sending, setSending] = useState<{ kind: 'idle' } | { kind: 'confirm' } | { kind: 'busy' } | { kind: 'failed'; message: string }>({ kind: 'idle' });
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const inFlight = useRef<AbortController | null>(null);
  const dirty = useRef(false);

  const system = view?.plant.unitSystem ?? 'SI';
  const thicknessUnit = displayUnit('thickness', system);
  const temperatureUnit = displayUnit('temperature', system);
  const lengthUnit = displayUnit('length', system);
  const presented = useMemo(() => (view && view.result && 'runs' in view.result ? presentReport(viewSource(view)) : null), [view]);

  async function start() {
    setSave({ kind: 'saving' });
    const answer = await openDraft(leadId, {});
    if (!answer.ok) {
      setSave({ kind: 'failed', message: problem(answer) });
      return;
    }
    setView(answer.data.report);
    setComposition(answer.data.report.composition);
    setSave({ kind: 'saved', at: new Date() });
  }

  async function persist(next: ReportPatch) {
    if (!view) return;
    inFlight.current?.abort();
    const controller = new AbortController();
    inFlight.current = controller;
    setSave({ kind: 'saving' });
    const answer = await saveDraft(view.id, next, controller.signal);
    if (controller.signal.aborted) return;
    if (answer.ok) {
      dirty.current = false;
      setIssues([]);
      setView(answer.data.report);
      setSave({ kind: 'saved', at: new Date() });
    } else {
      setIssues(answer.issues);
      setSave({ kind: 'failed', message: problem(answer) });
    }
  }

  function change(update: (current: ReportComposition) => ReportComposition) {
    if (!composition) return;
    const next = update(composition);
    setComposition(next);
    dirty.current = true;
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void persist(next), 600);
  }

  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (dirty.current) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  async function send() {
    if (!view || !composition) return;
    if (timer.current) clearTimeout(timer.current);
    setSending({ kind: 'busy' });
    if (dirty.current) await persist(composition);
    const answer = await sendReport(view.id);
    if (!answer.ok) {
      setIssues(answer.issues);
      setSending({ kind: 'failed', message: problem(answer) });
      return;
    }
    dirty.current = false;
    window.location.assign(`/desk/reports/${answer.data.report.id}?sent=1`);
  }

  if (!view || !composition) {
    return (
      <section className="space-y-3 rounded-plate border border-line bg-surface p-5">
        {canCompose ? (
          <>
            <p>{latestVersion > 0 ? `Version ${latestVersion} is with the owner. A correction starts from it and is sent as version ${latestVersion + 1}; version ${latestVersion} stays readable.` : 'No report yet. The draft starts from the latest site walk (or the owner’s answers) with the engine’s suggestion for each run.'}</p>
            <button type="button" className="btn btn-primary" onClick={() => void start()} disabled={save.kind === 'saving'}>
              {latestVersion > 0 ? 'Start a correction' : 'Start the report'}
            </button>
          </>
        ) : (
          <p>A report can be composed while you hold the lead, until the owner’s answer is confirmed.</p>
        )}
        {save.kind === 'failed' && (
          <p role="alert" className="notice notice-error">
            {save.message}
          </p>
        )}
      </section>
    );
  }

  const result = view.result as unknown as { runs: { id: string; label: string; fittings: { uncoveredCount: number }; lengthM: number }[] };
  const suggestions = new Map((view.suggestions ?? []).map((s) => [s.runId, s]));
  const choiceOf = (runId: string): RunChoice => composition.runs.find((c) => c.runId === runId) ?? { runId };
  const setChoice = (runId: string, patch: Partial<RunChoice>) =>
    change((current) => {
      const existing = current.runs.find((c) => c.runId === runId) ?? { runId };
      const merged = Object.fromEntries(Object.entries({ ...existing, ...patch }).filter(([, v]) => v !== undefined && v !== '')) as RunChoice;
      const others = current.runs.filter((c) => c.runId !== runId);
      const empty = Object.keys(merged).length === 1;
      return { ...current, runs: empty ? others : [...others, merged] };
    });
  const choiceIndex = (runId: string) => composition.runs.findIndex((c) => c.runId === runId);
  const runIssue = (runId: string, field: string) => {
    const i = choiceIndex(runId);
    return i < 0 ? null : issueAt(issues, `runs.${i}.${field}`);
  };
  const perLength = system === 'US' ? 'per ft' : 'per m';
  const lengthFactor = system === 'US' ? lengthUnit.toBase(1) : 1;

  return (
    <div className="composer space-y-6">
      <div className="composer-bar sticky top-0 z-10 flex flex-wrap items-center gap-3 border-b border-line bg-paper py-3">
        <p role="status" className="text-sm text-graphite-soft" data-save-state={save.kind}>
          {save.kind === 'saving' ? 'Saving…' : save.kind === 'saved' ? `Draft saved at ${save.at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}` : save.kind === 'failed' ? `Not saved: ${save.message}` : 'Draft'}
        </p>
        <button type="button" className="btn btn-quiet ml-auto" aria-pressed={preview} onClick={() => setPreview((p) => !p)}>
          {preview ? 'Back to editing' : 'Preview as the owner sees it'}
        </button>
        <button type="button" className="btn btn-primary" onClick={() => setSending({ kind: 'confirm' })} disabled={sending.kind === 'busy'}>
          Send to the owner
        </button>
      </div>

      {sending.kind === 'confirm' && (
        <div role="dialog" aria-labelledby="send-heading" className="rounded-plate border border-ember bg-surface p-4">
          <p id="send-heading" className="font-semibold">
            Send version {latestVersion + 1} of the report on {reference}?
          </p>
          <p>It is frozen once sent; a correction is a new version. The owner is e-mailed the link and the PDF.</p>
          <div className="mt-3 flex flex-wrap gap-3">
            <button type="button" className="btn btn-primary" onClick={() => void send()}>
              Send it now
            </button>
            <button type="button" className="btn btn-quiet" onClick={() => setSending({ kind: 'idle' })}>
              Not yet
            </button>
          </div>
        </div>
      )}
      {sending.kind === 'failed' && (
        <p role="alert" className="notice notice-error">
          Not sent: {sending.message}
        </p>
      )}

      {preview && presented ? (
        <div className="composer-preview rounded-plate border-4 border-sunken bg-paper p-4 sm:p-6" data-preview="owner">
          <ReportDocument report={presented} photos={view.photos} pdfUrl={null} pdfNote="The PDF is made when the report is sent." level={2} />
        </div>
      ) : (
        <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
          <div className="action-form space-y-8">
            <p className="text-sm text-graphite-soft">
              {view.baseRevisionNumber === 0 ? 'Starts from the owner’s answers.' : `Starts from site walk ${view.baseRevisionNumber}.`} {view.priceBasis.note}{' '}
              <a href="/desk/prices">Your price table</a>
            </p>
            {view.lead.latestRevisionNumber > view.baseRevisionNumber && (
              <div className="notice notice-warn" data-newer-walk={view.lead.latestRevisionNumber}>
                <p>Site walk {view.lead.latestRevisionNumber} was saved after this draft was started. Your choices, prices and notes carry over to it.</p>
                <button
                  type="button"
                  className="btn btn-quiet mt-2"
                  disabled={save.kind === 'saving'}
                  onClick={() => {
                    if (timer.current) clearTimeout(timer.current);
                    void persist({ ...composition, baseRevisionNumber: view.lead.latestRevisionNumber });
                  }}
                >
                  Work from site walk {view.lead.latestRevisionNumber}
                </button>
              </div>
            )}
            <label className="block">
              <span>A word to the owner at the top</span>
              <textarea rows={3} value={composition.introduction} onChange={(e) => change((c) => ({ ...c, introduction: e.target.value }))} />
              <FieldError text={issueAt(issues, 'introduction')} />
            </label>

            <section aria-labelledby="composer-runs" className="space-y-4">
              <h2 id="composer-runs" className="text-2xl font-extrabold">
                Run by run
              </h2>
              {result.runs.map((run, index) => {
                const suggestion = suggestions.get(run.id);
                const choice = choiceOf(run.id);
                const shown = presented?.runs[index];
                const changed =
                  suggestion !== undefined &&
                  ((choice.option !== undefined && choice.option !== suggestion.option) ||
                    (choice.material !== undefined && choice.material !== suggestion.material) ||
                    (choice.thicknessM !== undefined && Math.abs(choice.thicknessM - suggestion.thicknessM) > 1e-6) ||
                    (choice.jacket !== undefined && choice.jacket !== suggestion.jacket) ||
                    (choice.coverFittings !== undefined && choice.coverFittings !== suggestion.coverFittings));
                const id = (field: string) => `run-${index}-${field}`;
                return (
                  <fieldset key={run.id} className="space-y-3 rounded-plate border border-line bg-surface p-4" data-run={run.id}>
                    <legend className="px-1 text-lg font-extrabold">{run.label}</legend>
                    {shown && <p className="text-sm text-graphite-soft">{shown.line}. Today: {shown.today}, {shown.todayCost}.</p>}
                    {suggestion && (
                      <p className="text-sm">
                        Engine’s suggestion: <strong>{OPTION_WORDS[suggestion.option]}</strong>
                        {suggestion.option !== 'leave' && `, ${displayThickness(suggestion.thicknessM)} ${materialName(suggestion.material).toLowerCase()}`}
                      </p>
                    )}
                    <div className="grid gap-3 sm:grid-cols-2">
                      <label htmlFor={id('option')}>
                        <span>What to do</span>
                        <select id={id('option')} value={choice.option ?? ''} onChange={(e) => setChoice(run.id, { option: (e.target.value || undefined) as OptionKind | undefined })}>
                          <option value="">As suggested</option>
                          {OPTION_KINDS.map((kind) => (
                            <option key={kind} value={kind}>
                              {OPTION_WORDS[kind]}
                            </option>
                          ))}
                        </select>
                      </label>
                      <label htmlFor={id('material')}>
                        <span>Material</span>
                        <select id={id('material')} value={choice.material ?? ''} onChange={(e) => setChoice(run.id, { material: (e.target.value || undefined) as RunChoice['material'] })}>
                          <option value="">As suggested</option>
                          {INSULATION_MATERIALS.map((m) => (
                            <option key={m.id} value={m.id}>
                              {m.name}
                            </option>
                          ))}
                        </select>
                        <FieldError text={runIssue(run.id, 'material')} />
                      </label>
                      <label htmlFor={id('thickness')}>
                        <span>Thickness ({thicknessUnit.symbol})</span>
                        <input
                          id={id('thickness')}
                          type="text"
                          inputMode="decimal"
                          defaultValue={choice.thicknessM === undefined ? '' : String(Number(thicknessUnit.fromBase(choice.thicknessM).toFixed(3)))}
                          placeholder={suggestion ? String(Number(thicknessUnit.fromBase(suggestion.thicknessM).toFixed(3))) : ''}
                          onChange={(e) => {
                            const value = typed(e.target.value);
                            setChoice(run.id, { thicknessM: value === undefined ? undefined : thicknessUnit.toBase(value) });
                          }}
                        />
                        <FieldError text={runIssue(run.id, 'thicknessM')} />
                      </label>
                      <label htmlFor={id('jacket')}>
                        <span>Jacket</span>
                        <select id={id('jacket')} value={choice.jacket ?? ''} onChange={(e) => setChoice(run.id, { jacket: (e.target.value || undefined) as RunChoice['jacket'] })}>
                          <option value="">As suggested</option>
                          {JACKET_GROUPS.map((group) => (
                            <optgroup key={group.label} label={group.label}>
                              {group.choices.map((jacket) => (
                                <option key={jacket.value} value={jacket.value}>
                                  {jacket.label}
                                </option>
                              ))}
                            </optgroup>
                          ))}
                        </select>
                      </label>
                      {run.fittings.uncoveredCount > 0 && (
                        <label htmlFor={id('covers')} className="flex items-center gap-2 sm:col-span-2">
                          <input
                            id={id('covers')}
                            type="checkbox"
                            className="size-5"
                            checked={choice.coverFittings ?? suggestion?.coverFittings ?? true}
                            onChange={(e) => setChoice(run.id, { coverFittings: e.target.checked })}
                          />
                          <span>Removable covers on the {run.fittings.uncoveredCount} bare fitting{run.fittings.uncoveredCount === 1 ? '' : 's'}</span>
                        </label>
                      )}
                      <label htmlFor={id('per-length')}>
                        <span>Your price {perLength} (optional)</span>
                        <input
                          id={id('per-length')}
                          type="text"
                          inputMode="decimal"
                          defaultValue={choice.price?.perMetre === undefined ? '' : String(Number((choice.price.perMetre * lengthFactor).toFixed(2)))}
                          onChange={(e) => {
                            const value = typed(e.target.value);
                            const price = { ...(choice.price ?? {}), perMetre: value === undefined ? undefined : value / lengthFactor };
                            setChoice(run.id, { price: Object.values(price).some((v) => v !== undefined) ? price : undefined });
                          }}
                        />
                        <FieldError text={runIssue(run.id, 'price.perMetre')} />
                      </label>
                      <label htmlFor={id('lump')}>
                        <span>Or the whole run, installed (optional)</span>
                        <input
                          id={id('lump')}
                          type="text"
                          inputMode="decimal"
                          defaultValue={choice.price?.lumpSum === undefined ? '' : String(choice.price.lumpSum)}
                          onChange={(e) => {
                            const value = typed(e.target.value);
                            const price = { ...(choice.price ?? {}), lumpSum: value };
                            setChoice(run.id, { price: Object.values(price).some((v) => v !== undefined) ? price : undefined });
                          }}
                        />
                        <FieldError text={runIssue(run.id, 'price.lumpSum') ?? runIssue(run.id, 'price')} />
                      </label>
                    </div>
                    {(changed || choice.reason) && (
                      <label htmlFor={id('reason')} className="block">
                        <span>Why you changed the suggestion (the owner reads this)</span>
                        <textarea id={id('reason')} rows={2} value={choice.reason ?? ''} onChange={(e) => setChoice(run.id, { reason: e.target.value })} />
                        <FieldError text={runIssue(run.id, 'reason')} />
                      </label>
                    )}
                    {shown && (
                      <p className="text-sm" data-run-figures={run.id}>
                        {shown.recommendation}: installed <strong>{shown.installedCost}</strong>, saves <strong>{shown.saving}</strong>, pays back <strong>{shown.payback}</strong>
                      </p>
                    )}
                  </fieldset>
                );
              })}
            </section>

            <ListEditor
              title="Found on the site walk"
              addLabel="Add a finding"
              items={composition.findings}
              blank={{ kind: 'burn-point', place: '' } as Finding}
              onChange={(findings) => change((c) => ({ ...c, findings }))}
              render={(finding, i, update) => (
                <div className="grid gap-3 sm:grid-cols-2">
                  <label>
                    <span>What</span>
                    <select value={finding.kind} onChange={(e) => update({ ...finding, kind: e.target.value as Finding['kind'] })}>
                      {findingKinds.map((kind) => (
                        <option key={kind} value={kind}>
                          {FINDING_WORDS[kind]}
                        </option>
                      ))}
                    </select>
                  </label>
                  <label>
                    <span>On which run</span>
                    <select value={finding.runId ?? ''} onChange={(e) => update({ ...finding, runId: e.target.value || undefined })}>
                      <option value="">Not one run</option>
                      {result.runs.map((run) => (
                        <option key={run.id} value={run.id}>
                          {run.label}
                        </option>
                      ))}
                    </select>
                  </label>
                  <label className="sm:col-span-2">
                    <span>Where exactly</span>
                    <input type="text" value={finding.place} onChange={(e) => update({ ...finding, place: e.target.value })} />
                    <FieldError text={issueAt(issues, `findings.${i}.place`)} />
                  </label>
                  <label>
                    <span>Measured surface ({temperatureUnit.symbol})</span>
                    <input
                      type="text"
                      inputMode="decimal"
                      defaultValue={finding.surfaceTemperatureC === undefined ? '' : String(Math.round(temperatureUnit.fromBase(finding.surfaceTemperatureC)))}
                      onChange={(e) => {
                        const value = typed(e.target.value);
                        update({ ...finding, surfaceTemperatureC: value === undefined ? undefined : temperatureUnit.toBase(value) });
                      }}
                    />
                    <FieldError text={issueAt(issues, `findings.${i}.surfaceTemperatureC`)} />
                  </label>
                  <label>
                    <span>Note</span>
                    <input type="text" value={finding.note ?? ''} onChange={(e) => update({ ...finding, note: e.target.value || undefined })} />
                  </label>
                </div>
              )}
            />

            <ListEditor
              title="Incentives and rebates"
              addLabel="Add an incentive"
              items={composition.incentives}
              blank={{ text: '', amount: 0 }}
              onChange={(incentives) => change((c) => ({ ...c, incentives }))}
              render={(line, i, update) => (
                <div className="grid gap-3 sm:grid-cols-[1fr_10rem]">
                  <label>
                    <span>Incentive</span>
                    <input type="text" value={line.text} onChange={(e) => update({ ...line, text: e.target.value })} />
                    <FieldError text={issueAt(issues, `incentives.${i}.text`)} />
                  </label>
                  <label>
                    <span>Amount ({view.result && typeof view.result.currency === 'string' ? view.result.currency : ''})</span>
                    <input type="text" inputMode="decimal" defaultValue={String(line.amount)} onChange={(e) => update({ ...line, amount: typed(e.target.value) ?? 0 })} />
                    <FieldError text={issueAt(issues, `incentives.${i}.amount`)} />
                  </label>
                </div>
              )}
            />

            <ListEditor
              title="Not included"
              addLabel="Add an exclusion"
              items={composition.exclusions}
              blank=""
              onChange={(exclusions) => change((c) => ({ ...c, exclusions }))}
              render={(line, i, update) => (
                <label>
                  <span>Exclusion</span>
                  <input type="text" value={line} onChange={(e) => update(e.target.value)} />
                  <FieldError text={issueAt(issues, `exclusions.${i}`)} />
                </label>
              )}
            />

            <label className="block">
              <span>Notes</span>
              <textarea rows={4} value={composition.notes} onChange={(e) => change((c) => ({ ...c, notes: e.target.value }))} />
              <FieldError text={issueAt(issues, 'notes')} />
            </label>

            <fieldset className="space-y-2">
              <legend className="text-2xl font-extrabold">Photos in the report</legend>
              {(view.photoChoices ?? []).length === 0 ? (
                <p className="text-graphite-soft">The lead has no photos.</p>
              ) : (
                <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
                  {(view.photoChoices ?? []).map((photo) => {
                    const chosen = composition.photoIds.includes(photo.id);
                    return (
                      <li key={photo.id}>
                        <label className="block cursor-pointer">
                          <img src={photo.url} alt={photo.caption} className="aspect-[4/3] w-full rounded-plate border border-line object-cover" />
                          <span className="mt-1 flex items-center gap-2">
                            <input
                              type="checkbox"
                              className="size-5"
                              checked={chosen}
                              onChange={() => change((c) => ({ ...c, photoIds: chosen ? c.photoIds.filter((p) => p !== photo.id) : [...c.photoIds, photo.id] }))}
                            />
                            {photo.caption}
                          </span>
                        </label>
                      </li>
                    );
                  })}
                </ul>
              )}
            </fieldset>
          </div>

          <aside aria-labelledby="composer-totals" className="space-y-4 lg:sticky lg:top-20 lg:self-start">
            <h2 id="composer-totals" className="text-xl font-extrabold">
              As it stands
            </h2>
            {presented && (
              <>
                <dl className="space-y-2 rounded-plate border border-line bg-surface p-4">
                  {presented.headline.map((figure) => (
                    <div key={figure.key}>
                      <dt className="text-sm text-graphite-soft">{figure.label}</dt>
                      <dd className="text-xl font-extrabold tabular-nums" data-live-figure={figure.key}>
                        {figure.value}
                        {figure.range && <span className="block text-sm font-normal text-graphite-soft">likely {figure.range}</span>}
                        {figure.note && <span className="block text-sm font-normal text-graphite-soft">{figure.note}</span>}
                      </dd>
                    </div>
                  ))}
                </dl>
                <h3 className="font-extrabold">What to do first</h3>
                <ol className="space-y-1 text-sm">
                  {presented.actions.map((action) => (
                    <li key={action.rank}>
                      {action.rank}. <strong>{action.runLabel}</strong>
                      {action.tag && <span className="text-mineral"> ({action.tag.toLowerCase()})</span>}: {action.cost}, pays back {action.payback}
                    </li>
                  ))}
                </ol>
              </>
            )}
          </aside>
        </div>
      )}
    </div>
  );

  function displayThickness(meters: number): string {
    return `${Number(thicknessUnit.fromBase(meters).toFixed(2))} ${thicknessUnit.symbol}`;
  }
}

function materialName(id: string): string {
  return INSULATION_MATERIALS.find((m) => m.id === id)?.name ?? id;
}

interface ListEditorProps<T> {
  title: string;
  addLabel: string;
  items: readonly T[];
  blank: T;
  onChange: (items: T[]) => void;
  render: (item: T, index: number, update: (item: T) => void) => React.ReactNode;
}

/** A list the consultant adds to and removes from, each item edited in place. */
function ListEditor<T>({ title, addLabel, items, blank, onChange, render }: ListEditorProps<T>) {
  return (
    <section className="space-y-3">
      <h2 className="text-2xl font-extrabold">{title}</h2>
      <ul className="space-y-3">
        {items.map((item, i) => (
          <li key={i} className="rounded-plate border border-line bg-surface p-3">
            {render(item, i, (next) => onChange(items.map((old, j) => (j === i ? next : old))))}
            <button type="button" className="btn btn-quiet mt-2" onClick={() => onChange(items.filter((_, j) => j !== i))}>
              Remove
            </button>
          </li>
        ))}
      </ul>
      <button type="button" className="btn btn-quiet" onClick={() => onChange([...items, blank])}>
        {addLabel}
      </button>
    </section>
  );
}
