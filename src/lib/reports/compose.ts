/**
 * From a report's composition to the engine: the inventory it starts from with each run's
 * recommendation set by the consultant's choices, priced by the consultant's own table (when it
 * is in the plant's currency) or typed prices, then estimated. Also the engine's own suggestion
 * per run — the same inventory and prices without the consultant's changes — so the composer
 * can show it first and ask a reason where the consultant departs from it.
 */
import { estimatePlant, isEngineError, EngineError, type PlantResult, type RunEstimate } from '../../engine';
import type { ReportComposition, RunChoice, RunSuggestion } from '../../schemas/reports';
import { DomainError } from '../errors';
import type { Issue } from '../http';

/** A consultant's stored price table. */
export interface OwnPrices {
  readonly currency: string;
  readonly priceTable: Record<string, unknown>;
}

/** Where the installed prices come from. */
export interface PriceBasis {
  readonly kind: 'own-table' | 'demo-table';
  readonly note: string;
}

export interface ComposedInput {
  readonly input: Record<string, unknown>;
  readonly priceBasis: PriceBasis;
}

interface RunLike {
  id?: unknown;
  label?: unknown;
  proposed?: Record<string, unknown>;
}

const CHOICE_FIELDS = ['option', 'material', 'thicknessM', 'jacket', 'coverFittings', 'price'] as const;

function runsOf(plant: Record<string, unknown>): RunLike[] {
  return Array.isArray(plant.runs) ? (plant.runs as RunLike[]) : [];
}

/** The plant's currency as the engine reads it (USD when the answers name none). */
export function plantCurrency(plant: Record<string, unknown>): string {
  const currency = (plant.energy as { currency?: unknown } | undefined)?.currency;
  return typeof currency === 'string' && currency.trim() ? currency.trim().toUpperCase() : 'USD';
}

function priceBasisOf(plant: Record<string, unknown>, prices: OwnPrices | null): { table: Record<string, unknown> | null; basis: PriceBasis } {
  const currency = plantCurrency(plant);
  if (!prices) {
    return {
      table: null,
      basis: { kind: 'demo-table', note: 'No price table of your own yet: installed costs come from Lagwise’s illustrative demo prices until you save one or type prices per run.' },
    };
  }
  if (prices.currency !== currency) {
    return {
      table: null,
      basis: {
        kind: 'demo-table',
        note: `Your price table is in ${prices.currency} and this plant is priced in ${currency}: installed costs come from the illustrative demo prices; type this plant’s prices per run.`,
      },
    };
  }
  const label = typeof prices.priceTable.label === 'string' ? prices.priceTable.label : 'your price table';
  return { table: prices.priceTable, basis: { kind: 'own-table', note: `Installed costs from ${label} (${prices.currency}), unless typed per run.` } };
}

/** The inventory with the consultant's choices and prices applied, ready for the engine. */
export function composeInput(plant: Record<string, unknown>, composition: Pick<ReportComposition, 'runs'>, prices: OwnPrices | null): ComposedInput {
  const { table, basis } = priceBasisOf(plant, prices);
  const choices = new Map(composition.runs.map((choice) => [choice.runId, choice]));
  const runs = runsOf(plant).map((run) => {
    const choice = typeof run.id === 'string' ? choices.get(run.id) : undefined;
    if (!choice) return run;
    const proposed: Record<string, unknown> = { ...(run.proposed ?? {}) };
    for (const field of CHOICE_FIELDS) {
      if (choice[field] !== undefined) proposed[field] = choice[field];
    }
    return { ...run, proposed };
  });
  const input: Record<string, unknown> = { ...plant, runs };
  if (table) input.priceTable = table;
  else delete input.priceTable;
  return { input, priceBasis: basis };
}

/** Where a plant-input path points in the composition, so a refusal names the composer's field. */
function compositionPath(path: readonly (string | number)[], plant: Record<string, unknown>, composition: Pick<ReportComposition, 'runs'>): string {
  const [head, index, part, field] = path;
  if (head === 'runs' && typeof index === 'number') {
    const runId = runsOf(plant)[index]?.id;
    const choiceIndex = composition.runs.findIndex((c) => c.runId === runId);
    if (choiceIndex >= 0 && part === 'proposed' && typeof field === 'string') return ['runs', choiceIndex, ...path.slice(3)].join('.');
    if (choiceIndex >= 0) return `runs.${choiceIndex}`;
  }
  return `inventory.${path.join('.')}`;
}

/**
 * The engine's estimate of a composed input. A refusal (a material not rated for the line, a
 * price out of range) is INVALID_INPUT with each issue's path in the composition.
 */
export function estimateComposed(composed: ComposedInput, plant: Record<string, unknown>, composition: Pick<ReportComposition, 'runs'>): PlantResult {
  try {
    return estimatePlant(composed.input as never, { detail: 'summary' });
  } catch (error) {
    if (!isEngineError(error)) throw error;
    const issues: Issue[] = error.issues.map((issue) => ({ path: compositionPath(issue.path, plant, composition), message: issue.message }));
    const first = issues[0];
    throw new DomainError('INVALID_INPUT', first ? `${first.path}: ${first.message}` : error.message, first?.path, undefined, issues);
  }
}

function suggestionOf(run: RunEstimate): RunSuggestion {
  return {
    runId: run.id,
    option: run.proposed.option,
    material: run.proposed.material,
    thicknessM: run.proposed.thicknessM,
    jacket: run.proposed.jacket,
    coverFittings: run.proposed.coverFittings,
    installedCost: run.installedCost,
    annualSaving: run.savings.annualCost,
    simplePaybackYears: run.simplePaybackYears,
    choiceCode: run.choice.code,
  };
}

/** The engine's own choice per run, on the consultant's prices, before any change of theirs. */
export function suggestionsFor(plant: Record<string, unknown>, prices: OwnPrices | null): RunSuggestion[] {
  const composed = composeInput(plant, { runs: [] }, prices);
  try {
    return estimatePlant(composed.input as never, { detail: 'summary' }).runs.map(suggestionOf);
  } catch (error) {
    if (error instanceof EngineError || isEngineError(error)) return [];
    throw error;
  }
}

/** Whether a choice changes what the engine suggested for its run (prices alone do not). */
export function departsFromSuggestion(choice: RunChoice, suggestion: RunSuggestion | undefined): boolean {
  if (!suggestion) return false;
  const near = (a: number, b: number) => Math.abs(a - b) < 1e-6;
  return (
    (choice.option !== undefined && choice.option !== suggestion.option) ||
    (choice.material !== undefined && choice.material !== suggestion.material) ||
    (choice.thicknessM !== undefined && !near(choice.thicknessM, suggestion.thicknessM)) ||
    (choice.jacket !== undefined && choice.jacket !== suggestion.jacket) ||
    (choice.coverFittings !== undefined && choice.coverFittings !== suggestion.coverFittings)
  );
}

/** Issues that keep a composition from being used with this inventory: runs and photos it names that are not there. */
export function compositionIssues(plant: Record<string, unknown>, composition: ReportComposition, photoIds: ReadonlySet<string>): Issue[] {
  const runIds = new Set(runsOf(plant).map((r) => r.id).filter((id): id is string => typeof id === 'string'));
  const issues: Issue[] = [];
  const seen = new Set<string>();
  composition.runs.forEach((choice, i) => {
    if (!runIds.has(choice.runId)) issues.push({ path: `runs.${i}.runId`, message: `There is no run “${choice.runId}” in the inventory this report starts from.` });
    else if (seen.has(choice.runId)) issues.push({ path: `runs.${i}.runId`, message: `Run “${choice.runId}” has two choices; keep one.` });
    seen.add(choice.runId);
  });
  composition.findings.forEach((finding, i) => {
    if (finding.runId !== undefined && !runIds.has(finding.runId)) {
      issues.push({ path: `findings.${i}.runId`, message: `There is no run “${finding.runId}” in the inventory this report starts from.` });
    }
  });
  composition.photoIds.forEach((id, i) => {
    if (!photoIds.has(id)) issues.push({ path: `photoIds.${i}`, message: 'This photo is not one of the lead’s photos.' });
  });
  return issues;
}

/** Issues that keep a draft from being sent: a departure from the engine's suggestion with no reason. */
export function sendIssues(plant: Record<string, unknown>, composition: ReportComposition, suggestions: readonly RunSuggestion[]): Issue[] {
  const labels = new Map(runsOf(plant).map((r) => [r.id, typeof r.label === 'string' ? r.label : String(r.id)]));
  const byRun = new Map(suggestions.map((s) => [s.runId, s]));
  const issues: Issue[] = [];
  composition.runs.forEach((choice, i) => {
    if (departsFromSuggestion(choice, byRun.get(choice.runId)) && !choice.reason) {
      issues.push({
        path: `runs.${i}.reason`,
        message: `Say why you changed the suggestion for “${labels.get(choice.runId) ?? choice.runId}”; the owner reads it beside the change.`,
      });
    }
  });
  return issues;
}
