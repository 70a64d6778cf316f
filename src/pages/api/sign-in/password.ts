import { APIError } from 'better-auth/api';
import { getAuth, headersForAuth } from '../../../lib/auth';
import { endpoint } from '../../../lib/http';
import { isRoleName } from '../../../lib/permissions';
import { homeFor, passwordSignInSchema } from '../../../lib/sign-in';

export const prerender = false;

/** The sign-in page's consultant form posts here; better-auth checks the password and sets the cookie. */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  const parsed = passwordSignInSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) return redirect('/sign-in?error=password#team', 303);
  try {
    const response = await getAuth().api.signInEmail({
      body: { email: parsed.data.email, password: parsed.data.password },
      headers: headersForAuth(request, clientAddress),
      asResponse: true,
    });
    if (!response.ok) return redirect(response.status === 429 ? '/sign-in?error=limited#team' : '/sign-in?error=password#team', 303);
    const body = (await response.json()) as { user?: { role?: string } };
    const role = isRoleName(body.user?.role) ? body.user?.role : null;
    const headers = new Headers({ location: homeFor(role) });
    for (const cookie of response.headers.getSetCookie()) headers.append('set-cookie', cookie);
    return new Response(null, { status: 303, headers });
  } catch (error) {
    if (error instanceof APIError) return redirect('/sign-in?error=password#team', 303);
    throw error;
  }
});
