/**
 * What a visitor gets while PostgreSQL is away (restarting, failing over): a 503 that says to
 * try again shortly — JSON with Retry-After for the API, a plain page for people — never a 500.
 */
import type { APIContext, MiddlewareNext } from 'astro';
import { checkDatabase } from '../db/health';
import { describeForLog, isDatabaseUnavailable } from '../db/errors';

/** Seconds a client is told to wait; a PostgreSQL restart takes about this long. */
export const OUTAGE_RETRY_AFTER_SECONDS = 5;

const OUTAGE_MESSAGE = 'The service is briefly unavailable; please try again in a few seconds. Nothing you sent was lost or stored twice.';

/** The API's answer during an outage. */
export function outageJson(message = OUTAGE_MESSAGE): Response {
  return new Response(JSON.stringify({ error: { code: 'SERVICE_UNAVAILABLE', message } }), {
    status: 503,
    headers: {
      'content-type': 'application/json; charset=utf-8',
      'cache-control': 'no-store',
      'retry-after': String(OUTAGE_RETRY_AFTER_SECONDS),
    },
  });
}

/** A page with nothing to load: no scripts, no styles from elsewhere, so it shows even now. */
export function outagePage(): Response {
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Back in a moment · Lagwise</title>
<style>body{font:1.05rem/1.5 system-ui,sans-serif;max-width:34rem;margin:4rem auto;padding:0 1rem;color:#1d2a2f}h1{font-size:1.5rem}</style>
</head><body><main><h1>Back in a moment</h1>
<p>Lagwise is restarting a part of itself. Please reload this page in a few seconds.</p>
<p>Anything you already sent is safe, and nothing is sent twice.</p></main></body></html>`;
  return new Response(html, {
    status: 503,
    headers: {
      'content-type': 'text/html; charset=utf-8',
      'cache-control': 'no-store',
      'retry-after': String(OUTAGE_RETRY_AFTER_SECONDS),
    },
  });
}

/** JSON for the API, a page for everything else. */
export function outageResponse(pathname: string): Response {
  return pathname.startsWith('/api/') ? outageJson() : outagePage();
}

/**
 * Middleware step: an outage that escapes a page or a library's own handler (better-auth
 * answers its own 500s) becomes the 503 above. A 500 is re-checked against the database, so a
 * library that hides the cause still gets the right answer.
 */
export async function answerOutages(context: APIContext, next: MiddlewareNext): Promise<Response> {
  let response: Response;
  try {
    response = await next();
  } catch (error) {
    if (!isDatabaseUnavailable(error)) throw error;
    console.error(`[outage] ${context.request.method} ${context.url.pathname}: ${describeForLog(error)}`);
    return outageResponse(context.url.pathname);
  }
  if (response.status === 500 && !(await checkDatabase(undefined, 1_000)).ok) {
    console.error(`[outage] ${context.request.method} ${context.url.pathname}: a 500 while the database is away, answered 503`);
    return outageResponse(context.url.pathname);
  }
  return response;
}
