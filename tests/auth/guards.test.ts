/**
 * Each guard, named for the threat it stops. The matrix (./matrix.test.ts) pins statuses for
 * every route; these look at what comes back.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { leadRevisions, session, user } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { asPerson, ensureConsultant, ensureDeskRegion, ownerCookie, passwordCookie, submitLead, type SubmittedLead } from '../support/desk';
import { appFetch } from '../support/stack';

let inRegionA: string;
let inRegionB: string;
let outsider: string;
let admin: string;
let held: SubmittedLead;
let open: SubmittedLead;

function contactOf(lead: SubmittedLead): string[] {
  return [lead.ownerEmail, lead.company, lead.contactName, lead.phone];
}

describe('guards', () => {
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-guards-wirra', 'Wirra Creek (guards)', ['33']);
    const elsewhere = await ensureDeskRegion('test-guards-boab', 'Boab Downs (guards)', ['34']);
    await ensureConsultant({ email: 'guards-a@currawong-thermal.example', name: 'Ivo Currawong', firm: 'Currawong Thermal', regionIds: [region] });
    await ensureConsultant({ email: 'guards-b@pardalote-lagging.example', name: 'Uma Pardalote', firm: 'Pardalote Lagging', regionIds: [region] });
    await ensureConsultant({ email: 'guards-out@bilby-insulation.example', name: 'Ned Bilby', firm: 'Bilby Insulation', regionIds: [elsewhere] });
    const stamp = randomUUID().slice(0, 8);
    held = await submitLead('3301', { email: `held.${stamp}@wirra-dairy.example`, company: `Wirra Creek Dairy ${stamp}` });
    open = await submitLead('3302', { email: `open.${stamp}@wirra-smokehouse.example`, company: `Wirra Smokehouse ${stamp}` });
    inRegionA = await passwordCookie('guards-a@currawong-thermal.example');
    inRegionB = await passwordCookie('guards-b@pardalote-lagging.example');
    outsider = await passwordCookie('guards-out@bilby-insulation.example');
    admin = await passwordCookie('admin@lagwise.example', DEMO_PASSWORD);
    expect((await asPerson(inRegionA, `/api/leads/${held.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('a consultant cannot read another region’s lead: it answers exactly as an id that does not exist', async () => {
    const outOfRegion = await asPerson(outsider, `/api/leads/${held.id}`);
    const missing = await asPerson(outsider, `/api/leads/${randomUUID()}`);
    expect(outOfRegion.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(await outOfRegion.text()).toBe(await missing.text());
    const page = await asPerson(outsider, `/desk/leads/${held.id}`);
    expect(page.status).toBe(404);
    expect(await page.text()).not.toContain(held.reference);
  });

  it('a consultant cannot probe ids: a malformed id answers 404 like a missing one, never a 500', async () => {
    const missing = await (await asPerson(inRegionA, `/api/leads/${randomUUID()}`)).text();
    for (const bad of ['not-a-uuid', '1', "'%20or%201=1", '%00', 'x'.repeat(300)]) {
      const response = await asPerson(inRegionA, `/api/leads/${bad}`);
      expect(response.status, bad).toBe(404);
      expect(await response.text()).toBe(missing);
      expect((await asPerson(inRegionA, `/api/leads/${bad}/claim`, { method: 'POST', body: {} })).status, bad).toBe(404);
    }
  });

  it('a consultant cannot claim, move, note or release a lead of another region', async () => {
    for (const [path, body] of [
      ['claim', {}],
      ['moves', { to: 'in_touch' }],
      ['notes', { text: 'probing' }],
      ['release', { reason: 'no-capacity' }],
    ] as const) {
      const response = await asPerson(outsider, `/api/leads/${open.id}/${path}`, { method: 'POST', body });
      expect(response.status, path).toBe(404);
    }
  });

  it('the open list never carries the owner’s name, company, e-mail or phone, in JSON or HTML', async () => {
    const json = await (await asPerson(inRegionB, '/api/leads?view=open&pageSize=50')).text();
    expect(json).toContain(open.id);
    const html = await (await asPerson(inRegionB, '/desk?pageSize=50')).text();
    expect(html).toContain(open.reference);
    for (const secret of [...contactOf(open), ...contactOf(held)]) {
      expect(json).not.toContain(secret);
      expect(html).not.toContain(secret);
    }
  });

  it('a consultant of the region who does not hold a lead sees no contact data, photos or timeline', async () => {
    const response = await asPerson(inRegionB, `/api/leads/${held.id}`);
    expect(response.status).toBe(200);
    const text = await response.text();
    for (const secret of contactOf(held)) expect(text).not.toContain(secret);
    const { lead } = JSON.parse(text) as { lead: { contact: unknown; photos: unknown; timeline: unknown; claimedBy: { firm: string } } };
    expect(lead.contact).toBeNull();
    expect(lead.photos).toBeNull();
    expect(lead.timeline).toBeNull();
    expect(lead.claimedBy.firm).toBe('Currawong Thermal');
    const page = await (await asPerson(inRegionB, `/desk/leads/${held.id}`)).text();
    for (const secret of contactOf(held)) expect(page).not.toContain(secret);
  });

  it('only the consultant holding a lead, and admins, see its contact data', async () => {
    for (const cookie of [inRegionA, admin]) {
      const { lead } = (await (await asPerson(cookie, `/api/leads/${held.id}`)).json()) as { lead: { contact: { email: string; company: string } } };
      expect(lead.contact.email).toBe(held.ownerEmail);
      expect(lead.contact.company).toBe(held.company);
    }
  });

  it('a consultant cannot move, note or hand back a lead another consultant holds', async () => {
    for (const [path, body] of [
      ['moves', { to: 'in_touch' }],
      ['notes', { text: 'not mine' }],
      ['release', { reason: 'no-capacity' }],
    ] as const) {
      const response = await asPerson(inRegionB, `/api/leads/${held.id}/${path}`, { method: 'POST', body });
      expect(response.status, path).toBe(403);
      expect(((await response.json()) as { error: { message: string } }).error.message).toContain('Currawong Thermal');
    }
  });

  it('an owner cannot reach the desk, its API or the admin area', async () => {
    const owner = await ownerCookie(open.ownerEmail);
    expect((await asPerson(owner, '/api/leads')).status).toBe(403);
    expect((await asPerson(owner, `/api/leads/${open.id}`)).status).toBe(403);
    expect((await asPerson(owner, `/api/leads/${open.id}/claim`, { method: 'POST', body: {} })).status).toBe(403);
    const desk = await asPerson(owner, '/desk');
    expect(desk.status).toBe(403);
    expect(await desk.text()).toContain('Not for your account');
    expect((await asPerson(owner, '/admin')).status).toBe(403);
  });

  it('a consultant cannot enter the admin area', async () => {
    const page = await asPerson(inRegionA, '/admin');
    expect(page.status).toBe(403);
    expect(await page.text()).toContain('Not for your account');
  });

  it('a signed-out visitor is sent to sign in, keeping where they were going; the API answers 401 JSON', async () => {
    const page = await appFetch(`/desk/leads/${open.id}?claimed=1`);
    expect(page.status).toBe(303);
    expect(page.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(`/desk/leads/${open.id}?claimed=1`)}`);
    const api = await appFetch('/api/leads');
    expect(api.status).toBe(401);
    expect(await api.json()).toMatchObject({ error: { code: 'UNAUTHENTICATED' } });
  });

  describe('site-walk revisions', () => {
    const revision = async (lead: SubmittedLead, base = 0) => {
      const { original } = (await (await asPerson(admin, `/api/leads/${lead.id}/revisions`)).json()) as { original: { plant: { runs: { id: string; lengthM: number }[] } } };
      return { baseNumber: base, reason: `Measured on site ${randomUUID().slice(0, 6)}`, runs: original.plant.runs.map((run) => ({ ...run, lengthM: run.lengthM + 1 })) };
    };
    const stored = async (lead: SubmittedLead) => (await getDb().select({ n: leadRevisions.number }).from(leadRevisions).where(eq(leadRevisions.assessmentId, lead.id))).length;

    it('a consultant of another region cannot post a revision: the lead answers exactly as one that does not exist', async () => {
      const body = await revision(held);
      const before = await stored(held);
      const outOfRegion = await asPerson(outsider, `/api/leads/${held.id}/revisions`, { method: 'POST', body });
      const missing = await asPerson(outsider, `/api/leads/${randomUUID()}/revisions`, { method: 'POST', body });
      expect(outOfRegion.status).toBe(404);
      expect(await outOfRegion.text()).toBe(await missing.text());
      expect((await asPerson(outsider, `/api/leads/${held.id}/revisions`)).status).toBe(404);
      expect((await asPerson(outsider, `/desk/leads/${held.id}/site-walk`)).status).toBe(404);
      expect(await stored(held)).toBe(before);
    });

    it('the owner cannot revise, nor read the desk’s revisions', async () => {
      const owner = await ownerCookie(held.ownerEmail);
      const before = await stored(held);
      const posted = await asPerson(owner, `/api/leads/${held.id}/revisions`, { method: 'POST', body: await revision(held) });
      expect(posted.status).toBe(403);
      expect(await posted.json()).toMatchObject({ error: { code: 'FORBIDDEN' } });
      expect((await asPerson(owner, `/api/leads/${held.id}/revisions`)).status).toBe(403);
      expect((await asPerson(owner, `/desk/leads/${held.id}/site-walk`)).status).toBe(403);
      expect(await stored(held)).toBe(before);
    });

    it('a consultant who has not claimed the lead cannot revise it, whether another holds it or nobody does', async () => {
      const before = await stored(held);
      const other = await asPerson(inRegionB, `/api/leads/${held.id}/revisions`, { method: 'POST', body: await revision(held, before) });
      expect(other.status).toBe(403);
      expect(((await other.json()) as { error: { message: string } }).error.message).toBe('Currawong Thermal holds this lead; only they (or an admin) can work on it.');
      const unclaimed = await asPerson(inRegionB, `/api/leads/${open.id}/revisions`, { method: 'POST', body: await revision(open) });
      expect(unclaimed.status).toBe(403);
      expect(((await unclaimed.json()) as { error: { message: string } }).error.message).toBe('Claim this lead before working on it.');
      expect((await asPerson(inRegionB, `/desk/leads/${held.id}/site-walk`)).status).toBe(403);
      expect(await stored(held)).toBe(before);
      expect(await stored(open)).toBe(0);
    });

    it('the consultant of the region who does not hold the lead reads its revisions without their reasons or any contact data', async () => {
      const body = await revision(held, await stored(held));
      const saved = await asPerson(inRegionA, `/api/leads/${held.id}/revisions`, { method: 'POST', body });
      expect(saved.status, await saved.clone().text()).toBe(201);
      const seen = await asPerson(inRegionB, `/api/leads/${held.id}/revisions`);
      expect(seen.status).toBe(200);
      const text = await seen.text();
      expect(text).not.toContain(body.reason);
      for (const secret of contactOf(held)) expect(text).not.toContain(secret);
      const parsed = JSON.parse(text) as { revisions: { reason: string | null; author: { firm: string } }[]; allowed: { revise: boolean } };
      expect(parsed.revisions.at(-1)).toMatchObject({ reason: null, author: { firm: 'Currawong Thermal' } });
      expect(parsed.allowed.revise).toBe(false);
      const holderView = (await (await asPerson(inRegionA, `/api/leads/${held.id}/revisions`)).json()) as { revisions: { reason: string | null }[] };
      expect(holderView.revisions.at(-1)?.reason).toBe(body.reason);
    });

    it('an admin may revise a lead another consultant holds', async () => {
      const response = await asPerson(admin, `/api/leads/${held.id}/revisions`, { method: 'POST', body: await revision(held, await stored(held)) });
      expect(response.status, await response.clone().text()).toBe(201);
    });
  });

  it('a banned consultant’s open session stops working on its next request, and is ended', async () => {
    await ensureConsultant({ email: 'guards-banned@dunnart-thermal.example', name: 'Ari Dunnart', firm: 'Dunnart Thermal', regionIds: [] });
    const cookie = await passwordCookie('guards-banned@dunnart-thermal.example');
    expect((await asPerson(cookie, '/api/leads')).status).toBe(200);
    const [account] = await getDb().select({ id: user.id }).from(user).where(eq(user.email, 'guards-banned@dunnart-thermal.example'));
    await getDb().update(user).set({ banned: true }).where(eq(user.id, account!.id));
    expect((await asPerson(cookie, '/api/leads')).status).toBe(401);
    expect((await asPerson(cookie, '/desk')).status).toBe(303);
    expect(await getDb().select().from(session).where(eq(session.userId, account!.id))).toEqual([]);
  });

  it('after signing in, a consultant lands on the desk and an admin on the admin area', async () => {
    for (const [email, password, home] of [
      ['guards-a@currawong-thermal.example', 'lagwise-test-password-2026', '/desk'],
      ['admin@lagwise.example', DEMO_PASSWORD, '/admin'],
    ] as const) {
      const response = await appFetch('/api/sign-in/password', { method: 'POST', body: new URLSearchParams({ email, password }) });
      expect(response.headers.get('location')).toBe(home);
    }
  });
});
