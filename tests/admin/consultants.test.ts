/**
 * The admin's consultants through the HTTP API: invitations that work once and expire, resending
 * and withdrawing them, caps, deactivation (sessions end on the next request; open leads reopen
 * or go to a colleague, as the admin chose) and reactivation, password reset by e-mail, and the
 * refusals of bad input. Regions of the tests' own: Australian prefixes 41 and 42.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { activityLog, assessments, consultantInvitations, session, user, verification } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { asPerson, ensureConsultant, ensureDeskRegion, passwordCookie, submitLead } from '../support/desk';
import { messagesTo, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';
import { adminCookie, invitationTokens, resetToken } from './support';

let admin: string;
let regionA: string;
let regionB: string;
const stamp = randomUUID().slice(0, 8);

interface ConsultantBody {
  consultant: { id: string; status: string; email: string; openClaimCap: number; regions: { id: string }[]; invitation: { expiresAt: string } | null };
}

async function invite(email: string, regionIds: string[], extra: Record<string, unknown> = {}) {
  const response = await asPerson(admin, '/api/admin/consultants', {
    method: 'POST',
    body: { email, name: 'Wren Takahe', firm: `Takahe Lagging ${stamp}`, phone: '+61 3 5550 7788', regionIds, ...extra },
  });
  expect(response.status, await response.clone().text()).toBe(201);
  return ((await response.json()) as ConsultantBody).consultant;
}

function accept(token: string, password = 'a long enough password') {
  return appFetch('/api/invitations/accept', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ token, password }),
  });
}

/**
 * Posts the sign-in form and answers where it sends the browser. The server's limiter allows a
 * few sign-ins per address each few seconds and every test signs in from 127.0.0.1, so a
 * "too many tries" answer is waited out (a bounded number of times) rather than failing the test.
 */
async function signInThroughForm(email: string, password = 'lagwise-test-password-2026'): Promise<string> {
  for (let attempt = 0; attempt < 6; attempt += 1) {
    const response = await appFetch('/api/sign-in/password', { method: 'POST', body: new URLSearchParams({ email, password }) });
    const location = response.headers.get('location') ?? '';
    if (!location.includes('error=team-limited')) return location;
    await new Promise((resolve) => setTimeout(resolve, 4000));
  }
  throw new Error('the sign-in limiter never let the form through');
}

function cookieOf(response: Response): string {
  return response.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

describe('consultants in the admin area', () => {
  beforeAll(async () => {
    regionA = await ensureDeskRegion('test-admin-quokka', 'Quokka Point (admin)', ['41']);
    regionB = await ensureDeskRegion('test-admin-echidna', 'Echidna Flat (admin)', ['42']);
    admin = await adminCookie();
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('an invitation link sets a password once, signs the consultant in to their desk, and then no longer works', async () => {
    const email = `wren.${stamp}@takahe-lagging.example`;
    const made = await invite(email, [regionA]);
    expect(made.status).toBe('invited');
    expect(made.regions.map((r) => r.id)).toEqual([regionA]);
    const [token] = await invitationTokens(email, 1);
    // The stored token is its hash, never the link's own value.
    const [stored] = await getDb().select().from(consultantInvitations).where(eq(consultantInvitations.email, email));
    expect(stored!.tokenHash).not.toContain(token!);
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const page = await appFetch(`/join?token=${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(email);

    const first = await accept(token!);
    expect(first.status, await first.clone().text()).toBe(200);
    expect(await first.json()).toEqual({ home: '/desk' });
    const cookie = cookieOf(first);
    expect(cookie).toContain('session_token=');
    expect((await asPerson(cookie, '/api/leads?view=open')).status).toBe(200);

    const again = await accept(token!, 'another long password');
    expect(again.status).toBe(410);
    expect(((await again.json()) as { error: { message: string } }).error.message).toMatch(/used already/);
    expect((await appFetch(`/join?token=${token}`)).status).toBe(410);

    const listed = ((await (await asPerson(admin, `/api/admin/consultants/${made.id}`)).json()) as ConsultantBody).consultant;
    expect(listed.status).toBe('active');
    expect(listed.invitation).toBeNull();
    // And the password they chose signs them in through the ordinary form.
    expect(await passwordCookie(email, 'a long enough password')).toContain('session_token=');
  });

  it('an invitation link does not work after it expires', async () => {
    const email = `kea.${stamp}@takahe-lagging.example`;
    const made = await invite(email, [regionA]);
    const [token] = await invitationTokens(email, 1);
    await getDb().update(consultantInvitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(consultantInvitations.userId, made.id));
    const late = await accept(token!);
    expect(late.status).toBe(410);
    expect(((await late.json()) as { error: { message: string } }).error.message).toMatch(/expired/);
    expect((await appFetch(`/join?token=${token}`)).status).toBe(410);
    const listed = ((await (await asPerson(admin, `/api/admin/consultants/${made.id}`)).json()) as { consultant: { status: string; invitation: { expired: boolean } } }).consultant;
    expect(listed.status).toBe('invited');
    expect(listed.invitation.expired).toBe(true);
  });

  it('sending an invitation again replaces the link; withdrawing it ends the link and the unused account', async () => {
    const email = `weka.${stamp}@takahe-lagging.example`;
    const made = await invite(email, []);
    const resent = await asPerson(admin, `/api/admin/consultants/${made.id}/invitation`, { method: 'POST', body: {} });
    expect(resent.status).toBe(200);
    const [newest, oldest] = await invitationTokens(email, 2);
    expect(newest).not.toBe(oldest);
    expect((await accept(oldest!)).status).toBe(404);

    const withdrawn = await asPerson(admin, `/api/admin/consultants/${made.id}/invitation`, { method: 'DELETE' });
    expect(withdrawn.status).toBe(204);
    const gone = await accept(newest!);
    expect(gone.status).toBe(410);
    expect(((await gone.json()) as { error: { message: string } }).error.message).toMatch(/withdrawn/);
    expect(await getDb().select().from(user).where(eq(user.email, email))).toEqual([]);
    expect((await asPerson(admin, `/api/admin/consultants/${made.id}`)).status).toBe(404);
  });

  it('someone invited but not yet joined is not alerted about their region’s leads', async () => {
    const email = `tui.${stamp}@takahe-lagging.example`;
    await invite(email, [regionB]);
    const lead = await submitLead('4230', { email: `owner.tui.${stamp}@quokka-dairy.example` });
    const colleague = await ensureConsultant({ email: `kiwi.${stamp}@echidna-thermal.example`, name: 'Kiri Echidna', firm: 'Echidna Thermal', regionIds: [regionB] });
    expect(colleague).toBeTruthy();
    const lead2 = await submitLead('4231', { email: `owner.tui2.${stamp}@quokka-dairy.example` });
    await waitForMessages(`kiwi.${stamp}@echidna-thermal.example`, (m) => m.some((x) => x.subject.includes(lead2.reference)));
    const mail = await messagesTo(email);
    expect(mail.some((m) => m.subject.includes(lead.reference) || m.subject.includes(lead2.reference))).toBe(false);
  });

  it('refuses bad input with 400 and the field path, never a 500', async () => {
    const cases: [unknown, string][] = [
      [{ email: 'not-an-address', name: 'A', firm: 'B' }, 'email'],
      [{ email: `x.${stamp}@firm.example`, name: '', firm: 'B' }, 'name'],
      [{ email: `x.${stamp}@firm.example`, name: 'A' }, 'firm'],
      [{ email: `x.${stamp}@firm.example`, name: 'A', firm: 'B', openClaimCap: 0 }, 'openClaimCap'],
      [{ email: `x.${stamp}@firm.example`, name: 'A', firm: 'B', phone: 'call me' }, 'phone'],
      [{ email: `x.${stamp}@firm.example`, name: 'A', firm: 'B', regionIds: ['nope'] }, 'regionIds.0'],
      [{ email: `x.${stamp}@firm.example`, name: 'A', firm: 'B', regionIds: [randomUUID()] }, 'regionIds.0'],
      [{ email: `x.${stamp}@firm.example`, name: 'A', firm: 'B', role: 'admin' }, '(body)'],
    ];
    for (const [body, path] of cases) {
      const response = await asPerson(admin, '/api/admin/consultants', { method: 'POST', body });
      expect(response.status, JSON.stringify(body)).toBe(400);
      const { error } = (await response.json()) as { error: { issues: { path: string; message: string }[] } };
      expect(error.issues.map((i) => i.path), JSON.stringify(body)).toContain(path);
    }
    // An address that already has an account: 409 on the e-mail field.
    const taken = await asPerson(admin, '/api/admin/consultants', { method: 'POST', body: { email: 'admin@lagwise.example', name: 'A', firm: 'B' } });
    expect(taken.status).toBe(409);
    expect(((await taken.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe('email');
    for (const [path, body] of [
      ['deactivate', { leads: 'elsewhere' }],
      ['deactivate', { leads: 'colleague' }],
    ] as const) {
      const response = await asPerson(admin, `/api/admin/consultants/${randomUUID()}/${path}`, { method: 'POST', body });
      expect(response.status).toBe(400);
    }
    const bad = await appFetch('/api/invitations/accept', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ token: 'x'.repeat(30), password: 'short' }) });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe('password');
  });

  it('a cap set by the admin holds at the next claim', async () => {
    const email = `moa.${stamp}@takahe-lagging.example`;
    const id = await ensureConsultant({ email, name: 'Mo Ahu', firm: 'Ahu Insulation', regionIds: [regionA], cap: 5 });
    const patched = await asPerson(admin, `/api/admin/consultants/${id}`, { method: 'PATCH', body: { openClaimCap: 1 } });
    expect(patched.status).toBe(200);
    expect(((await patched.json()) as ConsultantBody).consultant.openClaimCap).toBe(1);
    const cookie = await passwordCookie(email);
    const one = await submitLead('4110', { email: `owner.moa1.${stamp}@quokka-dairy.example` });
    const two = await submitLead('4111', { email: `owner.moa2.${stamp}@quokka-dairy.example` });
    expect((await asPerson(cookie, `/api/leads/${one.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const refused = await asPerson(cookie, `/api/leads/${two.id}/claim`, { method: 'POST', body: {} });
    expect(refused.status).toBe(409);
    expect(((await refused.json()) as { error: { code: string } }).error.code).toBe('CLAIM_LIMIT');
  });

  it('a deactivated consultant’s open session stops working on its next request; their leads reopen for the region', async () => {
    const leaving = `huia.${stamp}@takahe-lagging.example`;
    const staying = `kaka.${stamp}@takahe-lagging.example`;
    const leavingId = await ensureConsultant({ email: leaving, name: 'Hui Leaving', firm: 'Huia Thermal', regionIds: [regionA] });
    await ensureConsultant({ email: staying, name: 'Ka Staying', firm: 'Kaka Lagging', regionIds: [regionA] });
    const cookie = await passwordCookie(leaving);
    const lead = await submitLead('4120', { email: `owner.huia.${stamp}@quokka-dairy.example` });
    expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    expect((await asPerson(cookie, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'in_touch' } })).status).toBe(200);

    const response = await asPerson(admin, `/api/admin/consultants/${leavingId}/deactivate`, { method: 'POST', body: { leads: 'reopen', reason: 'left the firm' } });
    expect(response.status, await response.clone().text()).toBe(200);
    const body = (await response.json()) as { consultant: { status: string }; leads: { reopened: number; handedOver: number } };
    expect(body.consultant.status).toBe('deactivated');
    expect(body.leads).toEqual({ reopened: 1, unrouted: 0, handedOver: 0 });

    expect((await asPerson(cookie, '/api/leads?view=mine')).status).toBe(401);
    expect((await asPerson(cookie, '/desk')).status).toBe(303);
    expect(await getDb().select().from(session).where(eq(session.userId, leavingId))).toEqual([]);

    const [row] = await getDb().select().from(assessments).where(eq(assessments.id, lead.id));
    expect(row!.status).toBe('fresh');
    expect(row!.claimedByUserId).toBeNull();
    // The region's other consultant is told it is open again; the one who left is not.
    await waitForMessages(staying, (m) => m.some((x) => x.subject.startsWith('Open again') && x.subject.includes(lead.reference)));
    expect((await messagesTo(leaving)).some((m) => m.subject.startsWith('Open again'))).toBe(false);

    // A deactivated account cannot sign in, and the refusal is kept in the log.
    expect(await signInThroughForm(leaving)).toContain('error=deactivated');
    const refusals = await getDb().select().from(activityLog).where(eq(activityLog.subjectUserId, leavingId));
    expect(refusals.map((r) => r.action)).toEqual(expect.arrayContaining(['consultant.deactivated', 'lead.reopened', 'sign-in.refused']));

    // Reactivated, they sign in again.
    const back = await asPerson(admin, `/api/admin/consultants/${leavingId}/reactivate`, { method: 'POST', body: {} });
    expect(back.status).toBe(200);
    expect(await passwordCookie(leaving)).toContain('session_token=');
  });

  it('deactivating can hand the open leads to a named colleague of the region instead', async () => {
    const leaving = `pipi.${stamp}@takahe-lagging.example`;
    const colleague = `toroa.${stamp}@takahe-lagging.example`;
    const outsider = `kereru.${stamp}@takahe-lagging.example`;
    const leavingId = await ensureConsultant({ email: leaving, name: 'Pip Leaving', firm: 'Pipi Thermal', regionIds: [regionA] });
    const colleagueId = await ensureConsultant({ email: colleague, name: 'Tor Colleague', firm: 'Toroa Insulation', regionIds: [regionA] });
    const outsiderId = await ensureConsultant({ email: outsider, name: 'Kere Outsider', firm: 'Kereru Lagging', regionIds: [regionB] });
    const cookie = await passwordCookie(leaving);
    const lead = await submitLead('4130', { email: `owner.pipi.${stamp}@quokka-dairy.example` });
    expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);

    const wrong = await asPerson(admin, `/api/admin/consultants/${leavingId}/deactivate`, { method: 'POST', body: { leads: 'colleague', colleagueId: outsiderId } });
    expect(wrong.status).toBe(400);
    const wrongBody = (await wrong.json()) as { error: { message: string; issues: { path: string }[] } };
    expect(wrongBody.error.issues[0]!.path).toBe('colleagueId');
    expect(wrongBody.error.message).toContain(lead.reference);
    // Refused whole: still active, still holding the lead.
    expect((await asPerson(cookie, '/api/leads?view=mine')).status).toBe(200);

    const response = await asPerson(admin, `/api/admin/consultants/${leavingId}/deactivate`, { method: 'POST', body: { leads: 'colleague', colleagueId } });
    expect(response.status).toBe(200);
    expect(((await response.json()) as { leads: unknown }).leads).toEqual({ reopened: 0, unrouted: 0, handedOver: 1 });
    expect((await asPerson(cookie, '/api/leads?view=mine')).status).toBe(401);
    const [row] = await getDb().select().from(assessments).where(eq(assessments.id, lead.id));
    expect(row!.status).toBe('claimed');
    expect(row!.claimedByUserId).toBe(colleagueId);
    await waitForMessages(colleague, (m) => m.some((x) => x.subject.includes(lead.reference) && x.subject.startsWith('A lead for you')));
    await waitForMessages(lead.ownerEmail, (m) => m.some((x) => (x.html ?? '').includes('Toroa Insulation')));
  });

  it('a consultant or admin who forgot their password gets a single-use link by e-mail; owners get nothing', async () => {
    const email = `ruru.${stamp}@takahe-lagging.example`;
    await ensureConsultant({ email, name: 'Ru Ruru', firm: 'Ruru Thermal', regionIds: [] });
    const old = await passwordCookie(email);
    const asked = await appFetch('/api/password/forgot', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email }) });
    expect(asked.status).toBe(200);
    const token = await resetToken(email);
    const reset = await appFetch('/api/password/reset', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ token, password: 'a brand new password' }) });
    expect(reset.status).toBe(200);
    // Every earlier session ends; the new password works; the link works once.
    expect((await asPerson(old, '/api/leads')).status).toBe(401);
    expect(await passwordCookie(email, 'a brand new password')).toContain('session_token=');
    const again = await appFetch('/api/password/reset', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ token, password: 'yet another password' }) });
    expect(again.status).toBe(410);

    const owner = await submitLead('4140', { email: `owner.ruru.${stamp}@quokka-dairy.example` });
    const ownerAsk = await appFetch('/api/password/forgot', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: owner.ownerEmail }) });
    expect(ownerAsk.status).toBe(200);
    const [ownerAccount] = await getDb().select({ id: user.id }).from(user).where(eq(user.email, owner.ownerEmail));
    expect(await getDb().select().from(verification).where(eq(verification.value, ownerAccount!.id))).toEqual([]);
  });
});
