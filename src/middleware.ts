import { defineMiddleware, sequence } from 'astro:middleware';
import { describeForLog, isDatabaseUnavailable } from './db/errors';
import { checkArea, REFUSAL_PAGE } from './lib/areas';
import { hardening } from './lib/hardening';
import { outageResponse } from './lib/outage';
import { sessionFromHeaders } from './lib/session';

/** A signed-in visitor (better-auth's session cookie) during an outage gets the outage page, not a sign-in form. */
function carriesSession(headers: Headers): boolean {
  return /(?:^|;\s*)(?:__Secure-)?better-auth\.session_token=/.test(headers.get('cookie') ?? '');
}

/**
 * Fills Astro.locals with the signed-in user on on-demand routes (prerendered pages have no
 * request), then lets a request into a guarded area (src/lib/areas.ts) only with the permission
 * that area needs.
 */
const session = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.sessionId = null;
  if (context.isPrerendered || context.url.pathname.startsWith('/api/auth/') || context.url.pathname === '/api/health') {
    return next();
  }
  let lookupFailed = false;
  try {
    const found = await sessionFromHeaders(context.request.headers);
    if (found) {
      context.locals.user = found.user;
      context.locals.sessionId = found.sessionId;
    }
  } catch (error) {
    if (isDatabaseUnavailable(error) && carriesSession(context.request.headers)) return outageResponse(context.url.pathname);
    // A session store outage must not take public pages down; the visitor is treated as signed out.
    console.error(`[session] lookup failed: ${describeForLog(error)}`);
    lookupFailed = true;
  }
  const verdict = checkArea(context.url, context.locals.user, lookupFailed);
  if (verdict.kind === 'respond') return verdict.response;
  if (verdict.kind === 'refuse-page') return next(REFUSAL_PAGE);
  return next();
});

/** Hardening first (outages, limits, origin, headers: src/lib/hardening), then the session. */
export const onRequest = sequence(hardening, session);
