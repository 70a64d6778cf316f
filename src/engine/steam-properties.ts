import {
  IF97_R_KJ_PER_KGK,
  IF97_REGION3_BOUNDARY_PRESSURE_MPA,
  IF97_REGION4_MIN_PRESSURE_MPA,
  IF97_CRITICAL_PRESSURE_MPA,
  REGION1_I,
  REGION1_J,
  REGION1_N,
  REGION2_I,
  REGION2_J,
  REGION2_J0,
  REGION2_N,
  REGION2_N0,
  REGION4_N,
} from './data/iapws-if97';
import { EngineError } from './errors';
import { STANDARD_ATMOSPHERE_KPA, ZERO_CELSIUS_K } from './physical-constants';

/** Lowest absolute pressure of IF97 region 4 (the triple-point line), kPa. */
export const SATURATION_MIN_ABSOLUTE_PRESSURE_KPA = IF97_REGION4_MIN_PRESSURE_MPA * 1000;
/** Highest absolute pressure of IF97 region 4 (the critical point), kPa. */
export const SATURATION_MAX_ABSOLUTE_PRESSURE_KPA = IF97_CRITICAL_PRESSURE_MPA * 1000;
/**
 * Highest absolute pressure for which the engine gives a latent heat: above it the
 * saturated states lie in IF97 region 3, which the engine does not carry. Plant
 * steam is far below (16.5 MPa is about 2 400 psi).
 */
export const STEAM_MAX_ABSOLUTE_PRESSURE_KPA = IF97_REGION3_BOUNDARY_PRESSURE_MPA * 1000;

const N = REGION4_N;

/**
 * Saturation temperature of water at an absolute pressure, by the IAPWS-IF97
 * region 4 backward equation (R7-97(2012) eq. 31).
 *
 * @param absolutePressureKPa absolute pressure, 0.611 kPa … 22 064 kPa
 * @returns saturation temperature, °C
 * @throws EngineError PRESSURE_OUT_OF_RANGE outside region 4
 */
export function saturationTemperatureC(absolutePressureKPa: number): number {
  if (
    !Number.isFinite(absolutePressureKPa) ||
    absolutePressureKPa < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA ||
    absolutePressureKPa > SATURATION_MAX_ABSOLUTE_PRESSURE_KPA
  ) {
    throw new EngineError(
      'PRESSURE_OUT_OF_RANGE',
      `Steam pressure must lie between ${SATURATION_MIN_ABSOLUTE_PRESSURE_KPA.toFixed(3)} kPa and ${SATURATION_MAX_ABSOLUTE_PRESSURE_KPA} kPa absolute for a saturation temperature; ${absolutePressureKPa} kPa was given.`,
    );
  }
  const beta = Math.pow(absolutePressureKPa / 1000, 0.25);
  const e = beta * beta + N[2] * beta + N[5];
  const f = N[0] * beta * beta + N[3] * beta + N[6];
  const g = N[1] * beta * beta + N[4] * beta + N[7];
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  const n10PlusD = N[9] + d;
  const temperatureK = (n10PlusD - Math.sqrt(n10PlusD * n10PlusD - 4 * (N[8] + N[9] * d))) / 2;
  return temperatureK - ZERO_CELSIUS_K;
}

/**
 * Saturation pressure of water at a temperature, IAPWS-IF97 region 4 basic equation
 * (R7-97(2012) eq. 30).
 *
 * @param temperatureC 0.01 °C … 373.946 °C
 * @returns absolute pressure, kPa
 */
export function saturationPressureKPa(temperatureC: number): number {
  const temperatureK = temperatureC + ZERO_CELSIUS_K;
  if (!Number.isFinite(temperatureK) || temperatureK < 273.15 || temperatureK > 647.096) {
    throw new EngineError(
      'TEMPERATURE_OUT_OF_RANGE',
      `Saturation pressure is defined from 0 °C to 373.946 °C; ${temperatureC} °C was given.`,
    );
  }
  const theta = temperatureK + N[8] / (temperatureK - N[9]);
  const a = theta * theta + N[0] * theta + N[1];
  const b = N[2] * theta * theta + N[3] * theta + N[4];
  const c = N[5] * theta * theta + N[6] * theta + N[7];
  return Math.pow((2 * c) / (-b + Math.sqrt(b * b - 4 * a * c)), 4) * 1000;
}

// Integer powers by repeated multiplication into scratch tables: the basic
// equations are sums of x^I·y^J terms, and Math.pow on each term costs far more.
const POWERS_A = new Float64Array(64);
const POWERS_B = new Float64Array(64);
const INVERSE_POWERS_B = new Float64Array(64);
const IDEAL_POWERS = new Float64Array(3);
const IDEAL_INVERSE_POWERS = new Float64Array(7);

function fillPowers(into: Float64Array, x: number, count: number): void {
  into[0] = 1;
  for (let k = 1; k < count; k++) into[k] = (into[k - 1] as number) * x;
}

function power(positive: Float64Array, inverse: Float64Array, exponent: number): number {
  return exponent >= 0 ? (positive[exponent] as number) : (inverse[-exponent] as number);
}

/** Specific enthalpy in region 1 (compressed liquid), kJ/kg — R7-97(2012) eq. 7, Table 3. */
function region1EnthalpyKJPerKg(temperatureK: number, pressureMPa: number): number {
  const tau = 1386 / temperatureK;
  const pi = pressureMPa / 16.53;
  fillPowers(POWERS_A, 7.1 - pi, 33);
  fillPowers(POWERS_B, tau - 1.222, 17);
  fillPowers(INVERSE_POWERS_B, 1 / (tau - 1.222), 43);
  let gammaTau = 0;
  for (let i = 0; i < REGION1_N.length; i++) {
    const jj = REGION1_J[i] as number;
    gammaTau +=
      (REGION1_N[i] as number) * (POWERS_A[REGION1_I[i] as number] as number) * jj * power(POWERS_B, INVERSE_POWERS_B, jj - 1);
  }
  return IF97_R_KJ_PER_KGK * temperatureK * tau * gammaTau;
}

/** Specific enthalpy in region 2 (vapor), kJ/kg — R7-97(2012) eq. 15–17, Tables 10–11. */
function region2EnthalpyKJPerKg(temperatureK: number, pressureMPa: number): number {
  const tau = 540 / temperatureK;
  // The ideal-gas part's powers run from τ⁻⁶ to τ², from their own small tables.
  fillPowers(IDEAL_POWERS, tau, 3);
  fillPowers(IDEAL_INVERSE_POWERS, 1 / tau, 7);
  let idealTau = 0;
  for (let i = 0; i < REGION2_N0.length; i++) {
    const jj = REGION2_J0[i] as number;
    idealTau += (REGION2_N0[i] as number) * jj * power(IDEAL_POWERS, IDEAL_INVERSE_POWERS, jj - 1);
  }
  fillPowers(POWERS_A, pressureMPa, 25);
  fillPowers(POWERS_B, tau - 0.5, 58);
  fillPowers(INVERSE_POWERS_B, 1 / (tau - 0.5), 2);
  let residualTau = 0;
  for (let i = 0; i < REGION2_N.length; i++) {
    const jj = REGION2_J[i] as number;
    residualTau +=
      (REGION2_N[i] as number) * (POWERS_A[REGION2_I[i] as number] as number) * jj * power(POWERS_B, INVERSE_POWERS_B, jj - 1);
  }
  return IF97_R_KJ_PER_KGK * temperatureK * tau * (idealTau + residualTau);
}

/** Saturated steam state at a line pressure. */
export interface SteamState {
  readonly absolutePressureKPa: number;
  readonly saturationTemperatureC: number;
  /** Enthalpy of saturated liquid h′, J/kg. */
  readonly liquidEnthalpyJPerKg: number;
  /** Enthalpy of saturated vapor h″, J/kg. */
  readonly vapourEnthalpyJPerKg: number;
  /** Latent heat of vaporization h″ − h′, J/kg. */
  readonly latentHeatJPerKg: number;
}

/**
 * Saturated steam at an absolute pressure: saturation temperature (IF97 eq. 31) and
 * the latent heat from the region 1 and region 2 basic equations evaluated on the
 * saturation line.
 *
 * @throws EngineError PRESSURE_OUT_OF_RANGE outside 0.611 kPa … 16 529 kPa absolute
 */
export function saturatedSteam(absolutePressureKPa: number): SteamState {
  if (!(absolutePressureKPa <= STEAM_MAX_ABSOLUTE_PRESSURE_KPA)) {
    throw new EngineError(
      'PRESSURE_OUT_OF_RANGE',
      `Steam above ${Math.round(STEAM_MAX_ABSOLUTE_PRESSURE_KPA)} kPa absolute is outside what this estimate covers; ${absolutePressureKPa} kPa was given.`,
    );
  }
  const saturationC = saturationTemperatureC(absolutePressureKPa);
  const temperatureK = saturationC + ZERO_CELSIUS_K;
  const pressureMPa = absolutePressureKPa / 1000;
  const liquid = region1EnthalpyKJPerKg(temperatureK, pressureMPa) * 1000;
  const vapor = region2EnthalpyKJPerKg(temperatureK, pressureMPa) * 1000;
  return {
    absolutePressureKPa,
    saturationTemperatureC: saturationC,
    liquidEnthalpyJPerKg: liquid,
    vapourEnthalpyJPerKg: vapor,
    latentHeatJPerKg: vapor - liquid,
  };
}

/** Saturated steam at a gauge pressure above the local atmosphere. */
export function saturatedSteamAtGauge(
  gaugePressureKPa: number,
  atmosphericPressureKPa: number = STANDARD_ATMOSPHERE_KPA,
): SteamState {
  return saturatedSteam(gaugePressureKPa + atmosphericPressureKPa);
}
