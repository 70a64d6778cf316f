import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../client';
import {
  activityLog,
  assessments,
  attachments,
  pipeRuns,
  regions,
  type AssessmentStatus,
  type NewAssessment,
} from '../schema';

export interface NewPipeRun {
  label: string;
  service: string;
  lengthM: number;
  spec: unknown;
}

export interface NewAttachment {
  objectKey: string;
  contentType: string;
  byteSize: number;
  widthPx?: number;
  heightPx?: number;
  originalName?: string;
  /** Index into the runs given alongside, or null for a plant-wide photo. */
  runIndex: number | null;
}

/** Stores an assessment with its runs and attachments; call inside a transaction. */
export async function insertAssessment(
  db: Executor,
  assessment: NewAssessment & { id: string },
  runs: NewPipeRun[],
  files: NewAttachment[],
): Promise<void> {
  await db.insert(assessments).values(assessment);
  const runIds: string[] = [];
  if (runs.length > 0) {
    const inserted = await db
      .insert(pipeRuns)
      .values(runs.map((run, position) => ({ ...run, assessmentId: assessment.id, position })))
      .returning({ id: pipeRuns.id, position: pipeRuns.position });
    for (const row of inserted) runIds[row.position] = row.id;
  }
  if (files.length > 0) {
    await db.insert(attachments).values(
      files.map(({ runIndex, ...file }) => ({
        ...file,
        assessmentId: assessment.id,
        pipeRunId: runIndex === null ? null : (runIds[runIndex] ?? null),
      })),
    );
  }
}

/** One activity entry; `subjectUserId` names the person it is about when that is not the actor. */
export async function recordActivity(
  db: Executor,
  entry: {
    assessmentId?: string | null;
    actorUserId?: string | null;
    subjectUserId?: string | null;
    action: string;
    detail?: Record<string, unknown>;
  },
): Promise<void> {
  await db.insert(activityLog).values({
    assessmentId: entry.assessmentId ?? null,
    actorUserId: entry.actorUserId ?? null,
    subjectUserId: entry.subjectUserId ?? null,
    action: entry.action,
    detail: entry.detail ?? {},
  });
}

export interface AssessmentSummary {
  id: string;
  reference: string;
  status: AssessmentStatus;
  regionName: string | null;
}

export async function findAssessmentByIdempotencyKey(
  db: Executor,
  key: string,
): Promise<(AssessmentSummary & { fingerprint: string | null }) | null> {
  const [row] = await db
    .select({
      id: assessments.id,
      reference: assessments.reference,
      status: assessments.status,
      regionName: regions.name,
      fingerprint: assessments.idempotencyFingerprint,
    })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .where(eq(assessments.idempotencyKey, key));
  return row ?? null;
}

/** Everything an owner may see of their own assessment; null when it is not theirs. */
export async function getOwnerAssessment(db: Executor, assessmentId: string, ownerUserId: string) {
  const [row] = await db
    .select({ assessment: assessments, regionName: regions.name })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .where(and(eq(assessments.id, assessmentId), eq(assessments.ownerUserId, ownerUserId)));
  if (!row) return null;
  const runs = await db.select().from(pipeRuns).where(eq(pipeRuns.assessmentId, assessmentId)).orderBy(asc(pipeRuns.position));
  const files = await db
    .select({ id: attachments.id, pipeRunId: attachments.pipeRunId, contentType: attachments.contentType, originalName: attachments.originalName })
    .from(attachments)
    .where(eq(attachments.assessmentId, assessmentId))
    .orderBy(asc(attachments.createdAt));
  return { ...row.assessment, regionName: row.regionName, runs, attachments: files };
}

export async function listOwnerAssessments(db: Executor, ownerUserId: string) {
  return db
    .select({
      id: assessments.id,
      reference: assessments.reference,
      status: assessments.status,
      plantName: assessments.plantName,
      companyName: assessments.companyName,
      createdAt: assessments.createdAt,
      questionnaire: assessments.questionnaire,
      resultSnapshot: assessments.resultSnapshot,
      engineVersion: assessments.engineVersion,
      regionName: regions.name,
    })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .where(eq(assessments.ownerUserId, ownerUserId))
    .orderBy(desc(assessments.createdAt));
}

/** Each assessment's run specs (as the engine takes them), in the owner's order, by assessment id. */
export async function listRunSpecs(db: Executor, assessmentIds: readonly string[]): Promise<Map<string, unknown[]>> {
  const specs = new Map<string, unknown[]>(assessmentIds.map((id) => [id, []]));
  if (assessmentIds.length === 0) return specs;
  const rows = await db
    .select({ assessmentId: pipeRuns.assessmentId, spec: pipeRuns.spec })
    .from(pipeRuns)
    .where(inArray(pipeRuns.assessmentId, [...assessmentIds]))
    .orderBy(asc(pipeRuns.assessmentId), asc(pipeRuns.position));
  for (const row of rows) specs.get(row.assessmentId)?.push(row.spec);
  return specs;
}

/** What the owner's confirmation e-mail needs. */
export async function getAssessmentForMail(db: Executor, assessmentId: string) {
  const [row] = await db
    .select({ assessment: assessments, regionName: regions.name })
    .from(assessments)
    .leftJoin(regions, eq(regions.id, assessments.regionId))
    .where(eq(assessments.id, assessmentId));
  if (!row) return null;
  const runs = await db
    .select({ label: pipeRuns.label, service: pipeRuns.service, lengthM: pipeRuns.lengthM, spec: pipeRuns.spec })
    .from(pipeRuns)
    .where(eq(pipeRuns.assessmentId, assessmentId))
    .orderBy(asc(pipeRuns.position));
  return { ...row.assessment, regionName: row.regionName, runs };
}
