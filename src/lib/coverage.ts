/**
 * Whether a consultant covers a plant's postal code, asked before the owner sends: the same
 * normalizing and routing a submission goes through, so the answer is the routing's own.
 */
import { getDb } from '../db/client';
import { findCoverage } from '../db/queries/coverage';
import type { CoverageAnswer, CoverageQuery } from '../schemas/coverage';
import { DomainError } from './errors';
import { normalisePostalCode, type CountryCode } from './routing/postal-code';

/**
 * The honest answer for one code: covered only when a region in service has an active
 * consultant. Asks per address are limited with the other public routes (src/lib/hardening).
 */
export async function checkCoverage(query: CoverageQuery): Promise<CoverageAnswer> {
  const db = getDb();
  const postal = normalisePostalCode(query.country as CountryCode, query.postalCode);
  if (!postal.ok) throw new DomainError('INVALID_INPUT', postal.message, 'postalCode');
  const row = await findCoverage(db, query.country, postal.routingKey);
  const covered = row !== null && row.activeConsultants > 0;
  return { countryCode: query.country, postalCode: postal.canonical, covered, regionName: covered ? row.regionName : null };
}
