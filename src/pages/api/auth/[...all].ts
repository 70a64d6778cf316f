import type { APIRoute } from 'astro';
import { getAuth, headersForAuth } from '../../../lib/auth';

export const prerender = false;

/**
 * better-auth serves its own routes (sign-in, sign-in links, sessions, admin) under /api/auth.
 * It rate-limits by client address, which it reads from a header: we set that header from the
 * address Astro saw, replacing whatever the caller sent.
 */
export const ALL: APIRoute = ({ request, clientAddress }) =>
  getAuth().handler(new Request(request, { headers: headersForAuth(request, clientAddress) }));
