/**
 * The request guards every on-demand route passes before its own code, each in its own module,
 * run in this order by the middleware (src/middleware.ts):
 *   1. outages and over-large bodies become 503 / 413 (../outage, src/server/body-limits);
 *   2. Astro's image endpoint is closed (nothing of ours uses it; it resizes on demand);
 *   3. a state-changing request from another site is refused (./origin);
 *   4. per-client request limits (./request-limits);
 *   5. on the way out, every on-demand answer is marked `Cache-Control: no-store` unless it
 *      says otherwise (they carry personal data or depend on the session).
 * Headers for every answer, static files included, are set by the server (src/server/).
 */
import type { APIContext, MiddlewareNext } from 'astro';
import { isBodyTooLarge } from '../../server/body-limits';
import { errorResponse } from '../http';
import { answerOutages } from '../outage';
import { refuseForeignOrigin } from './origin';
import { refuseOverLimit } from './request-limits';

/** Headers of a Response from fetch or redirect() are frozen; copy it when they are. */
export function withHeader(response: Response, name: string, value: string): Response {
  try {
    response.headers.set(name, value);
    return response;
  } catch {
    const copy = new Response(response.body, response);
    copy.headers.set(name, value);
    return copy;
  }
}

async function guarded(context: APIContext, next: MiddlewareNext): Promise<Response> {
  const { pathname } = context.url;
  if (pathname === '/_image' || pathname.startsWith('/_image/')) {
    return errorResponse(404, 'NOT_FOUND', 'There is nothing here.');
  }
  const foreign = refuseForeignOrigin(context.request);
  if (foreign) return foreign;
  const limited = await refuseOverLimit(context.request.method, pathname, context.clientAddress);
  if (limited) return limited;
  try {
    return await next();
  } catch (error) {
    if (isBodyTooLarge(error)) return errorResponse(413, 'PAYLOAD_TOO_LARGE', `${error.message} Send less.`);
    throw error;
  }
}

/** Astro middleware: the guards above around the route. */
export async function hardening(context: APIContext, next: MiddlewareNext): Promise<Response> {
  if (context.isPrerendered) return next();
  const response = await answerOutages(context, () => guarded(context, next));
  return response.headers.has('cache-control') ? response : withHeader(response, 'cache-control', 'no-store');
}
