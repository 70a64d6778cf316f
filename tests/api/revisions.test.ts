/**
 * Site-walk revisions over HTTP: a round trip that leaves the owner's original as it was and
 * moves the lead's headline figures; saves made from a stale base refused with who saved first;
 * a save sent again after a dropped connection answered with the revision it already made; and
 * what bad input gets. The guards are in tests/auth (matrix rows and named threat tests).
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { assessments, leadRevisions, pipeRuns } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import type { PlantRunInput } from '../../src/engine';
import type { LeadDetail } from '../../src/schemas/leads';
import type { RevisionListResponse, RevisionRequestInput, RevisionSavedResponse } from '../../src/schemas/revisions';
import { asPerson, ensureConsultant, ensureDeskRegion, passwordCookie, submitLead, type SubmittedLead } from '../support/desk';
import { appFetch } from '../support/stack';

let holder: string;
const holderEmail = 'walk-holder@ironbark-lagging.example';

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[]; details?: Record<string, unknown> };
}

async function history(cookie: string, id: string): Promise<RevisionListResponse> {
  const response = await asPerson(cookie, `/api/leads/${id}/revisions`);
  expect(response.status, await response.clone().text()).toBe(200);
  return (await response.json()) as RevisionListResponse;
}

function post(cookie: string, id: string, body: unknown): Promise<Response> {
  return asPerson(cookie, `/api/leads/${id}/revisions`, { method: 'POST', body });
}

/** A lead of the tests' region, claimed by the holder. */
async function heldLead(): Promise<SubmittedLead> {
  const lead = await submitLead('2801', { email: `walk.${randomUUID().slice(0, 8)}@ironbark-creamery.example` });
  const claimed = await asPerson(holder, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} });
  expect(claimed.status).toBe(200);
  return lead;
}

/** The runs as the owner sent them, ready to correct. */
async function ownerRuns(id: string): Promise<PlantRunInput[]> {
  return (await history(holder, id)).original.plant.runs as PlantRunInput[];
}

function walked(runs: PlantRunInput[], changes: Record<string, Partial<PlantRunInput>>): PlantRunInput[] {
  return runs.map((run) => ({ ...run, ...(changes[run.id] ?? {}) }));
}

describe('site-walk revisions over HTTP', () => {
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-walk-ironbark', 'Ironbark Ridge (revisions)', ['28']);
    await ensureConsultant({ email: holderEmail, name: 'Rhea Ironbark', firm: 'Ironbark Lagging', regionIds: [region], cap: 50 });
    holder = await passwordCookie(holderEmail);
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('round trip: a revision is stored whole, the owner’s original stays as it was, the headline figures follow the revision', async () => {
    const lead = await heldLead();
    const db = getDb();
    const [before] = await db.select().from(assessments).where(eq(assessments.id, lead.id));
    const runsBefore = await db.select().from(pipeRuns).where(eq(pipeRuns.assessmentId, lead.id));

    const fresh = await history(holder, lead.id);
    expect(fresh.lead.latestNumber).toBe(0);
    expect(fresh.revisions).toEqual([]);
    expect(fresh.diff).toBeNull();
    expect(fresh.allowed).toEqual({ revise: true });
    expect(fresh.original).toMatchObject({ number: 0, baseNumber: null, author: null, reason: null });

    const runs = walked(fresh.original.plant.runs as PlantRunInput[], {
      'steam-1': { measurements: { lengthM: 27.4, surfaceTemperatureC: 151, airTemperatureC: 23, surfaceMethod: 'contact' } },
    });
    const body: RevisionRequestInput = { baseNumber: 0, reason: 'Walked the boiler house: header paced out, probe on the bare header', runs, areas: [] };
    const response = await post(holder, lead.id, body);
    expect(response.status, await response.clone().text()).toBe(201);
    const saved = (await response.json()) as RevisionSavedResponse;
    expect(saved.replayed).toBe(false);
    expect(saved.revision).toMatchObject({
      number: 1,
      baseNumber: 0,
      author: { name: 'Rhea Ironbark', firm: 'Ironbark Lagging' },
      reason: 'Walked the boiler house: header paced out, probe on the bare header',
    });
    const header = saved.diff.runs.find((r) => r.runId === 'steam-1')!;
    expect(header.status).toBe('changed');
    expect(header.inputs.map((i) => i.field)).toEqual(['length', 'surfaceReading']);
    expect(header.inputs[0]).toEqual({ field: 'length', before: { lengthM: 20, measured: false }, after: { lengthM: 27.4, measured: true } });
    expect(saved.diff.runs.find((r) => r.runId === 'hw-1')?.status).toBe('unchanged');
    const result = saved.revision.result as { range: { currentAnnualCost: { likely: number; low: number; high: number } }; runs: { id: string; measurements: unknown }[] };
    expect(result.runs.find((r) => r.id === 'steam-1')?.measurements).toMatchObject({ surfaceTemperatureC: 151 });

    // The owner's original: the same row figures, snapshot and runs as before.
    const [after] = await db.select().from(assessments).where(eq(assessments.id, lead.id));
    expect(after!.resultSnapshot).toEqual(before!.resultSnapshot);
    expect(after!.questionnaire).toEqual(before!.questionnaire);
    expect(after!.engineVersion).toBe(before!.engineVersion);
    expect(await db.select().from(pipeRuns).where(eq(pipeRuns.assessmentId, lead.id))).toEqual(runsBefore);
    const again = await history(holder, lead.id);
    expect(again.original.result).toEqual(fresh.original.result);
    expect(again.original.plant).toEqual(fresh.original.plant);

    // The headline columns the desk lists read: the revision's figures.
    expect(after!.revisionNumber).toBe(1);
    expect(after!.annualLossCost).toBe(result.range.currentAnnualCost.likely);
    expect(after!.annualLossCostLow).toBe(result.range.currentAnnualCost.low);
    expect(after!.annualLossCost).not.toBe(before!.annualLossCost);
    const detail = ((await (await asPerson(holder, `/api/leads/${lead.id}`)).json()) as { lead: LeadDetail }).lead;
    expect(detail.annualLoss.likely).toBe(result.range.currentAnnualCost.likely);

    // Read back: the revision, the diff of the original against it, and a timeline entry.
    expect(again.lead.latestNumber).toBe(1);
    expect(again.revisions.map((r) => [r.number, r.reason])).toEqual([[1, body.reason]]);
    expect(again.diff?.runs.find((r) => r.runId === 'steam-1')).toMatchObject({ status: 'changed', changedIn: [1] });
    const entry = detail.timeline?.find((e) => e.action === 'lead.revised');
    expect(entry?.detail).toMatchObject({ number: 1, baseNumber: 0, reason: body.reason, changed: 1, added: 0, removed: 0 });
    expect(entry?.actor).toEqual({ name: 'Rhea Ironbark', firm: 'Ironbark Lagging' });
  });

  it('a second revision adds a missed run and removes one; the diff names the save that changed each', async () => {
    const lead = await heldLead();
    const runs = await ownerRuns(lead.id);
    const first = await post(holder, lead.id, { baseNumber: 0, reason: 'Measured the header', runs: walked(runs, { 'steam-1': { measurements: { lengthM: 24 } } }) });
    expect(first.status).toBe(201);
    const missed: PlantRunInput = {
      id: 'walk-cond',
      label: 'Condensate return behind the boiler',
      service: 'condensate-return',
      pipe: { standard: 'ASME-B36.10M', size: '1', schedule: '40', material: 'carbon-steel' },
      lengthM: 8,
      lengthConfidence: 'measured',
    };
    const second = await post(holder, lead.id, {
      baseNumber: 1,
      reason: 'Wash bay line was taken out last year; found a bare condensate return',
      runs: [walked(runs, { 'steam-1': { measurements: { lengthM: 24 } } })[0]!, missed],
    });
    expect(second.status, await second.clone().text()).toBe(201);
    const saved = (await second.json()) as RevisionSavedResponse;
    expect(saved.revision).toMatchObject({ number: 2, baseNumber: 1 });
    expect(saved.diff.runs.map((r) => [r.runId, r.status])).toEqual([
      ['steam-1', 'unchanged'],
      ['walk-cond', 'added'],
      ['hw-1', 'removed'],
    ]);
    const read = await history(holder, lead.id);
    expect(read.revisions.map((r) => r.number)).toEqual([1, 2]);
    expect(read.diff?.runs.map((r) => [r.runId, r.status, r.changedIn])).toEqual([
      ['steam-1', 'changed', [1]],
      ['walk-cond', 'added', [2]],
      ['hw-1', 'removed', [2]],
    ]);
    const [row] = await getDb().select({ runCount: assessments.runCount, services: assessments.services }).from(assessments).where(eq(assessments.id, lead.id));
    expect(row).toEqual({ runCount: 2, services: ['condensate-return', 'steam'] });
  });

  it('a save made from a revision that is no longer the latest is 409 with who saved meanwhile; nothing is overwritten', async () => {
    const lead = await heldLead();
    const runs = await ownerRuns(lead.id);
    expect((await post(holder, lead.id, { baseNumber: 0, reason: 'Header measured', runs: walked(runs, { 'steam-1': { lengthM: 22 } }) })).status).toBe(201);
    const stale = await post(holder, lead.id, { baseNumber: 0, reason: 'From an old page', runs: walked(runs, { 'steam-1': { lengthM: 99 } }) });
    expect(stale.status).toBe(409);
    const body = (await stale.json()) as ErrorBody;
    expect(body.error.code).toBe('CONFLICT');
    expect(body.error.message).toMatch(/^Rhea Ironbark \(Ironbark Lagging\) saved revision 1 on .+ UTC, after the revision 0 you started from\. Nothing was overwritten/);
    expect(body.error.details).toMatchObject({ latestNumber: 1, author: { name: 'Rhea Ironbark', firm: 'Ironbark Lagging' } });
    expect(body.error.issues).toEqual([{ path: 'baseNumber', message: body.error.message }]);
    const ahead = await post(holder, lead.id, { baseNumber: 5, reason: 'From the future', runs });
    expect(ahead.status).toBe(409);
    expect(((await ahead.json()) as ErrorBody).error.message).toBe('This lead has no revision 5; its latest is 1. Reload the lead and start from that.');
    const stored = await getDb().select({ number: leadRevisions.number, reason: leadRevisions.reason }).from(leadRevisions).where(eq(leadRevisions.assessmentId, lead.id));
    expect(stored).toEqual([{ number: 1, reason: 'Header measured' }]);
  });

  it('of many saves made at once from the same base exactly one lands; every other is a 409', async () => {
    const lead = await heldLead();
    const runs = await ownerRuns(lead.id);
    const answers = await Promise.all(
      Array.from({ length: 12 }, (_, i) => post(holder, lead.id, { baseNumber: 0, reason: `Attempt ${i}`, runs: walked(runs, { 'steam-1': { lengthM: 20 + i } }) })),
    );
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(11);
    for (const answer of answers.filter((a) => a.status === 409)) expect(((await answer.json()) as ErrorBody).error.code).toBe('CONFLICT');
    expect(await getDb().select({ n: leadRevisions.number }).from(leadRevisions).where(eq(leadRevisions.assessmentId, lead.id))).toEqual([{ n: 1 }]);
  });

  it('a save sent again with the same client key (a dropped connection) answers with the revision it made, once, even all at once', async () => {
    const lead = await heldLead();
    const runs = await ownerRuns(lead.id);
    const body = { baseNumber: 0, reason: 'Sent from the plant room', clientKey: `phone-${randomUUID()}`, runs: walked(runs, { 'hw-1': { lengthM: 14 } }) };
    const first = await post(holder, lead.id, body);
    expect(first.status).toBe(201);
    const again = await post(holder, lead.id, body);
    expect(again.status).toBe(200);
    const replayed = (await again.json()) as RevisionSavedResponse;
    expect(replayed).toMatchObject({ replayed: true, revision: { number: 1, reason: 'Sent from the plant room' } });
    expect(replayed.diff.runs.find((r) => r.runId === 'hw-1')?.status).toBe('changed');

    const burst = { ...body, baseNumber: 1, clientKey: `phone-${randomUUID()}`, reason: 'Second walk' };
    const answers = await Promise.all(Array.from({ length: 8 }, () => post(holder, lead.id, burst)));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 200, 200, 200, 201]);
    const numbers = await Promise.all(answers.map(async (a) => ((await a.json()) as RevisionSavedResponse).revision.number));
    expect(new Set(numbers)).toEqual(new Set([2]));
    expect((await getDb().select({ n: leadRevisions.number }).from(leadRevisions).where(eq(leadRevisions.assessmentId, lead.id))).map((r) => r.n).sort()).toEqual([1, 2]);
  });

  it('a closed lead takes no more revisions (409 with the reason)', async () => {
    const lead = await heldLead();
    const runs = await ownerRuns(lead.id);
    expect((await asPerson(holder, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'closed', reason: 'too-small' } })).status).toBe(200);
    const response = await post(holder, lead.id, { baseNumber: 0, reason: 'Late measurement', runs });
    expect(response.status).toBe(409);
    expect(await response.json()).toMatchObject({ error: { code: 'INVALID_TRANSITION', message: 'The lead is “Closed”; its inventory is final and takes no more revisions.' } });
    expect((await history(holder, lead.id)).allowed.revise).toBe(false);
  });

  it('is described in /api/openapi.json from the schemas the endpoint parses and answers with', async () => {
    const doc = (await (await appFetch('/api/openapi.json')).json()) as {
      paths: Record<string, Record<string, { responses: Record<string, unknown> }>>;
      components: { schemas: Record<string, { properties?: Record<string, unknown> }> };
    };
    const path = doc.paths['/api/leads/{id}/revisions']!;
    expect(Object.keys(path).sort()).toEqual(['get', 'post']);
    expect(Object.keys(path.post!.responses)).toEqual(expect.arrayContaining(['200', '201', '400', '401', '403', '404', '409']));
    expect(Object.keys(doc.components.schemas.RevisionRequest!.properties!).sort()).toEqual(['areas', 'baseNumber', 'clientKey', 'reason', 'runs']);
    expect(Object.keys(doc.components.schemas.RevisionList!.properties!).sort()).toEqual(['allowed', 'diff', 'lead', 'original', 'revisions']);
    expect(Object.keys(doc.components.schemas.RevisionSaved!.properties!).sort()).toEqual(['diff', 'replayed', 'revision']);
  });

  describe('bad input: 400 with the field path and a sentence in the field’s words and units', () => {
    let lead: SubmittedLead;
    let runs: PlantRunInput[];
    beforeAll(async () => {
      lead = await heldLead();
      runs = await ownerRuns(lead.id);
    });

    const cases: { name: string; body: () => unknown; path: string; message: string | RegExp }[] = [
      { name: 'a negative length', body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { lengthM: -3 } }) }), path: 'runs.0.lengthM', message: 'Run length must be more than 0 m; -3 m was given.' },
      {
        name: 'a measured length of zero',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'hw-1': { measurements: { lengthM: 0 } } }) }),
        path: 'runs.1.measurements.lengthM',
        message: 'Measured length must be more than 0 m; 0 m was given.',
      },
      {
        name: 'a surface reading without the air beside it',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { measurements: { surfaceTemperatureC: 140 } } }) }),
        path: 'runs.0.measurements.airTemperatureC',
        message: 'A measured surface temperature needs the air temperature measured beside it at the same time.',
      },
      {
        name: 'an infrared reading without its emittance setting',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { measurements: { surfaceTemperatureC: 140, airTemperatureC: 20, surfaceMethod: 'infrared' } } }) }),
        path: 'runs.0.measurements.infraredEmittanceSetting',
        message: /^Give the emittance the infrared thermometer was set to/,
      },
      {
        name: 'a surface hotter than the method covers',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { measurements: { surfaceTemperatureC: 900, airTemperatureC: 20 } } }) }),
        path: 'runs.0.measurements.surfaceTemperatureC',
        message: 'Measured surface temperature must be at most 400 °C; 900 °C was given.',
      },
      {
        name: 'a bare share over the whole run',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'hw-1': { current: { state: 'damaged', bareFraction: 1.4 } } }) }),
        path: 'runs.1.current.bareFraction',
        message: 'Damaged (bare) fraction must be at most 1; 1.4 was given.',
      },
      {
        name: 'a steam pressure beyond the formulation',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { steamGaugePressureKPa: 30000 } }) }),
        path: 'runs.0.steamGaugePressureKPa',
        message: 'Steam gauge pressure must be at most 16000 kPa; 30000 kPa was given.',
      },
      {
        name: 'a room the plant does not list',
        body: () => ({ baseNumber: 0, reason: 'x', runs: walked(runs, { 'steam-1': { areaId: 'walk-nowhere' } }) }),
        path: 'runs.0.areaId',
        message: 'Run "Boiler steam header" sits in area "walk-nowhere", which the plant does not list; add the area or choose one of none yet.',
      },
      {
        name: 'two runs with one id',
        body: () => ({ baseNumber: 0, reason: 'x', runs: [runs[0], { ...runs[1], id: 'steam-1' }] }),
        path: 'runs.1.id',
        message: 'Run id "steam-1" is used twice; each run needs its own id.',
      },
      { name: 'no runs left', body: () => ({ baseNumber: 0, reason: 'x', runs: [] }), path: 'runs', message: 'Add at least one pipe run.' },
      { name: 'no reason', body: () => ({ baseNumber: 0, reason: '  ', runs }), path: 'reason', message: 'Say in a few words what the site walk changed.' },
      { name: 'no base', body: () => ({ reason: 'x', runs }), path: 'baseNumber', message: 'baseNumber must be the number of the revision you started from (0 for the owner’s answers).' },
      { name: 'a field it does not take', body: () => ({ baseNumber: 0, reason: 'x', runs, energy: { price: 0 } }), path: '(body)', message: 'A revision carries baseNumber, reason, clientKey, areas and runs only; leave out "energy".' },
      { name: 'not an object', body: () => [1, 2], path: '(body)', message: 'Send the revision as a JSON object with baseNumber, reason and runs.' },
      { name: 'a client key with spaces', body: () => ({ baseNumber: 0, reason: 'x', runs, clientKey: 'my phone' }), path: 'clientKey', message: 'clientKey must be 8 to 64 letters, digits, dashes or underscores.' },
    ];

    it.each(cases)('$name → $path', async ({ body, path, message }) => {
      const response = await post(holder, lead.id, body());
      expect(response.status).toBe(400);
      const answer = (await response.json()) as ErrorBody;
      const issue = answer.error.issues?.find((i) => i.path === path);
      expect(issue, JSON.stringify(answer.error.issues)).toBeDefined();
      if (typeof message === 'string') expect(issue!.message).toBe(message);
      else expect(issue!.message).toMatch(message);
    });

    it('a body that is not JSON is a 400 (415 without the JSON type), and nothing was stored for any of them', async () => {
      const bare = await asPerson(holder, `/api/leads/${lead.id}/revisions`, { method: 'POST' });
      expect(bare.status).toBe(415);
      const broken = await appFetch(`/api/leads/${lead.id}/revisions`, {
        method: 'POST',
        headers: { cookie: holder, 'content-type': 'application/json' },
        body: '{"baseNumber": 0,',
      });
      expect(broken.status).toBe(400);
      expect(await broken.json()).toMatchObject({ error: { issues: [{ path: '(body)', message: 'The body is not valid JSON.' }] } });
      expect(await getDb().select().from(leadRevisions).where(eq(leadRevisions.assessmentId, lead.id))).toEqual([]);
    });

    it('never a 500, whatever is sent in the fields', async () => {
      await fc.assert(
        fc.asyncProperty(
          fc.record({ baseNumber: fc.oneof(fc.integer({ min: -2, max: 3 }), fc.string(), fc.constant(null)), reason: fc.oneof(fc.string(), fc.integer()), lengthM: fc.oneof(fc.double(), fc.string(), fc.constant(null)), surface: fc.oneof(fc.double(), fc.constant(undefined)) }),
          async ({ baseNumber, reason, lengthM, surface }) => {
            const body = { baseNumber, reason, runs: walked(runs, { 'steam-1': { lengthM: lengthM as number, measurements: { surfaceTemperatureC: surface, airTemperatureC: 20 } } }) };
            const response = await post(holder, lead.id, JSON.parse(JSON.stringify(body)));
            expect(response.status, await response.text()).toBeLessThan(500);
          },
        ),
        { numRuns: 30 },
      );
    });
  });
});
