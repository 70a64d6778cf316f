/**
 * The one typed client the islands use to talk to our API. Every call resolves — to a
 * success with the typed body, or to a failure carrying the status, the error code and
 * each issue with its field path — so a 4xx never throws into a component.
 */
import type { PlantInput } from '../engine';
import type { ApiIssue } from '../schemas/api-error';
import type { SubmitAssessmentAnswer, SubmittedAssessment } from '../schemas/assessment-answer';
import type { CoverageAnswer } from '../schemas/coverage';
import type { EstimateAnswer } from '../schemas/estimate';

export type { ApiIssue, CoverageAnswer, EstimateAnswer, SubmitAssessmentAnswer, SubmittedAssessment };

export interface ApiSuccess<T> {
  readonly ok: true;
  readonly status: number;
  readonly data: T;
}

/**
 * What went wrong. `status` is 0 when no answer arrived (`code` NETWORK) or the caller
 * aborted (`code` ABORTED).
 */
export interface ApiFailure {
  readonly ok: false;
  readonly status: number;
  readonly code: string;
  readonly message: string;
  readonly issues: readonly ApiIssue[];
}

export type ApiResult<T> = ApiSuccess<T> | ApiFailure;

function fallbackMessage(status: number): string {
  if (status === 429) return 'Too many requests in a short time; wait a minute and try again.';
  if (status === 413) return 'What you sent is too large; send fewer or smaller photos.';
  if (status >= 500) return 'Our server could not answer just now; nothing was lost, please try again in a minute.';
  return 'The request was refused.';
}

/** The answer schemas, imported with the first answer rather than with the page. */
const answers = () => import('../schemas/answers');

export const NO_ANSWER: ApiFailure = {
  ok: false,
  status: 0,
  code: 'NETWORK',
  message: 'No answer from the server: check the connection and try again. Nothing you entered was lost.',
  issues: [],
};

/** What parses an answer: a zod schema (classic or mini) declared in src/schemas. */
export interface AnswerSchema<T> {
  safeParse(value: unknown): { success: true; data: T } | { success: false };
}

/**
 * One request to our API (shared by ./desk-client), resolved to a success with the answer as
 * parsed by the schema that declares it (src/schemas), or to a failure with its issues. The
 * schema may be given as a loader: the estimate's schemas are imported when the first answer
 * arrives — nothing needs them before — so they stay out of the page's first load.
 */
export async function send<T>(url: string, init: RequestInit, answerSchema: AnswerSchema<T> | (() => Promise<AnswerSchema<T>>)): Promise<ApiResult<T>> {
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin', ...init });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') {
      return { ok: false, status: 0, code: 'ABORTED', message: 'The request was canceled.', issues: [] };
    }
    return NO_ANSWER;
  }
  let body: unknown = null;
  try {
    body = await response.json();
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') {
      return { ok: false, status: 0, code: 'ABORTED', message: 'The request was canceled.', issues: [] };
    }
    body = null;
  }
  // A dropped connection can also stop a schema's own file from arriving: that is no answer either.
  if (response.ok) {
    const schema = typeof answerSchema === 'function' ? await answerSchema().catch(() => null) : answerSchema;
    if (!schema) return NO_ANSWER;
    const parsed = schema.safeParse(body);
    if (parsed.success) return { ok: true, status: response.status, data: parsed.data };
    return {
      ok: false,
      status: response.status,
      code: 'BAD_RESPONSE',
      message: 'The server sent an answer we could not read; please try again.',
      issues: [],
    };
  }
  const errors = await answers().catch(() => null);
  if (!errors) return NO_ANSWER;
  // A proxy's HTML error page or an empty body still yields a sentence for the person.
  const error = errors.apiErrorSchema.safeParse(body);
  return {
    ok: false,
    status: response.status,
    code: error.success ? error.data.error.code : `HTTP_${response.status}`,
    message: error.success ? error.data.error.message : fallbackMessage(response.status),
    issues: error.success ? (error.data.error.issues ?? []) : [],
  };
}

/** The estimate of a plant; nothing is stored. Pass a signal to abort a stale request. */
export function requestEstimate(input: PlantInput, signal?: AbortSignal): Promise<ApiResult<EstimateAnswer>> {
  // The results step draws face profiles and thickness series, so it asks for the full answer.
  return send(
    '/api/estimate?detail=full',
    {
      method: 'POST',
      headers: { 'content-type': 'application/json', accept: 'application/json' },
      body: JSON.stringify(input),
      ...(signal ? { signal } : {}),
    },
    () => answers().then((m) => m.estimateAnswerSchema),
  );
}

/**
 * Submits an assessment as multipart/form-data (part `assessment` = the JSON, photos as
 * `photos.<runId>`). The same idempotency key sent twice stores one assessment.
 */
export function submitAssessment(form: FormData, idempotencyKey: string): Promise<ApiResult<SubmitAssessmentAnswer>> {
  return send(
    '/api/assessments',
    { method: 'POST', headers: { 'idempotency-key': idempotencyKey, accept: 'application/json' }, body: form },
    () => answers().then((m) => m.submitAssessmentAnswerSchema),
  );
}


/** Whether a consultant covers the plant's postal code (asked at the plant step). */
export function requestCoverage(countryCode: string, postalCode: string, signal?: AbortSignal): Promise<ApiResult<CoverageAnswer>> {
  const query = new URLSearchParams({ country: countryCode, postalCode });
  return send(
    `/api/coverage?${query}`,
    { method: 'GET', headers: { accept: 'application/json' }, ...(signal ? { signal } : {}) },
    () => answers().then((m) => m.coverageAnswerSchema),
  );
}
