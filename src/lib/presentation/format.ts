/**
 * How Lagwise writes a figure for a person: the one rounding rule, the unit each quantity
 * is shown in (from ../units-display), money in the plant's currency, and the spacing that
 * keeps a number with its unit. Pure TypeScript: pages, islands, e-mails and PDFs share it.
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

/** Options every formatter takes: the reader's unit system and the locale numbers are written in. */
export interface DisplayOptions {
  readonly system: UnitSystem;
  /**
   * BCP 47 locale for digits and separators; English with US separators by default, which
   * is what the forms accept back.
   */
  readonly locale?: string;
}

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

function decimalsOf(step: number): number {
  return step >= 1 ? 0 : Math.round(-Math.log10(step));
}

const formats = new Map<string, Intl.NumberFormat>();
function numberFormat(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, options);
    formats.set(key, format);
  }
  return format;
}

/** Minus sign for negatives and no-break spaces inside what Intl gives (e.g. "kr 4,230"). */
function typeset(text: string): string {
  return text.replace(/-/g, MINUS).replace(/[ \u202f]/g, NBSP);
}

/**
 * `value` rounded to `step` and written out. Range ends keep the step's decimals ("1.0–1.4");
 * a single figure drops trailing zeros ("78 %", not "78.0 %").
 */
function writeNumber(value: number, step: number, locale: string, keepZeros = true): string {
  const decimals = decimalsOf(step);
  return typeset(
    numberFormat(locale, { minimumFractionDigits: keepZeros ? decimals : 0, maximumFractionDigits: decimals, useGrouping: true }).format(
      roundToStep(value, step),
    ),
  );
}

/** The step of a single figure: `significant` figures, re-taken when rounding adds a digit (99.96 → 100). */
function figureStep(value: number, significant: number): number {
  const step = stepFor(value, significant);
  return Math.max(step, stepFor(roundToStep(value, step), significant));
}

/** A unit symbol with no-break spaces inside it ("Btu/h per ft" stays on one line). */
function unitText(symbol: string): string {
  return symbol.replace(/ /g, NBSP);
}

function withUnit(number: string, symbol: string): string {
  return symbol ? `${number}${NBSP}${unitText(symbol)}` : number;
}

/** The shared step of a range: {@link ROUNDING.rangeEnd} figures of the larger end, never below `minStep`. */
function rangeStep(low: number, high: number, minStep = 0): number {
  return Math.max(stepFor(Math.max(Math.abs(low), Math.abs(high)), ROUNDING.rangeEnd), minStep);
}

function rangeOf(low: string, high: string, unit: string): FormattedRange {
  const text = low === high ? withUnit(low, unit) : withUnit(`${low}–${high}`, unit);
  return { low, high, text };
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
   * significant figures only for catalogue dimensions people match against ("2.375 in OD").
   */
  quantity(valueSI: number, quantity: DisplayQuantity, significant?: number): string;
  /** A range of an SI quantity: ends without the unit, the whole with it once. */
  quantityRange(lowSI: number, highSI: number, quantity: DisplayQuantity): FormattedRange;
  /** A temperature in whole degrees: "337 °F", "−5 °C". */
  temperature(celsius: number, decimals?: number): string;
  /** An insulation thickness as the trade sells it: "1½ in", "40 mm". */
  thickness(metres: number): string;
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
 * out where no money is written (a form's hints), and money then refuses to be written.
 */
export function displayFormat(options: DisplayOptions & { readonly currency?: string }): DisplayFormat {
  const { system } = options;
  const currency = options.currency ?? '';
  const locale = options.locale ?? 'en-US';
  const number = (value: number, significant: number = ROUNDING.figure) =>
    Number.isFinite(value) ? writeNumber(value, figureStep(value, significant), locale, false) : '—';
  const shown = (valueSI: number, quantity: DisplayQuantity) => displayUnit(quantity, system).fromBase(valueSI);
  const quantityNumber = (valueSI: number, quantity: DisplayQuantity, significant: number = ROUNDING.figure) => {
    if (quantity === 'temperature') return writeNumber(shown(valueSI, quantity), ROUNDING.temperatureStep, locale);
    return number(shown(valueSI, quantity), significant);
  };
  const unit = (quantity: DisplayQuantity) => unitText(displayUnit(quantity, system).symbol);

  let currencyFormat: Intl.NumberFormat | null = null;
  try {
    currencyFormat = currency
      ? numberFormat(locale, { style: 'currency', currency, currencyDisplay: 'narrowSymbol', minimumFractionDigits: 0, maximumFractionDigits: 0 })
      : null;
  } catch {
    // A code Intl does not know still reads as "ABC 4,230".
    currencyFormat = null;
  }
  const moneyAt = (value: number, step: number) => {
    if (!currency) throw new Error('displayFormat was made without a currency, so it cannot write money.');
    const rounded = roundToStep(value, step);
    if (currencyFormat) return typeset(currencyFormat.format(rounded));
    return `${currency}${NBSP}${writeNumber(rounded, step, locale)}`;
  };
  const money = (value: number) => {
    if (!Number.isFinite(value)) return '—';
    if (value !== 0 && Math.abs(value) < ROUNDING.moneyStep / 2) return `under${NBSP}${moneyAt(ROUNDING.moneyStep, ROUNDING.moneyStep)}`;
    return moneyAt(value, Math.max(figureStep(value, ROUNDING.figure), ROUNDING.moneyStep));
  };

  const co2Unit = (kg: number) => (Math.abs(kg) >= 1000 ? { symbol: 't CO₂', scale: 1 / 1000 } : { symbol: 'kg CO₂', scale: 1 });

  const format: DisplayFormat = {
    system,
    locale,
    currency,
    number,
    unit,
    quantityNumber,
    quantity: (valueSI, quantity, significant) =>
      withUnit(quantityNumber(valueSI, quantity, significant), displayUnit(quantity, system).symbol),
    quantityRange: (lowSI, highSI, quantity) => {
      const low = shown(lowSI, quantity);
      const high = shown(highSI, quantity);
      const step = rangeStep(low, high, quantity === 'temperature' ? ROUNDING.temperatureStep : 0);
      return rangeOf(writeNumber(low, step, locale), writeNumber(high, step, locale), displayUnit(quantity, system).symbol);
    },
    temperature: (celsius, decimals = 0) => {
      if (!Number.isFinite(celsius)) return '—';
      return withUnit(writeNumber(shown(celsius, 'temperature'), 10 ** -decimals, locale), displayUnit('temperature', system).symbol);
    },
    thickness: (metres) => {
      if (system === 'US') {
        const inches = shown(metres, 'thickness');
        const eighths = Math.round(inches * 8);
        if (eighths > 0 && Math.abs(inches * 8 - eighths) < 0.05) {
          const whole = Math.floor(eighths / 8);
          const glyph = FRACTION_GLYPHS[eighths % 8] ?? '';
          return withUnit(`${whole === 0 ? '' : String(whole)}${glyph}`, 'in');
        }
      }
      if (system === 'SI') return withUnit(writeNumber(shown(metres, 'thickness'), 1, locale), 'mm');
      return format.quantity(metres, 'thickness');
    },
    money,
    moneyRange: (low, high) => {
      const step = rangeStep(low, high, ROUNDING.moneyStep);
      return rangeOf(moneyAt(low, step), moneyAt(high, step), '');
    },
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
  return format;
}

/** Money alone, where no other quantity is shown (lists of leads): the same rule, whatever the units. */
export function formatMoney(value: number, currency: string, locale?: string): string {
  return displayFormat({ system: 'SI', currency, ...(locale ? { locale } : {}) }).money(value);
}

/** A money range alone, on the shared step of the rule: "$2,900–$6,200". */
export function formatMoneyRange(low: number, high: number, currency: string, locale?: string): FormattedRange {
  return displayFormat({ system: 'SI', currency, ...(locale ? { locale } : {}) }).moneyRange(low, high);
}
