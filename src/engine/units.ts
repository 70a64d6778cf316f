/**
 * Unit conversions between US customary and SI, for the edges of the engine only
 * (the engine itself is SI throughout).
 *
 * Factors follow NIST Special Publication 811 (2008 ed.), Appendix B.8 and B.9,
 * "Factors for units listed alphabetically / by kind of quantity". Where SP 811
 * rounds a factor to seven digits we keep the exact value from the definitions it
 * rests on (international inch and foot, avoirdupois pound, standard gravity,
 * International Table Btu = 1055.05585262 J), so every conversion round-trips to
 * machine precision.
 */

const BTU_IT_J = 1055.05585262; // SP 811 lists 1.055 056 E+03 (International Table Btu)
const INCH_M = 0.0254; // exact, SP 811 B.8
const FOOT_M = 0.3048; // exact
const POUND_KG = 0.45359237; // exact (avoirdupois)
const POUND_FORCE_N = POUND_KG * 9.80665; // 4.448 222 E+00 in SP 811
const FAHRENHEIT_DEGREE_K = 5 / 9;

/** Conversion factors to the SI base of each quantity: value_SI = value × factor. */
export const UNIT_FACTORS = {
  length: { m: 1, mm: 1e-3, cm: 1e-2, in: INCH_M, ft: FOOT_M },
  area: { m2: 1, ft2: FOOT_M * FOOT_M, in2: INCH_M * INCH_M },
  volume: { m3: 1, L: 1e-3, gal: 231 * INCH_M ** 3, ft3: FOOT_M ** 3 },
  mass: { kg: 1, lb: POUND_KG, t: 1000 },
  /** Mass flow, SI base kg/h (the trade's unit for steam). */
  massFlow: { 'kg/h': 1, 'kg/s': 3600, 'lb/h': POUND_KG },
  speed: { 'm/s': 1, 'km/h': 1 / 3.6, mph: 1609.344 / 3600, 'ft/min': FOOT_M / 60 },
  /** Pressure (absolute or gauge alike), SI base kPa. */
  pressure: { kPa: 1, Pa: 1e-3, MPa: 1e3, bar: 100, psi: POUND_FORCE_N / (INCH_M * INCH_M) / 1000 },
  energy: {
    J: 1,
    kJ: 1e3,
    MJ: 1e6,
    GJ: 1e9,
    kWh: 3.6e6,
    Btu: BTU_IT_J,
    MMBtu: 1e6 * BTU_IT_J,
    /** 100 000 Btu_IT — the billing therm (SP 811 lists the EC therm as 1.055 06 E+08). */
    therm: 1e5 * BTU_IT_J,
  },
  power: { W: 1, kW: 1e3, 'Btu/h': BTU_IT_J / 3600, 'MMBtu/h': (1e6 * BTU_IT_J) / 3600 },
  heatFlowPerLength: { 'W/m': 1, 'Btu/(h·ft)': BTU_IT_J / 3600 / FOOT_M },
  heatFlux: { 'W/m2': 1, 'Btu/(h·ft2)': BTU_IT_J / 3600 / (FOOT_M * FOOT_M) },
  conductivity: {
    'W/(m·K)': 1,
    'Btu·in/(h·ft2·°F)': ((BTU_IT_J / 3600) * INCH_M) / (FOOT_M * FOOT_M * FAHRENHEIT_DEGREE_K),
  },
  heatTransferCoefficient: {
    'W/(m2·K)': 1,
    'Btu/(h·ft2·°F)': BTU_IT_J / 3600 / (FOOT_M * FOOT_M * FAHRENHEIT_DEGREE_K),
  },
  temperatureDifference: { K: 1, '°F': FAHRENHEIT_DEGREE_K },
} as const;

/** Quantities that convert by a factor. */
export type Quantity = keyof typeof UNIT_FACTORS;
/** Units known for a quantity. */
export type UnitOf<Q extends Quantity> = keyof (typeof UNIT_FACTORS)[Q] & string;

/** Converts `value` given in `unit` to the SI base of `quantity`. */
export function toSI<Q extends Quantity>(quantity: Q, value: number, unit: UnitOf<Q>): number {
  const factors = UNIT_FACTORS[quantity] as Record<string, number>;
  const factor = factors[unit];
  if (factor === undefined) throw new RangeError(`Unknown unit ${unit} for ${quantity}.`);
  return value * factor;
}

/** Converts `valueSI` from the SI base of `quantity` to `unit`. */
export function fromSI<Q extends Quantity>(quantity: Q, valueSI: number, unit: UnitOf<Q>): number {
  const factors = UNIT_FACTORS[quantity] as Record<string, number>;
  const factor = factors[unit];
  if (factor === undefined) throw new RangeError(`Unknown unit ${unit} for ${quantity}.`);
  return valueSI / factor;
}

/** °F → °C. */
export const fahrenheitToCelsius = (temperatureF: number): number => (temperatureF - 32) * FAHRENHEIT_DEGREE_K;
/** °C → °F. */
export const celsiusToFahrenheit = (temperatureC: number): number => temperatureC / FAHRENHEIT_DEGREE_K + 32;
/** psi → kPa (gauge stays gauge, absolute stays absolute). */
export const psiToKPa = (pressurePsi: number): number => toSI('pressure', pressurePsi, 'psi');
/** kPa → psi. */
export const kPaToPsi = (pressureKPa: number): number => fromSI('pressure', pressureKPa, 'psi');
/** inch → m. */
export const inchesToMetres = (lengthIn: number): number => lengthIn * INCH_M;
/** m → inch. */
export const metresToInches = (lengthM: number): number => lengthM / INCH_M;
/** ft → m. */
export const feetToMetres = (lengthFt: number): number => lengthFt * FOOT_M;
/** m → ft. */
export const metresToFeet = (lengthM: number): number => lengthM / FOOT_M;
/** mph → m/s. */
export const mphToMetresPerSecond = (speedMph: number): number => toSI('speed', speedMph, 'mph');
/** m/s → mph. */
export const metresPerSecondToMph = (speedMPerS: number): number => fromSI('speed', speedMPerS, 'mph');
/** Btu/(h·ft) → W/m. */
export const btuPerHourFootToWattsPerMetre = (value: number): number => toSI('heatFlowPerLength', value, 'Btu/(h·ft)');
/** W/m → Btu/(h·ft). */
export const wattsPerMetreToBtuPerHourFoot = (value: number): number => fromSI('heatFlowPerLength', value, 'Btu/(h·ft)');
/** Btu/h → W. */
export const btuPerHourToWatts = (value: number): number => toSI('power', value, 'Btu/h');
/** W → Btu/h. */
export const wattsToBtuPerHour = (value: number): number => fromSI('power', value, 'Btu/h');
/** J → MMBtu. */
export const joulesToMMBtu = (energyJ: number): number => fromSI('energy', energyJ, 'MMBtu');
/** MMBtu → J. */
export const mmbtuToJoules = (energyMMBtu: number): number => toSI('energy', energyMMBtu, 'MMBtu');
/** J → therm. */
export const joulesToTherms = (energyJ: number): number => fromSI('energy', energyJ, 'therm');
/** Btu → J. */
export const btuToJoules = (energyBtu: number): number => toSI('energy', energyBtu, 'Btu');
/** lb/h → kg/h. */
export const poundsPerHourToKgPerHour = (value: number): number => toSI('massFlow', value, 'lb/h');
/** kg/h → lb/h. */
export const kgPerHourToPoundsPerHour = (value: number): number => fromSI('massFlow', value, 'lb/h');
/** Btu·in/(h·ft²·°F) → W/(m·K). */
export const btuInchToWattsPerMetreKelvin = (value: number): number => toSI('conductivity', value, 'Btu·in/(h·ft2·°F)');
/** W/(m·K) → Btu·in/(h·ft²·°F). */
export const wattsPerMetreKelvinToBtuInch = (value: number): number => fromSI('conductivity', value, 'Btu·in/(h·ft2·°F)');
