/**
 * How Lagwise shows a quantity to a person: which unit in US customary or SI, how many
 * digits, thousands separators, currency. The engine keeps SI at full precision; these
 * helpers convert (with the engine's own factors) only for display and entry.
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

/** Quantities the estimate shows, each with its unit per system. */
export const DISPLAY_UNITS = {
  length,
  altitude: length,
  thickness: small,
  diameter: small,
  temperature,
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
 * What a person typed, as a number in that unit: undefined when empty, the text itself when
 * it is not a number (so the schema can say what was given). A comma is read as a decimal
 * point when there is no point, as many keyboards outside the US type it.
 */
export function parseTyped(text: string): number | string | undefined {
  const trimmed = text.trim().replace(/\s+/g, '').replace(/−/g, '-');
  if (trimmed === '') return undefined;
  const normalised = trimmed.includes('.') ? trimmed.replace(/,/g, '') : trimmed.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(normalised)) return trimmed;
  return Number(normalised);
}

/** Rounds to a number of significant digits (0 stays 0). */
export function roundSignificant(value: number, digits: number): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  return Number(value.toPrecision(digits));
}

const numberFormats = new Map<string, Intl.NumberFormat>();
function numberFormat(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat('en-US', options);
    numberFormats.set(key, format);
  }
  return format;
}

export interface FigureOptions {
  /** Significant digits kept (3 by default: honest for an estimate). */
  readonly significant?: number;
  /** Never more decimals than this (1 by default). */
  readonly maxDecimals?: number;
}

/** A figure for reading: thousands separators, three significant digits, at most one decimal. */
export function formatFigure(value: number, options: FigureOptions = {}): string {
  if (!Number.isFinite(value)) return '—';
  const { significant = 3, maxDecimals = 1 } = options;
  const rounded = roundSignificant(value, significant);
  const text = numberFormat({ maximumFractionDigits: maxDecimals, useGrouping: true }).format(rounded);
  return text === '-0' ? '0' : text.replace('-', '−');
}

/** A stored value shown in the system's unit with its symbol: "491 W/m", "1,680 Btu/h per ft". */
export function formatQuantity(
  value: number,
  quantity: DisplayQuantity,
  system: UnitSystem,
  options: FigureOptions = {},
): string {
  const shown = displayUnit(quantity, system);
  return `${formatFigure(shown.fromBase(value), options)} ${shown.symbol}`;
}

/** Money in the plant's currency, three significant digits, no cents on figures this size. */
export function formatMoney(value: number, currency: string, options: FigureOptions = {}): string {
  if (!Number.isFinite(value)) return '—';
  const { significant = 3 } = options;
  const rounded = roundSignificant(value, significant);
  const decimals = Math.abs(rounded) < 10 && rounded !== Math.round(rounded) ? 2 : 0;
  try {
    return numberFormat({
      style: 'currency',
      currency,
      minimumFractionDigits: decimals,
      maximumFractionDigits: decimals,
    }).format(rounded).replace('-', '−');
  } catch {
    // A currency code Intl does not know still reads as "ABC 1,234".
    return `${currency} ${formatFigure(rounded, { significant, maxDecimals: decimals })}`;
  }
}

/**
 * A low–high range with an en dash, the unit said once: "$3,900–$5,500", "1,200–1,600 GJ",
 * "8–11 months"; a range whose ends round alike is one figure.
 */
export function formatRange(low: number, high: number, format: (value: number) => string): string {
  const from = format(low);
  const to = format(high);
  if (from === to) return from;
  const split = (text: string) => /^([−\d.,]+) (.+)$/.exec(text);
  const a = split(from);
  const b = split(to);
  if (a && b && a[2] === b[2]) return `${a[1]}–${b[1]} ${b[2]}`;
  return `${from}–${to}`;
}

/** Years as a person says them: "11 months", "2.4 years". */
export function formatYears(years: number | null): string {
  if (years === null || !Number.isFinite(years)) return 'never on these inputs';
  if (years < 1) {
    const months = Math.max(1, Math.round(years * 12));
    return `${months} ${months === 1 ? 'month' : 'months'}`;
  }
  const rounded = roundSignificant(years, 2);
  return `${formatFigure(rounded, { significant: 2 })} ${rounded === 1 ? 'year' : 'years'}`;
}

/** Tonnes of CO₂ from kilograms: "22.7 t CO₂". */
export function formatCo2(kg: number, options: FigureOptions = {}): string {
  return `${formatFigure(kg / 1000, options)} t CO₂`;
}
