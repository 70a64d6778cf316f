import { and, eq, or, isNull, ne } from 'drizzle-orm';
import type { Executor } from '../client';
import { regionConsultants, user } from '../schema';

/** Consultants who cover a region and may be told about its leads (not banned). */
export async function listRegionConsultants(db: Executor, regionId: string) {
  return db
    .select({ id: user.id, email: user.email, name: user.name })
    .from(regionConsultants)
    .innerJoin(user, eq(user.id, regionConsultants.userId))
    .where(
      and(
        eq(regionConsultants.regionId, regionId),
        eq(user.role, 'consultant'),
        or(isNull(user.banned), ne(user.banned, true)),
      ),
    );
}
