/**
 * The admin's named queries over regions, their prefixes and consultants, and the re-routing of
 * open assessments when prefixes change.
 */
import { and, asc, eq, inArray, isNull, like, ne, or, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { consultantProfiles, regionConsultants, regionPostalPrefixes, regions, user } from '../schema';

/**
 * The region row's id inside the count subqueries. Written out in full: in a select from one
 * table Drizzle leaves its columns unqualified, and a bare "id" would mean the assessment's.
 */
const regionIdRef = sql.raw('"regions"."id"');

/** Every region (live first, then retired) with its open, stale and held lead counts. */
export async function listRegionRows(db: Executor, staleAfterHours: number, regionIds?: string[]) {
  if (regionIds && regionIds.length === 0) return [];
  return db
    .select({
      id: regions.id,
      slug: regions.slug,
      name: regions.name,
      countryCode: regions.countryCode,
      retiredAt: regions.retiredAt,
      openLeads: sql<number>`(select count(*) from assessments a where a.region_id = ${regionIdRef} and a.status = 'fresh')`.mapWith(Number),
      staleLeads: sql<number>`(select count(*) from assessments a where a.region_id = ${regionIdRef} and a.status = 'fresh' and a.updated_at < now() - make_interval(hours => ${staleAfterHours}))`.mapWith(Number),
      heldLeads: sql<number>`(select count(*) from assessments a where a.region_id = ${regionIdRef} and a.status in ('claimed','in_touch','site_walk_booked','report_sent'))`.mapWith(Number),
    })
    .from(regions)
    .where(regionIds ? inArray(regions.id, regionIds) : undefined)
    .orderBy(sql`${regions.retiredAt} is not null`, asc(regions.name));
}

export async function listPrefixRows(db: Executor, countryCode?: string) {
  return db
    .select({ regionId: regionPostalPrefixes.regionId, countryCode: regionPostalPrefixes.countryCode, prefix: regionPostalPrefixes.prefix, regionName: regions.name })
    .from(regionPostalPrefixes)
    .innerJoin(regions, eq(regions.id, regionPostalPrefixes.regionId))
    .where(countryCode ? eq(regionPostalPrefixes.countryCode, countryCode) : undefined)
    .orderBy(asc(regionPostalPrefixes.prefix));
}

export async function listRegionConsultantRows(db: Executor, regionIds?: string[]) {
  if (regionIds && regionIds.length === 0) return [];
  return db
    .select({
      regionId: regionConsultants.regionId,
      id: user.id,
      name: user.name,
      firm: consultantProfiles.firm,
      banned: user.banned,
    })
    .from(regionConsultants)
    .innerJoin(user, eq(user.id, regionConsultants.userId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, user.id))
    .where(regionIds ? inArray(regionConsultants.regionId, regionIds) : undefined)
    .orderBy(asc(user.name));
}

/** A live region's row, locked for the change being made. */
export async function lockRegion(db: Executor, regionId: string) {
  const rows = await db.execute<{ id: string; name: string; country_code: string; retired_at: Date | null }>(
    sql`select id, name, country_code, retired_at from ${regions} where id = ${regionId} for update`,
  );
  return rows.rows[0] ?? null;
}

/** A slug not yet taken, from the region's name. */
export async function freeSlug(db: Executor, name: string): Promise<string> {
  const base =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'region';
  const taken = new Set(
    (await db.select({ slug: regions.slug }).from(regions).where(or(eq(regions.slug, base), like(regions.slug, `${base}-%`)))).map((r) => r.slug),
  );
  if (!taken.has(base)) return base;
  for (let n = 2; ; n += 1) if (!taken.has(`${base}-${n}`)) return `${base}-${n}`;
}

export async function insertRegion(db: Executor, region: { slug: string; name: string; countryCode: string }): Promise<string> {
  const [row] = await db.insert(regions).values(region).returning({ id: regions.id });
  if (!row) throw new Error('the region was not stored');
  return row.id;
}

export async function updateRegionRow(db: Executor, regionId: string, change: { name?: string; countryCode?: string; retiredAt?: Date }) {
  await db.update(regions).set(change).where(eq(regions.id, regionId));
}

/** Replaces a region's prefixes. */
export async function setRegionPrefixes(db: Executor, regionId: string, countryCode: string, prefixes: string[]) {
  await db.delete(regionPostalPrefixes).where(eq(regionPostalPrefixes.regionId, regionId));
  if (prefixes.length) await db.insert(regionPostalPrefixes).values(prefixes.map((prefix) => ({ regionId, countryCode, prefix })));
}

/** The same prefixes held by another region of the country. */
export async function findTakenPrefixes(db: Executor, regionId: string | null, countryCode: string, prefixes: string[]) {
  if (prefixes.length === 0) return [];
  return db
    .select({ prefix: regionPostalPrefixes.prefix, regionName: regions.name })
    .from(regionPostalPrefixes)
    .innerJoin(regions, eq(regions.id, regionPostalPrefixes.regionId))
    .where(
      and(
        eq(regionPostalPrefixes.countryCode, countryCode),
        inArray(regionPostalPrefixes.prefix, prefixes),
        regionId ? ne(regionPostalPrefixes.regionId, regionId) : undefined,
      ),
    );
}

/** Replaces the consultants of a region. */
export async function setRegionConsultantIds(db: Executor, regionId: string, userIds: string[]) {
  await db.delete(regionConsultants).where(eq(regionConsultants.regionId, regionId));
  if (userIds.length) await db.insert(regionConsultants).values(userIds.map((userId) => ({ regionId, userId })));
}

/** Of the ids given, those that are consultants' accounts. */
export async function consultantIdsAmong(db: Executor, ids: string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await db.select({ id: user.id }).from(user).where(and(inArray(user.id, ids), eq(user.role, 'consultant')));
  return new Set(rows.map((r) => r.id));
}

export async function liveRegionExists(db: Executor, regionId: string): Promise<boolean> {
  const rows = await db.select({ id: regions.id }).from(regions).where(and(eq(regions.id, regionId), isNull(regions.retiredAt)));
  return rows.length > 0;
}

export type Rerouted = {
  id: string;
  reference: string;
  old_region: string | null;
  new_region: string | null;
  old_status: string;
};

/**
 * Routes again, by longest prefix, every assessment nobody holds (`unrouted` or `fresh`) of the
 * country whose postal code starts with one of `prefixes` — the prefixes a change added or
 * removed. Only those whose region changes are written: an unrouted one that now matches
 * becomes `fresh` in its region, an open one whose prefix went away moves to the region that now
 * wins, or to `unrouted`.
 */
export async function rerouteOpenAssessments(db: Executor, countryCode: string, prefixes: string[]): Promise<Rerouted[]> {
  if (prefixes.length === 0) return [];
  const patterns = prefixes.map((p) => `${p}%`);
  const result = await db.execute<Rerouted>(sql`
    with candidates as (
      select a.id, a.status, a.region_id, a.country_code, a.postal_code_normalised
      from assessments a
      where a.status in ('unrouted', 'fresh') and a.country_code = ${countryCode}
        and a.postal_code_normalised like any(${sql.param(patterns)}::text[])
      for update of a
    ), best as (
      select c.id, c.status as old_status, c.region_id as old_region, m.region_id as new_region
      from candidates c
      left join lateral (
        select p.region_id from region_postal_prefixes p
        where p.country_code = c.country_code and starts_with(c.postal_code_normalised, p.prefix)
        order by length(p.prefix) desc
        limit 1
      ) m on true
    )
    update assessments a
    set region_id = b.new_region,
        status = case when b.new_region is null then 'unrouted'::assessment_status else 'fresh'::assessment_status end,
        updated_at = now()
    from best b
    where a.id = b.id and b.new_region is distinct from b.old_region
    returning a.id, a.reference, b.old_region, b.new_region, b.old_status`);
  return result.rows;
}
