import { findSurface } from './catalogue';
import type { ParsedPlantRun } from './plant-input';
import { vapourPressureKPa } from './psychrometrics';
import type { PreparedRun } from './run';
import { solveLean, type ResolvedLayer } from './run-solver';
import { ZERO_CELSIUS_K } from './physical-constants';

/** What a run's site readings tell the estimate. */
export interface MeasurementReading {
  /** Loss per meter from the surface balance at the measured surface and air, W/m. */
  readonly measuredHeatLossWPerM: number | null;
  /** The surface temperature, corrected for the infrared thermometer's emittance setting, °C. */
  readonly surfaceTemperatureC: number | null;
  /** The line temperature a bare-pipe reading implies, °C. */
  readonly lineTemperatureC: number | null;
  /** Measured ÷ modeled loss of insulation in place, where the surface is far enough from the air. */
  readonly conditionFactor: number | null;
  /** The insulated surface read too close to the air to judge its condition. */
  readonly closeToAir: boolean;
}

/** Readings closer to the air than this say little about insulation (method.md: trusted where T_s − T_a > ~10 K). */
const MIN_DIFFERENCE_K = 10;
/** An inside film so large its resistance vanishes, for solving the surface balance at a given surface temperature. */
const NO_FILM_W_PER_M2K = 1e12;

/**
 * The true surface temperature behind an infrared reading taken with the thermometer set to
 * `emittanceSetting` on a surface of emittance `emittance`, reflected surroundings at
 * `reflectedC` — the broadband radiometric balance ε_set·T_read⁴ + (1 − ε_set)·T_refl⁴ =
 * ε·T⁴ + (1 − ε)·T_refl⁴ (a band-limited instrument differs somewhat; common practice).
 */
export function infraredCorrectedC(readingC: number, emittanceSetting: number, emittance: number, reflectedC: number): number {
  const read4 = (readingC + ZERO_CELSIUS_K) ** 4;
  const refl4 = (reflectedC + ZERO_CELSIUS_K) ** 4;
  const true4 = (emittanceSetting * read4 + (emittance - emittanceSetting) * refl4) / emittance;
  return Math.sqrt(Math.sqrt(Math.max(true4, 0))) - ZERO_CELSIUS_K;
}

/**
 * Interprets a run's measurements: on bare pipe, q′ = πD[h_c(T_s, T_a, D, V)(T_s − T_a) +
 * εσ(T_s⁴ − T_sur⁴)] from the measured surface and air, and the line temperature back through
 * the wall and inside film; on insulated pipe, the ratio of that loss to the model's at the
 * same air (method.md, "Judgment around the physics").
 *
 * @param existingLayers the run's insulation today, or null for bare pipe
 */
export function interpretMeasurements(
  run: ParsedPlantRun,
  prepared: PreparedRun,
  bareEmittance: number,
  existingLayers: readonly ResolvedLayer[] | null,
): MeasurementReading | null {
  const m = run.measurements;
  if (!m || m.surfaceTemperatureC === undefined || m.airTemperatureC === undefined) return null;
  const base = prepared.resolved;
  const insulated = existingLayers !== null && run.current.state === 'insulated';
  const emittance = insulated && run.current.state === 'insulated' ? (findSurface(run.current.jacket)?.emittance ?? 0.9) : bareEmittance;
  const surfaceC =
    m.surfaceMethod === 'infrared' && m.infraredEmittanceSetting !== undefined
      ? infraredCorrectedC(m.surfaceTemperatureC, m.infraredEmittanceSetting, emittance, m.airTemperatureC)
      : m.surfaceTemperatureC;
  let diameter = base.pipeOuterDiameterM;
  if (insulated) for (const layer of existingLayers) diameter += 2 * layer.thicknessM;
  const airC = m.airTemperatureC;
  const speed = m.airSpeedMPerS ?? base.windSpeedMPerS;
  const measured = solveLean({
    ...base,
    fluidTemperatureC: surfaceC,
    pipeOuterDiameterM: diameter,
    pipeInnerDiameterM: diameter,
    insideFilmWPerM2K: NO_FILM_W_PER_M2K,
    layers: [],
    ambientTemperatureC: airC,
    surroundingsTemperatureC: airC,
    windSpeedMPerS: speed,
    surfaceEmittance: emittance,
    airVapourPressureKPa: m.relativeHumidityPercent !== undefined ? vapourPressureKPa(airC, m.relativeHumidityPercent) : null,
  }).heatLossWPerM;
  if (!insulated) {
    const film = 1 / (base.insideFilmWPerM2K * Math.PI * base.pipeInnerDiameterM);
    const wall = base.pipeOuterDiameterM > base.pipeInnerDiameterM ? Math.log(base.pipeOuterDiameterM / base.pipeInnerDiameterM) / (2 * Math.PI * base.pipeConductivityWPerMK) : 0;
    return { measuredHeatLossWPerM: measured, surfaceTemperatureC: surfaceC, lineTemperatureC: surfaceC + measured * (film + wall), conditionFactor: null, closeToAir: false };
  }
  if (Math.abs(surfaceC - airC) <= MIN_DIFFERENCE_K) {
    return { measuredHeatLossWPerM: measured, surfaceTemperatureC: surfaceC, lineTemperatureC: null, conditionFactor: null, closeToAir: true };
  }
  const model = solveLean({
    ...base,
    layers: existingLayers,
    ambientTemperatureC: airC,
    surroundingsTemperatureC: airC,
    windSpeedMPerS: speed,
    surfaceEmittance: emittance,
    airVapourPressureKPa: null,
  }).heatLossWPerM;
  const factor = Math.abs(model) > 1e-9 ? measured / model : null;
  return { measuredHeatLossWPerM: measured, surfaceTemperatureC: surfaceC, lineTemperatureC: null, conditionFactor: factor !== null && factor > 0 ? factor : null, closeToAir: false };
}
