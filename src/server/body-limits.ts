/**
 * How large a request body may be, by route, known before a byte of it is read. The server
 * refuses a larger Content-Length (and an `Expect: 100-continue` for one) at once, and stops
 * reading a body without a length as soon as it passes the cap.
 */

/** JSON and form posts: an estimate with a few hundred runs is well under this. */
export const DEFAULT_MAX_BODY_BYTES = 1_000_000;

/** An assessment with its photos: 12 photos of up to 10 MB, plus the form (src/schemas/assessment.ts). */
export const SUBMISSION_MAX_BODY_BYTES = 12 * 10 * 1024 * 1024 + 2 * 1024 * 1024;

/**
 * Routes that take more than the default. Add a route here when it accepts uploads; its own
 * reader must cap again at its real limit.
 */
const LARGER_BODIES: ReadonlyArray<readonly [RegExp, number]> = [[/^\/api\/assessments\/?$/, SUBMISSION_MAX_BODY_BYTES]];

export function maxBodyBytesFor(pathname: string): number {
  for (const [pattern, bytes] of LARGER_BODIES) if (pattern.test(pathname)) return bytes;
  return DEFAULT_MAX_BODY_BYTES;
}

export function describeBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Math.round(bytes / 1024 / 1024)} MB` : `${Math.round(bytes / 1000)} kB`;
}

/** Thrown by a capped body stream; answered 413. */
export class BodyTooLarge extends Error {
  constructor(readonly maxBytes: number) {
    super(`The request body is over ${describeBytes(maxBytes)}.`);
    this.name = 'BodyTooLarge';
  }
}

/** True when `error` (or what it wraps) is a capped stream's refusal. */
export function isBodyTooLarge(error: unknown): error is BodyTooLarge {
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current && typeof current === 'object'; depth += 1) {
    if ((current as { name?: unknown }).name === 'BodyTooLarge') return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}
