import { APIError } from 'better-auth/api';
import { acceptInvitation } from '../../../lib/admin/invitations';
import { getAuth, headersForAuth } from '../../../lib/auth';
import { DomainError } from '../../../lib/errors';
import { backTo, readFormOrJson } from '../../../lib/form-posts';
import { endpoint, json } from '../../../lib/http';
import { acceptInvitationRequestSchema } from '../../../schemas/admin';

export const prerender = false;

/**
 * POST /api/invitations/accept `{ token, password }`: the invited consultant chooses a password
 * (the join page's form, or JSON). The link is spent and they are signed in, landing on the desk.
 */
export const POST = endpoint(async ({ request, clientAddress }) => {
  const read = await readFormOrJson(request, acceptInvitationRequestSchema);
  if (read.kind === 'form-invalid') {
    return backTo('/join', { token: read.fields.token, error: read.firstPath === 'password' ? 'password' : 'link' });
  }
  const { token, password } = read.body;
  let email: string;
  try {
    ({ email } = await acceptInvitation(token, password));
  } catch (error) {
    if (read.kind === 'form' && error instanceof DomainError) return backTo('/join', { token, error: error.code === 'GONE' ? 'gone' : 'link' });
    throw error;
  }
  const home = '/desk';
  const headers = new Headers();
  try {
    const signedIn = await getAuth().api.signInEmail({ body: { email, password }, headers: headersForAuth(request, clientAddress), asResponse: true });
    for (const cookie of signedIn.headers.getSetCookie()) headers.append('set-cookie', cookie);
  } catch (error) {
    // The password is set; if signing in is refused just now, the sign-in page takes over.
    if (!(error instanceof APIError)) throw error;
  }
  const landing = headers.has('set-cookie') ? home : '/sign-in?joined=1#team';
  if (read.kind === 'form') {
    headers.set('location', landing);
    return new Response(null, { status: 303, headers });
  }
  const answer = json({ home: landing });
  for (const cookie of headers.getSetCookie()) answer.headers.append('set-cookie', cookie);
  return answer;
});
