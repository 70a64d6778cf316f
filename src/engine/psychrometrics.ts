import { EngineError } from './errors';

// Magnus-form saturation vapor pressure, Alduchov & Eskridge (1996), J. Appl.
// Meteor. 35, 601–609: over water (AERK) a = 17.625, b = 243.04 °C; over ice
// (AERKi) a = 22.587, b = 273.86 °C. Like the ASHRAE formulation, saturation is
// taken over ice below 0 °C, so a dew point below 0 °C is a frost point.
const WATER_A = 17.625;
const WATER_B_C = 243.04;
const ICE_A = 22.587;
const ICE_B_C = 273.86;

/** ln(e_s / 6.1094 hPa) for the Magnus form; the constant factor cancels in the dew point. */
function logSaturationRatio(temperatureC: number): number {
  return temperatureC >= 0
    ? (WATER_A * temperatureC) / (WATER_B_C + temperatureC)
    : (ICE_A * temperatureC) / (ICE_B_C + temperatureC) + Math.log(6.1115 / 6.1094);
}

/**
 * Saturation vapor pressure over water (over ice below 0 °C), kPa, by the same Magnus forms:
 * e_s = 0.61094 exp(17.625 T / (243.04 + T)) over water, 0.61115 exp(22.587 T / (273.86 + T)) over ice.
 */
export function saturationVapourPressureKPa(temperatureC: number): number {
  return 0.61094 * Math.exp(logSaturationRatio(temperatureC));
}

/** The vapor partial pressure of air at a temperature and relative humidity, kPa. */
export function vapourPressureKPa(temperatureC: number, relativeHumidityPercent: number): number {
  return (relativeHumidityPercent / 100) * saturationVapourPressureKPa(temperatureC);
}

/** Dew point (frost point below 0 °C) of air holding vapor at this partial pressure, °C (Magnus forms above). */
export function dewPointFromVapourKPa(vapourKPa: number): number {
  const gamma = Math.log(vapourKPa / 0.61094);
  const overWater = (WATER_B_C * gamma) / (WATER_A - gamma);
  if (overWater >= 0) return overWater;
  const iceGamma = gamma - Math.log(6.1115 / 6.1094);
  return (ICE_B_C * iceGamma) / (ICE_A - iceGamma);
}

/**
 * Dew point of moist air (frost point below 0 °C), by the Magnus form.
 *
 * @param temperatureC dry-bulb air temperature, −60 … 60 °C
 * @param relativeHumidityPercent relative humidity, (0, 100] %
 * @returns dew-point temperature, °C
 */
export function dewPointC(temperatureC: number, relativeHumidityPercent: number): number {
  if (!Number.isFinite(temperatureC) || temperatureC < -60 || temperatureC > 60) {
    throw new EngineError(
      'TEMPERATURE_OUT_OF_RANGE',
      `Air temperature for a dew point must be between −60 °C and 60 °C; ${temperatureC} °C was given.`,
    );
  }
  if (!Number.isFinite(relativeHumidityPercent) || relativeHumidityPercent <= 0 || relativeHumidityPercent > 100) {
    throw new EngineError(
      'INVALID_INPUT',
      `Relative humidity must be above 0 % and at most 100 %; ${relativeHumidityPercent} % was given.`,
    );
  }
  const gamma = Math.log(relativeHumidityPercent / 100) + logSaturationRatio(temperatureC);
  const overWater = (WATER_B_C * gamma) / (WATER_A - gamma);
  if (overWater >= 0) return overWater;
  const iceGamma = gamma - Math.log(6.1115 / 6.1094);
  return (ICE_B_C * iceGamma) / (ICE_A - iceGamma);
}

/**
 * Atmospheric pressure at an altitude, ASHRAE Handbook—Fundamentals (2017) ch. 1
 * eq. 3 (standard atmosphere): p = 101.325 (1 − 2.25577×10⁻⁵ Z)^5.2559.
 *
 * @param altitudeM altitude above sea level, −500 … 5 000 m
 * @returns kPa
 */
export function atmosphericPressureKPaAtAltitude(altitudeM: number): number {
  return 101.325 * Math.pow(1 - 2.25577e-5 * altitudeM, 5.2559);
}
