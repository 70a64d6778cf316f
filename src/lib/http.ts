/**
 * The wrapper every endpoint goes through: parse with zod → 400 listing each issue with its
 * field path; known domain and engine errors → their status; anything else is logged and
 * answered without internals.
 */
import type { APIContext, APIRoute } from 'astro';
import { z } from 'zod';
import { isEngineError, type RangeIssueParams } from '../engine';
import { describeForLog, isDatabaseUnavailable } from '../db/errors';
import type { ApiErrorBody, ApiIssue } from '../schemas/api-error';
import type { Frozen } from '../schemas/mirror';
import { DomainError, type DomainErrorCode } from './errors';
import { outageJson } from './outage';
import { isBodyTooLarge } from '../server/body-limits';
import { findUnsafeText } from '../schemas/text';

/** One field-level problem, as declared in src/schemas/api-error.ts (range issues carry their params). */
export type Issue = ApiIssue;

const domainStatus: Record<DomainErrorCode, number> = {
  NOT_FOUND: 404,
  ALREADY_CLAIMED: 409,
  CLAIM_LIMIT: 409,
  INVALID_TRANSITION: 409,
  CONFLICT: 409,
  GONE: 410,
  INVALID_INPUT: 400,
  UNPROCESSABLE: 422,
  RATE_LIMITED: 429,
  FORBIDDEN: 403,
  UPLOAD_REFUSED: 400,
  PAYLOAD_TOO_LARGE: 413,
  SERVICE_UNAVAILABLE: 503,
};

export function json(body: unknown, status = 200, headers: HeadersInit = {}, replacer?: (key: string, value: unknown) => unknown): Response {
  return new Response(JSON.stringify(body, replacer), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

/**
 * An endpoint's answer, typed by the schema that declares it in src/schemas (the one the
 * OpenAPI document and the islands' client read), so an endpoint cannot answer a shape its
 * contract does not declare. The body is not parsed again here: the type is the check.
 */
export function answer<S extends z.core.$ZodType>(
  _schema: S,
  body: Frozen<z.output<S>>,
  status = 200,
  headers: HeadersInit = {},
  replacer?: (key: string, value: unknown) => unknown,
): Response {
  return json(body, status, headers, replacer);
}

export function errorResponse(status: number, code: string, message: string, issues?: Issue[], details?: Record<string, unknown>): Response {
  const body: ApiErrorBody = { error: { code, message, ...(issues ? { issues } : {}), ...(details ? { details } : {}) } };
  return json(body, status);
}

/** zod issues as `{ path: "runs.2.lengthM", message }`, the shape every 400 carries. */
export function issuesOf(error: z.ZodError): Issue[] {
  return error.issues.map((issue) => {
    const params = issue.code === 'custom' ? (issue.params as RangeIssueParams | undefined) : undefined;
    return {
      path: issue.path.map(String).join('.') || '(body)',
      message: issue.message,
      ...(params && typeof params.limitSI === 'number' ? { params } : {}),
    };
  });
}

export function validationFailed(issues: Issue[]): Response {
  const first = issues[0];
  const summary = first ? `${first.path}: ${first.message}` : 'The request was not valid.';
  return errorResponse(400, 'VALIDATION_FAILED', summary, issues);
}

/** Thrown inside handlers to answer with a prepared response (e.g. a 400 from a nested parse). */
export class HttpResponseError extends Error {
  constructor(readonly response: Response) {
    super('http response');
  }
}

const MAX_JSON_BYTES = 1_000_000;

/** Reads and parses a JSON body against a schema, or throws the 400/413 to answer with. */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().includes('application/json')) {
    throw new HttpResponseError(
      errorResponse(415, 'UNSUPPORTED_MEDIA_TYPE', 'Send the body as JSON with the header Content-Type: application/json.'),
    );
  }
  const text = await request.text();
  if (Buffer.byteLength(text) > MAX_JSON_BYTES) {
    throw new HttpResponseError(errorResponse(413, 'PAYLOAD_TOO_LARGE', 'The request body is over 1 MB; send fewer or smaller items.'));
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpResponseError(validationFailed([{ path: '(body)', message: 'The body is not valid JSON.' }]));
  }
  return parseValue(schema, raw);
}

export function parseValue<S extends z.ZodType>(schema: S, raw: unknown): z.output<S> {
  const unsafe = findUnsafeText(raw);
  if (unsafe.length > 0) throw new HttpResponseError(validationFailed(unsafe));
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new HttpResponseError(validationFailed(issuesOf(parsed.error)));
  return parsed.data;
}

/** Maps what a handler threw to the response the caller gets. */
export function responseForError(error: unknown, context: { method: string; path: string }): Response {
  if (error instanceof HttpResponseError) return error.response;
  if (isBodyTooLarge(error)) return errorResponse(413, 'PAYLOAD_TOO_LARGE', `${error.message} Send fewer or smaller items.`);
  if (error instanceof DomainError) {
    const issues = error.issues?.length ? [...error.issues] : error.field ? [{ path: error.field, message: error.message }] : undefined;
    const response = errorResponse(domainStatus[error.code], error.code, error.message, issues, error.details);
    if (error.retryAfterSeconds !== undefined) response.headers.set('retry-after', String(error.retryAfterSeconds));
    return response;
  }
  if (isEngineError(error)) {
    const issues = error.issues.length
      ? error.issues.map((i) => ({ path: i.path.map(String).join('.') || '(body)', message: i.message, ...(i.params ? { params: i.params } : {}) }))
      : undefined;
    return errorResponse(error.code === 'INVALID_INPUT' ? 400 : 422, error.code, error.message, issues);
  }
  if (isDatabaseUnavailable(error)) {
    console.error(`[http] ${context.method} ${context.path}: database unavailable: ${describeForLog(error)}`);
    return outageJson();
  }
  console.error(`[http] ${context.method} ${context.path} failed: ${describeForLog(error)}`);
  return errorResponse(500, 'INTERNAL', 'Something went wrong on our side; nothing was changed. Please try again.');
}

/** Wraps a handler: whatever it throws is mapped to the answer the caller gets. */
export function endpoint(handler: (context: APIContext) => Promise<Response> | Response): APIRoute {
  return async (context) => {
    try {
      return await handler(context);
    } catch (error) {
      return responseForError(error, { method: context.request.method, path: context.url.pathname });
    }
  };
}
