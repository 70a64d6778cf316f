/**
 * The draft as it is sent: the PlantInput POST /api/estimate takes and the body of an
 * assessment, each value's confidence said. Needed only once something is checked or sent,
 * so it loads then (with ./validation, or when the person sends).
 */
import { marketForCountry, serviceDefaults, type PlantInput } from '../../engine';
import type { CreateAssessmentInput } from '../../schemas/assessment';
import { NOTHING_TYPED, withConfidences, type WasTyped } from './confidence';
import type { DraftRun, DraftValues } from './draft';

/** Drops keys whose value is undefined, so the JSON body carries only what was given. */
function withoutUndefined<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

/** One run as it is posted: only the condition its service takes, only the fields its state uses. */
function runForPosting(run: DraftRun, areaIds: ReadonlySet<string>): DraftRun {
  const steam = serviceDefaults(run.service).kind === 'steam';
  const { steamGaugePressureKPa, fluidTemperatureC, areaId, ...rest } = run;
  const ambient = run.ambient;
  const current = run.current;
  return {
    ...rest,
    // An area taken off the list leaves its runs in the plant's own air.
    ...(areaId !== undefined && areaIds.has(areaId) ? { areaId } : {}),
    ...(steam ? { steamGaugePressureKPa } : { fluidTemperatureC }),
    ...(ambient
      ? {
          ambient:
            ambient.kind === 'outdoor'
              ? { kind: 'outdoor', windSpeedMPerS: ambient.windSpeedMPerS }
              : ambient.kind === 'indoor-draughty'
                ? { kind: 'indoor-draughty', airSpeedMPerS: ambient.airSpeedMPerS }
                : { kind: 'indoor-still' },
        }
      : {}),
    ...(current
      ? {
          current:
            current.state === 'bare'
              ? { state: 'bare' }
              : current.state === 'damaged'
                ? {
                    state: 'damaged',
                    bareFraction: current.bareFraction,
                    bareFractionConfidence: current.bareFractionConfidence,
                    material: current.material,
                    thicknessM: current.thicknessM,
                    jacket: current.jacket,
                  }
                : { state: 'insulated', material: current.material, thicknessM: current.thicknessM, jacket: current.jacket },
        }
      : {}),
    ...(current?.state === 'bare' ? { fittingsInsulated: false } : {}),
  };
}

/**
 * The PlantInput the draft describes, as POST /api/estimate takes it. The plant's country
 * sets the market (which stock thicknesses and prices apply); the display units never do.
 */
export function toPlantInput(estimate: PlantInput, countryCode?: string, wasTyped: WasTyped = NOTHING_TYPED): PlantInput {
  const market = estimate.market ?? (countryCode ? marketForCountry(countryCode) : undefined);
  const areaIds = new Set((estimate.areas ?? []).map((area) => area.id));
  const sure = withConfidences(estimate, wasTyped);
  return withoutUndefined({ ...sure, ...(market ? { market } : {}), runs: estimate.runs.map((run) => runForPosting(run, areaIds)) });
}

/** The body of the `assessment` part: the whole draft with the estimate cleaned up and its confidences said. */
export function toAssessmentInput(values: DraftValues, wasTyped: WasTyped = NOTHING_TYPED): CreateAssessmentInput {
  return withoutUndefined({ ...values, estimate: toPlantInput(values.estimate, values.plant?.countryCode, wasTyped) });
}
