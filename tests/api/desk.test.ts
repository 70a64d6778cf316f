/**
 * The desk over HTTP: claiming (first wins, the owner is told who will call, a cap on open
 * claims), the pipeline's moves, notes, handing a lead back, the lists' filters and order, and
 * what bad input gets.
 */
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import type { LeadDetail, LeadListResponse, MyLead, OpenLead } from '../../src/schemas/leads';
import { asPerson, ensureConsultant, ensureDeskRegion, passwordCookie, submitLead } from '../support/desk';
import { messagesTo, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';

let first: string;
let second: string;
let capped: string;
const firstEmail = 'desk-first@lyrebird-thermal.example';
const secondEmail = 'desk-second@wombat-lagging.example';

async function detail(cookie: string, id: string): Promise<LeadDetail> {
  const response = await asPerson(cookie, `/api/leads/${id}`);
  expect(response.status).toBe(200);
  return ((await response.json()) as { lead: LeadDetail }).lead;
}

async function list(cookie: string, query: string): Promise<LeadListResponse> {
  const response = await asPerson(cookie, `/api/leads?${query}`);
  expect(response.status, await response.clone().text()).toBe(200);
  return (await response.json()) as LeadListResponse;
}

describe('the desk API', () => {
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-desk-lyrebird', 'Lyrebird Gully (desk)', ['31']);
    const capRegion = await ensureDeskRegion('test-desk-numbat', 'Numbat Hills (desk)', ['32']);
    await ensureConsultant({ email: firstEmail, name: 'Tess Lyrebird', firm: 'Lyrebird Thermal', phone: '+61 3 5550 4411', regionIds: [region] });
    await ensureConsultant({ email: secondEmail, name: 'Omar Wombat', firm: 'Wombat Lagging', phone: '+61 3 5550 4422', regionIds: [region] });
    await ensureConsultant({ email: 'desk-capped@numbat-insulation.example', name: 'Kit Numbat', firm: 'Numbat Insulation', regionIds: [capRegion], cap: 2 });
    first = await passwordCookie(firstEmail);
    second = await passwordCookie(secondEmail);
    capped = await passwordCookie('desk-capped@numbat-insulation.example');
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('a claim gives the lead to the first consultant, tells the owner who will call, and answers the second with who was first', async () => {
    const lead = await submitLead('3101');
    const won = await asPerson(first, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    expect(won.status).toBe(200);
    expect(await won.json()).toMatchObject({ lead: { id: lead.id, status: 'claimed', claimedAt: expect.any(String) } });

    const lost = await asPerson(second, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    expect(lost.status).toBe(409);
    const body = (await lost.json()) as { error: { code: string; message: string; details: { firm: string; claimedAt: string } } };
    expect(body.error.code).toBe('ALREADY_CLAIMED');
    expect(body.error.details.firm).toBe('Lyrebird Thermal');
    expect(body.error.message).toContain('Lyrebird Thermal claimed this lead first');

    const mail = await waitForMessages(lead.ownerEmail, (m) => m.some((x) => x.subject.includes('will contact you')));
    const introduction = mail.find((m) => m.subject.includes('will contact you'))!;
    expect(introduction.subject).toBe(`Tess Lyrebird of Lyrebird Thermal will contact you about ${lead.reference}`);
    for (const fact of ['Tess Lyrebird', 'Lyrebird Thermal', '+61 3 5550 4411', firstEmail]) expect(introduction.text).toContain(fact);

    const held = await detail(first, lead.id);
    expect(held.contact?.email).toBe(lead.ownerEmail);
    expect(held.allowed).toEqual({ claim: false, moves: ['in_touch', 'closed'], release: true, note: true });
    expect(held.timeline?.map((e) => e.action)).toEqual(['assessment.submitted', 'lead.claimed']);
  });

  it('moves follow the pipeline table; a move it does not allow is 409 with the reason', async () => {
    const lead = await submitLead('3102');
    await asPerson(first, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    const skip = await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'signed' } });
    expect(skip.status).toBe(409);
    expect(await skip.json()).toMatchObject({ error: { code: 'INVALID_TRANSITION', message: expect.stringContaining('send the report first') } });
    const walk = await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'site_walk_booked' } });
    expect(walk.status).toBe(409);
    expect(((await walk.json()) as { error: { message: string } }).error.message).toBe('From “Taken on” a lead moves to “Talking” or “Closed”, not to “Walk booked”.');

    for (const to of ['in_touch', 'site_walk_booked'] as const) {
      const moved = await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to, note: `now ${to}` } });
      expect(moved.status).toBe(200);
      expect(await moved.json()).toEqual({ lead: { id: lead.id, status: to } });
    }
    const again = await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'site_walk_booked' } });
    expect(again.status).toBe(409);
    const closed = await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'closed', reason: 'postponed', note: 'After the summer shutdown.' } });
    expect(closed.status).toBe(200);
    const after = await detail(first, lead.id);
    expect(after.status).toBe('closed');
    expect(after.allowed).toEqual({ claim: false, moves: [], release: false, note: true });
    const moves = after.timeline!.filter((e) => e.action === 'lead.moved').map((e) => e.detail);
    expect(moves).toEqual([
      { from: 'claimed', to: 'in_touch', note: 'now in_touch' },
      { from: 'in_touch', to: 'site_walk_booked', note: 'now site_walk_booked' },
      { from: 'site_walk_booked', to: 'closed', reason: 'postponed', note: 'After the summer shutdown.' },
    ]);
    const fresh = await submitLead('3102');
    const unclaimed = await asPerson(first, `/api/leads/${fresh.id}/moves`, { method: 'POST', body: { to: 'in_touch' } });
    expect(unclaimed.status).toBe(409);
    expect(await unclaimed.json()).toMatchObject({ error: { message: 'Claim the lead before moving it along.' } });
  });

  it('notes join the timeline with who wrote them', async () => {
    const lead = await submitLead('3103');
    await asPerson(first, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    const noted = await asPerson(first, `/api/leads/${lead.id}/notes`, { method: 'POST', body: { text: '  Called Petra; boiler room access Tuesdays.  ' } });
    expect(noted.status).toBe(201);
    expect(await noted.json()).toMatchObject({ entry: { action: 'lead.noted', actor: { name: 'Tess Lyrebird', firm: 'Lyrebird Thermal' }, detail: { text: 'Called Petra; boiler room access Tuesdays.' } } });
    const timeline = (await detail(first, lead.id)).timeline!;
    expect(timeline.at(-1)).toMatchObject({ action: 'lead.noted', detail: { text: 'Called Petra; boiler room access Tuesdays.' } });
  });

  it('handing a lead back opens it again and alerts the region’s other consultants, not the one who handed it back', async () => {
    const lead = await submitLead('3104');
    await asPerson(first, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    await asPerson(first, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'in_touch' } });
    const released = await asPerson(first, `/api/leads/${lead.id}/release`, { method: 'POST', body: { reason: 'too-far', note: 'Three hours each way.' } });
    expect(released.status).toBe(200);
    expect(await released.json()).toEqual({ lead: { id: lead.id, status: 'fresh' } });
    const seen = await detail(second, lead.id);
    expect(seen).toMatchObject({ status: 'fresh', contact: null, claimedBy: null, allowed: { claim: true } });
    const again = await waitForMessages(secondEmail, (m) => m.some((x) => x.subject.startsWith('Open again') && x.subject.includes(lead.reference)));
    expect(again.find((x) => x.subject.includes(lead.reference))?.text).toContain('handed it back');
    expect((await messagesTo(firstEmail)).filter((m) => m.subject.startsWith('Open again') && m.subject.includes(lead.reference))).toEqual([]);
    // And the second consultant may take it on.
    expect((await asPerson(second, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
  });

  it('a consultant at their cap of open claims gets 409 with the reason, and simultaneous claims never pass it', async () => {
    const leads = await Promise.all(Array.from({ length: 6 }, (_, i) => submitLead(`320${i}`)));
    const answers = await Promise.all(leads.map((lead) => asPerson(capped, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([200, 200, 409, 409, 409, 409]);
    for (const answer of answers.filter((a) => a.status === 409)) {
      expect(await answer.json()).toMatchObject({ error: { code: 'CLAIM_LIMIT', details: { openClaims: 2, cap: 2 }, message: expect.stringContaining('your limit is 2') } });
    }
    const mine = await list(capped, 'view=mine&stage=claimed');
    expect(mine.total).toBe(2);
  });

  it('the open list is paged, sorted and filtered on the server', async () => {
    const tag = randomUUID().slice(0, 4);
    await Promise.all(Array.from({ length: 3 }, () => submitLead('3105', { company: `Gully Creamery ${tag}` })));
    const page1 = await list(second, 'view=open&pageSize=10&sort=loss&dir=asc');
    expect(page1.pageSize).toBe(10);
    expect(page1.total).toBeGreaterThanOrEqual(3);
    const losses = (page1.items as OpenLead[]).map((l) => l.annualLoss.likely);
    expect(losses).toEqual([...losses].sort((a, b) => a - b));
    const withPhotos = await list(second, 'view=open&photos=yes');
    expect(withPhotos.items.every((l) => l.photoCount > 0)).toBe(true);
    const glycol = await list(second, 'view=open&service=glycol');
    expect(glycol.total).toBe(0);
    const both = await list(second, 'view=open&service=steam&service=hot-water&runsMin=2&runsMax=2&maxAgeDays=1&plantType=creamery');
    expect(both.total).toBe(page1.total);
    const cheap = await list(second, 'view=open&lossMax=0.01');
    expect(cheap.total).toBe(0);
    const otherRegion = await list(second, `view=open&region=${randomUUID()}`);
    expect(otherRegion.total).toBe(0);
    const mine = await list(first, 'view=mine');
    expect((mine.items as MyLead[]).every((l) => typeof l.company === 'string' && l.status !== 'fresh')).toBe(true);
  });

  it('bad input answers 400 with the field path and a sentence', async () => {
    const lead = await submitLead('3106');
    await asPerson(first, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
    const cases: [string, string, unknown, string][] = [
      ['GET', '/api/leads?view=everything', undefined, 'view'],
      ['GET', '/api/leads?pageSize=7', undefined, 'pageSize'],
      ['GET', '/api/leads?lossMin=lots', undefined, 'lossMin'],
      ['GET', '/api/leads?lossMin=500&lossMax=100', undefined, 'lossMax'],
      ['GET', '/api/leads?service=lava', undefined, 'service.0'],
      ['GET', '/api/leads?sort=color', undefined, 'sort'],
      ['POST', `/api/leads/${lead.id}/moves`, { to: 'report_sent' }, 'to'],
      ['POST', `/api/leads/${lead.id}/moves`, { to: 'closed' }, 'reason'],
      ['POST', `/api/leads/${lead.id}/moves`, { to: 'closed', reason: 'other' }, 'note'],
      ['POST', `/api/leads/${lead.id}/moves`, { to: 'in_touch', color: 'red' }, '(body)'],
      ['POST', `/api/leads/${lead.id}/notes`, { text: '   ' }, 'text'],
      ['POST', `/api/leads/${lead.id}/notes`, { text: 'x'.repeat(4001) }, 'text'],
      ['POST', `/api/leads/${lead.id}/release`, { reason: 'bored' }, 'reason'],
    ];
    for (const [method, path, body, field] of cases) {
      const response = await asPerson(first, path, { method, body });
      expect(response.status, `${method} ${path} ${JSON.stringify(body)}`).toBe(400);
      const answer = (await response.json()) as { error: { issues: { path: string; message: string }[] } };
      expect(answer.error.issues.map((i) => i.path), path).toContain(field);
      for (const issue of answer.error.issues) expect(issue.message.length).toBeGreaterThan(10);
    }
  });

  it('answers every body and query below 500', async () => {
    const lead = await submitLead('3107');
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom('claim', 'moves', 'notes', 'release'),
        fc.oneof(fc.json({ maxDepth: 3 }), fc.string({ maxLength: 200 })),
        async (action, body) => {
          const response = await appFetch(`/api/leads/${lead.id}/${action}`, {
            method: 'POST',
            headers: { cookie: second, 'content-type': 'application/json' },
            body,
          });
          await response.arrayBuffer();
          return response.status < 500;
        },
      ),
      { numRuns: 40, seed: 7 },
    );
    await fc.assert(
      fc.asyncProperty(fc.dictionary(fc.constantFrom('view', 'page', 'pageSize', 'sort', 'dir', 'lossMin', 'service', 'photos', 'region', 'stage'), fc.string({ maxLength: 40 })), async (params) => {
        const response = await asPerson(second, `/api/leads?${new URLSearchParams(params)}`);
        await response.arrayBuffer();
        return response.status === 200 || response.status === 400;
      }),
      { numRuns: 60, seed: 11 },
    );
  });
});


describe('the desk in /api/openapi.json', () => {
  it('documents every lead endpoint with the schemas the server parses and answers with', async () => {
    const doc = (await (await appFetch('/api/openapi.json')).json()) as {
      paths: Record<string, Record<string, { parameters?: { name: string }[] }>>;
      components: { schemas: Record<string, { properties?: Record<string, { enum?: string[] }> }> };
    };
    expect(Object.keys(doc.paths)).toEqual(
      expect.arrayContaining(['/api/leads', '/api/leads/{id}', '/api/leads/{id}/claim', '/api/leads/{id}/moves', '/api/leads/{id}/release', '/api/leads/{id}/notes']),
    );
    expect(doc.paths['/api/leads']!.get!.parameters!.map((p) => p.name)).toEqual(
      expect.arrayContaining(['view', 'page', 'sort', 'region', 'plantType', 'service', 'lossMin', 'spreadMax', 'runsMin', 'photos', 'maxAgeDays']),
    );
    expect(doc.components.schemas.MoveRequest!.properties!.to!.enum).toEqual(['in_touch', 'site_walk_booked', 'signed', 'closed']);
    expect(Object.keys(doc.components.schemas.LeadList!.properties!)).toEqual(['view', 'items', 'page', 'pageSize', 'total', 'pageCount']);
  });
});
