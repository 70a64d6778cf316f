import { APIError } from 'better-auth/api';
import { getAuth, headersForAuth } from '../../../lib/auth';
import { DomainError } from '../../../lib/errors';
import { endpoint } from '../../../lib/http';
import { assertMayTryPassword, recordRightPassword, recordWrongPassword, withHashingSlot } from '../../../lib/password-guard';
import { isRoleName } from '../../../lib/permissions';
import { homeFor, passwordSignInSchema, signInPageUrl } from '../../../lib/sign-in';
import { noteRefusedSignIn } from '../../../lib/sign-in-refusals';

export const prerender = false;

/** A browser's form post wants the page back; anything else (a script) gets the status itself. */
function wantsPage(request: Request): boolean {
  return (request.headers.get('accept') ?? '').includes('text/html');
}

/**
 * The sign-in page's consultant form posts here; better-auth checks the password and sets the
 * cookie. Wrong tries are counted and paused (src/lib/password-guard.ts): a paused browser is
 * sent back to the form with the wait, a script gets 429 with Retry-After.
 */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  const parsed = passwordSignInSchema.safeParse(Object.fromEntries(form));
  const refused = (error: 'password' | 'team-limited' | 'deactivated', extra: Record<string, string> = {}) =>
    redirect(signInPageUrl({ error, ...extra }, form.get('next'), 'team'), 303);
  if (!parsed.success) return refused('password');
  const { email, password } = parsed.data;
  try {
    await assertMayTryPassword(email, clientAddress);
    const response = await withHashingSlot(() =>
      getAuth().api.signInEmail({ body: { email, password }, headers: headersForAuth(request, clientAddress), asResponse: true }),
    );
    if (!response.ok) {
      if (response.status === 429) {
        await noteRefusedSignIn(email, 'too-many-tries');
        return refused('team-limited', { wait: '60' });
      }
      // better-auth's admin plugin refuses a banned (deactivated) account with 403, after the password.
      if (response.status === 403) {
        await noteRefusedSignIn(email, 'deactivated');
        return refused('deactivated');
      }
      await recordWrongPassword(email, clientAddress);
      return refused('password');
    }
    await recordRightPassword(email);
    const body = (await response.json()) as { user?: { role?: string } };
    const role = isRoleName(body.user?.role) ? body.user?.role : null;
    const headers = new Headers({ location: parsed.data.next ?? homeFor(role) });
    for (const cookie of response.headers.getSetCookie()) headers.append('set-cookie', cookie);
    return new Response(null, { status: 303, headers });
  } catch (error) {
    if (error instanceof DomainError && error.code === 'RATE_LIMITED' && wantsPage(request)) {
      await noteRefusedSignIn(email, 'too-many-tries');
      return refused('team-limited', { wait: String(error.retryAfterSeconds ?? 60) });
    }
    if (error instanceof APIError && error.statusCode === 403) {
      await noteRefusedSignIn(email, 'deactivated');
      return refused('deactivated');
    }
    if (error instanceof APIError) {
      await recordWrongPassword(email, clientAddress);
      return refused('password');
    }
    throw error;
  }
});
