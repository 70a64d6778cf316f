/**
 * The one typed client the islands use to talk to our API. Every call resolves — to a
 * success with the typed body, or to a failure carrying the status, the error code and
 * each issue with its field path — so a 4xx never throws into a component.
 */
import type { PlantInput, PlantResult } from '../engine';

/** One field-level problem, as every 400 lists them: `{ path: 'runs.2.lengthM', message }`. */
export interface ApiIssue {
  readonly path: string;
  readonly message: string;
}

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

/** The answer of POST /api/estimate. */
export interface EstimateResponse {
  readonly engineVersion: string;
  readonly result: PlantResult;
}

/** The stored assessment as POST /api/assessments answers it. */
export interface SubmittedAssessment {
  readonly id: string;
  readonly reference: string;
  readonly status: string;
  /** The region whose consultants were alerted; null when no region covers the postal code. */
  readonly regionName: string | null;
}

export interface SubmitAssessmentResponse {
  readonly assessment: SubmittedAssessment;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

function issuesOf(value: unknown): ApiIssue[] {
  if (!Array.isArray(value)) return [];
  return value.flatMap((issue) =>
    isRecord(issue) && typeof issue.path === 'string' && typeof issue.message === 'string'
      ? [{ path: issue.path, message: issue.message }]
      : [],
  );
}

function fallbackMessage(status: number): string {
  if (status === 429) return 'Too many requests in a short time; wait a minute and try again.';
  if (status === 413) return 'What you sent is too large; send fewer or smaller photos.';
  if (status >= 500) return 'Our server could not answer just now; nothing was lost, please try again in a minute.';
  return 'The request was refused.';
}

/** One request to our API, resolved to a typed success or a failure with its issues (shared by ./desk-client). */
export async function send<T>(url: string, init: RequestInit, isBody: (body: unknown) => body is T): Promise<ApiResult<T>> {
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin', ...init });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') {
      return { ok: false, status: 0, code: 'ABORTED', message: 'The request was cancelled.', issues: [] };
    }
    return {
      ok: false,
      status: 0,
      code: 'NETWORK',
      message: 'No answer from the server: check the connection and try again. Nothing you entered was lost.',
      issues: [],
    };
  }
  let body: unknown = null;
  try {
    body = await response.json();
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') {
      return { ok: false, status: 0, code: 'ABORTED', message: 'The request was cancelled.', issues: [] };
    }
    body = null;
  }
  if (response.ok) {
    if (isBody(body)) return { ok: true, status: response.status, data: body };
    return {
      ok: false,
      status: response.status,
      code: 'BAD_RESPONSE',
      message: 'The server sent an answer we could not read; please try again.',
      issues: [],
    };
  }
  const error = isRecord(body) && isRecord(body.error) ? body.error : undefined;
  return {
    ok: false,
    status: response.status,
    code: typeof error?.code === 'string' ? error.code : `HTTP_${response.status}`,
    message: typeof error?.message === 'string' ? error.message : fallbackMessage(response.status),
    issues: issuesOf(error?.issues),
  };
}

function isEstimateResponse(body: unknown): body is EstimateResponse {
  return isRecord(body) && typeof body.engineVersion === 'string' && isRecord(body.result) && Array.isArray(body.result.runs);
}

function isSubmitResponse(body: unknown): body is SubmitAssessmentResponse {
  return (
    isRecord(body) &&
    isRecord(body.assessment) &&
    typeof body.assessment.id === 'string' &&
    typeof body.assessment.reference === 'string' &&
    (typeof body.assessment.regionName === 'string' || body.assessment.regionName === null)
  );
}

/** The estimate of a plant; nothing is stored. Pass a signal to abort a stale request. */
export function requestEstimate(input: PlantInput, signal?: AbortSignal): Promise<ApiResult<EstimateResponse>> {
  // The results step draws face profiles and thickness series, so it asks for the full answer.
  return send(
    '/api/estimate?detail=full',
    {
      method: 'POST',
      headers: { 'content-type': 'application/json', accept: 'application/json' },
      body: JSON.stringify(input),
      ...(signal ? { signal } : {}),
    },
    isEstimateResponse,
  );
}

/**
 * Submits an assessment as multipart/form-data (part `assessment` = the JSON, photos as
 * `photos.<runId>`). The same idempotency key sent twice stores one assessment.
 */
export function submitAssessment(form: FormData, idempotencyKey: string): Promise<ApiResult<SubmitAssessmentResponse>> {
  return send(
    '/api/assessments',
    { method: 'POST', headers: { 'idempotency-key': idempotencyKey, accept: 'application/json' }, body: form },
    isSubmitResponse,
  );
}

