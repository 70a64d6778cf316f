import { and, eq, inArray, isNotNull, lt, ne, notExists, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { session, user, verification } from '../auth-schema';
import { assessments, attachments, reports } from '../schema';

/** Junk submissions made before `before`, with their stored files. */
export async function findOldJunk(db: Executor, before: Date): Promise<{ id: string; objectKeys: string[] }[]> {
  const rows = await db
    .select({ id: assessments.id })
    .from(assessments)
    .where(and(eq(assessments.status, 'junk'), lt(assessments.createdAt, before)));
  return withStoredFiles(db, rows.map((row) => row.id));
}

/** Assessments still naming a person whose last activity was before `before`, with their stored files. */
export async function findInactiveNamed(db: Executor, before: Date, removed: string): Promise<{ id: string; objectKeys: string[] }[]> {
  const rows = await db
    .select({ id: assessments.id })
    .from(assessments)
    .where(and(ne(assessments.status, 'junk'), lt(assessments.updatedAt, before), ne(assessments.contactName, removed)));
  return withStoredFiles(db, rows.map((row) => row.id));
}

/** Each assessment with the object keys of what it stored: its photos and PDFs, and its reports' PDFs. */
async function withStoredFiles(db: Executor, ids: readonly string[]): Promise<{ id: string; objectKeys: string[] }[]> {
  if (ids.length === 0) return [];
  const uploads = await db
    .select({ id: attachments.assessmentId, objectKey: attachments.objectKey })
    .from(attachments)
    .where(inArray(attachments.assessmentId, [...ids]));
  const reportPdfs = await db
    .select({ id: reports.assessmentId, objectKey: reports.pdfObjectKey })
    .from(reports)
    .where(and(inArray(reports.assessmentId, [...ids]), isNotNull(reports.pdfObjectKey)));
  return groupKeys([...ids.map((id) => ({ id, objectKey: null })), ...uploads, ...reportPdfs]);
}

function groupKeys(rows: { id: string; objectKey: string | null }[]): { id: string; objectKeys: string[] }[] {
  const byId = new Map<string, string[]>();
  for (const row of rows) {
    const keys = byId.get(row.id) ?? [];
    if (row.objectKey) keys.push(row.objectKey);
    byId.set(row.id, keys);
  }
  return [...byId].map(([id, objectKeys]) => ({ id, objectKeys }));
}

export async function deleteAssessments(db: Executor, ids: readonly string[]): Promise<number> {
  if (ids.length === 0) return 0;
  const removed = await db.delete(assessments).where(inArray(assessments.id, [...ids])).returning({ id: assessments.id });
  return removed.length;
}

/**
 * Takes what identifies a person off assessments: contact details and plant name replaced,
 * the owner's account unlinked, file rows removed and the reports' PDFs (which name the owner
 * and the plant) let go of — their objects are deleted by the caller. The reports' figures stay,
 * and `pdfRenderedAt` with them: a sent report with that time and no key had its PDF removed.
 * `updatedAt` is kept, so the sweep's own change does not count as activity.
 */
export async function anonymiseAssessments(db: Executor, ids: readonly string[], removed: string): Promise<number> {
  if (ids.length === 0) return 0;
  await db.delete(attachments).where(inArray(attachments.assessmentId, [...ids]));
  await db
    .update(reports)
    .set({ pdfObjectKey: null, pdfByteSize: null })
    .where(and(inArray(reports.assessmentId, [...ids]), isNotNull(reports.pdfObjectKey)));
  const changed = await db
    .update(assessments)
    .set({
      contactName: removed,
      companyName: removed,
      contactEmail: removed,
      contactPhone: null,
      plantName: null,
      ownerUserId: null,
      idempotencyKey: null,
      idempotencyFingerprint: null,
      photoCount: 0,
      updatedAt: sql`${assessments.updatedAt}`,
    })
    .where(inArray(assessments.id, [...ids]))
    .returning({ id: assessments.id });
  return changed.length;
}

/** Owner accounts no assessment names any more. */
export async function deleteOwnersWithoutAssessments(db: Executor): Promise<number> {
  const removed = await db
    .delete(user)
    .where(
      and(
        eq(user.role, 'owner'),
        notExists(db.select({ one: sql`1` }).from(assessments).where(eq(assessments.ownerUserId, user.id))),
      ),
    )
    .returning({ id: user.id });
  return removed.length;
}

/** Sign-in links and sessions past their expiry. */
export async function deleteExpiredLinksAndSessions(db: Executor, now: Date): Promise<number> {
  const links = await db.delete(verification).where(lt(verification.expiresAt, now)).returning({ id: verification.id });
  const sessions = await db.delete(session).where(and(isNotNull(session.expiresAt), lt(session.expiresAt, now))).returning({ id: session.id });
  return links.length + sessions.length;
}
