/**
 * Server-side guards read from the permission table (./permissions): the same statements
 * better-auth's admin plugin checks. Endpoints call `requirePermission` inside `endpoint()`;
 * pages and whole areas are guarded in src/middleware.ts through ./areas.
 */
import { errorResponse, HttpResponseError } from './http';
import { roles, statements } from './permissions';
import type { SessionUser } from './session';

export type Resource = keyof typeof statements;
export type ActionOf<R extends Resource> = (typeof statements)[R][number];

/** Whether the person's role allows the action (a visitor who is not signed in may do nothing). */
export function can<R extends Resource>(user: SessionUser | null, resource: R, action: ActionOf<R>): boolean {
  if (!user) return false;
  const role = roles[user.role];
  return role.authorize({ [resource]: [action] } as Parameters<typeof role.authorize>[0]).success;
}

/** The answer for a request that needs a signed-in person and has none. */
export function notSignedIn(): Response {
  return errorResponse(401, 'UNAUTHENTICATED', 'Sign in to do this; your session may have ended.');
}

/** The answer for a signed-in person whose role does not allow the request. */
export function notForRole(): Response {
  return errorResponse(403, 'FORBIDDEN', 'Your account is not allowed to do this.');
}

/** The signed-in person, or a 401 JSON answer thrown to the endpoint wrapper. */
export function requireUser(locals: App.Locals): SessionUser {
  if (!locals.user) throw new HttpResponseError(notSignedIn());
  return locals.user;
}

/**
 * The signed-in person when their role allows `action` on `resource`; otherwise throws the
 * answer (401 signed out, 403 not allowed) for `endpoint()` to return.
 *
 * @example const viewer = requirePermission(locals, 'lead', 'claim');
 */
export function requirePermission<R extends Resource>(locals: App.Locals, resource: R, action: ActionOf<R>): SessionUser {
  const user = requireUser(locals);
  if (!can(user, resource, action)) throw new HttpResponseError(notForRole());
  return user;
}
