/**
 * Regions through the admin API: a prefix in the wrong format is refused naming the prefix and
 * the format; a new region routes the next submission and re-routes the unrouted assessments it
 * now covers (its consultants alerted); overlapping prefixes resolve by the longest; a dry run
 * shows all that and stores nothing; retiring hands the open leads on. New Zealand codes 9xxx,
 * which no other test or the demo uses.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { activityLog, assessments } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { validSubmission, waitForMessages } from '../support/fixtures';
import { asPerson, ensureConsultant } from '../support/desk';
import { appFetch } from '../support/stack';
import { adminCookie } from './support';

let admin: string;
const stamp = randomUUID().slice(0, 8);

interface Change {
  dryRun: boolean;
  region: { id: string; name: string; prefixes: string[]; consultants: { id: string }[]; retiredAt: string | null };
  overlaps: { prefix: string; otherPrefix: string; otherRegion: { name: string }; winner: 'this' | 'other' }[];
  routing: { routedFromUnrouted: number; moved: { from: string | null; to: string | null; count: number }[]; nowUnrouted: number; leads: { reference: string }[] };
}

/** Submits a New Zealand plant through the API, as an owner would. */
async function submitNz(postalCode: string): Promise<{ id: string; reference: string; status: string; email: string }> {
  const input = validSubmission({ email: `owner.${postalCode}.${randomUUID().slice(0, 6)}@kauri-creamery.example` });
  input.plant.countryCode = 'NZ';
  input.plant.postalCode = postalCode;
  const response = await appFetch('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
  expect(response.status, await response.clone().text()).toBe(201);
  const { assessment } = (await response.json()) as { assessment: { id: string; reference: string; status: string } };
  return { ...assessment, email: input.contact.email };
}

async function lead(id: string) {
  const [row] = await getDb().select({ status: assessments.status, regionId: assessments.regionId }).from(assessments).where(eq(assessments.id, id));
  return row!;
}

async function save(method: 'POST' | 'PATCH', path: string, body: unknown): Promise<{ status: number; body: Change & { error?: { message: string; issues: { path: string; message: string }[] } } }> {
  const response = await asPerson(admin, path, { method, body });
  return { status: response.status, body: (await response.json()) as never };
}

describe('regions in the admin area', () => {
  beforeAll(async () => {
    admin = await adminCookie();
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('refuses a prefix in the wrong format for its country, naming the prefix and the format (400 with its path)', async () => {
    const wrong = await save('POST', '/api/admin/regions', { name: `Wrong ${stamp}`, countryCode: 'US', prefixes: ['970', '97X1'] });
    expect(wrong.status).toBe(400);
    const issue = wrong.body.error!.issues.find((i) => i.path === 'prefixes.1');
    expect(issue?.message).toContain('"97X1"');
    expect(issue?.message).toMatch(/1 to 5 digits of a ZIP code/);
    for (const [countryCode, prefix, path] of [
      ['GB', '12', 'prefixes.0'],
      ['CA', 'D2', 'prefixes.0'],
      ['US', '972145', 'prefixes.0'],
      ['NZ', '90 1X', 'prefixes.0'],
    ] as const) {
      const refused = await save('POST', '/api/admin/regions', { name: `Wrong ${stamp}`, countryCode, prefixes: [prefix] });
      expect(refused.status, `${countryCode} ${prefix}`).toBe(400);
      expect(refused.body.error!.issues[0]!.path).toBe(path);
      expect(refused.body.error!.issues[0]!.message).toContain(`"${prefix}"`);
    }
    const others: [unknown, string][] = [
      [{ name: '', countryCode: 'NZ', prefixes: [] }, 'name'],
      [{ name: 'X', countryCode: 'ZZ', prefixes: [] }, 'countryCode'],
      [{ name: 'X', countryCode: 'NZ', prefixes: '90' }, 'prefixes'],
      [{ name: 'X', countryCode: 'NZ', prefixes: ['90', '90'] }, 'prefixes.1'],
      [{ name: 'X', countryCode: 'NZ', prefixes: [], consultantIds: ['x'] }, 'consultantIds.0'],
      [{ name: 'X', countryCode: 'NZ', prefixes: [], consultantIds: [randomUUID()] }, 'consultantIds.0'],
    ];
    for (const [body, path] of others) {
      const refused = await save('POST', '/api/admin/regions', body);
      expect(refused.status, JSON.stringify(body)).toBe(400);
      expect(refused.body.error!.issues.map((i) => i.path)).toContain(path);
    }
  });

  it('a new region routes the next submission there, re-routes the matching unrouted ones and alerts its consultants', async () => {
    const before = await submitNz('9012');
    expect(before.status).toBe('unrouted');
    const consultant = `kahu.${stamp}@kauri-thermal.example`;
    const consultantId = await ensureConsultant({ email: consultant, name: 'Kahu Kauri', firm: 'Kauri Thermal', regionIds: [] });

    const made = await save('POST', '/api/admin/regions', { name: `Otago Coast ${stamp}`, countryCode: 'NZ', prefixes: ['90'], consultantIds: [consultantId] });
    expect(made.status).toBe(201);
    expect(made.body.region.prefixes).toEqual(['90']);
    expect(made.body.routing.routedFromUnrouted).toBeGreaterThanOrEqual(1);
    expect(made.body.routing.leads.map((l) => l.reference)).toContain(before.reference);
    expect(await lead(before.id)).toEqual({ status: 'fresh', regionId: made.body.region.id });
    expect(made.body.region).toMatchObject({ openLeads: 1, staleLeads: 0, heldLeads: 0 });
    await waitForMessages(consultant, (m) => m.some((x) => x.subject.includes(before.reference)));
    const routed = await getDb().select().from(activityLog).where(eq(activityLog.assessmentId, before.id));
    expect(routed.map((r) => r.action)).toContain('lead.routed');

    const next = await submitNz('9016');
    expect(next.status).toBe('fresh');
    expect((await lead(next.id)).regionId).toBe(made.body.region.id);
  });

  it('overlapping prefixes resolve by the longest; a dry run shows it and stores nothing', async () => {
    const broad = await save('POST', '/api/admin/regions', { name: `Southland ${stamp}`, countryCode: 'NZ', prefixes: ['98'] });
    expect(broad.status).toBe(201);
    const inner = await submitNz('9810');
    const outer = await submitNz('9870');
    expect((await lead(inner.id)).regionId).toBe(broad.body.region.id);

    const dry = await save('POST', '/api/admin/regions?dryRun=1', { name: `Invercargill ${stamp}`, countryCode: 'NZ', prefixes: ['981'] });
    expect(dry.status).toBe(200);
    expect(dry.body.dryRun).toBe(true);
    expect(dry.body.overlaps).toEqual([
      expect.objectContaining({ prefix: '981', otherPrefix: '98', otherRegion: { id: broad.body.region.id, name: `Southland ${stamp}` }, winner: 'this' }),
    ]);
    expect(dry.body.routing.moved).toEqual([{ from: `Southland ${stamp}`, to: `Invercargill ${stamp}`, count: 1 }]);
    // Nothing stored: the lead is where it was and no such region exists.
    expect((await lead(inner.id)).regionId).toBe(broad.body.region.id);
    const listed = (await (await asPerson(admin, '/api/admin/regions')).json()) as { regions: { name: string }[] };
    expect(listed.regions.map((r) => r.name)).not.toContain(`Invercargill ${stamp}`);

    const saved = await save('POST', '/api/admin/regions', { name: `Invercargill ${stamp}`, countryCode: 'NZ', prefixes: ['981'] });
    expect(saved.status).toBe(201);
    expect((await lead(inner.id)).regionId).toBe(saved.body.region.id);
    expect((await lead(outer.id)).regionId).toBe(broad.body.region.id);
    expect((await lead((await submitNz('9815')).id)).regionId).toBe(saved.body.region.id);
    expect((await lead((await submitNz('9890')).id)).regionId).toBe(broad.body.region.id);

    // The broad region's own view of the same overlap: the other one wins 981.
    const view = await save('PATCH', `/api/admin/regions/${broad.body.region.id}?dryRun=1`, { prefixes: ['98'] });
    expect(view.body.overlaps).toEqual([expect.objectContaining({ prefix: '98', otherPrefix: '981', winner: 'other' })]);

    // The same prefix twice is refused: one region per prefix.
    const twice = await save('PATCH', `/api/admin/regions/${broad.body.region.id}`, { prefixes: ['98', '981'] });
    expect(twice.status).toBe(409);
    expect(twice.body.error!.issues[0]!.path).toBe('prefixes.1');

    // Retiring the narrower region hands its open lead back to the broad one.
    const retired = await asPerson(admin, `/api/admin/regions/${saved.body.region.id}`, { method: 'DELETE' });
    expect(retired.status).toBe(200);
    expect((await lead(inner.id)).regionId).toBe(broad.body.region.id);
    expect((await asPerson(admin, `/api/admin/regions/${saved.body.region.id}`, { method: 'DELETE' })).status).toBe(409);
  });

  it('taking a prefix out of a region leaves its open leads unrouted, and says so', async () => {
    const region = await save('POST', '/api/admin/regions', { name: `Catlins ${stamp}`, countryCode: 'NZ', prefixes: ['93', '94'] });
    const open = await submitNz('9420');
    expect((await lead(open.id)).regionId).toBe(region.body.region.id);
    const narrowed = await save('PATCH', `/api/admin/regions/${region.body.region.id}`, { prefixes: ['93'] });
    expect(narrowed.status).toBe(200);
    expect(narrowed.body.routing.nowUnrouted).toBe(1);
    expect(await lead(open.id)).toEqual({ status: 'unrouted', regionId: null });
    const wrongFormat = await save('PATCH', `/api/admin/regions/${region.body.region.id}`, { prefixes: ['93', 'A1'] });
    expect(wrongFormat.status).toBe(400);
    expect(wrongFormat.body.error!.issues[0]).toMatchObject({ path: 'prefixes.1' });
    expect(wrongFormat.body.error!.issues[0]!.message).toContain('"A1"');
  });
});
