import { getAuth } from '../../lib/auth';
import { endpoint } from '../../lib/http';

export const prerender = false;

export const POST = endpoint(async ({ request }) => {
  const response = await getAuth().api.signOut({ headers: request.headers, asResponse: true });
  const headers = new Headers({ location: '/' });
  for (const cookie of response.headers.getSetCookie()) headers.append('set-cookie', cookie);
  return new Response(null, { status: 303, headers });
});
