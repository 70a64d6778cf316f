/**
 * Taking in an owner's assessment: one transaction stores the assessment, its runs, its
 * photos' records, the activity entry and the jobs that mail the owner and alert the
 * region's consultants — all of it or none of it.
 */
import { createHash, randomUUID } from 'node:crypto';
import { findAssessmentByIdempotencyKey, insertAssessment, recordActivity, type AssessmentSummary } from '../../db/queries/assessments';
import { hitRateLimit } from '../../db/queries/rate-limits';
import { findRegionForPostalCode, lockRouting } from '../../db/queries/regions';
import { findOrCreateOwner } from '../../db/queries/users';
import { getDb } from '../../db/client';
import { describeForLog, isUniqueViolation } from '../../db/errors';
import type { AssessmentStatus } from '../../db/schema';
import { inTransaction } from '../../db/transaction';
import type { CreateAssessment } from '../../schemas/assessment';
import { ENGINE_VERSION, estimateParsedPlant } from '../../engine';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import { normalisePostalCode, type CountryCode } from '../routing/postal-code';
import { deleteObjects, putObject } from '../storage/objects';
import type { CleanPhoto } from '../uploads/photos';
import { headlineColumnsOf, isPhoto } from './headline';
import { newAssessmentReference } from './reference';

export interface SubmittedPhoto {
  /** The run the photo shows, by the run's id in the estimate; null for the plant as a whole. */
  runId: string | null;
  photo: CleanPhoto;
}

export interface SubmissionLimits {
  perAddressPerHour: number;
  perEmailPerHour: number;
}

export interface SubmissionContext {
  idempotencyKey?: string;
  /** SHA-256 of the request (see submissionFingerprint); a key reused with another body is refused. */
  fingerprint?: string;
  /** The submitter's network address, for the per-address limit. */
  clientAddress: string;
  limits?: SubmissionLimits;
}

export interface SubmissionOutcome {
  assessment: AssessmentSummary;
  /** True when the idempotency key had already stored this assessment. */
  replayed: boolean;
}

/**
 * Submissions per hour: generous for a plant team, tight for a script. The test stack raises
 * them by environment, since every test submits from 127.0.0.1.
 */
export function defaultSubmissionLimits(): SubmissionLimits {
  return {
    perAddressPerHour: Number(process.env.LAGWISE_SUBMISSIONS_PER_ADDRESS_PER_HOUR ?? 10),
    perEmailPerHour: Number(process.env.LAGWISE_SUBMISSIONS_PER_EMAIL_PER_HOUR ?? 5),
  };
}

async function enforceRateLimits(contactEmail: string, clientAddress: string, limits: SubmissionLimits): Promise<void> {
  const db = getDb();
  for (const [key, limit] of [
    [`submit:address:${clientAddress}`, limits.perAddressPerHour],
    [`submit:email:${contactEmail}`, limits.perEmailPerHour],
  ] as const) {
    const verdict = await hitRateLimit(db, key, { limit, windowSeconds: 3600 });
    if (!verdict.allowed) {
      const minutes = Math.max(1, Math.ceil(verdict.retryAfterSeconds / 60));
      throw new DomainError(
        'RATE_LIMITED',
        `Too many assessments were sent from here in the last hour; please try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      );
    }
  }
}

/** What identifies a submission's content: the parsed assessment and each photo's bytes. */
export function submissionFingerprint(input: CreateAssessment, photos: SubmittedPhoto[]): string {
  const hash = createHash('sha256').update(JSON.stringify(input));
  for (const { runId, photo } of photos) hash.update(`\u0000${runId ?? ''}\u0000`).update(photo.bytes);
  return hash.digest('hex');
}

/** The earlier answer for a reused key, unless the key now comes with something else. */
function replayOf(earlier: AssessmentSummary & { fingerprint: string | null }, context: SubmissionContext): SubmissionOutcome {
  const { fingerprint, ...assessment } = earlier;
  if (fingerprint !== null && context.fingerprint !== undefined && fingerprint !== context.fingerprint) {
    throw new DomainError(
      'UNPROCESSABLE',
      'This Idempotency-Key was already used for a different assessment. Send a new key with each new assessment; reuse a key only to resend the very same one.',
      'Idempotency-Key',
    );
  }
  return { assessment, replayed: true };
}

export async function submitAssessment(
  input: CreateAssessment,
  photos: SubmittedPhoto[],
  context: SubmissionContext,
): Promise<SubmissionOutcome> {
  const db = getDb();
  if (context.idempotencyKey) {
    const earlier = await findAssessmentByIdempotencyKey(db, context.idempotencyKey);
    if (earlier) return replayOf(earlier, context);
  }
  await enforceRateLimits(input.contact.email, context.clientAddress, context.limits ?? defaultSubmissionLimits());

  const runIndexById = new Map(input.estimate.runs.map((run, index) => [run.id, index]));
  for (const { runId } of photos) {
    if (runId !== null && !runIndexById.has(runId)) {
      throw new DomainError('UPLOAD_REFUSED', `A photo names run "${runId}", which is not in this assessment.`, `photos.${runId}`);
    }
  }

  const postal = normalisePostalCode(input.plant.countryCode as CountryCode, input.plant.postalCode);
  if (!postal.ok) throw new DomainError('UNPROCESSABLE', postal.message, 'plant.postalCode');

  const result = estimateParsedPlant(input.estimate);
  const spam = Boolean(input.website?.trim());
  const assessmentId = randomUUID();

  // Objects first: storage cannot join the transaction, so a failed transaction deletes them.
  const stored: { key: string; photo: SubmittedPhoto }[] = [];
  try {
    for (const item of photos) {
      const key = `assessments/${assessmentId}/${randomUUID()}.${item.photo.extension}`;
      await putObject(key, item.photo.bytes, item.photo.contentType);
      stored.push({ key, photo: item });
    }
    const assessment = await inTransaction(async (tx, sqlRunner) => {
      if (!spam) await lockRouting(tx, 'share');
      const region = spam ? null : await findRegionForPostalCode(tx, input.plant.countryCode, postal.routingKey);
      const status: AssessmentStatus = spam ? 'junk' : region ? 'fresh' : 'unrouted';
      const ownerUserId = spam ? null : await findOrCreateOwner(tx, input.contact.email, input.contact.name);
      const reference = newAssessmentReference();
      const { runs, ...estimateWithoutRuns } = input.estimate;
      await insertAssessment(
        tx,
        {
          id: assessmentId,
          reference,
          status,
          regionId: region?.regionId ?? null,
          ownerUserId,
          contactName: input.contact.name,
          companyName: input.contact.company,
          contactEmail: input.contact.email,
          contactPhone: input.contact.phone ?? null,
          consentedAt: new Date(),
          plantName: input.plant.plantName || null,
          plantType: input.plant.plantType,
          countryCode: input.plant.countryCode,
          postalCode: input.plant.postalCode,
          postalCodeNormalised: postal.canonical,
          questionnaire: { plant: input.plant, estimate: estimateWithoutRuns },
          resultSnapshot: result,
          engineVersion: ENGINE_VERSION,
          ...headlineColumnsOf(result, stored.filter(({ photo }) => isPhoto(photo.photo.contentType)).length),
          idempotencyKey: context.idempotencyKey ?? null,
          idempotencyFingerprint: context.idempotencyKey ? (context.fingerprint ?? null) : null,
        },
        runs.map((run) => ({ label: run.label, service: run.service, lengthM: run.lengthM, spec: run })),
        stored.map(({ key, photo }) => ({
          objectKey: key,
          contentType: photo.photo.contentType,
          byteSize: photo.photo.bytes.byteLength,
          widthPx: photo.photo.widthPx,
          heightPx: photo.photo.heightPx,
          originalName: photo.photo.originalName,
          runIndex: photo.runId === null ? null : (runIndexById.get(photo.runId) ?? null),
        })),
      );
      await recordActivity(tx, {
        assessmentId,
        actorUserId: ownerUserId,
        action: 'assessment.submitted',
        detail: { status, regionId: region?.regionId ?? null, matchedPrefix: region?.prefix ?? null, runs: runs.length, photos: stored.length },
      });
      if (!spam) {
        await enqueue(jobNames.confirmSubmission, { assessmentId }, { sqlRunner });
        if (region) await enqueue(jobNames.alertConsultants, { assessmentId }, { sqlRunner });
        else await enqueue(jobNames.alertAdminsUnrouted, { assessmentId }, { sqlRunner });
      }
      return { id: assessmentId, reference, status, regionName: region?.regionName ?? null };
    });
    return { assessment, replayed: false };
  } catch (error) {
    await deleteObjects(stored.map((s) => s.key)).catch((cleanup: unknown) =>
      console.error(`[submit] could not remove photos of a failed submission: ${describeForLog(cleanup)}`),
    );
    if (context.idempotencyKey && isUniqueViolation(error, 'idempotency_key')) {
      // A simultaneous request with the same key won the race; answer with what it stored.
      const earlier = await findAssessmentByIdempotencyKey(db, context.idempotencyKey);
      if (earlier) return replayOf(earlier, context);
    }
    throw error;
  }
}
