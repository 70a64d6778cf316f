import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { activityLog, assessments, pipeRuns, user } from '../../src/db/schema';
import { ensureTestRegion, messagesTo, submissionForm, testRegion, validSubmission, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';

interface Created {
  assessment: { id: string; reference: string; status: string; regionName: string | null };
}
interface Failure {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

function postJson(body: unknown, headers: Record<string, string> = {}): Promise<Response> {
  return appFetch('/api/assessments', {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
}

async function issuePaths(response: Response): Promise<string[]> {
  const body = (await response.json()) as Failure;
  return (body.error.issues ?? []).map((i) => i.path);
}

describe('POST /api/assessments', () => {
  beforeAll(async () => {
    await ensureTestRegion();
  });
  afterAll(async () => {
    await closeDb();
  });

  it('stores a routed assessment whole: the row, its runs, the activity entry and the owner account', async () => {
    const input = validSubmission();
    const response = await postJson(input);
    expect(response.status).toBe(201);
    const { assessment } = (await response.json()) as Created;
    expect(assessment).toMatchObject({ status: 'fresh', regionName: testRegion.name });
    expect(assessment.reference).toMatch(/^LW-[A-Z0-9]{4}-[A-Z0-9]{2}$/);

    const db = getDb();
    const [row] = await db.select().from(assessments).where(eq(assessments.id, assessment.id));
    expect(row).toMatchObject({ contactEmail: input.contact.email, postalCodeNormalised: '3564', countryCode: 'AU' });
    expect(row!.engineVersion).toMatch(/\S/);
    const runs = await db.select().from(pipeRuns).where(eq(pipeRuns.assessmentId, assessment.id));
    expect(runs.map((r) => r.label).sort()).toEqual(['Boiler steam header', 'Hot water to wash bay']);
    const activity = await db.select().from(activityLog).where(eq(activityLog.assessmentId, assessment.id));
    expect(activity.map((a) => a.action)).toEqual(['assessment.submitted']);
    const [owner] = await db.select().from(user).where(eq(user.email, input.contact.email));
    expect(owner?.role).toBe('owner');
    expect(row!.ownerUserId).toBe(owner!.id);
  });

  it('routes a postal code that no region covers to "unrouted" and alerts nobody', async () => {
    const response = await postJson(validSubmission({ postalCode: '0872' }));
    expect(response.status).toBe(201);
    const { assessment } = (await response.json()) as Created;
    expect(assessment).toMatchObject({ status: 'unrouted', regionName: null });
    const db = getDb();
    const [row] = await db.select().from(assessments).where(eq(assessments.id, assessment.id));
    expect(row?.regionId).toBeNull();
  });

  it('alerts the region’s consultant without the owner’s name, company, e-mail or phone', async () => {
    const input = validSubmission();
    const response = await postJson(input);
    const { assessment } = (await response.json()) as Created;
    const alerts = await waitForMessages(testRegion.consultant.email, (m) => m.some((x) => x.subject.includes(assessment.reference)));
    const alert = alerts.find((m) => m.subject.includes(assessment.reference))!;
    const everything = `${alert.subject}\n${alert.html}\n${alert.text}`;
    for (const secret of [input.contact.email, input.contact.phone!, input.contact.name, input.contact.company]) {
      expect(everything).not.toContain(secret);
    }
    expect(everything).toContain(testRegion.name);
  });

  it('mails the owner a confirmation carrying a working sign-in link to the assessment', async () => {
    const input = validSubmission();
    const { assessment } = (await (await postJson(input)).json()) as Created;
    const [confirmation] = await waitForMessages(input.contact.email, (m) => m.length > 0);
    expect(confirmation!.subject).toContain(assessment.reference);
    const link = /href="([^"]*magic-link\/verify[^"]*)"/.exec(confirmation!.html ?? '')?.[1]?.replaceAll('&amp;', '&');
    expect(link).toBeTruthy();

    const verified = await fetch(link!, { redirect: 'manual' });
    expect(verified.status).toBe(302);
    expect(verified.headers.get('location')).toContain(`/my/assessments/${assessment.id}`);
    const cookie = verified.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const page = await appFetch(`/my/assessments/${assessment.id}`, { headers: { cookie } });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(assessment.reference);

    const reused = await fetch(link!, { redirect: 'manual' });
    expect(reused.headers.getSetCookie().some((c) => c.startsWith('better-auth.session_token=') && !c.includes('Max-Age=0'))).toBe(false);
  });

  it('stores one assessment when the same submission is sent twice at once with one Idempotency-Key', async () => {
    const input = validSubmission();
    const key = crypto.randomUUID();
    const [first, second] = await Promise.all([postJson(input, { 'idempotency-key': key }), postJson(input, { 'idempotency-key': key })]);
    expect([first.status, second.status].sort()).toEqual([200, 201]);
    const a = (await first.json()) as Created;
    const b = (await second.json()) as Created;
    expect(a.assessment.id).toBe(b.assessment.id);
    const rows = await getDb().select({ id: assessments.id }).from(assessments).where(eq(assessments.idempotencyKey, key));
    expect(rows).toHaveLength(1);
  });

  it('stores a honeypot submission as junk, mailing no one and making no account', async () => {
    const input = { ...validSubmission(), website: 'http://cheap-pills.example' };
    const response = await postJson(input);
    expect(response.status).toBe(201);
    const { assessment } = (await response.json()) as Created;
    expect(assessment.status).toBe('junk');
    const owners = await getDb().select().from(user).where(eq(user.email, input.contact.email));
    expect(owners).toHaveLength(0);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await messagesTo(input.contact.email)).toHaveLength(0);
  });

  describe('refuses bad input with 400, the field and a sentence, and stores nothing', () => {
    const cases: [string, () => unknown, string][] = [
      ['a missing e-mail', () => ({ ...validSubmission(), contact: { name: 'Petra', company: 'Quarry Hill Dairy' } }), 'contact.email'],
      ['a malformed e-mail', () => ({ ...validSubmission(), contact: { ...validSubmission().contact, email: 'petra@' } }), 'contact.email'],
      ['no consent', () => ({ ...validSubmission(), consent: false }), 'consent'],
      ['a postal code of the wrong shape', () => validSubmission({ postalCode: '35A' }), 'plant.postalCode'],
      ['an unknown country', () => ({ ...validSubmission(), plant: { ...validSubmission().plant, countryCode: 'XX' } }), 'plant.countryCode'],
      ['no runs', () => ({ ...validSubmission(), estimate: { ...validSubmission().estimate, runs: [] } }), 'estimate.runs'],
      [
        'a negative length',
        () => {
          const s = validSubmission();
          return { ...s, estimate: { ...s.estimate, runs: [{ ...s.estimate.runs[0]!, lengthM: -4 }] } };
        },
        'estimate.runs.0.lengthM',
      ],
      [
        'a fluid colder than absolute zero',
        () => {
          const s = validSubmission();
          return { ...s, estimate: { ...s.estimate, runs: [{ ...s.estimate.runs[1]!, fluidTemperatureC: -400 }] } };
        },
        'estimate.runs.0.fluidTemperatureC',
      ],
    ];
    it.each(cases)('%s', async (_name, make, path) => {
      const input = make() as ReturnType<typeof validSubmission>;
      const response = await postJson(input);
      expect(response.status).toBe(400);
      const body = (await response.clone().json()) as Failure;
      expect(body.error.message).toMatch(/\w+ \w+/);
      expect(await issuePaths(response)).toContain(path);
      const email = input.contact?.email;
      if (email) expect(await getDb().select().from(assessments).where(eq(assessments.contactEmail, email))).toHaveLength(0);
    });

    it('a body that is not JSON', async () => {
      const response = await postJson('{"contact": ');
      expect(response.status).toBe(400);
      expect(await issuePaths(response)).toEqual(['(body)']);
    });

    it('a multipart body without its assessment part', async () => {
      const form = new FormData();
      form.set('note', 'hello');
      const response = await appFetch('/api/assessments', { method: 'POST', body: form });
      expect(response.status).toBe(400);
      expect(await issuePaths(response)).toEqual(['assessment']);
    });

    it('a malformed Idempotency-Key', async () => {
      const response = await postJson(validSubmission(), { 'idempotency-key': 'x' });
      expect(response.status).toBe(400);
      expect(await issuePaths(response)).toEqual(['Idempotency-Key']);
    });
  });

  it('accepts a photo sent with the multipart form and stores its record with the run', async () => {
    const { default: sharp } = await import('sharp');
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#a8461c' } }).jpeg().toBuffer();
    const input = validSubmission();
    const response = await appFetch('/api/assessments', {
      method: 'POST',
      body: submissionForm(input, [{ field: 'photos.steam-1', name: 'quarry-hill-header.jpg', type: 'image/jpeg', bytes: new Uint8Array(jpeg) }]),
    });
    expect(response.status).toBe(201);
    const { assessment } = (await response.json()) as Created;
    const stored = await getDb().query.attachments.findMany({ where: (a, { eq: equals }) => equals(a.assessmentId, assessment.id) });
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({ contentType: 'image/jpeg', widthPx: 64, heightPx: 48 });
    expect(stored[0]!.pipeRunId).not.toBeNull();
  });
});
