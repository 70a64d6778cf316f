import { endpoint } from '../../../lib/http';
import { linkRequestSchema, requestSignInLink } from '../../../lib/sign-in';

export const prerender = false;

/** The sign-in page's owner form posts here; it answers with a redirect either way. */
export const POST = endpoint(async ({ request, clientAddress, redirect }) => {
  const form = await request.formData().catch(() => new FormData());
  const parsed = linkRequestSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    const typed = String(form.get('email') ?? '');
    return redirect(`/sign-in?error=email&email=${encodeURIComponent(typed.slice(0, 254))}#owner`, 303);
  }
  const outcome = await requestSignInLink(parsed.data.email, parsed.data.next ?? '/my/assessments', clientAddress);
  return redirect(outcome === 'sent' ? '/sign-in?sent=1#owner' : '/sign-in?error=limited#owner', 303);
});
