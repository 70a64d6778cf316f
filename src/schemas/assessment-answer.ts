/**
 * The answer of POST /api/assessments, declared once: the endpoint's answer is typed by it,
 * the islands' client parses with it, the OpenAPI document is generated from it. Kept apart
 * from the request schema (./assessment) and written with `zod/mini`, so the browser's
 * parse of the answer costs a few kB.
 */
import * as z from 'zod/mini';
import { assessmentStatuses } from '../db/statuses';

/** The stored assessment, as the submitter may see it. */
export const submittedAssessmentSchema = z.object({
  id: z.uuid(),
  reference: z.string().check(z.describe('Short code people can read out on the phone, e.g. LW-7KQ4-MX.')),
  status: z.enum(assessmentStatuses).check(z.describe('fresh when routed, unrouted when no region covers the postal code; later states after a replay.')),
  regionName: z.nullable(z.string()).check(z.describe('The region whose consultants were alerted; null when no region covers the postal code.')),
});

export const submitAssessmentAnswerSchema = z.object({ assessment: submittedAssessmentSchema });

export type SubmittedAssessment = z.output<typeof submittedAssessmentSchema>;
export type SubmitAssessmentAnswer = z.output<typeof submitAssessmentAnswerSchema>;
