/**
 * The authorization matrix: every on-demand page and API route (found in src/pages) × every
 * kind of visitor → the status each must get. A route added without a row fails the first test;
 * adding a row is one line in `rows` below. The persona-specific threats have their own tests in
 * tests/auth/guards.test.ts.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { user } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { asPerson, ensureConsultant, ensureDeskRegion, ownerCookie, passwordCookie, submitLead, type SubmittedLead } from '../support/desk';
import { onDemandRoutes } from '../support/routes';
import { waitForPdf } from '../support/reports';
import { appFetch } from '../support/stack';

const personas = ['anonymous', 'owner', 'otherOwner', 'consultantIn', 'consultantOut', 'bannedConsultant', 'admin'] as const;
type Persona = (typeof personas)[number];
type Expected = Record<Persona, number>;

interface World {
  /** A lead of the matrix region, claimed by `consultantIn`; `owner` sent it. */
  held: SubmittedLead;
  /** A second lead of `owner`, also held by `consultantIn`, with version 1 of a report sent and its PDF rendered. */
  reported: SubmittedLead;
  reportId: string;
}

interface Row {
  method: string;
  route: string;
  path: (world: World) => string;
  /** JSON body, a form, or nothing. */
  body?: { json: unknown } | { form: Record<string, string> };
  expect: Expected;
}

const all = (status: number): Expected => Object.fromEntries(personas.map((p) => [p, status])) as Expected;
/** Pages for anyone signed in: sign-in for the signed-out (and the banned, who have no session). */
const signedInPage = (status = 200): Expected => ({ ...all(status), anonymous: 303, bannedConsultant: 303 });
/** Desk pages: consultants and admins; owners are shown the refusal page. */
const deskPage = ({ out = 200 }: { out?: number } = {}): Expected => ({
  anonymous: 303,
  owner: 403,
  otherOwner: 403,
  consultantIn: 200,
  consultantOut: out,
  bannedConsultant: 303,
  admin: 200,
});
/** Desk API: 401 signed out, 403 for owners; `inRegion` for the consultant who reaches the lead and admins. */
const deskApi = ({ inRegion, out = inRegion, admin = inRegion }: { inRegion: number; out?: number; admin?: number }): Expected => ({
  anonymous: 401,
  owner: 403,
  otherOwner: 403,
  consultantIn: inRegion,
  consultantOut: out,
  bannedConsultant: 401,
  admin,
});

const lead = (w: World) => w.held.id;
/** A sent report: its owner, the consultant holding the lead and admins read it; anyone else finds nothing. */
const reportApi = (status: number): Expected => ({ anonymous: 401, owner: status, otherOwner: 404, consultantIn: status, consultantOut: 404, bannedConsultant: 401, admin: status });
/** Admin pages: only admins; consultants and owners are shown the refusal page, the signed-out sent to sign in. */
const adminPage = (): Expected => ({ ...deskPage(), consultantIn: 403, consultantOut: 403 });
/** Admin API: `status` for admins; 401 signed out (and banned), 403 for everyone else. */
const adminApi = (status: number): Expected => ({ ...deskApi({ inRegion: 403 }), admin: status });
const nobody = '00000000-0000-4000-8000-000000000000';

// One line per route and method. Sign-out comes last: it ends each persona's session.
const rows: Row[] = [
  { method: 'GET', route: '/account', path: () => '/account', expect: signedInPage() },
  { method: 'GET', route: '/sign-in', path: () => '/sign-in', expect: all(200) },
  { method: 'GET', route: '/sign-in/link-used', path: () => '/sign-in/link-used?again=x', expect: all(200) },
  { method: 'GET', route: '/not-for-your-account', path: () => '/not-for-your-account', expect: all(403) },
  { method: 'GET', route: '/my/assessments', path: () => '/my/assessments', expect: { ...signedInPage(), consultantIn: 403, consultantOut: 403 } },
  {
    method: 'GET',
    route: '/my/assessments/[id]',
    path: (w) => `/my/assessments/${lead(w)}`,
    expect: { ...signedInPage(404), owner: 200, consultantIn: 403, consultantOut: 403 },
  },
  { method: 'GET', route: '/desk', path: () => '/desk', expect: deskPage() },
  { method: 'GET', route: '/desk/mine', path: () => '/desk/mine', expect: deskPage() },
  { method: 'GET', route: '/desk/leads/[id]', path: (w) => `/desk/leads/${lead(w)}`, expect: deskPage({ out: 404 }) },
  { method: 'GET', route: '/desk/leads/[id]/site-walk', path: (w) => `/desk/leads/${lead(w)}/site-walk`, expect: deskPage({ out: 404 }) },
  { method: 'GET', route: '/admin', path: () => '/admin', expect: { ...deskPage(), consultantIn: 403, consultantOut: 403 } },
  { method: 'GET', route: '/api/health', path: () => '/api/health', expect: all(200) },
  { method: 'ALL', route: '/api/auth/[...all]', path: () => '/api/auth/ok', expect: all(200) },
  { method: 'GET', route: '/api/coverage', path: () => '/api/coverage?country=ZZ&postalCode=1', expect: all(400) },
  { method: 'POST', route: '/api/estimate', path: () => '/api/estimate', body: { json: {} }, expect: all(400) },
  { method: 'POST', route: '/api/assessments', path: () => '/api/assessments', body: { json: {} }, expect: all(400) },
  { method: 'POST', route: '/api/sign-in/link', path: () => '/api/sign-in/link', body: { form: {} }, expect: all(303) },
  { method: 'POST', route: '/api/sign-in/password', path: () => '/api/sign-in/password', body: { form: {} }, expect: all(303) },
  { method: 'GET', route: '/api/leads', path: () => '/api/leads?view=open', expect: deskApi({ inRegion: 200 }) },
  { method: 'GET', route: '/api/leads/[id]', path: (w) => `/api/leads/${lead(w)}`, expect: deskApi({ inRegion: 200, out: 404 }) },
  { method: 'POST', route: '/api/leads/[id]/claim', path: (w) => `/api/leads/${lead(w)}/claim`, body: { json: {} }, expect: deskApi({ inRegion: 409, out: 404 }) },
  {
    method: 'POST',
    route: '/api/leads/[id]/moves',
    path: (w) => `/api/leads/${lead(w)}/moves`,
    body: { json: { to: 'signed' } },
    expect: deskApi({ inRegion: 409, out: 404 }),
  },
  { method: 'POST', route: '/api/leads/[id]/release', path: (w) => `/api/leads/${lead(w)}/release`, body: { json: {} }, expect: deskApi({ inRegion: 400, out: 404 }) },
  { method: 'POST', route: '/api/leads/[id]/notes', path: (w) => `/api/leads/${lead(w)}/notes`, body: { json: { text: '' } }, expect: deskApi({ inRegion: 400, out: 404 }) },
  ...(['/admin/consultants', '/admin/regions', '/admin/attention', '/admin/coverage', '/admin/activity'] as const).map(
    (route): Row => ({ method: 'GET', route, path: () => route, expect: adminPage() }),
  ),
  { method: 'GET', route: '/join', path: () => '/join', expect: all(404) },
  { method: 'GET', route: '/forgot-password', path: () => '/forgot-password', expect: all(200) },
  { method: 'GET', route: '/set-password', path: () => '/set-password', expect: all(410) },
  { method: 'POST', route: '/api/invitations/accept', path: () => '/api/invitations/accept', body: { json: {} }, expect: all(400) },
  { method: 'POST', route: '/api/password/forgot', path: () => '/api/password/forgot', body: { json: {} }, expect: all(400) },
  { method: 'POST', route: '/api/password/reset', path: () => '/api/password/reset', body: { json: {} }, expect: all(400) },
  { method: 'GET', route: '/api/admin/consultants', path: () => '/api/admin/consultants', expect: adminApi(200) },
  { method: 'POST', route: '/api/admin/consultants', path: () => '/api/admin/consultants', body: { json: {} }, expect: adminApi(400) },
  { method: 'GET', route: '/api/admin/consultants/[id]', path: () => `/api/admin/consultants/${nobody}`, expect: adminApi(404) },
  { method: 'PATCH', route: '/api/admin/consultants/[id]', path: () => `/api/admin/consultants/${nobody}`, body: { json: {} }, expect: adminApi(400) },
  { method: 'POST', route: '/api/admin/consultants/[id]/deactivate', path: () => `/api/admin/consultants/${nobody}/deactivate`, body: { json: {} }, expect: adminApi(400) },
  { method: 'POST', route: '/api/admin/consultants/[id]/reactivate', path: () => `/api/admin/consultants/${nobody}/reactivate`, body: { json: {} }, expect: adminApi(404) },
  { method: 'POST', route: '/api/admin/consultants/[id]/invitation', path: () => `/api/admin/consultants/${nobody}/invitation`, body: { json: {} }, expect: adminApi(404) },
  { method: 'DELETE', route: '/api/admin/consultants/[id]/invitation', path: () => `/api/admin/consultants/${nobody}/invitation`, expect: adminApi(404) },
  { method: 'GET', route: '/api/admin/regions', path: () => '/api/admin/regions', expect: adminApi(200) },
  { method: 'POST', route: '/api/admin/regions', path: () => '/api/admin/regions', body: { json: {} }, expect: adminApi(400) },
  { method: 'PATCH', route: '/api/admin/regions/[id]', path: () => `/api/admin/regions/${nobody}`, body: { json: {} }, expect: adminApi(400) },
  { method: 'DELETE', route: '/api/admin/regions/[id]', path: () => `/api/admin/regions/${nobody}`, expect: adminApi(404) },
  { method: 'POST', route: '/api/admin/leads/[id]/assign', path: (w) => `/api/admin/leads/${lead(w)}/assign`, body: { json: {} }, expect: adminApi(400) },
  { method: 'POST', route: '/api/admin/leads/[id]/junk', path: (w) => `/api/admin/leads/${lead(w)}/junk`, body: { json: {} }, expect: adminApi(400) },
  { method: 'POST', route: '/api/admin/leads/[id]/restore', path: (w) => `/api/admin/leads/${lead(w)}/restore`, body: { json: {} }, expect: adminApi(400) },
  { method: 'GET', route: '/api/admin/attention', path: () => '/api/admin/attention', expect: adminApi(200) },
  { method: 'GET', route: '/api/admin/funnel', path: () => '/api/admin/funnel', expect: adminApi(200) },
  { method: 'GET', route: '/api/admin/activity', path: () => '/api/admin/activity', expect: adminApi(200) },
  { method: 'GET', route: '/api/admin/settings', path: () => '/api/admin/settings', expect: adminApi(200) },
  { method: 'PATCH', route: '/api/admin/settings', path: () => '/api/admin/settings', body: { json: {} }, expect: adminApi(400) },
  { method: 'GET', route: '/api/leads/[id]/revisions', path: (w) => `/api/leads/${lead(w)}/revisions`, expect: deskApi({ inRegion: 200, out: 404 }) },
  {
    method: 'POST',
    route: '/api/leads/[id]/revisions',
    path: (w) => `/api/leads/${lead(w)}/revisions`,
    body: { json: { baseNumber: 0, reason: '' } },
    expect: deskApi({ inRegion: 400, out: 404 }),
  },
  // The follow-up report: the owner, the consultant holding the lead and admins; everyone else as for no report at all.
  { method: 'GET', route: '/desk/leads/[id]/report', path: (w) => `/desk/leads/${w.reported.id}/report`, expect: deskPage({ out: 404 }) },
  { method: 'GET', route: '/desk/prices', path: () => '/desk/prices', expect: deskPage() },
  { method: 'GET', route: '/desk/reports/[id]', path: (w) => `/desk/reports/${w.reportId}`, expect: deskPage({ out: 404 }) },
  {
    method: 'GET',
    route: '/my/reports/[id]',
    path: (w) => `/my/reports/${w.reportId}`,
    expect: { ...signedInPage(404), owner: 200, consultantIn: 403, consultantOut: 403, admin: 200 },
  },
  { method: 'GET', route: '/api/leads/[id]/reports', path: (w) => `/api/leads/${w.reported.id}/reports`, expect: deskApi({ inRegion: 200, out: 404 }) },
  {
    method: 'POST',
    route: '/api/leads/[id]/reports',
    path: (w) => `/api/leads/${w.reported.id}/reports`,
    body: { json: { fromVersion: 99 } },
    expect: deskApi({ inRegion: 400, out: 404 }),
  },
  { method: 'GET', route: '/api/reports/[id]', path: (w) => `/api/reports/${w.reportId}`, expect: reportApi(200) },
  { method: 'PATCH', route: '/api/reports/[id]', path: (w) => `/api/reports/${w.reportId}`, body: { json: {} }, expect: { ...deskApi({ inRegion: 409, out: 404 }) } },
  { method: 'POST', route: '/api/reports/[id]/send', path: (w) => `/api/reports/${w.reportId}/send`, body: { json: {} }, expect: deskApi({ inRegion: 200, out: 404 }) },
  { method: 'GET', route: '/api/reports/[id]/pdf', path: (w) => `/api/reports/${w.reportId}/pdf`, expect: reportApi(200) },
  {
    method: 'POST',
    route: '/api/reports/[id]/answer',
    path: (w) => `/api/reports/${w.reportId}/answer`,
    body: { json: {} },
    expect: { anonymous: 401, owner: 400, otherOwner: 404, consultantIn: 403, consultantOut: 403, bannedConsultant: 401, admin: 403 },
  },
  { method: 'GET', route: '/api/consultants/me/prices', path: () => '/api/consultants/me/prices', expect: deskApi({ inRegion: 200 }) },
  { method: 'PUT', route: '/api/consultants/me/prices', path: () => '/api/consultants/me/prices', body: { json: {} }, expect: deskApi({ inRegion: 400 }) },
  { method: 'POST', route: '/api/sign-out', path: () => '/api/sign-out', body: { form: {} }, expect: all(303) },
];

const world = {} as World;
const cookies = {} as Record<Persona, string | null>;

function send(row: Row, persona: Persona): Promise<Response> {
  const headers = new Headers();
  const cookie = cookies[persona];
  if (cookie) headers.set('cookie', cookie);
  let body: BodyInit | undefined;
  if (row.body && 'json' in row.body) {
    headers.set('content-type', 'application/json');
    body = JSON.stringify(row.body.json);
  } else if (row.body && 'form' in row.body) {
    body = new URLSearchParams(row.body.form);
  }
  return appFetch(row.path(world), { method: row.method === 'ALL' ? 'GET' : row.method, headers, body });
}

describe('the authorization matrix', () => {
  beforeAll(async () => {
    const inRegion = await ensureDeskRegion('test-matrix-gum-flats', 'Gum Flats (matrix)', ['37']);
    const outRegion = await ensureDeskRegion('test-matrix-saltbush', 'Saltbush Plains (matrix)', ['36']);
    const stamp = Date.now();
    await ensureConsultant({ email: 'matrix-in@brolga-insulation.example', name: 'Ada Brolga', firm: 'Brolga Insulation', regionIds: [inRegion] });
    await ensureConsultant({ email: 'matrix-out@mallee-lagging.example', name: 'Cy Mallee', firm: 'Mallee Lagging', regionIds: [outRegion] });
    const bannedId = await ensureConsultant({ email: 'matrix-banned@quoll-thermal.example', name: 'Bo Quoll', firm: 'Quoll Thermal', regionIds: [inRegion] });

    world.held = await submitLead('3710', { email: `owner.${stamp}@gum-flats-dairy.example` });
    world.reported = await submitLead('3711', { email: `owner.${stamp}@gum-flats-dairy.example` });
    const other = await submitLead('3712', { email: `other.${stamp}@gum-flats-bakery.example` });

    cookies.anonymous = null;
    cookies.consultantIn = await passwordCookie('matrix-in@brolga-insulation.example');
    cookies.consultantOut = await passwordCookie('matrix-out@mallee-lagging.example');
    cookies.bannedConsultant = await passwordCookie('matrix-banned@quoll-thermal.example');
    cookies.admin = await passwordCookie('admin@lagwise.example', DEMO_PASSWORD);
    [cookies.owner, cookies.otherOwner] = await Promise.all([ownerCookie(world.held.ownerEmail), ownerCookie(other.ownerEmail)]);

    // The held lead: claimed by the consultant of its region.
    const claimed = await asPerson(cookies.consultantIn, `/api/leads/${world.held.id}/claim`, { method: 'POST', body: {} });
    expect(claimed.status).toBe(200);
    // The second lead: claimed too, with version 1 of a report sent and its PDF rendered by the worker.
    expect((await asPerson(cookies.consultantIn, `/api/leads/${world.reported.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const draft = await asPerson(cookies.consultantIn, `/api/leads/${world.reported.id}/reports`, { method: 'POST', body: {} });
    expect(draft.status).toBe(201);
    world.reportId = ((await draft.json()) as { report: { id: string } }).report.id;
    expect((await asPerson(cookies.consultantIn, `/api/reports/${world.reportId}/send`, { method: 'POST', body: {} })).status).toBe(201);
    await waitForPdf(cookies.consultantIn, world.reportId);
    // Deactivated after signing in: the session cookie still exists; the account is banned.
    await getDb().update(user).set({ banned: true, banReason: 'left the firm' }).where(eq(user.id, bannedId));
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('has a row for every on-demand page and endpoint in src/pages', () => {
    const covered = new Set(rows.map((r) => `${r.method} ${r.route}`));
    const missing = onDemandRoutes()
      .map((r) => `${r.method} ${r.route}`)
      .filter((key) => !covered.has(key));
    expect(missing, 'routes without a row in the authorization matrix').toEqual([]);
  });

  for (const row of rows) {
    for (const persona of personas) {
      it(`${row.method} ${row.route} as ${persona} → ${row.expect[persona]}`, async () => {
        const response = await send(row, persona);
        const text = await response.text();
        expect(response.status, text.slice(0, 300)).toBe(row.expect[persona]);
        if (/^\/api\/(leads|admin|reports|consultants)/.test(row.route) && response.status >= 400) {
          expect(response.headers.get('content-type')).toContain('application/json');
          expect(JSON.parse(text)).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        }
      });
    }
  }
});
