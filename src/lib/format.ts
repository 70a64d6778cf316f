/** Numbers for people: money in the plant's currency, energy and mass with their units. */

export function formatMoney(amount: number, currency: string, { exact = false } = {}): string {
  try {
    return new Intl.NumberFormat('en', {
      style: 'currency',
      currency,
      maximumFractionDigits: exact ? 2 : 0,
      minimumFractionDigits: exact ? 2 : 0,
    }).format(amount);
  } catch {
    // An unknown currency code still reads well with the code before the number.
    return `${currency} ${formatNumber(amount, exact ? 2 : 0)}`;
  }
}

export function formatNumber(value: number, fractionDigits = 0): string {
  return new Intl.NumberFormat('en', { maximumFractionDigits: fractionDigits, minimumFractionDigits: fractionDigits }).format(value);
}

/** Two or three significant figures: an estimate should not look more exact than it is. */
export function formatRounded(value: number): string {
  if (value === 0 || !Number.isFinite(value)) return formatNumber(value);
  const digits = Math.abs(value) >= 100 ? 2 : 3;
  const magnitude = Math.floor(Math.log10(Math.abs(value))) + 1;
  const factor = 10 ** (magnitude - digits);
  return formatNumber(Math.round(value / factor) * factor, Math.max(0, digits - magnitude));
}

export function formatYears(years: number | null): string {
  if (years === null || !Number.isFinite(years)) return 'no payback';
  if (years < 1) return `${formatNumber(Math.max(1, Math.round(years * 12)))} months`;
  return `${formatNumber(years, years < 10 ? 1 : 0)} years`;
}
