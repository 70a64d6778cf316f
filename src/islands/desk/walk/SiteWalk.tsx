/**
 * The site-walk form: a consultant on a phone corrects the owner's inventory run by run, adds
 * runs the owner missed and removes ones that are gone, sees the figures worked out again as
 * they go, and saves a revision. Everything typed is kept on the phone at once; a save made
 * without a connection waits on the phone, says so, and goes when the connection returns; a
 * revision someone else saved meanwhile is shown, never overwritten.
 */
import { useStore } from '@nanostores/react';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { SERVICE_DEFAULTS, type ServiceId } from '../../../engine';
import { diffStates } from '../../../lib/revisions/diff';
import { displayFormat, type UnitSystem } from '../../../lib/presentation';
import type { RevisionListResponse } from '../../../schemas/revisions';
import type { PlantResult } from '../../../engine';
import { freshDraft, newClientKey, newRun, plantOf, resetRoom, revisionRequestOf, runChanged, WALK_ROOM_PREFIX, type WalkBase, type WalkDraft } from './draft';
import { Choices, SelectInput } from './fields';
import { useLiveFigures, type DraftIssue, type PlantFigures } from './figures';
import { fetchRevisions } from '../../../lib/desk-client';
import { keepPageForOffline } from './offline';
import { draftStore, sendDraft, type SendOutcome } from './outbox';
import { RunEditor } from './RunEditor';
import { problemInUnits, ROOM_FIELD_WORDS, RUN_FIELD_WORDS, SERVICE_OPTIONS } from './words';

export interface SiteWalkProps {
  leadId: string;
  reference: string;
  /** Where the lead's page is. */
  leadUrl: string;
  base: WalkBase & {
    /** "the owner’s answers" or "revision 2 by Marisol Quintero". */
    description: string;
  };
  /** The base revision's plant-wide answers (energy, hours, economics, conditions), without runs and areas. */
  plantAnswers: Record<string, unknown>;
  baseFigures: PlantFigures;
  /** The units the owner's questionnaire used. */
  system: UnitSystem;
}

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

function useOnline(): boolean {
  const [online, setOnline] = useState(() => navigator.onLine);
  useEffect(() => {
    const up = () => setOnline(true);
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, []);
  return online;
}

/** Problems by run id and field path inside the run; what belongs to no run under `general`. */
interface Problems {
  readonly byRun: Readonly<Record<string, Readonly<Record<string, string>>>>;
  readonly general: readonly string[];
}

function sortProblems(issues: readonly DraftIssue[], runIds: readonly string[], draft: WalkDraft, system: UnitSystem): Problems {
  const byRun: Record<string, Record<string, string>> = {};
  const general: string[] = [];
  const put = (runId: string, path: string, message: string) => {
    byRun[runId] ??= {};
    byRun[runId]![path] ??= message;
  };
  const areas = revisionRequestOf(draft).body.areas ?? [];
  for (const issue of issues) {
    const run = /^runs\.(\d+)\.(.+)$/.exec(issue.path);
    const area = /^areas\.(\d+)\.(.+)$/.exec(issue.path);
    if (run) {
      const runId = runIds[Number(run[1])];
      const path = run[2]!;
      if (runId) put(runId, path, problemInUnits(issue.message, issue.params, RUN_FIELD_WORDS[path], system));
      else general.push(issue.message);
    } else if (area) {
      const areaId = areas[Number(area[1])]?.id ?? '';
      const path = area[2]!;
      if (areaId.startsWith(WALK_ROOM_PREFIX)) put(areaId.slice(WALK_ROOM_PREFIX.length), `room.${path}`, problemInUnits(issue.message, issue.params, ROOM_FIELD_WORDS[path], system));
      else general.push(issue.message);
    } else {
      general.push(issue.message);
    }
  }
  return { byRun, general };
}

function Totals({ before, now, system }: { before: PlantFigures; now: PlantFigures | null; system: UnitSystem }) {
  const f = displayFormat({ system, currency: before.currency });
  const money = (value: number) => f.money(value);
  const rows = [
    { label: 'Lost a year', before: money(before.lossCost.likely), now: now ? money(now.lossCost.likely) : '…', note: now ? `likely ${money(now.lossCost.low)}–${money(now.lossCost.high)}` : '' },
    { label: 'Saving a year', before: money(before.saving), now: now ? money(now.saving) : '…', note: '' },
    { label: 'Installed cost', before: money(before.installedCost), now: now ? money(now.installedCost) : '…', note: 'illustrative prices' },
    { label: 'Pays back in', before: f.years(before.paybackYears), now: now ? f.years(now.paybackYears) : '…', note: '' },
  ];
  return (
    <table className="walk-totals">
      <caption className="sr-only">The plant’s figures before the walk and with your corrections ({system === 'US' ? 'US' : 'SI'} units)</caption>
      <thead>
        <tr>
          <td />
          <th scope="col">Before</th>
          <th scope="col">Now</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.label}>
            <th scope="row">{row.label}</th>
            <td>{row.before}</td>
            <td className="walk-now">
              {row.now}
              {row.note ? <span>{row.note}</span> : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** What a newer revision changed against the one the draft started from, by run name. */
function theirChanges(history: RevisionListResponse | null, fromNumber: number): string[] | null {
  if (!history) return null;
  const states = [history.original, ...history.revisions].map((r) => ({ number: r.number, plant: r.plant, result: r.result as unknown as PlantResult }));
  const from = states.find((s) => s.number === fromNumber);
  const to = states.find((s) => s.number === history.lead.latestNumber);
  if (!from || !to) return null;
  return diffStates(from, to)
    .runs.filter((run) => run.status !== 'unchanged')
    .map((run) => `${run.label} (${run.status === 'added' ? 'added' : run.status === 'removed' ? 'removed' : run.inputs.map((i) => i.field).join(', ')})`);
}

export default function SiteWalk({ leadId, reference, leadUrl, base, plantAnswers, baseFigures, system: ownerSystem }: SiteWalkProps) {
  const store = draftStore(leadId);
  const stored = useStore(store);
  const draft = useMemo(() => stored ?? freshDraft(leadId, base, ownerSystem), [stored, leadId, base, ownerSystem]);
  const online = useOnline();
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  const [outcome, setOutcome] = useState<SendOutcome | null>(null);
  const [sending, setSending] = useState(false);
  const [reasonAsked, setReasonAsked] = useState(false);
  const [newService, setNewService] = useState<ServiceId>('steam');
  const inFlight = useRef(false);
  const attempted = useRef(false);
  const system = draft.system;

  // The draft is written to the phone at once, with its key; the page is kept for a reload without signal.
  const leaving = useRef(false);
  useEffect(() => {
    if (!stored && !leaving.current) store.set(draft);
  }, [stored, store, draft]);
  useEffect(() => {
    void keepPageForOffline();
  }, []);

  const change = useCallback(
    (edit: (d: WalkDraft) => WalkDraft) => {
      const current = store.get() ?? draft;
      const next = edit(current);
      // Changing a save that is waiting takes it back to editing; if it may have reached the
      // server already, it gets a new key, so the change is not mistaken for the earlier save.
      store.set(current.status === 'waiting' ? { ...next, status: 'editing', queuedAt: null, clientKey: attempted.current ? newClientKey() : next.clientKey } : next);
      setOutcome(null);
    },
    [store, draft],
  );

  const plant = useMemo(() => plantOf(draft, plantAnswers), [draft, plantAnswers]);
  const live = useLiveFigures(plant, online);
  const { runIds } = revisionRequestOf(draft);
  const liveIssues = live.kind === 'invalid' ? live.issues : [];
  const shown = sortProblems(liveIssues, runIds, draft, system);
  const sendOutcomeProblems =
    outcome?.kind === 'invalid' ? sortProblems(outcome.issues.map((i) => ({ path: i.path, message: i.message })), outcome.runIds, draft, system) : null;
  const problemsOf = (runId: string) => ({ ...(shown.byRun[runId] ?? {}), ...(sendOutcomeProblems?.byRun[runId] ?? {}) });

  const trySend = useCallback(async () => {
    const current = store.get();
    if (!current || current.status !== 'waiting' || inFlight.current) return;
    inFlight.current = true;
    attempted.current = true;
    setSending(true);
    const result = await sendDraft(current);
    inFlight.current = false;
    setSending(false);
    if (result.kind === 'saved') {
      // Sent: nothing is left on the phone, and no fresh draft is started on the way out.
      leaving.current = true;
      store.set(undefined);
      window.location.assign(`${leadUrl}?revised=${result.number}#site-walk`);
      return;
    }
    if (result.kind === 'offline') return;
    const latest = store.get();
    if (latest) store.set({ ...latest, status: 'editing', queuedAt: null });
    setOutcome(result);
  }, [store, leadUrl]);

  // A waiting save goes at once, when the phone says it is back online, and every 15 s in case it does not say.
  useEffect(() => {
    if (draft.status !== 'waiting') return;
    void trySend();
    const retry = () => void trySend();
    window.addEventListener('online', retry);
    const timer = window.setInterval(retry, 15_000);
    return () => {
      window.removeEventListener('online', retry);
      window.clearInterval(timer);
    };
  }, [draft.status, trySend]);

  function save() {
    if (!draft.reason.trim() || liveIssues.length) {
      setReasonAsked(true);
      // Open the runs with problems, then take the person to the first one.
      setOpen((set) => new Set([...set, ...Object.keys(shown.byRun)]));
      window.setTimeout(() => document.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus(), 0);
      return;
    }
    setOutcome(null);
    store.set({ ...draft, status: 'waiting', queuedAt: new Date().toISOString() });
  }

  const conflictAtLoad = stored !== undefined && draft.baseNumber < base.number && draft.status === 'editing';
  const conflict = outcome?.kind === 'conflict' ? outcome : null;
  const [history, setHistory] = useState<RevisionListResponse | null>(null);
  useEffect(() => {
    if (conflict) setHistory(conflict.history);
  }, [conflict]);
  useEffect(() => {
    if (!conflictAtLoad || history || !online) return;
    const controller = new AbortController();
    void fetchRevisions(leadId, controller.signal).then((answer) => {
      if (answer.ok) setHistory(answer.data);
    });
    return () => controller.abort();
  }, [conflictAtLoad, history, online, leadId]);
  const latestNumber = conflict?.history?.lead.latestNumber ?? (conflictAtLoad ? base.number : null);
  const changedByThem = latestNumber !== null ? theirChanges(history, draft.baseNumber) : null;

  function startAgain() {
    leaving.current = true;
    store.set(undefined);
    window.location.reload();
  }

  function keepMine() {
    if (latestNumber === null) return;
    store.set({ ...draft, baseNumber: latestNumber, clientKey: newClientKey(), status: 'editing', queuedAt: null });
    setOutcome(null);
  }

  const generalProblems = [...shown.general, ...(sendOutcomeProblems?.general ?? [])];
  const reasonProblem = reasonAsked && !draft.reason.trim() ? 'Say in a few words what the walk changed.' : undefined;
  const addedCount = draft.runs.filter((r) => !base.runs.some((b) => b.id === r.id)).length;
  const figures = live.figures;

  return (
    <div className="walk">
      <div className="walk-bar">
        <p className="walk-kept" role="status">
          {draft.status === 'waiting'
            ? sending
              ? 'Sending the revision…'
              : 'Saved on this phone, not yet sent. It goes by itself as soon as the phone has a connection.'
            : 'Your changes are kept on this phone as you type.'}
        </p>
        <Choices<UnitSystem>
          legend="Units"
          name="walk-units"
          value={system}
          options={[
            { value: 'US', label: 'US (ft, °F, psig)' },
            { value: 'SI', label: 'SI (m, °C, bar)' },
          ]}
          onChange={(value) => store.set({ ...draft, system: value })}
        />
      </div>

      {!online ? (
        <p className="notice walk-offline">No connection here. Everything stays on this phone; the figures and the save catch up when the connection returns.</p>
      ) : null}

      {draft.status === 'waiting' ? (
        <div className="notice walk-waiting">
          <p className="font-extrabold">Saved on this phone, not yet sent</p>
          <p>
            Kept since {when.format(new Date(draft.queuedAt ?? draft.startedAt))}. Leave this page open or come back to it; it is sent when the phone is
            online again.
          </p>
          <button type="button" className="btn btn-quiet" disabled={sending} onClick={() => void trySend()}>
            {sending ? 'Sending…' : 'Try sending now'}
          </button>
        </div>
      ) : null}

      {conflict || conflictAtLoad ? (
        <section className="notice notice-error walk-conflict" aria-labelledby="walk-conflict-heading">
          <h2 id="walk-conflict-heading" className="text-lg font-extrabold">
            A newer revision was saved
          </h2>
          <p>
            {conflict
              ? conflict.message
              : `Revision ${base.number} (${base.description}) was saved after you started from revision ${draft.baseNumber}. Nothing of yours was sent or lost: it is still on this phone.`}
          </p>
          {changedByThem ? (
            changedByThem.length ? (
              <>
                <p>Their revision changed:</p>
                <ul className="walk-list">
                  {changedByThem.map((line) => (
                    <li key={line}>{line}</li>
                  ))}
                </ul>
              </>
            ) : (
              <p>Their revision changed no run’s answers.</p>
            )
          ) : null}
          <div className="walk-run-actions">
            <button type="button" className="btn btn-quiet" onClick={startAgain}>
              Start again from revision {latestNumber ?? base.number}
            </button>
            {latestNumber !== null ? (
              <button type="button" className="btn btn-primary" onClick={keepMine}>
                Keep my changes and save them over it
              </button>
            ) : null}
          </div>
        </section>
      ) : null}

      {outcome?.kind === 'refused' ? <p className="notice notice-error">{outcome.message}</p> : null}

      <section aria-labelledby="walk-figures-heading" className="walk-panel">
        <h2 id="walk-figures-heading" className="text-xl font-extrabold">
          The plant with your corrections
        </h2>
        <p className="walk-hint">
          Starting from {base.description}.{' '}
          {live.kind === 'working' ? 'Working the figures out…' : live.kind === 'offline' ? 'The figures wait for a connection.' : live.kind === 'invalid' ? 'Some answers need a look before the figures can follow.' : live.kind === 'failed' ? live.message : 'Figures up to date.'}
        </p>
        <Totals before={baseFigures} now={figures} system={system} />
      </section>

      {generalProblems.length ? (
        <ul className="notice notice-error walk-list" aria-label="Problems to fix">
          {generalProblems.map((message) => (
            <li key={message}>{message}</li>
          ))}
        </ul>
      ) : null}

      <section aria-labelledby="walk-runs-heading" className="walk-runs">
        <h2 id="walk-runs-heading" className="text-xl font-extrabold">
          Runs
        </h2>
        {draft.runs.map((run) => {
          const removed = draft.removed.includes(run.id);
          const status = runChanged(draft, base, run.id);
          return (
            <RunEditor
              key={run.id}
              run={run}
              draft={draft}
              base={base}
              status={status}
              removed={removed}
              open={open.has(run.id)}
              system={system}
              currency={baseFigures.currency}
              before={baseFigures.runs[run.id]}
              now={removed ? undefined : figures?.runs[run.id]}
              problems={problemsOf(run.id)}
              onChange={change}
              onToggle={(isOpen) =>
                setOpen((set) => {
                  const next = new Set(set);
                  if (isOpen) next.add(run.id);
                  else next.delete(run.id);
                  return next;
                })
              }
              onRemove={() =>
                change((d) =>
                  status === 'added' ? { ...d, runs: d.runs.filter((r) => r.id !== run.id), areas: d.areas.filter((a) => a.id !== `${WALK_ROOM_PREFIX}${run.id}`) } : { ...d, removed: [...d.removed, run.id] },
                )
              }
              onRestore={() => change((d) => ({ ...d, removed: d.removed.filter((id) => id !== run.id) }))}
              onResetRoom={() => change((d) => resetRoom(d, run.id, base))}
            />
          );
        })}
        <div className="walk-add">
          <SelectInput id="walk-new-service" label="A run the owner missed carries" value={newService} options={SERVICE_OPTIONS} onChange={(v) => setNewService(v as ServiceId)} />
          <button
            type="button"
            className="btn btn-quiet"
            onClick={() => {
              const run = newRun(SERVICE_DEFAULTS.find((s) => s.id === newService)?.id ?? 'steam', addedCount + 1);
              change((d) => ({ ...d, runs: [...d.runs, run] }));
              setOpen((set) => new Set(set).add(run.id));
            }}
          >
            Add the run
          </button>
        </div>
      </section>

      <section aria-labelledby="walk-save-heading" className="walk-panel">
        <h2 id="walk-save-heading" className="text-xl font-extrabold">
          Save the revision
        </h2>
        <div className="walk-field">
          <label htmlFor="walk-reason" className="walk-label">
            What the walk changed
          </label>
          <p id="walk-reason-hint" className="walk-hint">
            Kept with the revision for you and the record; the owner does not see it.
          </p>
          <textarea
            id="walk-reason"
            className="walk-input walk-textarea"
            rows={3}
            maxLength={500}
            value={draft.reason}
            aria-invalid={reasonProblem ? true : undefined}
            aria-describedby={reasonProblem ? 'walk-reason-hint walk-reason-error' : 'walk-reason-hint'}
            onChange={(event) => change((d) => ({ ...d, reason: event.target.value }))}
          />
          {reasonProblem ? (
            <p id="walk-reason-error" className="walk-error">
              {reasonProblem}
            </p>
          ) : null}
        </div>
        <button type="button" className="btn btn-primary walk-save" disabled={draft.status === 'waiting' || conflictAtLoad || conflict !== null} onClick={save}>
          {draft.status === 'waiting' ? 'Waiting to send…' : `Save revision ${draft.baseNumber + 1} of ${reference}`}
        </button>
        <p className="walk-hint">
          The owner’s own answers stay as they sent them; the revision is kept beside them on the lead. <a href={leadUrl}>Back to the lead</a>
        </p>
      </section>
    </div>
  );
}
