/**
 * How Lagwise writes a number for a person: the one rounding rule, the unit each quantity
 * is shown in (from ../units-display), and the spacing that keeps a number with its unit.
 * The small core the forms need too; ./format builds every reader's formatters on it.
 *
 * The rounding rule, chosen once ({@link ROUNDING}):
 * - a figure is rounded once, in the unit it is shown in, to 3 significant figures — an
 *   estimate built on paced lengths and guessed hours earns no more;
 * - never finer than its unit's step: money in whole currency units (whatever the display
 *   units), temperatures in whole degrees (a temperature scale has no natural zero, so
 *   significant figures mean nothing for it);
 * - the two ends of a low–high range share one step, the one that gives the larger end
 *   2 significant figures: the ends are percentiles of a spread, and a third digit there is
 *   noise (so "$2,900–$6,200", never "$2,910–$6,190" on one screen and the other elsewhere);
 * - durations (payback) keep 2 significant figures, months under a year.
 * Money never depends on the unit system: the same amount reads the same in US and SI.
 */
import { displayUnit, type DisplayQuantity, type UnitSystem } from '../units-display';

/** No-break space: between a number and its unit, so "−5 °C" never breaks across lines. */
export const NBSP = '\u00a0';
/** The minus sign (U+2212), which reads better than a hyphen and never breaks from its digits. */
export const MINUS = '\u2212';

/** The one rounding rule's numbers. */
export const ROUNDING = {
  /** Significant figures of a single figure. */
  figure: 3,
  /** Significant figures of the larger end of a range; the other end takes the same step. */
  rangeEnd: 2,
  /** Significant figures of a duration in years. */
  duration: 2,
  /** Smallest step of money: whole units of the currency. */
  moneyStep: 1,
  /** Smallest step of a temperature: whole degrees. */
  temperatureStep: 1,
} as const;

/** A low–high range: each end as written, and the whole with its unit said once. */
export interface FormattedRange {
  readonly low: string;
  readonly high: string;
  /** "$2,900–$6,200", "1,200–1,600 GJ"; one figure when both ends read the same. */
  readonly text: string;
}

/** The power-of-ten step that keeps `significant` figures of `value`. */
export function stepFor(value: number, significant: number): number {
  if (value === 0 || !Number.isFinite(value)) return 1;
  return 10 ** (Math.floor(Math.log10(Math.abs(value))) - significant + 1);
}

/** `value` rounded to a multiple of `step` (halves away from zero), without binary dust. */
export function roundToStep(value: number, step: number): number {
  // toPrecision first: 0.15 / 0.1 is 1.4999999999999998 in binary, and should round up.
  const units = Math.round(Number((Math.abs(value) / step).toPrecision(12))) * Math.sign(value);
  const rounded = step >= 1 ? units * step : units / Math.round(1 / step);
  return Object.is(rounded, -0) ? 0 : rounded;
}

export function decimalsOf(step: number): number {
  return step >= 1 ? 0 : Math.round(-Math.log10(step));
}

const formats = new Map<string, Intl.NumberFormat>();
export function numberFormat(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, options);
    formats.set(key, format);
  }
  return format;
}

/** Minus sign for negatives and no-break spaces inside what Intl gives (e.g. "kr 4,230"). */
export function typeset(text: string): string {
  return text.replace(/-/g, MINUS).replace(/[ \u202f]/g, NBSP);
}

/**
 * `value` rounded to `step` and written out. Range ends keep the step's decimals ("1.0–1.4");
 * a single figure drops trailing zeros ("78 %", not "78.0 %").
 */
export function writeNumber(value: number, step: number, locale: string, keepZeros = true): string {
  const decimals = decimalsOf(step);
  return typeset(
    numberFormat(locale, { minimumFractionDigits: keepZeros ? decimals : 0, maximumFractionDigits: decimals, useGrouping: true }).format(
      roundToStep(value, step),
    ),
  );
}

/** The step of a single figure: `significant` figures, re-taken when rounding adds a digit (99.96 → 100). */
export function figureStep(value: number, significant: number): number {
  const step = stepFor(value, significant);
  return Math.max(step, stepFor(roundToStep(value, step), significant));
}

/** A unit symbol with no-break spaces inside it ("Btu/h per ft" stays on one line). */
export function unitText(symbol: string): string {
  return symbol.replace(/ /g, NBSP);
}

export function withUnit(number: string, symbol: string): string {
  return symbol ? `${number}${NBSP}${unitText(symbol)}` : number;
}

/** The shared step of a range: {@link ROUNDING.rangeEnd} figures of the larger end, never below `minStep`. */
export function rangeStep(low: number, high: number, minStep = 0): number {
  return Math.max(stepFor(Math.max(Math.abs(low), Math.abs(high)), ROUNDING.rangeEnd), minStep);
}

export function rangeOf(low: string, high: string, unit: string): FormattedRange {
  const text = low === high ? withUnit(low, unit) : withUnit(`${low}–${high}`, unit);
  return { low, high, text };
}

/** Digits and separators as the forms accept them back. */
export const DEFAULT_LOCALE = 'en-US';

/** A plain number by the rule: 3 significant figures (or as many as asked), trailing zeros dropped. */
export function formatNumber(value: number, significant: number = ROUNDING.figure, locale = DEFAULT_LOCALE): string {
  return Number.isFinite(value) ? writeNumber(value, figureStep(value, significant), locale, false) : '—';
}

/** A temperature in the system's unit, whole degrees (or `decimals`): "337 °F", "−5 °C". */
export function formatTemperature(celsius: number, system: UnitSystem, decimals = 0, locale = DEFAULT_LOCALE): string {
  if (!Number.isFinite(celsius)) return '—';
  const unit = displayUnit('temperature', system);
  return withUnit(writeNumber(unit.fromBase(celsius), 10 ** -decimals, locale), unit.symbol);
}

/**
 * An SI value converted, rounded and with its unit: "1,680 Btu/h per ft", "337 °F". More
 * significant figures only for catalog dimensions people match against ("2.375 in OD").
 */
export function formatQuantity(
  valueSI: number,
  quantity: DisplayQuantity,
  system: UnitSystem,
  significant: number = ROUNDING.figure,
  locale = DEFAULT_LOCALE,
): string {
  if (quantity === 'temperature') return formatTemperature(valueSI, system, 0, locale);
  const unit = displayUnit(quantity, system);
  return withUnit(formatNumber(unit.fromBase(valueSI), significant, locale), unit.symbol);
}

