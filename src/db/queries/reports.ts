/**
 * Named queries over follow-up reports and consultants' price tables. Each takes a database or
 * transaction handle first; who may read or change a report is decided by src/lib/reports,
 * never here.
 */
import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { assessments, consultantPriceTables, reports, type AssessmentStatus, type Report } from '../schema';

/** A lead's reports, newest first: the draft (if any) before the versions, highest version first. */
export async function listLeadReports(db: Executor, leadId: string): Promise<Report[]> {
  return db
    .select()
    .from(reports)
    .where(eq(reports.assessmentId, leadId))
    .orderBy(sql`${reports.version} desc nulls first`, desc(reports.createdAt));
}

export async function findReport(db: Executor, reportId: string): Promise<Report | null> {
  const [row] = await db.select().from(reports).where(eq(reports.id, reportId));
  return row ?? null;
}

/** The lead's draft, or null. */
export async function findDraft(db: Executor, leadId: string): Promise<Report | null> {
  const [row] = await db.select().from(reports).where(and(eq(reports.assessmentId, leadId), eq(reports.status, 'draft')));
  return row ?? null;
}

/** One sent version of a lead, or null. */
export async function findVersion(db: Executor, leadId: string, version: number): Promise<Report | null> {
  const [row] = await db.select().from(reports).where(and(eq(reports.assessmentId, leadId), eq(reports.version, version)));
  return row ?? null;
}

/** The highest version sent for a lead (0 when none). */
export async function latestVersionNumber(db: Executor, leadId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`coalesce(max(${reports.version}), 0)::int` })
    .from(reports)
    .where(eq(reports.assessmentId, leadId));
  return row?.n ?? 0;
}

/**
 * Makes the lead's draft. Returns null when the lead already has one (the partial unique index
 * `reports_one_draft_key` lets only one of two simultaneous creations through).
 */
export async function insertDraft(
  db: Executor,
  draft: { assessmentId: string; authorUserId: string; baseRevisionNumber: number; composition: unknown },
): Promise<Report | null> {
  const [row] = await db
    .insert(reports)
    .values({ ...draft, status: 'draft' })
    .onConflictDoNothing({ target: reports.assessmentId, where: sql`${reports.status} = 'draft'` })
    .returning();
  return row ?? null;
}

/** Saves a draft's composition (and base) only while it is still a draft; null when it was sent meanwhile. */
export async function updateDraft(
  db: Executor,
  reportId: string,
  change: { composition: unknown; baseRevisionNumber: number; authorUserId: string },
): Promise<Report | null> {
  const [row] = await db
    .update(reports)
    .set(change)
    .where(and(eq(reports.id, reportId), eq(reports.status, 'draft')))
    .returning();
  return row ?? null;
}

export interface FrozenVersion {
  version: number;
  composition: unknown;
  plantInput: unknown;
  resultSnapshot: unknown;
  engineVersion: string;
  consultant: unknown;
  authorUserId: string;
}

/**
 * Freezes a draft as a numbered version, only if it is still a draft: under two simultaneous
 * sends, one turns it into a version and the other finds no draft (and answers with that version).
 */
export async function freezeDraft(db: Executor, reportId: string, frozen: FrozenVersion): Promise<Report | null> {
  const [row] = await db
    .update(reports)
    .set({ ...frozen, status: 'sent', sentAt: sql`now()` })
    .where(and(eq(reports.id, reportId), eq(reports.status, 'draft')))
    .returning();
  return row ?? null;
}

/** Records where the rendered PDF is stored, once: null when it was recorded already. */
export async function recordReportPdf(db: Executor, reportId: string, objectKey: string, byteSize: number): Promise<Report | null> {
  const [row] = await db
    .update(reports)
    .set({ pdfObjectKey: objectKey, pdfByteSize: byteSize, pdfRenderedAt: sql`now()` })
    .where(and(eq(reports.id, reportId), eq(reports.status, 'sent'), isNull(reports.pdfObjectKey)))
    .returning();
  return row ?? null;
}

/** Records the owner's answer to a version, once: null when it was answered already. */
export async function recordReportAnswer(db: Executor, reportId: string, answer: { answer: 'accepted' | 'declined'; answerReason: string | null }) {
  const [row] = await db
    .update(reports)
    .set({ ...answer, answeredAt: sql`now()` })
    .where(and(eq(reports.id, reportId), eq(reports.status, 'sent'), isNull(reports.answer)))
    .returning();
  return row ?? null;
}

/** A consultant's price table, or null before they save one. */
export async function findPriceTable(db: Executor, userId: string) {
  const [row] = await db.select().from(consultantPriceTables).where(eq(consultantPriceTables.userId, userId));
  return row ?? null;
}

export async function upsertPriceTable(db: Executor, userId: string, currency: string, priceTable: unknown) {
  const [row] = await db
    .insert(consultantPriceTables)
    .values({ userId, currency, priceTable })
    .onConflictDoUpdate({ target: consultantPriceTables.userId, set: { currency, priceTable, updatedAt: sql`now()` } })
    .returning();
  if (!row) throw new Error('the price table was not stored');
  return row;
}

/**
 * Moves a lead to `report_sent` from one of `stages` (staying there when a correction is sent),
 * only while `holderUserId` (when given) still holds it; null when the lead moved on meanwhile.
 */
export async function markLeadReportSent(db: Executor, leadId: string, stages: readonly AssessmentStatus[], holderUserId: string | null) {
  const [row] = await db
    .update(assessments)
    .set({ status: 'report_sent' })
    .where(
      and(
        eq(assessments.id, leadId),
        inArray(assessments.status, [...stages]),
        holderUserId ? eq(assessments.claimedByUserId, holderUserId) : undefined,
      ),
    )
    .returning({ id: assessments.id, status: assessments.status, contactEmail: assessments.contactEmail, claimedByUserId: assessments.claimedByUserId });
  return row ?? null;
}
