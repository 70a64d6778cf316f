/**
 * Whether a consultant covers a plant's postal code, asked before the owner sends: the same
 * normalising and routing a submission goes through, so the answer is the routing's own.
 */
import { getDb } from '../db/client';
import { findCoverage } from '../db/queries/coverage';
import { hitRateLimit } from '../db/queries/rate-limits';
import type { CoverageAnswer, CoverageQuery } from '../schemas/coverage';
import { DomainError } from './errors';
import { normalisePostalCode, type CountryCode } from './routing/postal-code';

/** Per client address and minute: a person typing a code asks a few times; a list of codes is refused. */
export const COVERAGE_ASKS_PER_MINUTE = 60;

/** The honest answer for one code: covered only when a region in service has an active consultant. */
export async function checkCoverage(query: CoverageQuery, clientAddress: string): Promise<CoverageAnswer> {
  const db = getDb();
  const verdict = await hitRateLimit(db, `coverage:address:${clientAddress}`, { limit: COVERAGE_ASKS_PER_MINUTE, windowSeconds: 60 });
  if (!verdict.allowed) {
    throw new DomainError('RATE_LIMITED', `Too many postal codes asked about in a minute; wait ${verdict.retryAfterSeconds} seconds and try again.`);
  }
  const postal = normalisePostalCode(query.country as CountryCode, query.postalCode);
  if (!postal.ok) throw new DomainError('INVALID_INPUT', postal.message, 'postalCode');
  const row = await findCoverage(db, query.country, postal.routingKey);
  const covered = row !== null && row.activeConsultants > 0;
  return { countryCode: query.country, postalCode: postal.canonical, covered, regionName: covered ? row.regionName : null };
}
