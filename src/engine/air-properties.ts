import { popielSlenderB, popielSlenderC } from './convection';
import {
  AIR_CONDUCTIVITY_W_PER_MK,
  AIR_KINEMATIC_VISCOSITY_M2_PER_S,
  AIR_PRANDTL,
  AIR_TABLE_START_K,
  AIR_TABLE_STEP_K,
} from './data/air-properties';

/** Air properties at one film temperature (mutable scratch, reused in the hot loop). */
export interface AirProperties {
  kinematicViscosityM2PerS: number;
  conductivityWPerMK: number;
  prandtl: number;
  /** [1 + (0.559/Pr)^(9/16)]^(8/27), the Prandtl factor of Churchill & Chu's horizontal-cylinder form. */
  horizontalShape: number;
  /** [1 + (0.492/Pr)^(9/16)]^(8/27), the Prandtl factor of Churchill & Chu's vertical-plate form. */
  verticalShape: number;
  /** Pr^(1/3) / [1 + (0.4/Pr)^(2/3)]^(1/4), the Prandtl factor of Churchill & Bernstein. */
  crossFlowFactor: number;
  /** B of Popiel's slender vertical cylinder correction (convection.ts). */
  slenderB: number;
  /** C of Popiel's slender vertical cylinder correction (convection.ts). */
  slenderC: number;
}

const LAST = AIR_PRANDTL.length - 1;
/** Film temperatures the table covers, K; outside it the end values are held. */
export const AIR_TABLE_MIN_K = AIR_TABLE_START_K;
export const AIR_TABLE_MAX_K = AIR_TABLE_START_K + LAST * AIR_TABLE_STEP_K;

// The Prandtl factors of the correlations are tabulated once per table row, so the
// solver's inner loop interpolates them instead of taking powers on every trial.
const HORIZONTAL_SHAPE = AIR_PRANDTL.map((pr) => Math.pow(1 + Math.pow(0.559 / pr, 9 / 16), 8 / 27));
const VERTICAL_SHAPE = AIR_PRANDTL.map((pr) => Math.pow(1 + Math.pow(0.492 / pr, 9 / 16), 8 / 27));
const CROSS_FLOW = AIR_PRANDTL.map((pr) => Math.cbrt(pr) / Math.pow(1 + Math.pow(0.4 / pr, 2 / 3), 0.25));
const SLENDER_B = AIR_PRANDTL.map((pr) => popielSlenderB(pr));
const SLENDER_C = AIR_PRANDTL.map((pr) => popielSlenderC(pr));

/**
 * Dry air at 1 atm at a film temperature, linear in the Incropera Table A.4 rows
 * (see data/air-properties.ts). Writes into `out` so the solver allocates nothing.
 */
export function airPropertiesAt(filmTemperatureK: number, out: AirProperties): AirProperties {
  let x = (filmTemperatureK - AIR_TABLE_START_K) / AIR_TABLE_STEP_K;
  if (!(x > 0)) x = 0;
  if (x > LAST) x = LAST;
  let i = Math.floor(x);
  if (i >= LAST) i = LAST - 1;
  const w = x - i;
  const v = AIR_KINEMATIC_VISCOSITY_M2_PER_S;
  const k = AIR_CONDUCTIVITY_W_PER_MK;
  const p = AIR_PRANDTL;
  out.kinematicViscosityM2PerS = (v[i] as number) + w * ((v[i + 1] as number) - (v[i] as number));
  out.conductivityWPerMK = (k[i] as number) + w * ((k[i + 1] as number) - (k[i] as number));
  out.prandtl = (p[i] as number) + w * ((p[i + 1] as number) - (p[i] as number));
  out.horizontalShape =
    (HORIZONTAL_SHAPE[i] as number) + w * ((HORIZONTAL_SHAPE[i + 1] as number) - (HORIZONTAL_SHAPE[i] as number));
  out.verticalShape =
    (VERTICAL_SHAPE[i] as number) + w * ((VERTICAL_SHAPE[i + 1] as number) - (VERTICAL_SHAPE[i] as number));
  out.crossFlowFactor = (CROSS_FLOW[i] as number) + w * ((CROSS_FLOW[i + 1] as number) - (CROSS_FLOW[i] as number));
  out.slenderB = (SLENDER_B[i] as number) + w * ((SLENDER_B[i + 1] as number) - (SLENDER_B[i] as number));
  out.slenderC = (SLENDER_C[i] as number) + w * ((SLENDER_C[i + 1] as number) - (SLENDER_C[i] as number));
  return out;
}
