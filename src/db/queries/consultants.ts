import { and, eq, or, isNull, ne, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { consultantInvitations, regionConsultants, user } from '../schema';

/**
 * Consultants who cover a region and may be told about its leads: not banned, and not still
 * waiting to accept their invitation (they have no password yet).
 */
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
        sql`not exists (select 1 from ${consultantInvitations} i where i.user_id = ${user.id} and i.accepted_at is null and i.withdrawn_at is null)`,
      ),
    );
}
