/**
 * The site-walk draft: the runs and rooms as the consultant corrects them (the very shape
 * POST /api/leads/{id}/revisions takes, engine runs in SI), the revision they were started
 * from, and what the phone needs to send them later. Pure functions over plain data, so the
 * draft can be kept in localStorage and read back after a reload.
 */
import { AREA_PRESETS, type AreaPresetId, type PlantInput, type PlantRunInput, type ServiceId } from '../../../engine';
import { sameValue } from '../../../lib/revisions/diff';
import type { UnitSystem } from '../../../lib/units-display';
import type { RevisionRequestInput } from '../../../schemas/revisions';

export type AreaInput = NonNullable<PlantInput['areas']>[number];
export type RunInput = PlantRunInput;
export type Measurements = NonNullable<RunInput['measurements']>;

/** Where the draft stands: being edited, or saved on this phone and waiting to be sent. */
export type DraftStatus = 'editing' | 'waiting';

export interface WalkDraft {
  readonly version: 1;
  readonly leadId: string;
  /** The revision the edit started from (0: the owner's answers). */
  readonly baseNumber: number;
  /** Names this save, so sending it twice (after a dropped connection) stores it once. */
  readonly clientKey: string;
  readonly reason: string;
  /** Every run, the removed ones too (they stay until the revision is sent, so removing can be undone). */
  readonly runs: readonly RunInput[];
  readonly removed: readonly string[];
  readonly areas: readonly AreaInput[];
  readonly system: UnitSystem;
  readonly status: DraftStatus;
  /** When the consultant pressed save (ISO), for the waiting notice. */
  readonly queuedAt: string | null;
  readonly startedAt: string;
}

/** The state a walk starts from, as the page hands it to the island. */
export interface WalkBase {
  readonly number: number;
  readonly runs: readonly RunInput[];
  readonly areas: readonly AreaInput[];
}

function randomKey(): string {
  const bytes = new Uint8Array(12);
  crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

export function newClientKey(): string {
  return `walk-${randomKey()}`;
}

const today = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });

/** A fresh draft of `base`: nothing changed yet. */
export function freshDraft(leadId: string, base: WalkBase, system: UnitSystem, now = new Date()): WalkDraft {
  return {
    version: 1,
    leadId,
    baseNumber: base.number,
    clientKey: newClientKey(),
    reason: `Site walk on ${today.format(now)}`,
    runs: base.runs.map((run) => structuredClone(run)),
    removed: [],
    areas: base.areas.map((area) => structuredClone(area)),
    system,
    status: 'editing',
    queuedAt: null,
    startedAt: now.toISOString(),
  };
}

/** Whether a stored value is a draft this code can read (anything else is dropped). */
export function isWalkDraft(value: unknown, leadId: string): value is WalkDraft {
  if (typeof value !== 'object' || value === null) return false;
  const d = value as Partial<WalkDraft>;
  return (
    d.version === 1 &&
    d.leadId === leadId &&
    typeof d.baseNumber === 'number' &&
    typeof d.clientKey === 'string' &&
    typeof d.reason === 'string' &&
    Array.isArray(d.runs) &&
    Array.isArray(d.removed) &&
    Array.isArray(d.areas) &&
    (d.system === 'US' || d.system === 'SI') &&
    (d.status === 'editing' || d.status === 'waiting')
  );
}

/** The body POST /api/leads/{id}/revisions takes, and which run each index of `runs` is. */
export function revisionRequestOf(draft: WalkDraft): { body: RevisionRequestInput; runIds: string[] } {
  const kept = draft.runs.filter((run) => !draft.removed.includes(run.id));
  const usedAreas = new Set(kept.map((run) => run.areaId).filter((id): id is string => id !== undefined));
  // A room made on the walk for a run that is gone has nothing left in it.
  const areas = draft.areas.filter((area) => !area.id.startsWith(WALK_ROOM_PREFIX) || usedAreas.has(area.id));
  return {
    body: { baseNumber: draft.baseNumber, reason: draft.reason, clientKey: draft.clientKey, areas: [...areas], runs: kept.map(withoutEmptyMeasurements) },
    runIds: kept.map((run) => run.id),
  };
}

/** Measurements with nothing in them are left out, so an opened and emptied form changes nothing. */
function withoutEmptyMeasurements(run: RunInput): RunInput {
  const m = run.measurements;
  if (!m) return run;
  const meaningful = ['surfaceTemperatureC', 'airTemperatureC', 'relativeHumidityPercent', 'airSpeedMPerS', 'lengthM'].some(
    (key) => (m as Record<string, unknown>)[key] !== undefined,
  );
  if (meaningful) return run;
  const { measurements: _m, ...rest } = run;
  return rest;
}

/** The plant the live figures are worked out for: the base's plant-wide answers with the draft's rooms and runs. */
export function plantOf(draft: WalkDraft, plantAnswers: Record<string, unknown>): PlantInput {
  const { body } = revisionRequestOf(draft);
  return { ...(plantAnswers as Omit<PlantInput, 'runs'>), areas: body.areas, runs: body.runs } as PlantInput;
}

// Editing ------------------------------------------------------------------------------

export function updateRun(draft: WalkDraft, runId: string, change: (run: RunInput) => RunInput): WalkDraft {
  return { ...draft, runs: draft.runs.map((run) => (run.id === runId ? change(run) : run)) };
}

/** Sets a value at a dotted path inside a run (undefined removes it), copying what it passes through. */
export function setIn<T extends object>(target: T, path: string, value: unknown): T {
  const [head, ...rest] = path.split('.');
  if (!head) return target;
  const source = target as Record<string, unknown>;
  if (rest.length === 0) {
    const { [head]: _old, ...others } = source;
    return (value === undefined ? others : { ...others, [head]: value }) as T;
  }
  const child = source[head];
  const next = setIn(typeof child === 'object' && child !== null ? (child as object) : {}, rest.join('.'), value);
  return { ...source, [head]: next } as T;
}

/** Reads a value at a dotted path. */
export function getIn(target: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((value, key) => (typeof value === 'object' && value !== null ? (value as Record<string, unknown>)[key] : undefined), target);
}

/** Rooms made on the walk for one run carry this prefix and the run's id. */
export const WALK_ROOM_PREFIX = 'walk-room-';

export function walkRoomId(runId: string): string {
  return `${WALK_ROOM_PREFIX}${runId}`.slice(0, 64);
}

/** The kind of room a run sits in today: its area's preset, or what its setting suggests. */
export function presetOf(draft: WalkDraft, run: RunInput): AreaPresetId {
  const area = run.areaId ? draft.areas.find((a) => a.id === run.areaId) : undefined;
  if (area?.preset) return area.preset;
  return run.ambient?.kind === 'outdoor' ? 'outdoors' : 'process-room';
}

/**
 * Sets one figure of the air around a run, giving the run a room of its own on first use (the
 * kind of room it sat in before, its air measured), so other runs sharing the owner's area keep
 * theirs.
 */
export function setRoom(draft: WalkDraft, runId: string, path: 'preset' | 'average.airTemperatureC' | 'average.relativeHumidityPercent' | 'average.airSpeedMPerS', value: unknown): WalkDraft {
  const run = draft.runs.find((r) => r.id === runId);
  if (!run) return draft;
  const id = walkRoomId(runId);
  let areas = draft.areas;
  if (!areas.some((a) => a.id === id)) {
    const room: AreaInput = { id, label: `Around ${run.label}`.slice(0, 120), preset: presetOf(draft, run), average: {}, confidence: 'measured' };
    areas = [...areas, room];
  }
  areas = areas.map((area) => (area.id === id ? setIn(area, path, value) : area));
  return { ...updateRun({ ...draft, areas }, runId, (r) => ({ ...r, areaId: id })), areas };
}

/** Puts a run back in the room the walk started with. */
export function resetRoom(draft: WalkDraft, runId: string, base: WalkBase): WalkDraft {
  const original = base.runs.find((r) => r.id === runId);
  const id = walkRoomId(runId);
  const areas = draft.areas.filter((a) => a.id !== id);
  return {
    ...updateRun({ ...draft, areas }, runId, (run) => {
      const { areaId: _a, ambient: _b, ...rest } = run;
      return { ...rest, ...(original?.areaId ? { areaId: original.areaId } : {}), ...(original?.ambient ? { ambient: original.ambient } : {}) };
    }),
    areas,
  };
}

/** The run's own walk room, when the consultant has measured its air. */
export function walkRoomOf(draft: WalkDraft, runId: string): AreaInput | undefined {
  return draft.areas.find((a) => a.id === walkRoomId(runId));
}

export function presetName(id: string): string {
  return AREA_PRESETS.find((p) => p.id === id)?.name ?? 'Process room';
}

/** A run the owner missed, with the service's usual pipe, to be corrected from there. */
export function newRun(service: ServiceId, count: number): RunInput {
  return {
    id: `walk-${randomKey().slice(0, 10)}`,
    label: `Run found on the walk ${count}`,
    service,
    pipe: { standard: 'ASME-B36.10M', size: '1', schedule: '40', material: 'carbon-steel' },
    lengthM: 5,
    lengthConfidence: 'measured',
    current: { state: 'bare' },
  };
}

/** Whether a run differs from how it stood at the base (its room included). */
export function runChanged(draft: WalkDraft, base: WalkBase, runId: string): 'added' | 'changed' | 'unchanged' {
  const before = base.runs.find((r) => r.id === runId);
  const now = draft.runs.find((r) => r.id === runId);
  if (!before) return 'added';
  if (!now) return 'unchanged';
  return sameValue(withoutEmptyMeasurements(now), withoutEmptyMeasurements(before)) && !walkRoomOf(draft, runId) ? 'unchanged' : 'changed';
}
