import { airPropertiesAt, type AirProperties } from './air-properties';
import { conductivityAt, meanConductivity, temperatureAcrossLayer, type ConductivityCurve } from './conductivity';
import { combineMixedConvection, rayleighNumber } from './convection';
import { EngineError } from './errors';
import { STEFAN_BOLTZMANN_W_PER_M2K4, ZERO_CELSIUS_K } from './physical-constants';
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
   * Water vapor in the air, for latent gain where the surface falls below the dew point:
   * the air's vapor partial pressure, kPa, or null to leave latent heat out.
   */
  readonly airVapourPressureKPa?: number | null;
}

/** The solved state of one run, per meter. */
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
  /** Latent heat brought in by vapor condensing (or frosting) on the surface, W/m; 0 when dry. */
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
/** Bound on Brent's iterations where the secant search gives way; it needs about 4–10 here. */
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
  /** The combined outer coefficient is fixed by the caller (no separate radiation): `fixedCombined`. */
  hasFixedCombined: boolean;
  fixedCombined: number;
  /** The convection coefficient is fixed by the caller: `fixedConvection`. */
  hasFixedConvection: boolean;
  fixedConvection: number;
  vapourKPa: number;
  /** Dew point of the air, °C: no vapor condenses on a surface above it. */
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
  /** Trials of the secant search so far. */
  secantTrials: number;
  /** The root of the last solve, °C, and the trials or iterations it took. */
  rootC: number;
  rootIterations: number;
  /** Faces of the last trial's march: the inner face of each layer, then the surface. */
  faceTemperatures: Float64Array;
  /** Natural-convection part of the last trial's coefficient, W/(m²·K), and d ln h_N / d ln ΔT. */
  lastNatural: number;
  lastNaturalExponent: number;
}

// Every number starts as a non-integer double: a field first given a small integer and later a
// fraction ends up holding either, and then each store of a fraction boxes it anew — thousands
// of short-lived allocations per plant. A field that has only ever held doubles is written in place.
const state: SolverState = {
  run: undefined as unknown as ResolvedRun,
  nLayers: 0,
  layerCoefficients: new Float64Array(MAX_LAYERS),
  innerResistance: Number.NaN,
  wallResistance: Number.NaN,
  filmResistance: Number.NaN,
  fluidC: Number.NaN,
  ambientC: Number.NaN,
  surroundingsC: Number.NaN,
  surroundingsK: Number.NaN,
  marchLowC: Number.NaN,
  marchHighC: Number.NaN,
  perimeter: Number.NaN,
  surfaceDiameterM: Number.NaN,
  vertical: false,
  naturalLengthM: Number.NaN,
  hasFixedCombined: false,
  fixedCombined: Number.NaN,
  hasFixedConvection: false,
  fixedConvection: Number.NaN,
  vapourKPa: Number.NaN,
  dewC: Number.NEGATIVE_INFINITY,
  slenderFactor: Number.NaN,
  air: {
    kinematicViscosityM2PerS: Number.NaN,
    conductivityWPerMK: Number.NaN,
    prandtl: Number.NaN,
    horizontalShape: Number.NaN,
    verticalShape: Number.NaN,
    crossFlowFactor: Number.NaN,
    slenderB: Number.NaN,
    slenderC: Number.NaN,
  },
  lastConvection: Number.NaN,
  lastRadiation: Number.NaN,
  lastHeat: Number.NaN,
  lastRayleigh: Number.NaN,
  lastLatent: Number.NaN,
  lastSurfaceC: Number.NaN,
  secantTrials: 0,
  rootC: Number.NaN,
  rootIterations: 0,
  lastNatural: Number.NaN,
  lastNaturalExponent: Number.NaN,
  faceTemperatures: new Float64Array(MAX_LAYERS + 1),
};

/** The convection coefficient at a trial surface, into `lastConvection` (a number returned from a call not inlined would be boxed). */
function updateConvection(surfaceC: number): void {
  const st = state;
  if (st.hasFixedConvection) {
    st.lastNatural = 0;
    st.lastConvection = st.fixedConvection;
    return;
  }
  const filmK = 0.5 * (surfaceC + st.ambientC) + ZERO_CELSIUS_K;
  const air = airPropertiesAt(filmK, st.air);
  const nu = air.kinematicViscosityM2PerS;
  const ra = rayleighNumber(surfaceC - st.ambientC, st.naturalLengthM, filmK, nu, air.prandtl);
  st.lastRayleigh = ra;
  // Churchill & Chu (1975): horizontal cylinder on D, or vertical plate on the run height.
  const rising = (0.387 * Math.sqrt(Math.cbrt(ra))) / (st.vertical ? air.verticalShape : air.horizontalShape);
  const root = (st.vertical ? 0.825 : 0.6) + rising;
  let naturalNusselt = root * root;
  // A thin vertical run sheds more than a flat plate of its height: Popiel's (2008) slender-
  // cylinder correction of the Churchill–Chu plate value on Gr_L = Ra_L / Pr (see convection.ts).
  if (st.vertical && ra > 0) naturalNusselt *= 1 + air.slenderB * Math.pow(st.slenderFactor / Math.sqrt(Math.sqrt(ra / air.prandtl)), air.slenderC);
  const natural = (naturalNusselt * air.conductivityWPerMK) / st.naturalLengthM;
  // For the root finder's slope: d ln h_N / d ln ΔT of the Churchill–Chu form {c₀ + X}², X ∝ Ra^(1/6), is X / (3·(c₀ + X)).
  st.lastNatural = natural;
  st.lastNaturalExponent = rising / (3 * root);
  // Churchill & Bernstein (1977) in cross-flow; 0.3 alone in still air.
  const reynolds = (st.run.windSpeedMPerS * st.surfaceDiameterM) / nu;
  const forcedNusselt =
    reynolds > 0
      ? 0.3 + 0.62 * Math.sqrt(reynolds) * air.crossFlowFactor * Math.pow(1 + Math.pow(reynolds / 282000, 0.625), 0.8)
      : 0.3;
  const forced = (forcedNusselt * air.conductivityWPerMK) / st.surfaceDiameterM;
  st.lastConvection = combineMixedConvection(forced, natural);
}

function heatAt(surfaceC: number): number {
  const st = state;
  if (st.hasFixedCombined) {
    st.lastConvection = st.fixedCombined;
    st.lastRadiation = 0;
    return st.fixedCombined * st.perimeter * (surfaceC - st.ambientC);
  }
  updateConvection(surfaceC);
  st.lastRadiation = radiationCoefficientWPerM2K(st.run.surfaceEmittance, surfaceC + ZERO_CELSIUS_K, st.surroundingsK);
  const sensible = st.perimeter * (st.lastConvection * (surfaceC - st.ambientC) + st.lastRadiation * (surfaceC - st.surroundingsC));
  st.lastLatent = 0;
  if (st.vapourKPa > 0 && surfaceC < st.dewC) {
    // Vapor condensing on a surface below the dew point gives up its latent heat to the line.
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
  const faces = st.faceTemperatures;
  faces[st.nLayers] = t;
  for (let j = st.nLayers - 1; j >= 0; j--) {
    t = temperatureAcrossLayer((layers[j] as ResolvedLayer).curve, t, q * (st.layerCoefficients[j] as number), st.marchLowC, st.marchHighC);
    faces[j] = t;
  }
  return t + q * st.innerResistance - st.fluidC;
}

/** Solves the surface balance of a run; the root and its figures are left in the state. */
function findSurface(run: ResolvedRun, guessSurfaceC: number | undefined): void {
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
  st.hasFixedCombined = run.fixedSurfaceCoefficientWPerM2K !== null;
  st.fixedCombined = run.fixedSurfaceCoefficientWPerM2K ?? Number.NaN;
  st.hasFixedConvection = run.fixedConvectionCoefficientWPerM2K !== null;
  st.fixedConvection = run.fixedConvectionCoefficientWPerM2K ?? Number.NaN;
  st.vapourKPa =
    run.fixedSurfaceCoefficientWPerM2K === null && run.fixedConvectionCoefficientWPerM2K === null ? (run.airVapourPressureKPa ?? -1) : -1;
  st.dewC = st.vapourKPa > 0 ? dewPointFromVapourKPa(st.vapourKPa) : Number.NEGATIVE_INFINITY;
  // Popiel's slender-cylinder parameter: 32^½ · L/D (the Ra^¼ divides it per trial).
  st.slenderFactor = Math.sqrt(32) * (run.runHeightM / surfaceDiameterM);
  st.lastRayleigh = 0;
  st.lastLatent = 0;

  if (highC - lowC < 1e-12) {
    impliedFluidMinusActual(fluidC);
    st.rootC = fluidC;
    st.rootIterations = 0;
    return;
  }
  // Without a warm start, guess the surface from the resistances with k at the mean
  // line/air temperature and a typical still-air coefficient of 10 W/(m²·K).
  let guess = Number.NaN;
  // A warm start outside the bracket is no start at all: the guess from the resistances is used instead.
  if (guessSurfaceC !== undefined && guessSurfaceC > lowC && guessSurfaceC < highC) guess = +guessSurfaceC;
  else {
    const meanC = 0.5 * (fluidC + ambientC);
    let layersR = 0;
    for (let j = 0; j < nLayers; j++) {
      layersR += (st.layerCoefficients[j] as number) / conductivityAt((run.layers[j] as ResolvedLayer).curve, meanC);
    }
    const surfaceR = 1 / ((st.hasFixedCombined ? st.fixedCombined : 10) * st.perimeter);
    guess = ambientC + ((fluidC - ambientC) * surfaceR) / (st.innerResistance + layersR + surfaceR);
  }
  const inside = guess > lowC && guess < highC;
  const secant = inside ? secantRoot(guess, lowC, highC) : Number.NaN;
  if (!Number.isNaN(secant)) {
    // The state holds the last trial, which is the root.
    st.rootC = secant;
    st.rootIterations = st.secantTrials;
    return;
  }
  bracketedRoot(inside ? guess : Number.NaN, lowC, highC);
}

/**
 * The bracketed search, where the secant search cannot start or does not settle: the bracket
 * narrowed around the guess (when there is one), then Brent's method; the root's figures
 * left in the state.
 */
function bracketedRoot(guess: number, lowC: number, highC: number): void {
  const st = state;
  const fluidC = st.fluidC;
  let a = lowC;
  let b = highC;
  let fa = Number.NaN;
  let fb = Number.NaN;
  if (!Number.isNaN(guess)) {
    // Narrow the bracket around the guess: a few K usually holds the root.
    const fg = impliedFluidMinusActual(guess);
    let step = Math.max(0.25, 0.01 * (highC - lowC));
    // A Newton estimate of the root from the surface's own coefficients: d(implied fluid)/dT_s
    // ≈ 1 + π·D·(1.25·h_c + h_r)·R_inside (natural convection grows as ΔT^¼). The first
    // trial lands just past it, so Brent starts on a bracket a few hundredths of a kelvin wide.
    const q = st.lastHeat;
    if (Math.abs(q) > 1e-9) {
      const insideR = (fg + fluidC - guess) / q;
      const hSlope = st.hasFixedCombined ? st.fixedCombined : 1.25 * st.lastConvection + st.lastRadiation;
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
    Number.isNaN(fa) ? impliedFluidMinusActual(a) : fa,
    Number.isNaN(fb) ? impliedFluidMinusActual(b) : fb,
    IMPLIED_FLUID_TOLERANCE_K,
  );
  if (!result.converged || !Number.isFinite(result.root)) {
    throw new EngineError(
      'NO_CONVERGENCE',
      'The surface heat balance did not converge for this run; check its temperatures and dimensions.',
    );
  }
  // The state must hold the root's figures; most often the root was the last trial and already does.
  if (st.lastSurfaceC !== result.root) impliedFluidMinusActual(result.root);
  st.rootC = result.root;
  st.rootIterations = result.iterations;
}

/** Most solves end within this many secant steps; beyond it the bracketed search takes over. */
const MAX_SECANT_STEPS = 12;

/**
 * d(q′/πD)/dT_s at the last trial, W/(m²·K): convection h + n·h_N³/h² (mixed convection
 * (h_F³ + h_N³)^⅓ with h_N ∝ ΔT^n, the film's properties held), radiation 4εσT_s³ exactly.
 */
function surfaceSlope(surfaceC: number): number {
  const st = state;
  if (st.hasFixedCombined) return st.fixedCombined;
  const h = st.lastConvection;
  const hN = st.lastNatural;
  const convection = h > 0 ? h + (st.lastNaturalExponent * hN * hN * hN) / (h * h) : 0;
  const surfaceK = surfaceC + ZERO_CELSIUS_K;
  return convection + 4 * st.run.surfaceEmittance * STEFAN_BOLTZMANN_W_PER_M2K4 * surfaceK * surfaceK * surfaceK;
}

/**
 * d(implied fluid temperature)/dT_s at the last trial. Across a layer K(T_in) − K(T_out) = q′·L,
 * so ∂T_in/∂T_out = k(T_out)/k(T_in) and ∂T_in/∂q′ = L/k(T_in); chained inward through the
 * layers and the inside resistance, with dq′/dT_s = π·D × {@link surfaceSlope}.
 */
function impliedFluidSlope(surfaceC: number): number {
  const st = state;
  const faces = st.faceTemperatures;
  const layers = st.run.layers;
  let bySurface = 1;
  let byHeat = 0;
  for (let j = st.nLayers - 1; j >= 0; j--) {
    const curve = (layers[j] as ResolvedLayer).curve;
    const kIn = conductivityAt(curve, faces[j] as number);
    const ratio = conductivityAt(curve, faces[j + 1] as number) / kIn;
    bySurface *= ratio;
    byHeat = byHeat * ratio + (st.layerCoefficients[j] as number) / kIn;
  }
  return bySurface + (byHeat + st.innerResistance) * st.perimeter * surfaceSlope(surfaceC);
}

/**
 * The usual way to the root: a Newton step from the guess on the slope of the implied fluid
 * temperature ({@link impliedFluidSlope}, exact but for the film's properties and latent heat),
 * then secant steps, each kept inside the bracket the trials so far have built (the
 * implied fluid temperature rises strictly with the surface's, so every trial narrows it), with
 * a bisection where a step would leave it. It ends on a trial within the tolerances, so the
 * state holds the root's figures; NaN where it cannot start or does not settle, and the
 * bracketed search (Brent) is used instead.
 */
function secantRoot(guess: number, lowC: number, highC: number): number {
  const st = state;
  // Plain doubles for the loop (see temperatureAcrossLayer): no step allocates.
  let x0 = +guess;
  let f0 = impliedFluidMinusActual(x0);
  st.secantTrials = 1;
  if (Math.abs(f0) <= IMPLIED_FLUID_TOLERANCE_K) return x0;
  const slope = impliedFluidSlope(x0);
  if (!(slope > 0 && Number.isFinite(slope))) return Number.NaN;
  let lo = +lowC;
  let hi = +highC;
  if (f0 < 0) lo = x0;
  else hi = x0;
  let x1 = x0 - f0 / slope;
  if (!(x1 > lo && x1 < hi)) x1 = 0.5 * (lo + hi);
  for (let step = 0; step < MAX_SECANT_STEPS; step++) {
    const f1 = impliedFluidMinusActual(x1);
    st.secantTrials++;
    if (!Number.isFinite(f1)) return Number.NaN;
    if (Math.abs(f1) <= IMPLIED_FLUID_TOLERANCE_K) return x1;
    if (f1 < 0) lo = x1;
    else hi = x1;
    if (hi - lo <= SURFACE_TOLERANCE_K) return x1;
    const denominator = f1 - f0;
    let x2 = denominator !== 0 ? x1 - (f1 * (x1 - x0)) / denominator : Number.NaN;
    if (!(x2 > lo && x2 < hi)) x2 = 0.5 * (lo + hi);
    x0 = x1;
    f0 = f1;
    x1 = x2;
  }
  return Number.NaN;
}

/**
 * A warm start for a run solved again at other air: the surface kept at the same share of the
 * drop from the line to the air as in the solve at the first air.
 */
export function startAtOtherAir(surfaceC: number, fluidC: number, firstAirC: number, otherAirC: number): number {
  const drop = firstAirC - fluidC;
  if (Math.abs(drop) < 1e-9) return otherAirC;
  return fluidC + ((surfaceC - fluidC) / drop) * (otherAirC - fluidC);
}

/** The heat flow and surface temperature of a lean solve (reused; copy what you keep). */
export interface LeanSolution {
  heatLossWPerM: number;
  surfaceTemperatureC: number;
  latentGainWPerM: number;
}

// Doubles from the start, so each solve writes them in place (see `state`).
const lean: LeanSolution = { heatLossWPerM: Number.NaN, surfaceTemperatureC: Number.NaN, latentGainWPerM: Number.NaN };

/**
 * The surface balance alone — heat flow and surface temperature, nothing else — for the
 * many solves of a thickness series, where the full result of every trial is not needed.
 * Returns one reused record: read it before the next solve.
 */
export function solveLean(run: ResolvedRun, guessSurfaceC?: number): LeanSolution {
  findSurface(run, guessSurfaceC);
  const surfaceC = state.rootC;
  lean.heatLossWPerM = state.lastHeat;
  lean.surfaceTemperatureC = surfaceC;
  lean.latentGainWPerM = state.lastLatent;
  return lean;
}

/**
 * Solves the surface heat balance of one run (method.md): per meter, the heat
 * through the inside film, the wall and each layer (k̄ over the layer's own span)
 * equals the heat leaving the surface by convection and radiation. The unknown is
 * the surface temperature; marching inward from a trial surface temperature with
 * the surface's q′ gives the fluid temperature that trial implies, and a Newton step
 * then secant steps (Brent's method where those do not settle) drive that to the real
 * fluid temperature, to within 1e-7 K. The implied fluid temperature rises strictly
 * with the trial surface temperature, and the bracket [min, max] of fluid, air and
 * surroundings temperatures always holds the root.
 *
 * @param guessSurfaceC optional warm start (e.g. the previous thickness of a series)
 */
export function solveResolvedRun(run: ResolvedRun, guessSurfaceC?: number): CoreSolution {
  findSurface(run, guessSurfaceC);
  const st = state;
  const surfaceC = st.rootC;
  const iterations = st.rootIterations;
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
  // temperature or vapor condenses on the surface.
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
