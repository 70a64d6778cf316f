import { endpoint } from '../../../lib/http';
import { linkRequestSchema, requestSignInLink, signInPageUrl } from '../../../lib/sign-in';

export const prerender = false;

/** The sign-in page's owner form posts here; it answers with a redirect either way. */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  const parsed = linkRequestSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    const typed = String(form.get('email') ?? '').slice(0, 254);
    return redirect(signInPageUrl({ error: 'email', email: typed }, form.get('next'), 'owner'), 303);
  }
  const outcome = await requestSignInLink(parsed.data.email, parsed.data.next ?? '/my/assessments', clientAddress);
  return redirect(signInPageUrl(outcome === 'sent' ? { sent: '1' } : { error: 'limited' }, parsed.data.next, 'owner'), 303);
});
