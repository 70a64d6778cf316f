/**
 * A sign-in link that was used (or is stale) says so and offers a new one in one click, sent
 * to the address the old link went to — which the page never shows, and a visitor cannot pick.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { validSubmission, waitForMessages, type FakeMessage } from '../support/fixtures';
import { appFetch } from '../support/stack';

function linkIn(message: FakeMessage | undefined): string {
  const link = /href="([^"]*magic-link\/verify[^"]*)"/.exec(message?.html ?? '')?.[1];
  if (!link) throw new Error(`no sign-in link in “${message?.subject ?? 'no message'}”`);
  return link.replaceAll('&amp;', '&');
}

/**
 * Opens a sign-in link as a mail client would. The sign-in routes are rate-limited per address
 * and every test here comes from 127.0.0.1, so a 429 is waited out as its Retry-After says.
 */
async function openLink(link: string): Promise<Response> {
  for (;;) {
    const response = await fetch(link, { redirect: 'manual' });
    if (response.status !== 429) return response;
    const wait = Number(response.headers.get('retry-after') ?? response.headers.get('x-retry-after') ?? 5);
    await new Promise((resolve) => setTimeout(resolve, Math.max(1, wait) * 1000));
  }
}

describe('a used sign-in link', () => {
  afterAll(async () => {
    await closeDb();
  });

  it('says what happened and sends a new link in one click, which signs the owner in where they were going', async () => {
    const input = validSubmission();
    const submitted = await appFetch('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
    expect(submitted.status).toBe(201);
    const { assessment } = (await submitted.json()) as { assessment: { id: string } };
    const [confirmation] = await waitForMessages(input.contact.email, (m) => m.length === 1);
    const link = linkIn(confirmation);

    const first = await openLink(link);
    expect(new URL(first.headers.get('location') ?? '', 'http://x').pathname).toBe(`/my/assessments/${assessment.id}`);

    const second = await openLink(link);
    const spent = new URL(second.headers.get('location') ?? '', 'http://x');
    expect(spent.pathname).toBe('/sign-in/link-used');
    expect(spent.searchParams.get('next')).toBe(`/my/assessments/${assessment.id}`);
    // The address travels sealed: the page's address never shows it.
    expect(spent.search).not.toContain(encodeURIComponent(input.contact.email));
    expect(spent.search).not.toContain(input.contact.email);

    const page = await appFetch(`${spent.pathname}${spent.search}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('This sign-in link no longer works');
    expect(html).toContain('E-mail me a new link');
    expect(html).not.toContain(input.contact.email);

    const again = await appFetch('/api/sign-in/link', {
      method: 'POST',
      body: new URLSearchParams({ again: spent.searchParams.get('again') ?? '', next: spent.searchParams.get('next') ?? '' }),
    });
    expect(again.status).toBe(303);
    expect(again.headers.get('location')).toBe(`/sign-in?sent=1&next=${encodeURIComponent(`/my/assessments/${assessment.id}`)}#owner`);

    // The new link signs in to where the owner was going (opening it is what the other tests do).
    const mail = await waitForMessages(input.contact.email, (m) => m.some((x) => x.subject === 'Your Lagwise sign-in link'));
    const fresh = new URL(linkIn(mail.find((m) => m.subject === 'Your Lagwise sign-in link')));
    expect(fresh.pathname).toBe('/api/auth/magic-link/verify');
    expect(fresh.searchParams.get('callbackURL')).toBe(`/my/assessments/${assessment.id}`);
    expect(fresh.searchParams.get('errorCallbackURL')).toMatch(/^\/sign-in\/link-used\?again=/);
    // A 429 from the per-address limit of the sign-in routes is waited out (see openLink).
  }, 180_000);

  it('a sealed address that was altered asks for the address instead, and sends nothing', async () => {
    const page = await (await appFetch('/sign-in/link-used?again=not-a-sealed-address&next=%2Fmy%2Fassessments')).text();
    expect(page).toContain('Ask for a new link');
    expect(page).not.toContain('E-mail me a new link');
    const forged = await appFetch('/api/sign-in/link', { method: 'POST', body: new URLSearchParams({ again: 'bm90LWEtc2VhbGVkLWFkZHJlc3MtYXQtYWxs' }) });
    expect(forged.status).toBe(303);
    expect(forged.headers.get('location')).toBe('/sign-in?error=email&email=#owner');
  });
});
