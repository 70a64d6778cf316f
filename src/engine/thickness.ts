import { EngineError, invalidInput } from './errors';
import { walkStockSeries } from './least-thickness';
import { runInputSchema, type InsulationLayerInput, type RunInput } from './run-input';
import { prepareRun } from './run';
import type { ResolvedLayer } from './run-solver';

/** One stock thickness tried by a search. */
export interface ThicknessCandidate {
  readonly thicknessM: number;
  readonly surfaceTemperatureC: number;
  readonly heatLossWPerM: number;
}

/** The least stock thickness meeting a surface-temperature limit, or null when none does. */
export interface ThicknessSearchResult {
  readonly thicknessM: number | null;
  /** The surface limit searched for, °C (touch limit, or dew point plus margin). */
  readonly limitC: number;
  readonly candidates: readonly ThicknessCandidate[];
}

/** The layer a search adds, without its thickness. */
export type SearchLayer = Omit<InsulationLayerInput, 'thicknessM'>;

function searchCandidates(
  input: RunInput,
  layer: SearchLayer,
  candidateThicknessesM: readonly number[],
  meets: (surfaceC: number) => boolean,
): { candidates: ThicknessCandidate[]; thicknessM: number | null } {
  const sorted = [...candidateThicknessesM].sort((a, b) => a - b);
  // Parse once with the first thickness (the layer's checks do not depend on it), then walk the series.
  const parsed = runInputSchema.safeParse({ ...input, insulation: [{ ...layer, thicknessM: sorted[0] }] });
  if (!parsed.success) throw invalidInput(parsed.error);
  const resolved = prepareRun(parsed.data).resolved;
  const curve = (resolved.layers[0] as ResolvedLayer).curve;
  const points = walkStockSeries({
    thicknessesM: sorted,
    runAt: (thicknessM) => ({ ...resolved, layers: [{ thicknessM, curve }] }),
    designRunAt: null,
    meets,
  });
  const candidates = points.map((p) => ({ thicknessM: p.thicknessM, surfaceTemperatureC: p.surfaceTemperatureC, heatLossWPerM: p.heatLossWPerM }));
  return { candidates, thicknessM: points.find((p) => p.meets)?.thicknessM ?? null };
}

/**
 * Least thickness from a stock series that keeps the surface at or below the touch
 * limit (60 °C by default: the usual personnel-protection design criterion drawn
 * from ASTM C1055's burn thresholds — common practice). A flag with cautions, not
 * an approval.
 */
export function personnelProtectionThickness(
  input: RunInput,
  options: { readonly layer: SearchLayer; readonly candidateThicknessesM: readonly number[]; readonly touchLimitC?: number },
): ThicknessSearchResult {
  const limitC = options.touchLimitC ?? 60;
  const { candidates, thicknessM } = searchCandidates(input, options.layer, options.candidateThicknessesM, (s) => s <= limitC);
  return { thicknessM, limitC, candidates };
}

/**
 * Least thickness from a stock series that keeps a cold line's surface at or above
 * the air's dew point plus a margin (the run must give its relative humidity).
 */
export function condensationControlThickness(
  input: RunInput,
  options: { readonly layer: SearchLayer; readonly candidateThicknessesM: readonly number[]; readonly marginK?: number },
): ThicknessSearchResult {
  const parsed = runInputSchema.safeParse(input);
  if (!parsed.success) throw invalidInput(parsed.error);
  const dew = prepareRun(parsed.data).dewPointC;
  if (dew === null) {
    throw new EngineError('INVALID_INPUT', 'Condensation control needs the relative humidity of the air around the run.');
  }
  const limitC = dew + (options.marginK ?? 0);
  const { candidates, thicknessM } = searchCandidates(input, options.layer, options.candidateThicknessesM, (s) => s >= limitC);
  return { thicknessM, limitC, candidates };
}
