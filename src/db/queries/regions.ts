import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { regionPostalPrefixes, regions } from '../schema';
import { prefixCandidates } from '../../lib/routing/postal-code';

export interface RegionMatch {
  regionId: string;
  regionName: string;
  prefix: string;
}

/** The region whose prefix is the longest leading part of the code; none when nothing matches. */
export async function findRegionForPostalCode(
  db: Executor,
  countryCode: string,
  routingKey: string,
): Promise<RegionMatch | null> {
  const candidates = prefixCandidates(routingKey);
  if (candidates.length === 0) return null;
  const [match] = await db
    .select({ regionId: regions.id, regionName: regions.name, prefix: regionPostalPrefixes.prefix })
    .from(regionPostalPrefixes)
    .innerJoin(regions, eq(regions.id, regionPostalPrefixes.regionId))
    .where(and(eq(regionPostalPrefixes.countryCode, countryCode), inArray(regionPostalPrefixes.prefix, candidates)))
    .orderBy(desc(sql`length(${regionPostalPrefixes.prefix})`))
    .limit(1);
  return match ?? null;
}

/**
 * Serializes routing against region changes: a submission routes under the shared lock, a
 * change of prefixes holds it alone, so no assessment is routed against prefixes that are being
 * changed and then missed by the change's re-routing of unrouted assessments.
 */
export async function lockRouting(db: Executor, mode: 'share' | 'exclusive'): Promise<void> {
  await db.execute(
    mode === 'share'
      ? sql`select pg_advisory_xact_lock_shared(hashtext('lagwise:routing'))`
      : sql`select pg_advisory_xact_lock(hashtext('lagwise:routing'))`,
  );
}
