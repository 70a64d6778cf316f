import { defineMiddleware } from 'astro:middleware';
import { describeForLog } from './db/errors';
import { sessionFromHeaders } from './lib/session';

/** Fills Astro.locals with the signed-in user on on-demand routes (prerendered pages have no request). */
export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.sessionId = null;
  if (context.isPrerendered || context.url.pathname.startsWith('/api/auth/') || context.url.pathname === '/api/health') {
    return next();
  }
  try {
    const found = await sessionFromHeaders(context.request.headers);
    if (found) {
      context.locals.user = found.user;
      context.locals.sessionId = found.sessionId;
    }
  } catch (error) {
    // A session store outage must not take public pages down; the visitor is treated as signed out.
    console.error(`[session] lookup failed: ${describeForLog(error)}`);
  }
  return next();
});
