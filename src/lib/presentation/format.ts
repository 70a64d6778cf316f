/**
 * The formatters for one reader — their unit system, their locale, the plant's currency —
 * built on the rounding rule of ./rounding and the money of ./money.
 */
import { displayUnit, type DisplayQuantity, type UnitSystem } from '../units-display';
import { moneyOf, moneyRangeOf, moneyWriter } from './money';
import {
  DEFAULT_LOCALE,
  formatNumber,
  formatQuantity,
  formatTemperature,
  NBSP,
  rangeOf,
  rangeStep,
  ROUNDING,
  unitText,
  withUnit,
  writeNumber,
  type FormattedRange,
} from './rounding';

/** Options every formatter takes: the reader's unit system and the locale numbers are written in. */
export interface DisplayOptions {
  readonly system: UnitSystem;
  /**
   * BCP 47 locale for digits and separators; English with US separators by default, which
   * is what the forms accept back.
   */
  readonly locale?: string;
}

/** Months for a duration under a year, rounded (at least 1). */
function months(years: number): number {
  return Math.max(1, Math.round(years * 12));
}

/**
 * The formatters for one reader: their unit system, their locale, the plant's currency.
 * Every figure Lagwise shows goes through one of these.
 */
export interface DisplayFormat {
  readonly system: UnitSystem;
  readonly locale: string;
  readonly currency: string;
  /** A plain number by the rule (3 significant figures, or as many as asked). */
  number(value: number, significant?: number): string;
  /** The unit symbol a quantity is shown in under this system. */
  unit(quantity: DisplayQuantity): string;
  /** An SI value converted and rounded, without its unit: "1,680". */
  quantityNumber(valueSI: number, quantity: DisplayQuantity, significant?: number): string;
  /**
   * An SI value converted, rounded and with its unit: "1,680 Btu/h per ft", "337 °F". More
   * significant figures only for catalog dimensions people match against ("2.375 in OD").
   */
  quantity(valueSI: number, quantity: DisplayQuantity, significant?: number): string;
  /** A range of an SI quantity: ends without the unit, the whole with it once. */
  quantityRange(lowSI: number, highSI: number, quantity: DisplayQuantity): FormattedRange;
  /** A temperature in whole degrees: "337 °F", "−5 °C". */
  temperature(celsius: number, decimals?: number): string;
  /** An insulation thickness as the trade sells it: "1½ in", "40 mm". */
  thickness(meters: number): string;
  /** Money in the plant's currency, whole units: "$4,230", "under $1". */
  money(value: number): string;
  moneyRange(low: number, high: number): FormattedRange;
  /** A duration: "11 months", "2.4 years"; null (nothing saved) reads as "no payback". */
  years(value: number | null): string;
  yearsRange(low: number, high: number): FormattedRange;
  /** CO₂ by mass: "22.7 t CO₂", "450 kg CO₂". */
  co2(kg: number): string;
  co2Range(lowKg: number, highKg: number): FormattedRange;
  /** A fraction 0–1 as a percentage: "78 %". */
  percent(fraction: number): string;
}

const FRACTION_GLYPHS: Record<number, string> = { 1: '⅛', 2: '¼', 3: '⅜', 4: '½', 5: '⅝', 6: '¾', 7: '⅞' };

/**
 * The formatters for a reader. `currency` is the plant's (an ISO 4217 code); it may be left
 * out where no money is written, and money then refuses to be written.
 */
export function displayFormat(options: DisplayOptions & { readonly currency?: string }): DisplayFormat {
  const { system } = options;
  const currency = options.currency ?? '';
  const locale = options.locale ?? DEFAULT_LOCALE;
  const number = (value: number, significant?: number) => formatNumber(value, significant, locale);
  const shown = (valueSI: number, quantity: DisplayQuantity) => displayUnit(quantity, system).fromBase(valueSI);
  const temperature = (celsius: number, decimals = 0) => formatTemperature(celsius, system, decimals, locale);
  const quantity = (valueSI: number, q: DisplayQuantity, significant?: number) => formatQuantity(valueSI, q, system, significant, locale);
  const write = currency
    ? moneyWriter(currency, locale)
    : () => {
        throw new Error('displayFormat was made without a currency, so it cannot write money.');
      };
  const co2Unit = (kg: number) => (Math.abs(kg) >= 1000 ? { symbol: 't CO₂', scale: 1 / 1000 } : { symbol: 'kg CO₂', scale: 1 });

  return {
    system,
    locale,
    currency,
    number,
    unit: (q) => unitText(displayUnit(q, system).symbol),
    quantityNumber: (valueSI, q, significant) =>
      q === 'temperature' ? writeNumber(shown(valueSI, q), ROUNDING.temperatureStep, locale) : number(shown(valueSI, q), significant),
    quantity,
    quantityRange: (lowSI, highSI, q) => {
      const low = shown(lowSI, q);
      const high = shown(highSI, q);
      const step = rangeStep(low, high, q === 'temperature' ? ROUNDING.temperatureStep : 0);
      return rangeOf(writeNumber(low, step, locale), writeNumber(high, step, locale), displayUnit(q, system).symbol);
    },
    temperature,
    thickness: (meters) => {
      if (system === 'SI') return withUnit(writeNumber(shown(meters, 'thickness'), 1, locale), 'mm');
      const inches = shown(meters, 'thickness');
      const eighths = Math.round(inches * 8);
      if (eighths > 0 && Math.abs(inches * 8 - eighths) < 0.05) {
        const whole = Math.floor(eighths / 8);
        return withUnit(`${whole === 0 ? '' : String(whole)}${FRACTION_GLYPHS[eighths % 8] ?? ''}`, 'in');
      }
      return quantity(meters, 'thickness');
    },
    money: (value) => moneyOf(write, value),
    moneyRange: (low, high) => moneyRangeOf(write, low, high),
    years: (value) => {
      if (value === null || !Number.isFinite(value)) return 'no payback';
      if (value < 1) {
        const m = months(value);
        return `${m}${NBSP}${m === 1 ? 'month' : 'months'}`;
      }
      const text = number(value, ROUNDING.duration);
      return `${text}${NBSP}${text === '1' ? 'year' : 'years'}`;
    },
    yearsRange: (low, high) => {
      if (high < 1) return rangeOf(String(months(low)), String(months(high)), 'months');
      const step = rangeStep(low, high);
      return rangeOf(writeNumber(low, step, locale), writeNumber(high, step, locale), 'years');
    },
    co2: (kg) => {
      const { symbol, scale } = co2Unit(kg);
      return withUnit(number(kg * scale), symbol);
    },
    co2Range: (lowKg, highKg) => {
      const { symbol, scale } = co2Unit(Math.max(Math.abs(lowKg), Math.abs(highKg)));
      const step = rangeStep(lowKg * scale, highKg * scale);
      return rangeOf(writeNumber(lowKg * scale, step, locale), writeNumber(highKg * scale, step, locale), symbol);
    },
    percent: (fraction) => withUnit(number(fraction * 100), '%'),
  };
}
