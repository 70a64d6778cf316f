import { APIError } from 'better-auth/api';
import { getAuth, headersForAuth } from '../../../lib/auth';
import { endpoint } from '../../../lib/http';
import { isRoleName } from '../../../lib/permissions';
import { homeFor, passwordSignInSchema, signInPageUrl } from '../../../lib/sign-in';
import { noteRefusedSignIn } from '../../../lib/sign-in-refusals';

export const prerender = false;

/** The sign-in page's consultant form posts here; better-auth checks the password and sets the cookie. */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  const parsed = passwordSignInSchema.safeParse(Object.fromEntries(form));
  const refused = (error: 'password' | 'team-limited' | 'deactivated') => redirect(signInPageUrl({ error }, form.get('next'), 'team'), 303);
  if (!parsed.success) return refused('password');
  try {
    const response = await getAuth().api.signInEmail({
      body: { email: parsed.data.email, password: parsed.data.password },
      headers: headersForAuth(request, clientAddress),
      asResponse: true,
    });
    if (!response.ok) {
      if (response.status === 429) {
        await noteRefusedSignIn(parsed.data.email, 'too-many-tries');
        return refused('team-limited');
      }
      // better-auth's admin plugin refuses a banned (deactivated) account with 403, after the password.
      if (response.status === 403) {
        await noteRefusedSignIn(parsed.data.email, 'deactivated');
        return refused('deactivated');
      }
      return refused('password');
    }
    const body = (await response.json()) as { user?: { role?: string } };
    const role = isRoleName(body.user?.role) ? body.user?.role : null;
    const headers = new Headers({ location: parsed.data.next ?? homeFor(role) });
    for (const cookie of response.headers.getSetCookie()) headers.append('set-cookie', cookie);
    return new Response(null, { status: 303, headers });
  } catch (error) {
    if (error instanceof APIError && error.statusCode === 403) {
      await noteRefusedSignIn(parsed.data.email, 'deactivated');
      return refused('deactivated');
    }
    if (error instanceof APIError) return refused('password');
    throw error;
  }
});
