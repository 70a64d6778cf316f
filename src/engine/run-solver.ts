import { airPropertiesAt, type AirProperties } from './air-properties';
import { conductivityAt, meanConductivity, temperatureAcrossLayer, type ConductivityCurve } from './conductivity';
import { combineMixedConvection, rayleighNumber } from './convection';
import { EngineError } from './errors';
import { ZERO_CELSIUS_K } from './physical-constants';
import { radiationCoefficientWPerM2K } from './radiation';
import { brentRoot } from './root-finding';
import { condensationFluxKgPerM2S, latentHeatOfDepositionJPerKg } from './latent-gain';
import { dewPointFromVapourKPa } from './psychrometrics';

/** One insulation layer with everything the solver needs. */
export interface ResolvedLayer {
  readonly thicknessM: number;
  readonly curve: ConductivityCurve;
}

/** A run with every property resolved to numbers (SI), ready to solve. */
export interface ResolvedRun {
  readonly fluidTemperatureC: number;
  readonly pipeOuterDiameterM: number;
  readonly pipeInnerDiameterM: number;
  readonly pipeConductivityWPerMK: number;
  readonly insideFilmWPerM2K: number;
  readonly layers: readonly ResolvedLayer[];
  readonly ambientTemperatureC: number;
  readonly surroundingsTemperatureC: number;
  readonly windSpeedMPerS: number;
  readonly orientation: 'horizontal' | 'vertical';
  readonly runHeightM: number;
  readonly surfaceEmittance: number;
  /** Combined outer coefficient fixed by the caller (no separate radiation), or null. */
  readonly fixedSurfaceCoefficientWPerM2K: number | null;
  /** Convection coefficient fixed by the caller (radiation still computed), or null. */
  readonly fixedConvectionCoefficientWPerM2K: number | null;
  /**
   * Water vapour in the air, for latent gain where the surface falls below the dew point:
   * the air's vapour partial pressure, kPa, or null to leave latent heat out.
   */
  readonly airVapourPressureKPa?: number | null;
}

/** The solved state of one run, per metre. */
export interface CoreSolution {
  readonly heatLossWPerM: number;
  readonly surfaceTemperatureC: number;
  /** Fluid, inner wall, outer wall, then the outer face of each layer (last = surface). */
  readonly interfaceTemperaturesC: readonly number[];
  /** Diameters of the faces after the fluid: inner wall, outer wall, each layer's outer face. */
  readonly interfaceDiametersM: readonly number[];
  readonly layerMeanConductivitiesWPerMK: readonly number[];
  readonly convectionCoefficientWPerM2K: number;
  readonly radiationCoefficientWPerM2K: number;
  readonly insideFilmResistanceMKPerW: number;
  readonly wallResistanceMKPerW: number;
  readonly layerResistancesMKPerW: readonly number[];
  readonly surfaceResistanceMKPerW: number;
  readonly totalResistanceMKPerW: number;
  readonly surfaceDiameterM: number;
  readonly rayleighNumber: number;
  /** Latent heat brought in by vapour condensing (or frosting) on the surface, W/m; 0 when dry. */
  readonly latentGainWPerM: number;
  readonly iterations: number;
}

const TWO_PI = 2 * Math.PI;
/** Surface temperature tolerance of the root finder, K. */
const SURFACE_TOLERANCE_K = 1e-7;
/**
 * The balance is met when the fluid temperature a trial surface implies is within this of
 * the real one, K: q′ then balances through every resistance to about 1e-9 of the driving
 * difference.
 */
const IMPLIED_FLUID_TOLERANCE_K = 1e-7;
/** Bound on root-finder iterations; Brent needs about 4–10 here. */
const MAX_ITERATIONS = 200;
const MAX_LAYERS = 8;

/**
 * Everything one solve needs, kept in a single reused record so the root finder's
 * many trials allocate nothing (no closures, no arrays). The engine is synchronous,
 * so one record serves every call.
 */
interface SolverState {
  run: ResolvedRun;
  nLayers: number;
  layerCoefficients: Float64Array;
  innerResistance: number;
  wallResistance: number;
  filmResistance: number;
  fluidC: number;
  ambientC: number;
  surroundingsC: number;
  surroundingsK: number;
  marchLowC: number;
  marchHighC: number;
  perimeter: number;
  surfaceDiameterM: number;
  vertical: boolean;
  naturalLengthM: number;
  fixedCombined: number | null;
  fixedConvection: number | null;
  vapourKPa: number;
  /** Dew point of the air, °C: no vapour condenses on a surface above it. */
  dewC: number;
  slenderFactor: number;
  air: AirProperties;
  lastConvection: number;
  lastRadiation: number;
  lastHeat: number;
  lastRayleigh: number;
  lastLatent: number;
  /** The surface temperature of the last trial, whose figures the `last…` fields hold. */
  lastSurfaceC: number;
}

const state: SolverState = {
  run: undefined as unknown as ResolvedRun,
  nLayers: 0,
  layerCoefficients: new Float64Array(MAX_LAYERS),
  innerResistance: 0,
  wallResistance: 0,
  filmResistance: 0,
  fluidC: 0,
  ambientC: 0,
  surroundingsC: 0,
  surroundingsK: 0,
  marchLowC: 0,
  marchHighC: 0,
  perimeter: 0,
  surfaceDiameterM: 0,
  vertical: false,
  naturalLengthM: 0,
  fixedCombined: null,
  fixedConvection: null,
  vapourKPa: -1,
  dewC: -Infinity,
  slenderFactor: 0,
  air: { kinematicViscosityM2PerS: 0, conductivityWPerMK: 0, prandtl: 0, horizontalShape: 1, verticalShape: 1, crossFlowFactor: 1, slenderB: 0, slenderC: 1 },
  lastConvection: 0,
  lastRadiation: 0,
  lastHeat: 0,
  lastRayleigh: 0,
  lastLatent: 0,
  lastSurfaceC: Number.NaN,
};

function convectionAt(surfaceC: number): number {
  const st = state;
  if (st.fixedConvection !== null) return st.fixedConvection;
  const filmK = 0.5 * (surfaceC + st.ambientC) + ZERO_CELSIUS_K;
  const air = airPropertiesAt(filmK, st.air);
  const nu = air.kinematicViscosityM2PerS;
  const ra = rayleighNumber(surfaceC - st.ambientC, st.naturalLengthM, filmK, nu, air.prandtl);
  st.lastRayleigh = ra;
  // Churchill & Chu (1975): horizontal cylinder on D, or vertical plate on the run height.
  const root =
    (st.vertical ? 0.825 : 0.6) + (0.387 * Math.sqrt(Math.cbrt(ra))) / (st.vertical ? air.verticalShape : air.horizontalShape);
  let naturalNusselt = root * root;
  // A thin vertical run sheds more than a flat plate of its height: Popiel's (2008) slender-
  // cylinder correction of the Churchill–Chu plate value on Gr_L = Ra_L / Pr (see convection.ts).
  if (st.vertical && ra > 0) naturalNusselt *= 1 + air.slenderB * Math.pow(st.slenderFactor / Math.sqrt(Math.sqrt(ra / air.prandtl)), air.slenderC);
  const natural = (naturalNusselt * air.conductivityWPerMK) / st.naturalLengthM;
  // Churchill & Bernstein (1977) in cross-flow; 0.3 alone in still air.
  const reynolds = (st.run.windSpeedMPerS * st.surfaceDiameterM) / nu;
  const forcedNusselt =
    reynolds > 0
      ? 0.3 + 0.62 * Math.sqrt(reynolds) * air.crossFlowFactor * Math.pow(1 + Math.pow(reynolds / 282000, 0.625), 0.8)
      : 0.3;
  const forced = (forcedNusselt * air.conductivityWPerMK) / st.surfaceDiameterM;
  return combineMixedConvection(forced, natural);
}

function heatAt(surfaceC: number): number {
  const st = state;
  if (st.fixedCombined !== null) {
    st.lastConvection = st.fixedCombined;
    st.lastRadiation = 0;
    return st.fixedCombined * st.perimeter * (surfaceC - st.ambientC);
  }
  st.lastConvection = convectionAt(surfaceC);
  st.lastRadiation = radiationCoefficientWPerM2K(st.run.surfaceEmittance, surfaceC + ZERO_CELSIUS_K, st.surroundingsK);
  const sensible = st.perimeter * (st.lastConvection * (surfaceC - st.ambientC) + st.lastRadiation * (surfaceC - st.surroundingsC));
  st.lastLatent = 0;
  if (st.vapourKPa > 0 && surfaceC < st.dewC) {
    // Vapour condensing on a surface below the dew point gives up its latent heat to the line.
    const flux = condensationFluxKgPerM2S(st.lastConvection, st.air, surfaceC, st.ambientC, st.vapourKPa);
    if (flux > 0) st.lastLatent = st.perimeter * flux * latentHeatOfDepositionJPerKg(surfaceC);
  }
  return sensible - st.lastLatent;
}

/** Fluid temperature implied by a trial surface temperature, minus the real one. */
function impliedFluidMinusActual(surfaceC: number): number {
  const st = state;
  const q = heatAt(surfaceC);
  st.lastHeat = q;
  st.lastSurfaceC = surfaceC;
  let t = surfaceC;
  const layers = st.run.layers;
  for (let j = st.nLayers - 1; j >= 0; j--) {
    t = temperatureAcrossLayer((layers[j] as ResolvedLayer).curve, t, q * (st.layerCoefficients[j] as number), st.marchLowC, st.marchHighC);
  }
  return t + q * st.innerResistance - st.fluidC;
}

function findSurface(run: ResolvedRun, guessSurfaceC: number | undefined): { surfaceC: number; iterations: number } {
  const st = state;
  const nLayers = run.layers.length;
  if (nLayers > MAX_LAYERS) {
    throw new EngineError('INVALID_INPUT', `At most ${MAX_LAYERS} insulation layers can be solved.`);
  }
  st.run = run;
  st.nLayers = nLayers;
  let outer = run.pipeOuterDiameterM;
  for (let j = 0; j < nLayers; j++) {
    const next = outer + 2 * (run.layers[j] as ResolvedLayer).thicknessM;
    st.layerCoefficients[j] = Math.log(next / outer) / TWO_PI;
    outer = next;
  }
  const surfaceDiameterM = outer;
  const filmResistance = 1 / (run.insideFilmWPerM2K * Math.PI * run.pipeInnerDiameterM);
  st.wallResistance =
    run.pipeOuterDiameterM > run.pipeInnerDiameterM
      ? Math.log(run.pipeOuterDiameterM / run.pipeInnerDiameterM) / (TWO_PI * run.pipeConductivityWPerMK)
      : 0;
  st.innerResistance = filmResistance + st.wallResistance;
  st.filmResistance = filmResistance;
  const fluidC = run.fluidTemperatureC;
  const ambientC = run.ambientTemperatureC;
  const surroundingsC = run.surroundingsTemperatureC;
  st.fluidC = fluidC;
  st.ambientC = ambientC;
  st.surroundingsC = surroundingsC;
  st.surroundingsK = surroundingsC + ZERO_CELSIUS_K;
  const lowC = Math.min(fluidC, ambientC, surroundingsC);
  const highC = Math.max(fluidC, ambientC, surroundingsC);
  st.marchLowC = lowC - 1;
  st.marchHighC = highC + 1;
  st.surfaceDiameterM = surfaceDiameterM;
  st.perimeter = Math.PI * surfaceDiameterM;
  st.vertical = run.orientation === 'vertical';
  st.naturalLengthM = st.vertical ? run.runHeightM : surfaceDiameterM;
  st.fixedCombined = run.fixedSurfaceCoefficientWPerM2K;
  st.fixedConvection = run.fixedConvectionCoefficientWPerM2K;
  st.vapourKPa =
    run.fixedSurfaceCoefficientWPerM2K === null && run.fixedConvectionCoefficientWPerM2K === null ? (run.airVapourPressureKPa ?? -1) : -1;
  st.dewC = st.vapourKPa > 0 ? dewPointFromVapourKPa(st.vapourKPa) : Number.NEGATIVE_INFINITY;
  // Popiel's slender-cylinder parameter: 32^½ · L/D (the Ra^¼ divides it per trial).
  st.slenderFactor = Math.sqrt(32) * (run.runHeightM / surfaceDiameterM);
  st.lastRayleigh = 0;
  st.lastLatent = 0;

  let surfaceC: number;
  let iterations: number;
  if (highC - lowC < 1e-12) {
    surfaceC = fluidC;
    iterations = 0;
    impliedFluidMinusActual(surfaceC);
  } else {
    let a = lowC;
    let b = highC;
    let fa: number | undefined;
    let fb: number | undefined;
    // Without a warm start, guess the surface from the resistances with k at the mean
    // line/air temperature and a typical still-air coefficient of 10 W/(m²·K).
    let guess = guessSurfaceC;
    if (guess === undefined) {
      const meanC = 0.5 * (fluidC + ambientC);
      let layersR = 0;
      for (let j = 0; j < nLayers; j++) {
        layersR += (st.layerCoefficients[j] as number) / conductivityAt((run.layers[j] as ResolvedLayer).curve, meanC);
      }
      const surfaceR = 1 / ((st.fixedCombined ?? 10) * st.perimeter);
      guess = ambientC + ((fluidC - ambientC) * surfaceR) / (st.innerResistance + layersR + surfaceR);
    }
    if (guess > lowC && guess < highC) {
      // Narrow the bracket around the guess: a few K usually holds the root.
      const fg = impliedFluidMinusActual(guess);
      let step = Math.max(0.25, 0.01 * (highC - lowC));
      // A Newton estimate of the root from the surface's own coefficients: d(implied fluid)/dT_s
      // ≈ 1 + π·D·(1.25·h_c + h_r)·R_inside (natural convection grows as ΔT^¼). The first
      // trial lands just past it, so Brent starts on a bracket a few hundredths of a kelvin wide.
      const q = st.lastHeat;
      if (Math.abs(q) > 1e-9) {
        const insideR = (fg + fluidC - guess) / q;
        const hSlope = st.fixedCombined !== null ? st.fixedCombined : 1.25 * st.lastConvection + st.lastRadiation;
        const slope = 1 + st.perimeter * hSlope * insideR;
        if (slope > 0 && Number.isFinite(slope)) step = Math.max(Math.abs(fg / slope) * 1.02, 1e-6);
      }
      if (fg < 0) {
        a = guess;
        fa = fg;
        for (;;) {
          const trial = a + step;
          if (trial >= highC) break;
          const ft = impliedFluidMinusActual(trial);
          if (ft >= 0) {
            b = trial;
            fb = ft;
            break;
          }
          a = trial;
          fa = ft;
          step *= 4;
        }
      } else {
        b = guess;
        fb = fg;
        for (;;) {
          const trial = b - step;
          if (trial <= lowC) break;
          const ft = impliedFluidMinusActual(trial);
          if (ft <= 0) {
            a = trial;
            fa = ft;
            break;
          }
          b = trial;
          fb = ft;
          step *= 4;
        }
      }
    }
    const result = brentRoot(
      impliedFluidMinusActual,
      a,
      b,
      SURFACE_TOLERANCE_K,
      MAX_ITERATIONS,
      fa ?? impliedFluidMinusActual(a),
      fb ?? impliedFluidMinusActual(b),
      IMPLIED_FLUID_TOLERANCE_K,
    );
    if (!result.converged || !Number.isFinite(result.root)) {
      throw new EngineError(
        'NO_CONVERGENCE',
        'The surface heat balance did not converge for this run; check its temperatures and dimensions.',
      );
    }
    surfaceC = result.root;
    iterations = result.iterations;
    // The state must hold the root's figures; most often the root was the last trial and already does.
    if (st.lastSurfaceC !== surfaceC) impliedFluidMinusActual(surfaceC);
  }
  return { surfaceC, iterations };
}

/** The heat flow and surface temperature of a lean solve (reused; copy what you keep). */
export interface LeanSolution {
  heatLossWPerM: number;
  surfaceTemperatureC: number;
  latentGainWPerM: number;
}

const lean: LeanSolution = { heatLossWPerM: 0, surfaceTemperatureC: 0, latentGainWPerM: 0 };

/**
 * The surface balance alone — heat flow and surface temperature, nothing else — for the
 * many solves of a thickness series, where the full result of every trial is not needed.
 * Returns one reused record: read it before the next solve.
 */
export function solveLean(run: ResolvedRun, guessSurfaceC?: number): LeanSolution {
  const { surfaceC } = findSurface(run, guessSurfaceC);
  lean.heatLossWPerM = state.lastHeat;
  lean.surfaceTemperatureC = surfaceC;
  lean.latentGainWPerM = state.lastLatent;
  return lean;
}

/**
 * Solves the surface heat balance of one run (method.md): per metre, the heat
 * through the inside film, the wall and each layer (k̄ over the layer's own span)
 * equals the heat leaving the surface by convection and radiation. The unknown is
 * the surface temperature; marching inward from a trial surface temperature with
 * the surface's q′ gives the fluid temperature that trial implies, and Brent's
 * method drives that to the real fluid temperature. The implied fluid temperature
 * rises strictly with the trial surface temperature, and the bracket
 * [min, max] of fluid, air and surroundings temperatures always holds the root.
 *
 * @param guessSurfaceC optional warm start (e.g. the previous thickness of a series)
 */
export function solveResolvedRun(run: ResolvedRun, guessSurfaceC?: number): CoreSolution {
  const { surfaceC, iterations } = findSurface(run, guessSurfaceC);
  const st = state;
  const nLayers = st.nLayers;
  const fluidC = st.fluidC;
  const surfaceDiameterM = st.surfaceDiameterM;
  const wallResistance = st.wallResistance;
  const filmResistance = st.filmResistance;
  // Read the state back at the root: the same q′ through every resistance.
  const q = st.lastHeat;
  const hc = st.lastConvection;
  const hr = st.lastRadiation;
  const rayleigh = st.lastRayleigh;
  const layerTemps = new Array<number>(nLayers + 1);
  const diameters = new Array<number>(nLayers + 2);
  diameters[0] = run.pipeInnerDiameterM;
  diameters[1] = run.pipeOuterDiameterM;
  layerTemps[nLayers] = surfaceC;
  for (let j = nLayers - 1; j >= 0; j--) {
    const layer = run.layers[j] as ResolvedLayer;
    layerTemps[j] = temperatureAcrossLayer(
      layer.curve,
      layerTemps[j + 1] as number,
      q * (st.layerCoefficients[j] as number),
      st.marchLowC,
      st.marchHighC,
    );
  }
  const pipeOuterC = layerTemps[0] as number;
  const innerWallC = pipeOuterC + q * wallResistance;
  const meanK: number[] = new Array<number>(nLayers);
  const layerResistances: number[] = new Array<number>(nLayers);
  // The surface resistance is the air-side temperature difference over the heat flow, so the
  // resistances add up to fluid − air even when the surroundings radiate from another
  // temperature or vapour condenses on the surface.
  const surfaceResistance =
    Math.abs(q) > 1e-12 && Math.abs(surfaceC - st.ambientC) > 1e-9 ? (surfaceC - st.ambientC) / q : 1 / ((hc + hr) * st.perimeter);
  let total = st.innerResistance + surfaceResistance;
  for (let j = 0; j < nLayers; j++) {
    const layer = run.layers[j] as ResolvedLayer;
    diameters[j + 2] = (diameters[j + 1] as number) + 2 * layer.thicknessM;
    const inner = layerTemps[j] as number;
    const outerC = layerTemps[j + 1] as number;
    const k = Math.abs(inner - outerC) < 1e-9 ? conductivityAt(layer.curve, inner) : meanConductivity(layer.curve, outerC, inner);
    meanK[j] = k;
    const r = (st.layerCoefficients[j] as number) / k;
    layerResistances[j] = r;
    total += r;
  }
  return {
    heatLossWPerM: q,
    surfaceTemperatureC: surfaceC,
    interfaceTemperaturesC: [fluidC, innerWallC, ...layerTemps],
    interfaceDiametersM: diameters,
    layerMeanConductivitiesWPerMK: meanK,
    convectionCoefficientWPerM2K: hc,
    radiationCoefficientWPerM2K: hr,
    insideFilmResistanceMKPerW: filmResistance,
    wallResistanceMKPerW: wallResistance,
    layerResistancesMKPerW: layerResistances,
    surfaceResistanceMKPerW: surfaceResistance,
    totalResistanceMKPerW: total,
    surfaceDiameterM,
    rayleighNumber: rayleigh,
    latentGainWPerM: st.lastLatent,
    iterations,
  };
}
