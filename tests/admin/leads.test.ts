/**
 * Leads that need a person, through the admin API: the attention list, the admin's mails
 * (unrouted at once, stale at most once a day), handing over by hand, junk, the funnel and the
 * activity log's filters. Regions of the tests' own: Australian prefixes 45, 46 and 47; 49 is
 * covered by no region.
 */
import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { assessments } from '../../src/db/schema';
import { mailStaleDigest } from '../../src/lib/admin/oversight';
import { stopSender } from '../../src/lib/jobs/queue';
import { asPerson, ensureConsultant, ensureDeskRegion, passwordCookie, submitLead, type SubmittedLead } from '../support/desk';
import { waitForMessages } from '../support/fixtures';
import { adminCookie } from './support';

let admin: string;
let region45: string;
let region46: string;
const stamp = randomUUID().slice(0, 8);
const owner = (tag: string) => `owner.${tag}.${stamp}@banksia-bakery.example`;

interface Attention {
  staleAfterHours: number;
  leads: { id: string; reason: string; holder: { id: string } | null }[];
  overCap: { id: string; openClaims: number; cap: number }[];
}

async function attention(): Promise<Attention> {
  const response = await asPerson(admin, '/api/admin/attention');
  expect(response.status).toBe(200);
  return (await response.json()) as Attention;
}

async function leadRow(id: string) {
  const [row] = await getDb().select().from(assessments).where(eq(assessments.id, id));
  return row!;
}

describe('leads that need a person', () => {
  beforeAll(async () => {
    region45 = await ensureDeskRegion('test-admin-banksia', 'Banksia Rise (admin)', ['45']);
    region46 = await ensureDeskRegion('test-admin-wombat', 'Wombat Gully (admin)', ['46']);
    admin = await adminCookie();
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('an assessment that matches no region is on the attention list, and every admin is e-mailed about it', async () => {
    const lost = await submitLead('4901', { email: owner('lost') });
    expect((await leadRow(lost.id)).status).toBe('unrouted');
    const listed = (await attention()).leads.find((l) => l.id === lost.id);
    expect(listed?.reason).toBe('unrouted');
    await waitForMessages('admin@lagwise.example', (m) => m.some((x) => x.subject.includes(lost.reference) && x.subject.startsWith('No region covers')));
  });

  it('the admin hands a lead over by hand with a reason, past the cap if need be, and the consultant is flagged over it', async () => {
    const email = `grevillea.${stamp}@banksia-thermal.example`;
    const consultantId = await ensureConsultant({ email, name: 'Gil Grevillea', firm: `Grevillea Thermal ${stamp}`, regionIds: [region45], cap: 1 });
    const cookie = await passwordCookie(email);
    const first = await submitLead('4510', { email: owner('first') });
    expect((await asPerson(cookie, `/api/leads/${first.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const lost = await submitLead('4902', { email: owner('handed') });

    const bad = await asPerson(admin, `/api/admin/leads/${lost.id}/assign`, { method: 'POST', body: { consultantId, reason: '' } });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe('reason');
    const nobody = await asPerson(admin, `/api/admin/leads/${lost.id}/assign`, { method: 'POST', body: { consultantId: randomUUID(), reason: 'x' } });
    expect(nobody.status).toBe(400);
    expect((await asPerson(admin, `/api/admin/leads/${randomUUID()}/assign`, { method: 'POST', body: { consultantId, reason: 'x' } })).status).toBe(404);

    const response = await asPerson(admin, `/api/admin/leads/${lost.id}/assign`, { method: 'POST', body: { consultantId, reason: 'Nearest firm to the plant' } });
    expect(response.status, await response.clone().text()).toBe(200);
    const body = (await response.json()) as { lead: { status: string; holder: { id: string } }; overCap: boolean };
    expect(body.lead.status).toBe('claimed');
    expect(body.lead.holder.id).toBe(consultantId);
    expect(body.overCap).toBe(true);
    expect((await attention()).overCap).toContainEqual(expect.objectContaining({ id: consultantId, openClaims: 2, cap: 1 }));

    // The consultant sees it among their leads (contact included); both are told by mail.
    const mine = (await (await asPerson(cookie, `/api/leads/${lost.id}`)).json()) as { lead: { contact: { email: string } } };
    expect(mine.lead.contact.email).toBe(lost.ownerEmail);
    await waitForMessages(email, (m) => m.some((x) => x.subject.startsWith('A lead for you') && x.subject.includes(lost.reference)));
    await waitForMessages(lost.ownerEmail, (m) => m.some((x) => (x.html ?? '').includes(`Grevillea Thermal ${stamp}`)));

    const log = (await (await asPerson(admin, `/api/admin/activity?lead=${lost.reference}`)).json()) as { entries: { action: string; note: string | null }[] };
    expect(log.entries).toContainEqual(expect.objectContaining({ action: 'lead.assigned', note: 'Nearest firm to the plant' }));
  });

  it('a lead set aside as junk leaves every consultant’s view, the holder’s too, and can be taken back', async () => {
    const holderEmail = `hakea.${stamp}@banksia-thermal.example`;
    const otherEmail = `boronia.${stamp}@banksia-thermal.example`;
    await ensureConsultant({ email: holderEmail, name: 'Hak Hakea', firm: 'Hakea Lagging', regionIds: [region46] });
    await ensureConsultant({ email: otherEmail, name: 'Bo Boronia', firm: 'Boronia Insulation', regionIds: [region46] });
    const holder = await passwordCookie(holderEmail);
    const other = await passwordCookie(otherEmail);
    const held = await submitLead('4610', { email: owner('held-junk') });
    const open = await submitLead('4611', { email: owner('open-junk') });
    expect((await asPerson(holder, `/api/leads/${held.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    expect((await asPerson(holder, `/api/leads/${held.id}/moves`, { method: 'POST', body: { to: 'in_touch' } })).status).toBe(200);

    for (const lead of [held, open]) {
      const response = await asPerson(admin, `/api/admin/leads/${lead.id}/junk`, { method: 'POST', body: { reason: 'A test entry from a student' } });
      expect(response.status).toBe(200);
    }
    for (const cookie of [holder, other]) {
      expect((await asPerson(cookie, `/api/leads/${held.id}`)).status).toBe(404);
      expect((await asPerson(cookie, `/api/leads/${open.id}`)).status).toBe(404);
      const lists = [await (await asPerson(cookie, '/api/leads?view=open&pageSize=50')).text(), await (await asPerson(cookie, '/api/leads?view=mine&pageSize=50')).text()];
      for (const list of lists) {
        expect(list).not.toContain(held.id);
        expect(list).not.toContain(open.id);
      }
    }
    expect((await asPerson(admin, `/api/admin/leads/${held.id}/junk`, { method: 'POST', body: { reason: 'again' } })).status).toBe(409);

    const restored = await asPerson(admin, `/api/admin/leads/${held.id}/restore`, { method: 'POST', body: { reason: 'It was real after all' } });
    expect(restored.status).toBe(200);
    expect(((await restored.json()) as { lead: { status: string } }).lead.status).toBe('in_touch');
    expect((await asPerson(holder, `/api/leads/${held.id}`)).status).toBe(200);
    const reopened = await asPerson(admin, `/api/admin/leads/${open.id}/restore`, { method: 'POST', body: { reason: 'Real' } });
    expect(((await reopened.json()) as { lead: { status: string } }).lead.status).toBe('fresh');
  });

  it('an open lead nobody takes on is listed after the setting’s hours and mailed to the admin at most once a day', async () => {
    const waiting = await submitLead('4620', { email: owner('stale') });
    expect((await attention()).leads.map((l) => l.id)).not.toContain(waiting.id);
    await getDb().update(assessments).set({ updatedAt: sql`now() - interval '72 hours'` }).where(eq(assessments.id, waiting.id));
    expect((await attention()).leads).toContainEqual(expect.objectContaining({ id: waiting.id, reason: 'stale' }));

    const longer = await asPerson(admin, '/api/admin/settings', { method: 'PATCH', body: { staleAfterHours: 100 } });
    expect(longer.status).toBe(200);
    expect((await attention()).leads.map((l) => l.id)).not.toContain(waiting.id);
    const bad = await asPerson(admin, '/api/admin/settings', { method: 'PATCH', body: { staleAfterHours: 0 } });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe('staleAfterHours');
    expect((await asPerson(admin, '/api/admin/settings', { method: 'PATCH', body: { staleAfterHours: 48 } })).status).toBe(200);

    // The daily mail: its day is counted in the database, so a second run that day sends nothing.
    const day = new Date('2031-05-04T09:00:00Z');
    expect(await mailStaleDigest(day)).toBe(true);
    expect(await mailStaleDigest(new Date('2031-05-04T22:00:00Z'))).toBe(false);
    expect(await mailStaleDigest(new Date('2031-05-05T09:00:00Z'))).toBe(true);
    await waitForMessages('admin@lagwise.example', (m) => m.some((x) => / nobody has taken on$/.test(x.subject) && (x.html ?? '').includes(waiting.reference)));
  });

  it('the funnel counts each lead at the furthest step it reached, by region and month', async () => {
    const region = await ensureDeskRegion('test-admin-funnel', 'Funnel Flats (admin)', ['47']);
    const prefix = '470';
    const email = `correa.${stamp}@banksia-thermal.example`;
    await ensureConsultant({ email, name: 'Cor Correa', firm: 'Correa Thermal', regionIds: [region], cap: 10 });
    const cookie = await passwordCookie(email);
    const leads: SubmittedLead[] = [];
    for (let i = 0; i < 3; i += 1) leads.push(await submitLead(`${prefix}${i}`, { email: owner(`funnel${i}`) }));
    for (const lead of leads.slice(0, 2)) expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const walked = leads[0]!;
    for (const to of ['in_touch', 'site_walk_booked'] as const) {
      expect((await asPerson(cookie, `/api/leads/${walked.id}/moves`, { method: 'POST', body: { to } })).status).toBe(200);
    }
    expect((await asPerson(cookie, `/api/leads/${walked.id}/moves`, { method: 'POST', body: { to: 'closed', reason: 'postponed' } })).status).toBe(200);

    const response = await asPerson(admin, `/api/admin/funnel?region=${region}&months=1`);
    expect(response.status).toBe(200);
    const funnel = (await response.json()) as { totals: Record<string, number>; rows: { region: { id: string } | null }[] };
    expect(funnel.totals).toEqual({ submitted: 3, claimed: 2, in_touch: 1, site_walk: 1, report_sent: 0, signed: 0 });
    expect(funnel.rows.every((r) => r.region?.id === region)).toBe(true);
    const bad = await asPerson(admin, '/api/admin/funnel?months=99');
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path).toBe('months');
  });

  it('the activity log filters by lead, person, action and day, and pages on the server', async () => {
    const email = `waratah.${stamp}@banksia-thermal.example`;
    const personId = await ensureConsultant({ email, name: 'War Waratah', firm: 'Waratah Thermal', regionIds: [region45], cap: 10 });
    const cookie = await passwordCookie(email);
    const leads: SubmittedLead[] = [];
    for (let i = 0; i < 3; i += 1) leads.push(await submitLead(`452${i}`, { email: owner(`log${i}`) }));
    for (const lead of leads) {
      expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
      expect((await asPerson(cookie, `/api/leads/${lead.id}/notes`, { method: 'POST', body: { text: `Called ${lead.reference}` } })).status).toBe(201);
    }
    type Page = { entries: { action: string; actor: { id: string } | null; subject: { id: string } | null; lead: { id: string; reference: string } | null }[]; total: number; page: number; pageCount: number };
    const get = async (query: string) => {
      const response = await asPerson(admin, `/api/admin/activity?${query}`);
      expect(response.status, query).toBe(200);
      return (await response.json()) as Page;
    };

    const byPerson = await get(`person=${personId}&pageSize=25`);
    expect(byPerson.total).toBe(6);
    expect(byPerson.entries.every((e) => e.actor?.id === personId || e.subject?.id === personId)).toBe(true);

    const claims = await get(`person=${personId}&action=lead.claimed`);
    expect(claims.entries.map((e) => e.lead?.reference).sort()).toEqual(leads.map((l) => l.reference).sort());
    const family = await get(`person=${personId}&action=lead`);
    expect(family.total).toBe(6);

    const one = await get(`lead=${leads[1]!.reference}`);
    expect(one.entries.every((e) => e.lead?.id === leads[1]!.id)).toBe(true);
    expect(one.entries.map((e) => e.action)).toEqual(['lead.noted', 'lead.claimed', 'assessment.submitted']);
    expect((await get(`lead=${leads[1]!.id}`)).total).toBe(one.total);

    const today = new Date().toISOString().slice(0, 10);
    expect((await get(`person=${personId}&from=${today}&to=${today}`)).total).toBe(6);
    expect((await get(`person=${personId}&from=2020-01-01&to=2020-01-31`)).total).toBe(0);

    const pageOne = await get(`person=${personId}&pageSize=25&page=1`);
    expect(pageOne.pageCount).toBe(1);
    // Other tests write to the log meanwhile, so the whole log is checked for its shape only.
    const everything = await get('pageSize=25');
    expect(everything.entries).toHaveLength(25);
    expect(everything.pageCount).toBe(Math.ceil(everything.total / 25));
    const second = await get('pageSize=25&page=2');
    expect(second.page).toBe(2);
    expect(second.entries.length).toBeGreaterThan(0);
    const times = [...everything.entries, ...second.entries].map((e) => (e as unknown as { at: string }).at);
    expect([...times].sort().reverse()).toEqual(times);

    for (const [query, path] of [
      ['pageSize=7', 'pageSize'],
      ['page=0', 'page'],
      ['person=someone', 'person'],
      ['action=DROP TABLE', 'action'],
      ['from=yesterday', 'from'],
      ['from=2026-03-02&to=2026-03-01', 'to'],
      ['lead=%27%20or%201%3D1', 'lead'],
    ] as const) {
      const response = await asPerson(admin, `/api/admin/activity?${query}`);
      expect(response.status, query).toBe(400);
      expect(((await response.json()) as { error: { issues: { path: string }[] } }).error.issues[0]!.path, query).toBe(path);
    }
  });
});
