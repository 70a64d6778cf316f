import { endpoint } from '../../../lib/http';
import { linkRequestSchema, requestSignInLink, signInPageUrl } from '../../../lib/sign-in';
import { openAddress } from '../../../lib/sign-in-again';

export const prerender = false;

/** The sign-in page's owner form posts here; it answers with a redirect either way. */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  // From the page behind a spent link: the address it was sent to, sealed in that link.
  const sealed = form.get('again');
  if (sealed !== null) form.set('email', openAddress(sealed) ?? '');
  const parsed = linkRequestSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    const typed = sealed !== null ? '' : String(form.get('email') ?? '').slice(0, 254);
    return redirect(signInPageUrl({ error: 'email', email: typed }, form.get('next'), 'owner'), 303);
  }
  const outcome = await requestSignInLink(parsed.data.email, parsed.data.next ?? '/my/assessments', clientAddress);
  return redirect(signInPageUrl(outcome === 'sent' ? { sent: '1' } : { error: 'limited' }, parsed.data.next, 'owner'), 303);
});
