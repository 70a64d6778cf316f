import { defineMiddleware } from 'astro:middleware';
import { describeForLog } from './db/errors';
import { checkArea, REFUSAL_PAGE } from './lib/areas';
import { sessionFromHeaders } from './lib/session';

/**
 * Fills Astro.locals with the signed-in user on on-demand routes (prerendered pages have no
 * request), then lets a request into a guarded area (src/lib/areas.ts) only with the permission
 * that area needs.
 */
export const onRequest = defineMiddleware(async (context, next) => {
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
    // A session store outage must not take public pages down; the visitor is treated as signed out.
    console.error(`[session] lookup failed: ${describeForLog(error)}`);
    lookupFailed = true;
  }
  const verdict = checkArea(context.url, context.locals.user, lookupFailed);
  if (verdict.kind === 'respond') return verdict.response;
  if (verdict.kind === 'refuse-page') return next(REFUSAL_PAGE);
  return next();
});
