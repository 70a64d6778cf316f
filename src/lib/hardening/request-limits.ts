/**
 * A generous per-client limit on every state-changing API request, kept in PostgreSQL (so it
 * holds across servers), answered 429 with Retry-After. Routes named below get their own
 * number; every other write under /api gets the default. Declaring a new public POST's limit
 * is one line in REQUEST_LIMITS.
 */
import { getDb } from '../../db/client';
import { hitRateLimit } from '../../db/queries/rate-limits';
import { errorResponse } from '../http';

export interface RequestLimit {
  /** The route, as a pattern on the path. */
  pattern: RegExp;
  /** The counter's name (routes may share one). */
  bucket: string;
  perMinute: number;
  /** A public read counted too (by default only writes are). */
  reads?: boolean;
}

/** Per client address, per minute. A person at a form never comes near these. */
export const REQUEST_LIMITS: readonly RequestLimit[] = [
  // The estimate form recalculates as fields change (debounced): a busy minute is ~60.
  { pattern: /^\/api\/estimate\/?$/, bucket: 'estimate', perMinute: 240 },
  { pattern: /^\/api\/assessments\/?$/, bucket: 'submit', perMinute: 30 },
  { pattern: /^\/api\/sign-in\//, bucket: 'sign-in', perMinute: 60 },
  // Coverage is asked once typing pauses at the plant step; a list of codes walked through is refused.
  { pattern: /^\/api\/coverage\/?$/, bucket: 'coverage', perMinute: 60, reads: true },
];

export const DEFAULT_WRITES_PER_MINUTE = 120;

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The test stack multiplies every limit (all its clients are 127.0.0.1); the abuse suite runs at 1. */
function multiplier(): number {
  const value = Number(process.env.LAGWISE_REQUEST_LIMIT_MULTIPLIER ?? 1);
  return Number.isFinite(value) && value >= 1 ? value : 1;
}

export function limitFor(method: string, pathname: string): { bucket: string; perMinute: number } | undefined {
  if (!pathname.startsWith('/api/')) return undefined;
  const named = REQUEST_LIMITS.find((limit) => limit.pattern.test(pathname));
  if (!WRITE_METHODS.has(method) && !(named?.reads && method === 'GET')) return undefined;
  return named ? { bucket: named.bucket, perMinute: named.perMinute } : { bucket: 'write', perMinute: DEFAULT_WRITES_PER_MINUTE };
}

/** Counts the request; the 429 to answer with, or undefined when within the limit. */
export async function refuseOverLimit(method: string, pathname: string, clientAddress: string): Promise<Response | undefined> {
  const limit = limitFor(method, pathname);
  if (!limit) return undefined;
  const verdict = await hitRateLimit(getDb(), `req:${limit.bucket}:${clientAddress}`, {
    limit: limit.perMinute * multiplier(),
    windowSeconds: 60,
  });
  if (verdict.allowed) return undefined;
  const response = errorResponse(
    429,
    'RATE_LIMITED',
    `Too many requests from your address in the last minute; please wait ${verdict.retryAfterSeconds} seconds and try again.`,
  );
  response.headers.set('retry-after', String(verdict.retryAfterSeconds));
  return response;
}
