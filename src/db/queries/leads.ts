/**
 * The desk's named queries over assessments seen as leads. Each takes a database or transaction
 * handle first; who may reach which lead is decided by src/lib/leads/access.ts and passed in as
 * a condition, never read from a cookie here.
 */
import { and, asc, count, desc, eq, gte, inArray, lte, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { Executor } from '../client';
import {
  activityLog,
  assessments,
  attachments,
  consultantProfiles,
  DEFAULT_OPEN_CLAIM_CAP,
  pipeRuns,
  regionConsultants,
  regions,
  user,
  type AssessmentStatus,
} from '../schema';
import type { LeadSortKey } from '../../schemas/leads';

/** The columns every list row carries; none of them says who the owner is. */
const listColumns = {
  id: assessments.id,
  reference: assessments.reference,
  status: assessments.status,
  regionId: assessments.regionId,
  regionName: regions.name,
  plantType: assessments.plantType,
  countryCode: assessments.countryCode,
  postalCodeNormalised: assessments.postalCodeNormalised,
  currency: assessments.currency,
  annualLossCost: assessments.annualLossCost,
  annualLossCostLow: assessments.annualLossCostLow,
  annualLossCostHigh: assessments.annualLossCostHigh,
  annualSavingCost: assessments.annualSavingCost,
  runCount: assessments.runCount,
  photoCount: assessments.photoCount,
  hazardRunCount: assessments.hazardRunCount,
  services: assessments.services,
  createdAt: assessments.createdAt,
};

export interface LeadFilters {
  regionIds?: string[];
  plantType?: string;
  services?: string[];
  lossMin?: number;
  lossMax?: number;
  /** Widest accepted (high − low) / likely, as a fraction. */
  spreadMax?: number;
  runsMin?: number;
  runsMax?: number;
  photos?: 'yes' | 'no';
  maxAgeDays?: number;
  minAgeDays?: number;
}

export interface LeadPage {
  page: number;
  pageSize: number;
  sort: LeadSortKey;
  dir: 'asc' | 'desc';
}

const spread = sql<number>`(${assessments.annualLossCostHigh} - ${assessments.annualLossCostLow}) / nullif(${assessments.annualLossCost}, 0)`;

const sortColumns: Record<LeadSortKey, SQL | AnyPgColumn> = {
  posted: assessments.createdAt,
  loss: assessments.annualLossCost,
  saving: assessments.annualSavingCost,
  spread,
  runs: assessments.runCount,
  photos: assessments.photoCount,
};

function filterConditions(filters: LeadFilters): (SQL | undefined)[] {
  const days = (n: number) => sql`now() - make_interval(days => ${n})`;
  return [
    filters.regionIds ? inArray(assessments.regionId, filters.regionIds) : undefined,
    filters.plantType ? eq(assessments.plantType, filters.plantType) : undefined,
    filters.services?.length ? sql`${assessments.services} @> ${sql.param(filters.services)}::text[]` : undefined,
    filters.lossMin !== undefined ? gte(assessments.annualLossCost, filters.lossMin) : undefined,
    filters.lossMax !== undefined ? lte(assessments.annualLossCost, filters.lossMax) : undefined,
    filters.spreadMax !== undefined ? sql`${spread} <= ${filters.spreadMax}` : undefined,
    filters.runsMin !== undefined ? gte(assessments.runCount, filters.runsMin) : undefined,
    filters.runsMax !== undefined ? lte(assessments.runCount, filters.runsMax) : undefined,
    filters.photos === 'yes' ? sql`${assessments.photoCount} > 0` : filters.photos === 'no' ? eq(assessments.photoCount, 0) : undefined,
    filters.maxAgeDays !== undefined ? sql`${assessments.createdAt} >= ${days(filters.maxAgeDays)}` : undefined,
    filters.minAgeDays !== undefined ? sql`${assessments.createdAt} <= ${days(filters.minAgeDays)}` : undefined,
  ];
}

function orderOf(page: LeadPage): SQL[] {
  const column = sortColumns[page.sort];
  const direction = page.dir === 'asc' ? sql`asc` : sql`desc`;
  // Newest first breaks ties, then the id, so paging never repeats or skips a row.
  return [
    sql`${column} ${direction} nulls last`,
    sql`${assessments.createdAt} desc`,
    sql`${assessments.id} desc`,
  ];
}

/** The ids of the regions a consultant covers. */
export async function regionIdsOf(db: Executor, userId: string): Promise<string[]> {
  const rows = await db.select({ id: regionConsultants.regionId }).from(regionConsultants).where(eq(regionConsultants.userId, userId));
  return rows.map((r) => r.id);
}

/** Regions as the desk's filter offers them: the consultant's own, or all for `null`. */
export async function listRegionChoices(db: Executor, regionIds: string[] | null) {
  const query = db.select({ id: regions.id, name: regions.name, countryCode: regions.countryCode }).from(regions);
  const rows = regionIds ? (regionIds.length ? await query.where(inArray(regions.id, regionIds)) : []) : await query;
  return rows.sort((a, b) => a.name.localeCompare(b.name));
}

export type OpenLeadRow = Awaited<ReturnType<typeof listOpenLeads>>['rows'][number];

/**
 * Fresh leads of the given regions (all regions for `regionIds: undefined`), one page of them,
 * with the total. Reads only the headline columns: the partial index
 * `assessments_open_list_idx` serves the default order (newest first) region by region.
 */
export async function listOpenLeads(db: Executor, filters: LeadFilters, page: LeadPage) {
  if (filters.regionIds && filters.regionIds.length === 0) return { rows: [], total: 0 };
  const { rows, total } = openLeadsQueries(db, filters, page);
  const [found, totals] = await Promise.all([rows, total]);
  return { rows: found, total: totals[0]?.n ?? 0 };
}

/** The two statements of the open list (its page and its count), unexecuted: the bench explains them. */
export function openLeadsQueries(db: Executor, filters: LeadFilters, page: LeadPage) {
  const where = and(eq(assessments.status, 'fresh'), ...filterConditions(filters));
  return {
    rows: db
      .select(listColumns)
      .from(assessments)
      .leftJoin(regions, eq(regions.id, assessments.regionId))
      .where(where)
      .orderBy(...orderOf(page))
      .limit(page.pageSize)
      .offset((page.page - 1) * page.pageSize),
    total: db.select({ n: count() }).from(assessments).where(where),
  };
}

export type MyLeadRow = Awaited<ReturnType<typeof listHeldLeads>>['rows'][number];

/** Leads a consultant holds (every stage after the claim), most recently changed first. */
export async function listHeldLeads(
  db: Executor,
  holderUserId: string,
  stages: readonly AssessmentStatus[],
  filters: LeadFilters,
  page: LeadPage,
) {
  const where = and(eq(assessments.claimedByUserId, holderUserId), inArray(assessments.status, [...stages]), ...filterConditions(filters));
  const order = page.sort === 'posted' && page.dir === 'desc' ? [desc(assessments.updatedAt), desc(assessments.id)] : orderOf(page);
  const [rows, totals] = await Promise.all([
    db
      .select({
        ...listColumns,
        companyName: assessments.companyName,
        contactName: assessments.contactName,
        claimedAt: assessments.claimedAt,
        updatedAt: assessments.updatedAt,
      })
      .from(assessments)
      .leftJoin(regions, eq(regions.id, assessments.regionId))
      .where(where)
      .orderBy(...order)
      .limit(page.pageSize)
      .offset((page.page - 1) * page.pageSize),
    db.select({ n: count() }).from(assessments).where(where),
  ]);
  return { rows, total: totals[0]?.n ?? 0 };
}

/** How many leads a consultant holds at each stage. */
export async function countHeldLeadsByStage(db: Executor, holderUserId: string) {
  const rows = await db
    .select({ status: assessments.status, n: count() })
    .from(assessments)
    .where(eq(assessments.claimedByUserId, holderUserId))
    .groupBy(assessments.status);
  return new Map(rows.map((r) => [r.status, r.n]));
}

export type LeadRecord = NonNullable<Awaited<ReturnType<typeof findLead>>>;

/** A whole lead with its region and holder, when `reach` (from lib/leads/access) lets the viewer reach it. */
export async function findLead(db: Executor, leadId: string, reach: SQL | undefined) {
  const [row] = await db
    .select({
      lead: assessments,
      regionName: regions.name,
      holderName: user.name,
      holderFirm: consultantProfiles.firm,
    })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .leftJoin(user, eq(user.id, assessments.claimedByUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, assessments.claimedByUserId))
    .where(and(eq(assessments.id, leadId), reach));
  return row ?? null;
}

export async function listLeadRuns(db: Executor, leadId: string) {
  return db
    .select({ id: pipeRuns.id, position: pipeRuns.position, label: pipeRuns.label, service: pipeRuns.service, lengthM: pipeRuns.lengthM, spec: pipeRuns.spec })
    .from(pipeRuns)
    .where(eq(pipeRuns.assessmentId, leadId))
    .orderBy(asc(pipeRuns.position));
}

export async function listLeadAttachments(db: Executor, leadId: string) {
  return db
    .select({ id: attachments.id, pipeRunId: attachments.pipeRunId, objectKey: attachments.objectKey, contentType: attachments.contentType })
    .from(attachments)
    .where(eq(attachments.assessmentId, leadId))
    .orderBy(asc(attachments.createdAt), asc(attachments.id));
}

/** The lead's history, oldest first, with who did each thing. */
export async function listLeadActivity(db: Executor, leadId: string) {
  return db
    .select({
      id: activityLog.id,
      at: activityLog.createdAt,
      action: activityLog.action,
      detail: activityLog.detail,
      actorName: user.name,
      actorFirm: consultantProfiles.firm,
    })
    .from(activityLog)
    .leftJoin(user, eq(user.id, activityLog.actorUserId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, activityLog.actorUserId))
    .where(eq(activityLog.assessmentId, leadId))
    .orderBy(asc(activityLog.createdAt), asc(activityLog.id));
}

/**
 * Locks the consultant's account row for the rest of the transaction, so their claims are
 * counted one after another, and answers their cap of open claims (the default when no profile
 * has been made).
 */
export async function lockClaimant(db: Executor, userId: string): Promise<{ cap: number } | null> {
  const rows = await db.execute<{ cap: number }>(sql`
    select coalesce(p.open_claim_cap, ${DEFAULT_OPEN_CLAIM_CAP}) as cap
    from "user" u left join ${consultantProfiles} p on p.user_id = u.id
    where u.id = ${userId}
    for no key update of u`);
  const row = rows.rows[0];
  return row ? { cap: Number(row.cap) } : null;
}

export async function countOpenClaims(db: Executor, userId: string, stages: readonly AssessmentStatus[]): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(assessments)
    .where(and(eq(assessments.claimedByUserId, userId), inArray(assessments.status, [...stages])));
  return row?.n ?? 0;
}

/**
 * The claim itself: one conditional UPDATE. Only a lead that is still `fresh` and within
 * `reach` changes; under concurrent claims PostgreSQL lets exactly one of them see it fresh.
 * No row back means someone was first (or the lead is not the claimant's to take).
 */
export async function claimFreshLead(db: Executor, leadId: string, claimantUserId: string, reach: SQL | undefined) {
  const [row] = await db
    .update(assessments)
    .set({ status: 'claimed', claimedByUserId: claimantUserId, claimedAt: sql`now()` })
    .where(and(eq(assessments.id, leadId), eq(assessments.status, 'fresh'), reach))
    .returning({ id: assessments.id, reference: assessments.reference, contactEmail: assessments.contactEmail, claimedAt: assessments.claimedAt, regionId: assessments.regionId });
  return row ?? null;
}

/**
 * Moves a held lead from `from` to `to` only if it is still at `from` (and, when `holderUserId`
 * is given, still held by them), so two moves made at once cannot both apply.
 */
export async function moveHeldLead(
  db: Executor,
  leadId: string,
  from: AssessmentStatus,
  to: AssessmentStatus,
  holderUserId: string | null,
) {
  const [row] = await db
    .update(assessments)
    .set({ status: to })
    .where(
      and(eq(assessments.id, leadId), eq(assessments.status, from), holderUserId ? eq(assessments.claimedByUserId, holderUserId) : undefined),
    )
    .returning({ id: assessments.id, status: assessments.status });
  return row ?? null;
}

/** Hands a held lead back to its region (`fresh`, nobody holding it), if still at `from`. */
export async function releaseHeldLead(db: Executor, leadId: string, from: AssessmentStatus, holderUserId: string | null) {
  const [row] = await db
    .update(assessments)
    .set({ status: 'fresh', claimedByUserId: null, claimedAt: null })
    .where(
      and(eq(assessments.id, leadId), eq(assessments.status, from), holderUserId ? eq(assessments.claimedByUserId, holderUserId) : undefined),
    )
    .returning({ id: assessments.id, status: assessments.status, regionId: assessments.regionId });
  return row ?? null;
}

/** A consultant's desk profile (firm, phone, cap), or null when none has been made. */
export async function findConsultantProfile(db: Executor, userId: string) {
  const [row] = await db
    .select({ firm: consultantProfiles.firm, phone: consultantProfiles.phone, openClaimCap: consultantProfiles.openClaimCap, name: user.name, email: user.email })
    .from(user)
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, user.id))
    .where(eq(user.id, userId));
  return row ?? null;
}

/** Makes or updates a consultant's profile (the demo seed and the admin area use it). */
export async function upsertConsultantProfile(
  db: Executor,
  profile: { userId: string; firm: string; phone?: string | null; openClaimCap?: number },
): Promise<void> {
  await db
    .insert(consultantProfiles)
    .values(profile)
    .onConflictDoUpdate({
      target: consultantProfiles.userId,
      set: {
        firm: profile.firm,
        ...(profile.phone !== undefined ? { phone: profile.phone } : {}),
        ...(profile.openClaimCap !== undefined ? { openClaimCap: profile.openClaimCap } : {}),
      },
    });
}

