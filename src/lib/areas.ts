/**
 * The guarded areas of the site, as data: each path prefix and the permission a person needs to
 * enter it. src/middleware.ts checks every request against this table before any page or
 * endpoint runs; endpoints then check their own finer permission with `requirePermission`.
 */
import { can, notForRole, notSignedIn, type ActionOf, type Resource } from './guards';
import { errorResponse } from './http';
import type { SessionUser } from './session';

interface AreaRule<R extends Resource = Resource> {
  /** Matches the prefix itself and everything below it. */
  prefix: string;
  /** `api` areas answer JSON; `page` areas redirect to sign-in or show the refusal page. */
  kind: 'page' | 'api';
  resource: R;
  action: ActionOf<R>;
}

const rule = <R extends Resource>(prefix: string, kind: 'page' | 'api', resource: R, action: ActionOf<R>): AreaRule =>
  ({ prefix, kind, resource, action }) as AreaRule;

/** The consultant's desk, the admin area and the owner's pages, with their API counterparts. */
export const areaRules: readonly AreaRule[] = [
  rule('/desk', 'page', 'lead', 'list-open'),
  rule('/api/leads', 'api', 'lead', 'list-open'),
  // Only admins manage consultants, so the statement stands for the whole admin area.
  rule('/admin', 'page', 'consultant', 'manage'),
  rule('/api/admin', 'api', 'consultant', 'manage'),
  rule('/my', 'page', 'assessment', 'read-own'),
];

/** The page a refused person is shown (rendered with status 403 in place of the asked page). */
export const REFUSAL_PAGE = '/not-for-your-account';

export function areaRuleFor(pathname: string): AreaRule | undefined {
  const path = pathname.replace(/\/+$/, '') || '/';
  return areaRules.find((r) => path === r.prefix || path.startsWith(`${r.prefix}/`));
}

export type AreaVerdict =
  | { kind: 'pass' }
  | { kind: 'respond'; response: Response }
  /** Render the refusal page in place of the asked one. */
  | { kind: 'refuse-page' };

/**
 * What to do with a request to `url` from `user`. `lookupFailed` is true when the session store
 * could not be asked: a guarded area then answers 503 rather than guessing.
 */
export function checkArea(url: URL, user: SessionUser | null, lookupFailed: boolean): AreaVerdict {
  const area = areaRuleFor(url.pathname);
  if (!area) return { kind: 'pass' };
  if (lookupFailed) {
    const message = 'Sign-in could not be checked just now; please try again in a minute.';
    return {
      kind: 'respond',
      response:
        area.kind === 'api'
          ? errorResponse(503, 'SERVICE_UNAVAILABLE', message)
          : new Response(message, { status: 503, headers: { 'content-type': 'text/plain; charset=utf-8', 'retry-after': '30' } }),
    };
  }
  if (!user) {
    if (area.kind === 'api') return { kind: 'respond', response: notSignedIn() };
    const next = encodeURIComponent(`${url.pathname}${url.search}`);
    return { kind: 'respond', response: new Response(null, { status: 303, headers: { location: `/sign-in?next=${next}` } }) };
  }
  if (can(user, area.resource, area.action)) return { kind: 'pass' };
  return area.kind === 'api' ? { kind: 'respond', response: notForRole() } : { kind: 'refuse-page' };
}
