import { expect } from 'vitest';

/** Tolerance as the source states it: relative (0.15 = ±15 %) or absolute, in the row's unit. */
export type Tolerance = { readonly relative: number } | { readonly absolute: number };

/** One published check: conditions, expected value, tolerance, where it comes from. */
export interface ReferenceRow<Input> {
  readonly name: string;
  readonly input: Input;
  readonly expected: number;
  readonly tolerance: Tolerance;
  /** Source, with "from memory" where the value was recalled rather than read. */
  readonly source: string;
}

/** Signed deviation of `actual` from the row, in the tolerance's own terms (relative or absolute). */
export function deviation(actual: number, row: { expected: number; tolerance: Tolerance }): number {
  return 'relative' in row.tolerance ? actual / row.expected - 1 : actual - row.expected;
}

/** Asserts `actual` lies within the row's tolerance, naming the row and its source on failure. */
export function expectWithin(actual: number, row: { name: string; expected: number; tolerance: Tolerance; source: string }): void {
  const d = deviation(actual, row);
  const limit = 'relative' in row.tolerance ? row.tolerance.relative : row.tolerance.absolute;
  expect(Number.isFinite(actual), `${row.name}: result must be finite`).toBe(true);
  expect(
    Math.abs(d),
    `${row.name}: got ${actual}, expected ${row.expected} ±${'relative' in row.tolerance ? `${limit * 100} %` : limit} (${row.source})`,
  ).toBeLessThanOrEqual(limit);
}
