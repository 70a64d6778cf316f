import { findInsulationMaterial, findPipeMaterial, findPipeStandard, findSurface, lookupPipe } from './catalogue';
import { constantConductivity } from './conductivity';
import type { InsulationMaterial } from './data/insulation-materials';
import { EngineError, invalidInput } from './errors';
import { CONDENSING_STEAM_FILM_W_PER_M2K, liquidFilmCoefficientWPerM2K } from './inside-film';
import { dewPointC, vapourPressureKPa } from './psychrometrics';
import { runInputSchema, type ParsedRunInput, type RunInput } from './run-input';
import { solveResolvedRun, type CoreSolution, type ResolvedLayer, type ResolvedRun } from './run-solver';
import { formatNumber } from './schema-helpers';
import { saturatedSteamAtGauge, type SteamState } from './steam-properties';
import { STANDARD_ATMOSPHERE_KPA } from './physical-constants';

/** Codes of the cautions a run result can carry. */
export type RunWarningCode =
  | 'MATERIAL_ABOVE_SERVICE_LIMIT'
  | 'MATERIAL_BELOW_SERVICE_LIMIT'
  | 'SURFACE_ABOVE_TOUCH_LIMIT'
  | 'SURFACE_BELOW_DEW_POINT'
  | 'INSULATION_BELOW_CRITICAL_RADIUS'
  | 'RAYLEIGH_BEYOND_CORRELATION'
  | 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT'
  | 'BARE_FITTINGS_BELOW_DEW_POINT';

/** A caution: a stable code for programs and a sentence for people. */
export interface RunWarning {
  readonly code: RunWarningCode;
  readonly message: string;
  /** Index of the insulation layer concerned, when there is one. */
  readonly layer?: number;
}

/** Resistances in series per meter of run, m·K/W. */
export interface RunResistances {
  readonly insideFilmMKPerW: number;
  readonly pipeWallMKPerW: number;
  readonly layersMKPerW: readonly number[];
  readonly surfaceMKPerW: number;
  readonly totalMKPerW: number;
}

/** The solved run, per meter of length. Heat loss is negative for heat gain (cold lines). */
export interface RunResult {
  readonly heatLossWPerM: number;
  readonly surfaceTemperatureC: number;
  /** Fluid, inner wall, outer wall, then the outer face of each layer (the last is the surface). */
  readonly interfaceTemperaturesC: readonly number[];
  /** Diameters of the faces after the fluid (inner wall, outer wall, each layer's outer face), m. */
  readonly interfaceDiametersM: readonly number[];
  readonly layerMeanConductivitiesWPerMK: readonly number[];
  readonly convectionCoefficientWPerM2K: number;
  readonly radiationCoefficientWPerM2K: number;
  readonly surfaceCoefficientWPerM2K: number;
  readonly insideFilmWPerM2K: number;
  /** Latent heat of vapor condensing (or frosting) on a surface below the dew point, W/m. */
  readonly latentGainWPerM: number;
  readonly resistances: RunResistances;
  /** Overall coefficient on the inner pipe area, W/(m²·K). */
  readonly uInnerWPerM2K: number;
  /** Overall coefficient on the outer surface area, W/(m²·K). */
  readonly uOuterWPerM2K: number;
  readonly innerDiameterM: number;
  readonly pipeOuterDiameterM: number;
  readonly surfaceDiameterM: number;
  readonly fluidTemperatureC: number;
  readonly ambientTemperatureC: number;
  readonly surfaceEmittance: number;
  readonly steam?: {
    readonly absolutePressureKPa: number;
    readonly saturationTemperatureC: number;
    readonly latentHeatJPerKg: number;
  };
  readonly dewPointC?: number;
  readonly iterations: number;
  readonly warnings: readonly RunWarning[];
}

/** A parsed run with its resolved numbers and the context its warnings need. */
export interface PreparedRun {
  readonly resolved: ResolvedRun;
  readonly layerMaterials: readonly (InsulationMaterial | null)[];
  readonly steam: SteamState | null;
  readonly dewPointC: number | null;
  readonly touchLimitC: number;
}

/** Resolves catalog look-ups and defaults of a parsed run into numbers. */
export function prepareRun(run: ParsedRunInput): PreparedRun {
  let outerDiameterM: number;
  let wallThicknessM: number;
  let conductivityWPerMK: number;
  let bareEmittance = 0.8;
  if ('outerDiameterM' in run.pipe) {
    ({ outerDiameterM, wallThicknessM, conductivityWPerMK } = run.pipe);
  } else {
    const dims = lookupPipe(run.pipe.standard, run.pipe.size, run.pipe.schedule);
    outerDiameterM = dims.outerDiameterM;
    wallThicknessM = dims.wallThicknessM;
    const materialId = run.pipe.material ?? findPipeStandard(run.pipe.standard)?.defaultMaterial ?? 'carbon-steel';
    const material = findPipeMaterial(materialId);
    if (!material) throw new EngineError('UNKNOWN_MATERIAL', `Unknown pipe material "${materialId}".`);
    conductivityWPerMK = material.conductivityWPerMK;
    bareEmittance = findSurface(material.bareSurface)?.emittance ?? 0.8;
  }
  const innerDiameterM = outerDiameterM - 2 * wallThicknessM;

  let steam: SteamState | null = null;
  let fluidC: number;
  if (run.steam) {
    steam = saturatedSteamAtGauge(run.steam.gaugePressureKPa, run.steam.atmosphericPressureKPa ?? STANDARD_ATMOSPHERE_KPA);
    fluidC = steam.saturationTemperatureC;
  } else {
    fluidC = run.fluidTemperatureC as number;
  }

  const insideFilm =
    run.insideFilmWPerM2K ??
    (steam
      ? CONDENSING_STEAM_FILM_W_PER_M2K
      : liquidFilmCoefficientWPerM2K(
          run.fluid?.kind ?? 'water',
          fluidC,
          run.fluid?.velocityMPerS ?? 1,
          innerDiameterM,
          run.runLengthM,
        ));

  const layerMaterials: (InsulationMaterial | null)[] = [];
  const layers: ResolvedLayer[] = run.insulation.map((layer) => {
    if (layer.material !== undefined) {
      const material = findInsulationMaterial(layer.material);
      if (!material) throw new EngineError('UNKNOWN_MATERIAL', `Unknown insulation material "${layer.material}".`);
      layerMaterials.push(material);
      return { thicknessM: layer.thicknessM, curve: material.conductivity };
    }
    layerMaterials.push(null);
    return { thicknessM: layer.thicknessM, curve: constantConductivity(layer.conductivityWPerMK as number) };
  });

  const emittance =
    run.surfaceEmittance ??
    (run.surface !== undefined ? (findSurface(run.surface)?.emittance ?? 0.9) : layers.length > 0 ? 0.9 : bareEmittance);

  const resolved: ResolvedRun = {
    fluidTemperatureC: fluidC,
    pipeOuterDiameterM: outerDiameterM,
    pipeInnerDiameterM: innerDiameterM,
    pipeConductivityWPerMK: conductivityWPerMK,
    insideFilmWPerM2K: insideFilm,
    layers,
    ambientTemperatureC: run.ambientTemperatureC,
    surroundingsTemperatureC: run.surroundingsTemperatureC ?? run.ambientTemperatureC,
    windSpeedMPerS: run.windSpeedMPerS,
    orientation: run.orientation,
    runHeightM: run.runHeightM,
    surfaceEmittance: emittance,
    fixedSurfaceCoefficientWPerM2K: run.surfaceCoefficientWPerM2K ?? null,
    fixedConvectionCoefficientWPerM2K: run.convectionCoefficientWPerM2K ?? null,
    airVapourPressureKPa:
      run.relativeHumidityPercent !== undefined ? vapourPressureKPa(run.ambientTemperatureC, run.relativeHumidityPercent) : null,
  };
  const dew =
    run.relativeHumidityPercent !== undefined ? dewPointC(run.ambientTemperatureC, run.relativeHumidityPercent) : null;
  return { resolved, layerMaterials, steam, dewPointC: dew, touchLimitC: run.touchLimitC };
}

function warningsFor(prepared: PreparedRun, solution: CoreSolution): RunWarning[] {
  const warnings: RunWarning[] = [];
  const temps = solution.interfaceTemperaturesC;
  prepared.layerMaterials.forEach((material, j) => {
    if (!material) return;
    const inner = temps[j + 2] as number;
    const outer = temps[j + 3] as number;
    const hottest = Math.max(inner, outer);
    const coldest = Math.min(inner, outer);
    if (hottest > material.serviceMaxC) {
      warnings.push({
        code: 'MATERIAL_ABOVE_SERVICE_LIMIT',
        layer: j,
        message: `${material.name} in layer ${j + 1} reaches ${formatNumber(Math.round(hottest))} °C, above its ${material.serviceMaxC} °C rating; use a material rated for that temperature next to the pipe.`,
      });
    }
    if (coldest < material.serviceMinC) {
      warnings.push({
        code: 'MATERIAL_BELOW_SERVICE_LIMIT',
        layer: j,
        message: `${material.name} in layer ${j + 1} falls to ${formatNumber(Math.round(coldest))} °C, below its ${material.serviceMinC} °C rating.`,
      });
    }
  });
  const surfaceC = solution.surfaceTemperatureC;
  if (surfaceC > prepared.touchLimitC) {
    warnings.push({
      code: 'SURFACE_ABOVE_TOUCH_LIMIT',
      message: `The surface runs at about ${Math.round(surfaceC)} °C, above the ${prepared.touchLimitC} °C touch limit (ASTM C1055 basis): it can burn on contact.`,
    });
  }
  if (prepared.dewPointC !== null && surfaceC < prepared.dewPointC) {
    warnings.push({
      code: 'SURFACE_BELOW_DEW_POINT',
      message: `The surface runs at about ${formatNumber(Math.round(surfaceC * 10) / 10)} °C, below the air's dew point of ${formatNumber(Math.round(prepared.dewPointC * 10) / 10)} °C: it will sweat (or frost) unless insulated with a vapor retarder.`,
    });
  }
  const layers = prepared.resolved.layers;
  const outerK = solution.layerMeanConductivitiesWPerMK[layers.length - 1];
  if (outerK !== undefined) {
    const h = solution.convectionCoefficientWPerM2K + solution.radiationCoefficientWPerM2K;
    if (solution.surfaceDiameterM / 2 < outerK / h) {
      warnings.push({
        code: 'INSULATION_BELOW_CRITICAL_RADIUS',
        message: `The insulated radius is below the critical radius (k/h ≈ ${formatNumber(Math.round((outerK / h) * 1000))} mm): at this size a thin layer adds surface faster than resistance, so a little more insulation would raise the heat flow.`,
      });
    }
  }
  if (prepared.resolved.orientation === 'horizontal' && solution.rayleighNumber > 1e12) {
    warnings.push({
      code: 'RAYLEIGH_BEYOND_CORRELATION',
      message: 'The pipe is beyond the range of the natural-convection correlation (Rayleigh number above 10¹²); treat the result as approximate.',
    });
  }
  return warnings;
}

/** Solves a prepared run and assembles the public result. */
export function solvePreparedRun(prepared: PreparedRun, guessSurfaceC?: number): RunResult {
  const run = prepared.resolved;
  const s = solveResolvedRun(run, guessSurfaceC);
  if (!Number.isFinite(s.heatLossWPerM) || !Number.isFinite(s.surfaceTemperatureC)) {
    throw new EngineError('NON_FINITE_RESULT', 'The calculation gave no finite answer for this run; check its inputs.');
  }
  const total = s.totalResistanceMKPerW;
  const result: RunResult = {
    heatLossWPerM: s.heatLossWPerM,
    surfaceTemperatureC: s.surfaceTemperatureC,
    interfaceTemperaturesC: s.interfaceTemperaturesC,
    interfaceDiametersM: s.interfaceDiametersM,
    layerMeanConductivitiesWPerMK: s.layerMeanConductivitiesWPerMK,
    convectionCoefficientWPerM2K: s.convectionCoefficientWPerM2K,
    radiationCoefficientWPerM2K: s.radiationCoefficientWPerM2K,
    surfaceCoefficientWPerM2K: s.convectionCoefficientWPerM2K + s.radiationCoefficientWPerM2K,
    insideFilmWPerM2K: run.insideFilmWPerM2K,
    latentGainWPerM: s.latentGainWPerM,
    resistances: {
      insideFilmMKPerW: s.insideFilmResistanceMKPerW,
      pipeWallMKPerW: s.wallResistanceMKPerW,
      layersMKPerW: s.layerResistancesMKPerW,
      surfaceMKPerW: s.surfaceResistanceMKPerW,
      totalMKPerW: total,
    },
    uInnerWPerM2K: 1 / (total * Math.PI * run.pipeInnerDiameterM),
    uOuterWPerM2K: 1 / (total * Math.PI * s.surfaceDiameterM),
    innerDiameterM: run.pipeInnerDiameterM,
    pipeOuterDiameterM: run.pipeOuterDiameterM,
    surfaceDiameterM: s.surfaceDiameterM,
    fluidTemperatureC: run.fluidTemperatureC,
    ambientTemperatureC: run.ambientTemperatureC,
    surfaceEmittance: run.surfaceEmittance,
    ...(prepared.steam
      ? {
          steam: {
            absolutePressureKPa: prepared.steam.absolutePressureKPa,
            saturationTemperatureC: prepared.steam.saturationTemperatureC,
            latentHeatJPerKg: prepared.steam.latentHeatJPerKg,
          },
        }
      : {}),
    ...(prepared.dewPointC !== null ? { dewPointC: prepared.dewPointC } : {}),
    iterations: s.iterations,
    warnings: warningsFor(prepared, s),
  };
  return result;
}

/**
 * Heat loss (or gain) of one straight run, per meter, steady state: inside film,
 * pipe wall, each insulation layer with k̄ over its own temperature span (ASTM
 * C680 approach), and convection plus radiation at the surface.
 *
 * @throws EngineError INVALID_INPUT (with every issue and its path) when the input
 *   is refused; NO_CONVERGENCE if the surface balance cannot be solved.
 */
export function solveRun(input: RunInput): RunResult {
  const parsed = runInputSchema.safeParse(input);
  if (!parsed.success) throw invalidInput(parsed.error);
  return solvePreparedRun(prepareRun(parsed.data));
}
