import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { messagesTo, validSubmission, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';

function postForm(path: string, fields: Record<string, string>): Promise<Response> {
  return appFetch(path, { method: 'POST', body: new URLSearchParams(fields) });
}

function cookiesOf(response: Response): string {
  return response.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

describe('signing in from the sign-in page', () => {
  afterAll(async () => {
    await closeDb();
  });

  it('a consultant signs in with e-mail and password and lands on the desk', async () => {
    const response = await postForm('/api/sign-in/password', { email: 'marisol@quintero-thermal.example', password: DEMO_PASSWORD });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/desk');
    const page = await appFetch('/account', { headers: { cookie: cookiesOf(response) } });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Marisol Quintero');
    expect(html).toContain('consultant');
  });

  it('a visitor sent to sign in from a page goes back to it, and a crafted address elsewhere is ignored', async () => {
    const page = await (await appFetch('/sign-in?next=%2Fdesk%2Fmine')).text();
    expect(page).toContain('name="next" value="/desk/mine"');
    const back = await postForm('/api/sign-in/password', {
      email: 'priya@raman-audits.example',
      password: DEMO_PASSWORD,
      next: '/desk/mine',
    });
    expect(back.headers.get('location')).toBe('/desk/mine');
    const away = await postForm('/api/sign-in/password', {
      email: 'priya@raman-audits.example',
      password: DEMO_PASSWORD,
      next: '//elsewhere.example/steal',
    });
    expect(away.headers.get('location')).toBe('/desk');
  });

  it('a wrong password goes back to the form with a message, and no session', async () => {
    const response = await postForm('/api/sign-in/password', { email: 'marisol@quintero-thermal.example', password: 'not-the-password' });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/sign-in?error=password#team');
    expect(response.headers.getSetCookie().filter((c) => c.includes('session_token=') && !c.includes('Max-Age=0'))).toEqual([]);
  });

  it('an owner asks for a link and gets one by e-mail; an unknown address gets the same answer and no mail', async () => {
    const input = validSubmission();
    const submitted = await appFetch('/api/assessments', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(input),
    });
    expect(submitted.status).toBe(201);
    await waitForMessages(input.contact.email, (m) => m.length === 1);

    const known = await postForm('/api/sign-in/link', { email: input.contact.email });
    const unknown = await postForm('/api/sign-in/link', { email: 'nobody-here@wicker-falls.example' });
    expect(known.headers.get('location')).toBe('/sign-in?sent=1#owner');
    expect(unknown.headers.get('location')).toBe('/sign-in?sent=1#owner');
    const mail = await waitForMessages(input.contact.email, (m) => m.some((x) => x.subject === 'Your Lagwise sign-in link'));
    expect(mail.find((m) => m.subject === 'Your Lagwise sign-in link')?.html).toContain('magic-link/verify');
    expect(await messagesTo('nobody-here@wicker-falls.example')).toEqual([]);
  });

  it('an owner cannot open another owner’s assessment', async () => {
    const first = validSubmission();
    const second = validSubmission();
    const created = await Promise.all(
      [first, second].map(async (input) => {
        const response = await appFetch('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
        return ((await response.json()) as { assessment: { id: string } }).assessment.id;
      }),
    );
    const [mail] = await waitForMessages(first.contact.email, (m) => m.length > 0);
    const link = /href="([^"]*magic-link\/verify[^"]*)"/.exec(mail!.html ?? '')![1]!.replaceAll('&amp;', '&');
    const cookie = cookiesOf(await fetch(link, { redirect: 'manual' }));
    expect((await appFetch(`/my/assessments/${created[0]}`, { headers: { cookie } })).status).toBe(200);
    expect((await appFetch(`/my/assessments/${created[1]}`, { headers: { cookie } })).status).toBe(404);
  });

  it('signed-out visitors are sent to the sign-in page', async () => {
    const response = await appFetch('/my/assessments');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toContain('/sign-in');
  });
});
