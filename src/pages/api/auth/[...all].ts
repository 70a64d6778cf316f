import type { APIRoute } from 'astro';
import { getAuth, headersForAuth } from '../../../lib/auth';
import { isOpenAuthRoute } from '../../../lib/auth-routes';
import { errorResponse } from '../../../lib/http';

export const prerender = false;

/**
 * better-auth serves the routes listed in src/lib/auth-routes.ts; the rest (its own sign-in
 * and sign-up routes among them) are refused, since our endpoints under /api/sign-in guard
 * those flows. It rate-limits by client address, which it reads from a header: we set that
 * header from the address the server trusts, replacing whatever the caller sent.
 */
export const ALL: APIRoute = ({ request, clientAddress, url }) => {
  const rest = url.pathname.slice('/api/auth'.length);
  if (!isOpenAuthRoute(request.method, rest)) {
    return errorResponse(404, 'NOT_FOUND', 'There is nothing here. To sign in, use the form at /sign-in.');
  }
  return getAuth().handler(new Request(request, { headers: headersForAuth(request, clientAddress) }));
};
