import { randomInt } from 'node:crypto';

/** Letters and digits that cannot be misread for one another on the phone (no 0/O, 1/I/L, 5/S, 2/Z, 8/B). */
const ALPHABET = '34679ACDEFGHJKMNPQRTUVWXY';

/** A short code people can read out, e.g. LW-7KQ4-MX: 25⁶ ≈ 244 million combinations. */
export function newAssessmentReference(): string {
  const pick = (n: number) => Array.from({ length: n }, () => ALPHABET[randomInt(ALPHABET.length)]).join('');
  return `LW-${pick(4)}-${pick(2)}`;
}
