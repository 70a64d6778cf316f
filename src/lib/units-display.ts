/**
 * Which unit each quantity is shown and typed in, in US customary or SI, and how a typed
 * value goes back and forth. The engine keeps SI at full precision; these helpers convert
 * (with the engine's own factors) only for display and entry. How a figure is rounded and
 * written for reading lives in ./presentation (the one rounding rule).
 */
import { celsiusToFahrenheit, fahrenheitToCelsius, fromSI, toSI } from '../engine';

/** The two ways a person can read the figures. */
export type UnitSystem = 'SI' | 'US';

/** One unit a quantity can be shown in. */
export interface DisplayUnit {
  /** Printed after the number: "ft", "°F", "psi (gauge)". */
  readonly symbol: string;
  /** From the engine's SI value (or stored fraction) to this unit. */
  readonly fromBase: (value: number) => number;
  /** From a value typed in this unit to the engine's SI value. */
  readonly toBase: (value: number) => number;
  /** Decimals kept when a stored value is put back into an input. */
  readonly inputDecimals: number;
}

const unit = (
  symbol: string,
  fromBase: (value: number) => number,
  toBase: (value: number) => number,
  inputDecimals: number,
): DisplayUnit => ({ symbol, fromBase, toBase, inputDecimals });

const same = (value: number) => value;

const length = {
  SI: unit('m', same, same, 3),
  US: unit('ft', (m) => fromSI('length', m, 'ft'), (ft) => toSI('length', ft, 'ft'), 2),
};
const small = {
  SI: unit('mm', (m) => fromSI('length', m, 'mm'), (mm) => toSI('length', mm, 'mm'), 1),
  US: unit('in', (m) => fromSI('length', m, 'in'), (inch) => toSI('length', inch, 'in'), 3),
};
const temperature = {
  SI: unit('°C', same, same, 1),
  US: unit('°F', celsiusToFahrenheit, fahrenheitToCelsius, 1),
};
const percent = { SI: unit('%', same, same, 1), US: unit('%', same, same, 1) };
/** A difference of temperatures (a margin), stored in K. */
const temperatureDifference = {
  SI: unit('K', same, same, 1),
  US: unit('°F', (k) => fromSI('temperatureDifference', k, '°F'), (f) => toSI('temperatureDifference', f, '°F'), 1),
};

/** Quantities the estimate shows, each with its unit per system. */
export const DISPLAY_UNITS = {
  length,
  altitude: length,
  thickness: small,
  diameter: small,
  temperature,
  temperatureDifference,
  gaugePressure: {
    SI: unit('bar (gauge)', (kPa) => fromSI('pressure', kPa, 'bar'), (bar) => toSI('pressure', bar, 'bar'), 2),
    US: unit('psig', (kPa) => fromSI('pressure', kPa, 'psi'), (psi) => toSI('pressure', psi, 'psi'), 1),
  },
  speed: {
    SI: unit('m/s', same, same, 1),
    US: unit('mph', (ms) => fromSI('speed', ms, 'mph'), (mph) => toSI('speed', mph, 'mph'), 1),
  },
  percent,
  /** A stored fraction 0–1 shown as a percentage (boiler efficiency, bare share). */
  fraction: {
    SI: unit('%', (f) => f * 100, (p) => p / 100, 1),
    US: unit('%', (f) => f * 100, (p) => p / 100, 1),
  },
  heatPerLength: {
    SI: unit('W/m', same, same, 0),
    US: unit('Btu/h per ft', (w) => fromSI('heatFlowPerLength', w, 'Btu/(h·ft)'), (b) => toSI('heatFlowPerLength', b, 'Btu/(h·ft)'), 0),
  },
  /** Heat flow, stored in W. */
  power: {
    SI: unit('kW', (w) => fromSI('power', w, 'kW'), (kw) => toSI('power', kw, 'kW'), 2),
    US: unit('Btu/h', (w) => fromSI('power', w, 'Btu/h'), (b) => toSI('power', b, 'Btu/h'), 0),
  },
  /** Energy over a year, stored in GJ as the engine reports it. */
  energyPerYear: {
    SI: unit('GJ', same, same, 1),
    US: unit('MMBtu', (gj) => fromSI('energy', gj * 1e9, 'MMBtu'), (mmbtu) => toSI('energy', mmbtu, 'MMBtu') / 1e9, 1),
  },
  steamRate: {
    SI: unit('kg/h', same, same, 1),
    US: unit('lb/h', (kg) => fromSI('massFlow', kg, 'lb/h'), (lb) => toSI('massFlow', lb, 'lb/h'), 1),
  },
  /** Steam over a year, stored in kg. */
  steamMass: {
    SI: unit('t', (kg) => fromSI('mass', kg, 't'), (t) => toSI('mass', t, 't'), 1),
    US: unit('lb', (kg) => fromSI('mass', kg, 'lb'), (lb) => toSI('mass', lb, 'lb'), 0),
  },
} as const satisfies Record<string, Record<UnitSystem, DisplayUnit>>;

export type DisplayQuantity = keyof typeof DISPLAY_UNITS;

/** The unit a quantity is shown in under a unit system. */
export function displayUnit(quantity: DisplayQuantity, system: UnitSystem): DisplayUnit {
  return DISPLAY_UNITS[quantity][system];
}

/**
 * A stored value as it goes back into an input: rounded to the unit's input decimals,
 * no separators, so "100 ft" stored as 30.48 m reads 100 again, never 99.99999.
 */
export function formatForInput(value: unknown, quantity: DisplayQuantity, system: UnitSystem): string {
  if (value === undefined || value === null || value === '') return '';
  if (typeof value !== 'number') return String(value);
  if (!Number.isFinite(value)) return '';
  const shown = displayUnit(quantity, system).fromBase(value);
  const decimals = displayUnit(quantity, system).inputDecimals;
  const rounded = Number(shown.toFixed(decimals));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

/**
 * A stored value converted into a unit it was not typed in: three significant figures (no
 * fewer than the whole number), at most the unit's input decimals — 131 ft reads 39.9 m,
 * 25 mm reads 0.984 in, 600 kPa reads 87 psig. The stored value keeps full precision, so
 * switching back shows what was typed.
 */
export function formatConverted(value: unknown, quantity: DisplayQuantity, system: UnitSystem): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return formatForInput(value, quantity, system);
  const unit = displayUnit(quantity, system);
  const shown = unit.fromBase(value);
  const magnitude = shown === 0 ? 0 : Math.floor(Math.log10(Math.abs(shown)));
  const decimals = quantity === 'temperature' ? unit.inputDecimals : Math.min(unit.inputDecimals, Math.max(0, 2 - magnitude));
  const rounded = Number(shown.toFixed(decimals));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

/**
 * What a person typed, as a number in that unit: undefined when empty, the text itself when
 * it is not a number (so the schema can say what was given). A comma is read as a decimal
 * point when there is no point, as many keyboards outside the US type it.
 */
export function parseTyped(text: string): number | string | undefined {
  const trimmed = text.trim().replace(/\s+/g, '').replace(/−/g, '-');
  if (trimmed === '') return undefined;
  const normalized = trimmed.includes('.') ? trimmed.replace(/,/g, '') : trimmed.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(normalized)) return trimmed;
  return Number(normalized);
}
