/**
 * Which of better-auth's own routes (under /api/auth) are open. Signing in goes through our
 * endpoints (/api/sign-in/*), which count wrong passwords, mail links only to accounts and
 * answer every address alike; better-auth's direct sign-in routes would bypass all of that,
 * so they are refused. Open only what our pages and flows call.
 */
export const OPEN_AUTH_ROUTES: ReadonlyArray<{ method: 'GET' | 'POST'; pattern: RegExp; why: string }> = [
  { method: 'GET', pattern: /^\/magic-link\/verify$/, why: 'the link in a sign-in e-mail' },
  { method: 'GET', pattern: /^\/get-session$/, why: 'the session, for a page that asks' },
  { method: 'GET', pattern: /^\/ok$/, why: "better-auth's own liveness answer (the authorization matrix probes it)" },
  { method: 'POST', pattern: /^\/sign-out$/, why: 'signing out' },
  { method: 'GET', pattern: /^\/reset-password\/[^/]+$/, why: 'a password-reset link (token-bound)' },
  { method: 'POST', pattern: /^\/reset-password$/, why: 'setting a new password with a reset token' },
  // The admin plugin checks the session's role itself (src/lib/permissions.ts).
  { method: 'GET', pattern: /^\/admin\/[a-z-]+$/, why: 'admin screens' },
  { method: 'POST', pattern: /^\/admin\/[a-z-]+$/, why: 'admin actions' },
];

/** True when `/api/auth<rest>` may reach better-auth with this method. */
export function isOpenAuthRoute(method: string, rest: string): boolean {
  const path = rest.replace(/\/+$/, '') || '/';
  return OPEN_AUTH_ROUTES.some((route) => route.method === method && route.pattern.test(path));
}
