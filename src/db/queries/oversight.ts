/**
 * What the admin watches: leads that need a person, the funnel, the activity log and coverage.
 * Named queries, each taking a database or transaction handle first.
 */
import { and, desc, eq, gte, inArray, like, lt, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../client';
import { activityLog, assessments, consultantProfiles, DEFAULT_OPEN_CLAIM_CAP, regionConsultants, regions, user } from '../schema';

const unfinished = sql.raw(`('claimed','in_touch','site_walk_booked','report_sent')`);

/**
 * Leads that need a person: unrouted ones, open ones nobody has taken for `staleAfterHours`
 * (counted from when they last became open), and held ones whose consultant was deactivated.
 */
export async function listAttentionLeads(db: Executor, staleAfterHours: number) {
  const holder = alias(user, 'holder');
  const reason = sql<'unrouted' | 'stale' | 'holder-deactivated'>`case
      when ${assessments.status} = 'unrouted' then 'unrouted'
      when ${assessments.status} = 'fresh' then 'stale'
      else 'holder-deactivated' end`;
  return db
    .select({
      id: assessments.id,
      reference: assessments.reference,
      status: assessments.status,
      reason,
      plantType: assessments.plantType,
      postalCode: assessments.postalCode,
      countryCode: assessments.countryCode,
      regionId: assessments.regionId,
      regionName: regions.name,
      holderId: assessments.claimedByUserId,
      holderName: holder.name,
      holderFirm: consultantProfiles.firm,
      createdAt: assessments.createdAt,
      openSince: assessments.updatedAt,
      currency: assessments.currency,
      annualLoss: assessments.annualLossCost,
    })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .leftJoin(holder, eq(holder.id, assessments.claimedByUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, assessments.claimedByUserId))
    .where(
      or(
        eq(assessments.status, 'unrouted'),
        and(eq(assessments.status, 'fresh'), sql`${assessments.updatedAt} < now() - make_interval(hours => ${staleAfterHours})`),
        and(sql`${assessments.status} in ${unfinished}`, eq(holder.banned, true)),
      ),
    )
    .orderBy(sql`case ${reason} when 'unrouted' then 0 when 'holder-deactivated' then 1 else 2 end`, assessments.updatedAt)
    .limit(500);
}

/** Active consultants with their open claims, cap and regions: who a lead can be handed to. */
export async function listConsultantLoads(db: Executor) {
  const rows = await db
    .select({
      id: user.id,
      name: user.name,
      firm: consultantProfiles.firm,
      cap: sql<number>`coalesce(${consultantProfiles.openClaimCap}, ${DEFAULT_OPEN_CLAIM_CAP})`.mapWith(Number),
      openClaims: sql<number>`(select count(*) from assessments a where a.claimed_by_user_id = ${user.id} and a.status in ('claimed','in_touch','site_walk_booked'))`.mapWith(Number),
      regionIds: sql<string[]>`coalesce((select array_agg(rc.region_id) from ${regionConsultants} rc join ${regions} r on r.id = rc.region_id and r.retired_at is null where rc.user_id = ${user.id}), '{}')`,
    })
    .from(user)
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, user.id))
    .where(
      and(
        eq(user.role, 'consultant'),
        sql`coalesce(${user.banned}, false) = false`,
        sql`not exists (select 1 from consultant_invitations i where i.user_id = ${user.id} and i.accepted_at is null and i.withdrawn_at is null)`,
      ),
    )
    .orderBy(user.name);
  return rows.map((r) => ({ ...r, regionIds: r.regionIds ?? [] }));
}

/** Fresh leads open longer than `staleAfterHours`, oldest first (the daily mail lists them). */
export async function listStaleLeads(db: Executor, staleAfterHours: number, limit: number) {
  const where = and(eq(assessments.status, 'fresh'), sql`${assessments.updatedAt} < now() - make_interval(hours => ${staleAfterHours})`);
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: assessments.id,
        reference: assessments.reference,
        regionName: regions.name,
        waitingHours: sql<number>`floor(extract(epoch from now() - ${assessments.updatedAt}) / 3600)`.mapWith(Number),
      })
      .from(assessments)
      .leftJoin(regions, eq(regions.id, assessments.regionId))
      .where(where)
      .orderBy(assessments.updatedAt)
      .limit(limit),
    db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(assessments).where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

const rank = (value: SQL) => sql`case ${value} when 'claimed' then 1 when 'in_touch' then 2 when 'site_walk_booked' then 3 when 'report_sent' then 4 when 'signed' then 5 else 0 end`;

/**
 * The funnel: per month of submission (UTC) and region, how many assessments reached each step.
 * A lead's furthest step is the furthest of its stage now and every stage its moves reached, so
 * a lead closed after a site walk still counts as walked; a claim or a hand-over counts as claimed.
 */
export async function funnelCounts(db: Executor, since: Date, regionId?: string) {
  const result = await db.execute<{
    month: string;
    region_id: string | null;
    region_name: string | null;
    submitted: string;
    claimed: string;
    in_touch: string;
    site_walk: string;
    report_sent: string;
    signed: string;
  }>(sql`
    with reach as (
      select a.id, a.region_id, to_char(a.created_at at time zone 'UTC', 'YYYY-MM') as month,
        greatest(
          ${rank(sql`a.status::text`)},
          coalesce((select max(${rank(sql`l.detail->>'to'`)}) from ${activityLog} l where l.assessment_id = a.id and l.action in ('lead.moved', 'lead.assigned')), 0),
          case when exists (select 1 from ${activityLog} l where l.assessment_id = a.id and l.action in ('lead.claimed', 'lead.assigned')) then 1 else 0 end
        ) as furthest
      from ${assessments} a
      where a.status <> 'junk' and a.created_at >= ${since} ${regionId ? sql`and a.region_id = ${regionId}` : sql``}
    )
    select r.month, r.region_id, g.name as region_name,
      count(*) as submitted,
      count(*) filter (where furthest >= 1) as claimed,
      count(*) filter (where furthest >= 2) as in_touch,
      count(*) filter (where furthest >= 3) as site_walk,
      count(*) filter (where furthest >= 4) as report_sent,
      count(*) filter (where furthest >= 5) as signed
    from reach r left join ${regions} g on g.id = r.region_id
    group by r.month, r.region_id, g.name
    order by r.month, g.name nulls last`);
  return result.rows.map((row) => ({
    month: row.month,
    regionId: row.region_id,
    regionName: row.region_name,
    counts: {
      submitted: Number(row.submitted),
      claimed: Number(row.claimed),
      in_touch: Number(row.in_touch),
      site_walk: Number(row.site_walk),
      report_sent: Number(row.report_sent),
      signed: Number(row.signed),
    },
  }));
}

export interface ActivityFilters {
  leadId?: string;
  leadReference?: string;
  personId?: string;
  /** `lead.claimed` exactly, or a family such as `lead` (every `lead.…`). */
  action?: string;
  /** Inclusive UTC dates, YYYY-MM-DD. */
  from?: string;
  to?: string;
}

/** One page of the activity log, newest first, with who did it, whom it was about and its lead. */
export async function listActivity(db: Executor, filters: ActivityFilters, page: { page: number; pageSize: number }) {
  const actor = alias(user, 'actor');
  const subject = alias(user, 'subject');
  const actorProfile = alias(consultantProfiles, 'actor_profile');
  const leadIds = filters.leadReference
    ? sql`(select ${assessments.id} from ${assessments} where ${assessments.reference} = ${filters.leadReference.toUpperCase()})`
    : undefined;
  const where = and(
    filters.leadId ? eq(activityLog.assessmentId, filters.leadId) : undefined,
    leadIds ? inArray(activityLog.assessmentId, leadIds) : undefined,
    filters.personId ? or(eq(activityLog.actorUserId, filters.personId), eq(activityLog.subjectUserId, filters.personId)) : undefined,
    filters.action ? (filters.action.includes('.') ? eq(activityLog.action, filters.action) : like(activityLog.action, `${filters.action}.%`)) : undefined,
    filters.from ? gte(activityLog.createdAt, new Date(`${filters.from}T00:00:00Z`)) : undefined,
    filters.to ? lt(activityLog.createdAt, new Date(new Date(`${filters.to}T00:00:00Z`).getTime() + 86_400_000)) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: activityLog.id,
        at: activityLog.createdAt,
        action: activityLog.action,
        detail: activityLog.detail,
        actorId: activityLog.actorUserId,
        actorName: actor.name,
        actorFirm: actorProfile.firm,
        subjectId: activityLog.subjectUserId,
        subjectName: subject.name,
        leadId: activityLog.assessmentId,
        leadReference: assessments.reference,
      })
      .from(activityLog)
      .leftJoin(actor, eq(actor.id, activityLog.actorUserId))
      .leftJoin(actorProfile, eq(actorProfile.userId, activityLog.actorUserId))
      .leftJoin(subject, eq(subject.id, activityLog.subjectUserId))
      .leftJoin(assessments, eq(assessments.id, activityLog.assessmentId))
      .where(where)
      .orderBy(desc(activityLog.createdAt), desc(activityLog.id))
      .limit(page.pageSize)
      .offset((page.page - 1) * page.pageSize),
    db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(activityLog).where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}
export type ActivityRow = Awaited<ReturnType<typeof listActivity>>['rows'][number];

/** People who appear in the log (for the person filter): staff first, by name. */
export async function listLoggedPeople(db: Executor) {
  return db
    .select({ id: user.id, name: user.name, role: user.role })
    .from(user)
    .where(inArray(user.role, ['admin', 'consultant']))
    .orderBy(user.role, user.name);
}

/** Unrouted assessments per country and the first two characters of their postal code. */
export async function unroutedByStart(db: Executor) {
  const result = await db.execute<{ country_code: string; start: string; n: string }>(sql`
    select country_code, left(postal_code_normalised, 2) as start, count(*) as n
    from ${assessments} where status = 'unrouted' group by 1, 2`);
  return result.rows.map((r) => ({ countryCode: r.country_code, start: r.start, count: Number(r.n) }));
}

/** Leads claimed or handed to each consultant in the last `days` days. */
export async function claimsPerConsultant(db: Executor, days: number) {
  const result = await db.execute<{ user_id: string; n: string }>(sql`
    select coalesce(case when action = 'lead.assigned' then subject_user_id else actor_user_id end) as user_id, count(*) as n
    from ${activityLog}
    where action in ('lead.claimed', 'lead.assigned') and created_at >= now() - make_interval(days => ${days})
    group by 1`);
  return new Map(result.rows.filter((r) => r.user_id).map((r) => [r.user_id, Number(r.n)]));
}

/** The newest open and held leads of each live region, a few per region, for the coverage boards. */
export async function recentRegionLeads(db: Executor, perRegion: number) {
  const result = await db.execute<{ id: string; reference: string; status: string; region_id: string; holder_name: string | null }>(sql`
    select id, reference, status, region_id, holder_name from (
      select a.id, a.reference, a.status::text as status, a.region_id, u.name as holder_name,
        row_number() over (partition by a.region_id order by a.updated_at desc, a.id) as n
      from ${assessments} a
      join ${regions} r on r.id = a.region_id and r.retired_at is null
      left join "user" u on u.id = a.claimed_by_user_id
      where a.status in ('fresh', 'claimed', 'in_touch', 'site_walk_booked', 'report_sent')
    ) ranked where n <= ${perRegion}`);
  return result.rows;
}

/** Unrouted United States assessments by the first three digits of their ZIP code. */
export async function unroutedUsZip3(db: Executor): Promise<Map<string, number>> {
  const result = await db.execute<{ zip3: string; n: string }>(sql`
    select left(postal_code_normalised, 3) as zip3, count(*) as n
    from ${assessments} where status = 'unrouted' and country_code = 'US' group by 1`);
  return new Map(result.rows.map((r) => [r.zip3, Number(r.n)]));
}
