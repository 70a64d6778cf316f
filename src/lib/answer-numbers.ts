/**
 * How numbers are written into the estimate's answer: six significant digits — more than any
 * screen shows, far fewer bytes than the seventeen a double prints with.
 */
export const ANSWER_SIGNIFICANT_DIGITS = 6;

/** A JSON.stringify replacer that writes fractional numbers with six significant digits. */
export function withAnswerDigits(_key: string, value: unknown): unknown {
  return typeof value === 'number' && Number.isFinite(value) && !Number.isInteger(value) ? Number(value.toPrecision(ANSWER_SIGNIFICANT_DIGITS)) : value;
}
