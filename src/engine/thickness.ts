import { EngineError } from './errors';
import { runInputSchema, type InsulationLayerInput, type RunInput } from './run-input';
import { prepareRun } from './run';
import { solveResolvedRun } from './run-solver';

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
  const candidates: ThicknessCandidate[] = [];
  let found: number | null = null;
  let guess: number | undefined;
  for (const thicknessM of [...candidateThicknessesM].sort((a, b) => a - b)) {
    const parsed = runInputSchema.safeParse({ ...input, insulation: [{ ...layer, thicknessM }] });
    if (!parsed.success) {
      throw new EngineError(
        'INVALID_INPUT',
        parsed.error.issues.map((i) => i.message).join(' '),
        parsed.error.issues.map((i) => ({
          path: i.path.filter((p): p is string | number => typeof p !== 'symbol'),
          message: i.message,
        })),
      );
    }
    const solution = solveResolvedRun(prepareRun(parsed.data).resolved, guess);
    guess = solution.surfaceTemperatureC;
    candidates.push({ thicknessM, surfaceTemperatureC: solution.surfaceTemperatureC, heatLossWPerM: solution.heatLossWPerM });
    if (found === null && meets(solution.surfaceTemperatureC)) found = thicknessM;
  }
  return { candidates, thicknessM: found };
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
  if (!parsed.success) {
    throw new EngineError('INVALID_INPUT', parsed.error.issues.map((i) => i.message).join(' '));
  }
  const dew = prepareRun(parsed.data).dewPointC;
  if (dew === null) {
    throw new EngineError('INVALID_INPUT', 'Condensation control needs the relative humidity of the air around the run.');
  }
  const limitC = dew + (options.marginK ?? 0);
  const { candidates, thicknessM } = searchCandidates(input, options.layer, options.candidateThicknessesM, (s) => s >= limitC);
  return { thicknessM, limitC, candidates };
}
