import { and, eq, isNull, or, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { user } from '../auth-schema';
import { regionConsultants, regions } from '../schema';
import { findRegionForPostalCode } from './regions';

/** The region that takes a routing key and how many active consultants work it. */
export interface CoverageRow {
  regionName: string;
  activeConsultants: number;
}

/**
 * Who would receive an assessment sent from this code: the region routing picks (the longest
 * matching prefix), if it is in service, with its consultants who are not deactivated.
 */
export async function findCoverage(db: Executor, countryCode: string, routingKey: string): Promise<CoverageRow | null> {
  const match = await findRegionForPostalCode(db, countryCode, routingKey);
  if (!match) return null;
  const [row] = await db
    .select({
      regionName: regions.name,
      activeConsultants: sql<number>`count(${user.id})::int`,
    })
    .from(regions)
    .leftJoin(regionConsultants, eq(regionConsultants.regionId, regions.id))
    .leftJoin(user, and(eq(user.id, regionConsultants.userId), or(isNull(user.banned), eq(user.banned, false))))
    .where(and(eq(regions.id, match.regionId), isNull(regions.retiredAt)))
    .groupBy(regions.id, regions.name);
  return row ?? null;
}
