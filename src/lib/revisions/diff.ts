/**
 * What changed between two states of a lead's inventory — the owner's answers and a site-walk
 * revision, or two revisions: run by run, the inputs a consultant corrects on site and the
 * figures the engine gave for each, then the plant's totals. Pure: no database, no formatting
 * (values stay SI, as the engine keeps them; screens format them through the presentation).
 *
 * Runs are matched by their id; a run only one side has is added or removed. Inputs are
 * compared after filling in the engine's defaults, so "no valves" and "0 valves" are the same.
 */
import { plantInputSchema, type PlantResult, type RunEstimate } from '../../engine';
import type {
  InputChange,
  InputField,
  RevisionDiff,
  RunDiff,
  RunFigureChange,
  TotalFigureChange,
} from '../../schemas/revisions';
import { runFigureIds, totalFigureIds } from '../../schemas/revisions';

/** One state of the inventory: its number (0 for the owner's answers), the plant as sent to the engine, and its result. */
export interface InventoryState {
  readonly number: number;
  /** A PlantInput, raw or already parsed. */
  readonly plant: unknown;
  readonly result: PlantResult;
}

const runSchema = plantInputSchema.shape.runs.element;

/** A run with the engine's defaults filled in; a run today's schema refuses is read as it was stored. */
type RunRecord = Record<string, unknown> & { id: string; label: string };

function runsOf(plant: unknown): RunRecord[] {
  const runs = (plant as { runs?: unknown } | null)?.runs;
  if (!Array.isArray(runs)) return [];
  return runs.flatMap((raw): RunRecord[] => {
    const parsed = runSchema.safeParse(raw);
    const run = (parsed.success ? parsed.data : raw) as Record<string, unknown> | null;
    if (!run || typeof run.id !== 'string') return [];
    return [{ ...run, id: run.id, label: typeof run.label === 'string' ? run.label : run.id }];
  });
}

const record = (value: unknown): Record<string, unknown> => (typeof value === 'object' && value !== null ? (value as Record<string, unknown>) : {});
const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const str = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const int = (value: unknown): number => (typeof value === 'number' && Number.isInteger(value) ? value : 0);

type Values = { [F in InputField]: Extract<InputChange, { field: F }>['before'] };

/** Every compared input of a run, read from the run and (for the air it sits in) its result. */
function inputsOf(run: RunRecord, estimate: RunEstimate | undefined): Values {
  const measurements = record(run.measurements);
  const current = record(run.current);
  const state = current.state === 'damaged' || current.state === 'insulated' ? current.state : 'bare';
  const pipe = record(run.pipe);
  const steam = run.service === 'steam';
  const measuredLength = num(measurements.lengthM);
  const surface = num(measurements.surfaceTemperatureC);
  const method = measurements.surfaceMethod === 'infrared' ? 'infrared' : 'contact';
  const condition = current.condition === 'wet' || current.condition === 'crushed' ? current.condition : 'sound';
  return {
    label: run.label,
    service: str(run.service),
    length: { lengthM: measuredLength ?? num(run.lengthM) ?? 0, measured: measuredLength !== null || run.lengthConfidence === 'measured' },
    pipe: {
      standard: str(pipe.standard),
      size: str(pipe.size),
      schedule: str(pipe.schedule),
      material: str(pipe.material),
      outerDiameterM: num(pipe.outerDiameterM),
    },
    line: steam
      ? { steamGaugePressureKPa: num(run.steamGaugePressureKPa), fluidTemperatureC: null }
      : { steamGaugePressureKPa: null, fluidTemperatureC: num(run.fluidTemperatureC) },
    lagging: { state, material: state === 'bare' ? null : str(current.material), thicknessM: state === 'bare' ? null : num(current.thicknessM) },
    bareFraction: state === 'damaged' ? num(current.bareFraction) : null,
    laggingCondition: state === 'bare' ? null : condition,
    jacket: state === 'bare' ? null : str(current.jacket),
    fittings: {
      valves: int(run.valves),
      flangePairs: int(run.flangePairs),
      covered: run.fittingsInsulated === true,
      others: (Array.isArray(run.fittings) ? run.fittings : []).map((f) => {
        const fitting = record(f);
        return { type: str(fitting.type) ?? 'unknown', count: int(fitting.count), covered: fitting.covered === true };
      }),
    },
    room: estimate
      ? {
          areaId: estimate.areaId,
          airTemperatureC: estimate.air.temperatureC,
          relativeHumidityPercent: estimate.air.relativeHumidityPercent,
          airSpeedMPerS: estimate.air.speedMPerS,
        }
      : null,
    surfaceReading:
      surface === null
        ? null
        : {
            surfaceTemperatureC: surface,
            method,
            infraredEmittanceSetting: method === 'infrared' ? num(measurements.infraredEmittanceSetting) : null,
            airTemperatureC: num(measurements.airTemperatureC),
          },
  };
}

/** Whether two numbers are the same figure (stored JSON and a fresh computation may differ in the last bits). */
export function sameNumber(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

/** Deep equality of plain values, numbers compared with {@link sameNumber}. */
export function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return sameNumber(a, b);
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return a === b;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((item, i) => sameValue(item, b[i]));
  const left = a as Record<string, unknown>;
  const right = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(left), ...Object.keys(right)]);
  return [...keys].every((key) => sameValue(left[key], right[key]));
}

const INPUT_ORDER: readonly InputField[] = [
  'label',
  'service',
  'length',
  'pipe',
  'line',
  'lagging',
  'bareFraction',
  'laggingCondition',
  'jacket',
  'fittings',
  'room',
  'surfaceReading',
];

function inputChanges(before: Values | null, after: Values | null): InputChange[] {
  return INPUT_ORDER.flatMap((field) => {
    const a = before ? before[field] : null;
    const b = after ? after[field] : null;
    if (sameValue(a, b)) return [];
    return [{ field, before: a, after: b } as InputChange];
  });
}

function runFigure(estimate: RunEstimate, figure: (typeof runFigureIds)[number]): number | null {
  switch (figure) {
    case 'heatLossWPerM':
      return estimate.current.heatLossWPerM;
    case 'annualHeatGJ':
      return estimate.current.annualHeatGJ;
    case 'annualCost':
      return estimate.current.annualCost;
    case 'annualSaving':
      return estimate.savings.annualCost;
    case 'installedCost':
      return estimate.installedCost;
    case 'paybackYears':
      return estimate.simplePaybackYears;
    case 'surfaceTemperatureC':
      return estimate.current.surfaceTemperatureC;
  }
}

function runFigures(before: RunEstimate | undefined, after: RunEstimate | undefined): RunFigureChange[] {
  return runFigureIds.map((figure) => ({
    figure,
    before: before ? runFigure(before, figure) : null,
    after: after ? runFigure(after, figure) : null,
  }));
}

function totalFigure(result: PlantResult, figure: (typeof totalFigureIds)[number]): number | null {
  switch (figure) {
    case 'annualCost':
      return result.range.currentAnnualCost.likely;
    case 'annualHeatGJ':
      return result.range.currentAnnualHeatGJ.likely;
    case 'annualCo2Kg':
      return result.range.currentAnnualCo2Kg.likely;
    case 'annualSaving':
      return result.range.annualCostSaving.likely;
    case 'installedCost':
      return result.totals.installedCost;
    case 'paybackYears':
      return result.totals.simplePaybackYears;
    case 'runsWithHazards':
      return result.runs.filter((run) => run.hazards.length > 0).length;
  }
}

/** Relative change in a figure under which it counts as unmoved (a tenth of a per cent). */
const FIGURE_MOVE = 1e-3;

function figuresMoved(figures: readonly RunFigureChange[]): boolean {
  return figures.some(({ before, after }) => {
    if (before === null || after === null) return before !== after;
    return Math.abs(after - before) > FIGURE_MOVE * Math.max(Math.abs(before), Math.abs(after), 1e-9);
  });
}

const hazardCodes = (estimate: RunEstimate | undefined): string[] => (estimate ? [...new Set(estimate.hazards.map((h) => h.code))] : []);

/** The diff of two states of the inventory: `from` the earlier, `to` the later. */
export function diffStates(from: InventoryState, to: InventoryState): RevisionDiff {
  const beforeRuns = runsOf(from.plant);
  const afterRuns = runsOf(to.plant);
  const beforeById = new Map(beforeRuns.map((run) => [run.id, run]));
  const afterIds = new Set(afterRuns.map((run) => run.id));
  const estimateIn = (result: PlantResult, id: string) => result.runs.find((run) => run.id === id);

  const describe = (before: RunRecord | undefined, after: RunRecord | undefined): RunDiff => {
    const id = (after ?? before)!.id;
    const beforeEstimate = before ? estimateIn(from.result, id) : undefined;
    const afterEstimate = after ? estimateIn(to.result, id) : undefined;
    const inputs = inputChanges(before ? inputsOf(before, beforeEstimate) : null, after ? inputsOf(after, afterEstimate) : null);
    const figures = runFigures(beforeEstimate, afterEstimate);
    const status: RunDiff['status'] = !before ? 'added' : !after ? 'removed' : inputs.length > 0 ? 'changed' : 'unchanged';
    return {
      runId: id,
      label: (after ?? before)!.label,
      status,
      inputs,
      figures,
      figuresMoved: status === 'unchanged' && figuresMoved(figures),
      hazards: { before: hazardCodes(beforeEstimate), after: hazardCodes(afterEstimate) },
      changedIn: status === 'unchanged' ? [] : [to.number],
    };
  };

  const runs = [
    ...afterRuns.map((run) => describe(beforeById.get(run.id), run)),
    ...beforeRuns.filter((run) => !afterIds.has(run.id)).map((run) => describe(run, undefined)),
  ];
  const totals: TotalFigureChange[] = totalFigureIds.map((figure) => ({
    figure,
    before: totalFigure(from.result, figure),
    after: totalFigure(to.result, figure),
  }));
  const count = (status: RunDiff['status']) => runs.filter((run) => run.status === status).length;
  return {
    fromNumber: from.number,
    toNumber: to.number,
    runs,
    totals,
    lossRange: { before: { ...from.result.range.currentAnnualCost }, after: { ...to.result.range.currentAnnualCost } },
    counts: { changed: count('changed'), unchanged: count('unchanged'), added: count('added'), removed: count('removed') },
  };
}

/**
 * The first state against the last of a history (oldest first), each run telling which of the
 * saves between them changed it — so the page can say who changed what, and when.
 */
export function diffHistory(states: readonly InventoryState[]): RevisionDiff {
  const first = states[0];
  const last = states[states.length - 1];
  if (!first || !last) throw new RangeError('a history needs at least one state');
  const overall = diffStates(first, last);
  const changedIn = new Map<string, number[]>();
  for (let i = 1; i < states.length; i++) {
    for (const run of diffStates(states[i - 1]!, states[i]!).runs) {
      if (run.status === 'unchanged') continue;
      changedIn.set(run.runId, [...(changedIn.get(run.runId) ?? []), states[i]!.number]);
    }
  }
  return { ...overall, runs: overall.runs.map((run) => ({ ...run, changedIn: changedIn.get(run.runId) ?? [] })) };
}

/** A few words on what a revision changed, for its activity entry and timeline. */
export function diffSummary(diff: RevisionDiff): { changed: number; added: number; removed: number; runs: string[] } {
  const touched = diff.runs.filter((run) => run.status !== 'unchanged');
  return { changed: diff.counts.changed, added: diff.counts.added, removed: diff.counts.removed, runs: touched.map((run) => run.label) };
}
