/**
 * Money by the rule: the plant's currency with its narrow symbol, whole units, three
 * significant figures, ranges on a shared two-figure step — the same whatever the display
 * units, since money has none.
 */
import { DEFAULT_LOCALE, figureStep, NBSP, numberFormat, rangeOf, rangeStep, ROUNDING, roundToStep, typeset, writeNumber, type FormattedRange } from './rounding';

/** Writes money in one currency by the rule; `step` is the rounding step in currency units. */
export function moneyWriter(currency: string, locale: string): (value: number, step: number) => string {
  let format: Intl.NumberFormat | null = null;
  try {
    format = numberFormat(locale, { style: 'currency', currency, currencyDisplay: 'narrowSymbol', minimumFractionDigits: 0, maximumFractionDigits: 0 });
  } catch {
    // A code Intl does not know still reads as "ABC 4,230".
    format = null;
  }
  return (value, step) => {
    const rounded = roundToStep(value, step);
    return format ? typeset(format.format(rounded)) : `${currency}${NBSP}${writeNumber(rounded, step, locale)}`;
  };
}

export function moneyOf(write: (value: number, step: number) => string, value: number): string {
  if (!Number.isFinite(value)) return '—';
  if (value !== 0 && Math.abs(value) < ROUNDING.moneyStep / 2) return `under${NBSP}${write(ROUNDING.moneyStep, ROUNDING.moneyStep)}`;
  return write(value, Math.max(figureStep(value, ROUNDING.figure), ROUNDING.moneyStep));
}

export function moneyRangeOf(write: (value: number, step: number) => string, low: number, high: number): FormattedRange {
  const step = rangeStep(low, high, ROUNDING.moneyStep);
  return rangeOf(write(low, step), write(high, step), '');
}

/** Money in the plant's currency, whole units, the same whatever the display units: "$4,230", "under $1". */
export function formatMoney(value: number, currency: string, locale = DEFAULT_LOCALE): string {
  return moneyOf(moneyWriter(currency, locale), value);
}

/** A money range on the shared step of the rule: "$2,900–$6,200". */
export function formatMoneyRange(low: number, high: number, currency: string, locale = DEFAULT_LOCALE): FormattedRange {
  return moneyRangeOf(moneyWriter(currency, locale), low, high);
}

