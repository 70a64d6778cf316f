/**
 * Cross-site request forgery: a state-changing request that a browser marks as coming from
 * another site is refused, whatever its content type (Astro's own check covers form posts only,
 * not JSON). A request with no Origin at all comes from a script, not a browser page, and
 * carries no one's cookies by accident.
 */
import { errorResponse } from '../http';
import { trustedOrigins } from '../site';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

let allowed: Set<string> | undefined;

/** The refusal, or undefined when the request may go on. */
export function refuseForeignOrigin(request: Request): Response | undefined {
  if (SAFE_METHODS.has(request.method)) return undefined;
  allowed ??= new Set(trustedOrigins());
  const origin = request.headers.get('origin');
  if (origin === null) {
    const site = request.headers.get('sec-fetch-site');
    if (site === null || site === 'same-origin' || site === 'none') return undefined;
  } else if (allowed.has(origin)) {
    return undefined;
  }
  return errorResponse(403, 'FOREIGN_ORIGIN', 'This request came from another site, so it was refused. Use the form on this site.');
}
