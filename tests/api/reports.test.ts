/**
 * The follow-up report through the API: a consultant's price table, the draft with the engine's
 * suggestion, choices and bad input, sending (frozen, numbered, idempotent, 409 on editing a
 * version), the PDF rendered by the worker with the web page's very figures, the e-mail carrying
 * it, a second version leaving the first readable, and the owner's answer reaching the consultant.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { activityLog, assessments } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { asPerson, ensureConsultant, ensureDeskRegion, ownerCookie, passwordCookie, submitLead, type SubmittedLead } from '../support/desk';
import { messagesTo, waitForMessages } from '../support/fixtures';
import { pageFigures, pdfText, squeeze, waitForPdf } from '../support/reports';

interface ReportBody {
  report: {
    id: string;
    status: 'draft' | 'sent';
    version: number | null;
    replacedBy: { version: number } | null;
    pdfReady: boolean;
    answer: { accept: boolean; reason: string | null } | null;
    suggestions: { runId: string; option: string; thicknessM: number; material: string }[] | null;
    result: { runs: { id: string; installedCost: number; proposed: { thicknessM: number; option: string } }[]; assumptions: { priceTableIllustrative: boolean; priceTable: string } };
    priceBasis: { kind: string };
    allowed: { edit: boolean; send: boolean; answer: boolean };
  };
}

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

const STAMP = randomUUID().slice(0, 8);
const HOLDER = `reports-holder-${STAMP}@tallowwood-thermal.example`;
const NEIGHBOUR = `reports-neighbour-${STAMP}@ironbark-lagging.example`;

let holder: string;
let neighbor: string;
let owner: string;
let otherOwner: string;
let admin: string;
let lead: SubmittedLead;

/** A price grid of the holder's own: two diameters, two thicknesses, in the plant's currency. */
const ownTable = {
  currency: 'AUD',
  priceTable: {
    label: 'Tallowwood Thermal 2026 rates',
    pipeOuterDiametersM: [0.0334, 0.0603],
    thicknessesM: [0.025, 0.05],
    costPerMetre: [
      [52, 66],
      [58, 74],
    ],
    fittingCoverCostEach: [160, 190],
  },
};

async function json<T>(response: Response): Promise<T> {
  return (await response.json()) as T;
}

describe('the follow-up report', () => {
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-reports-tallowwood', 'Tallowwood Creek (reports)', ['22']);
    await ensureConsultant({ email: HOLDER, name: 'Wren Tallowwood', firm: 'Tallowwood Thermal', phone: '+61 3 5550 2201', regionIds: [region] });
    await ensureConsultant({ email: NEIGHBOUR, name: 'Odo Ironbark', firm: 'Ironbark Lagging', regionIds: [region] });
    lead = await submitLead('2201', { email: `reports-owner.${STAMP}@tallowwood-dairy.example`, company: `Tallowwood Dairy ${STAMP}` });
    const other = await submitLead('2202', { email: `reports-other.${STAMP}@tallowwood-bakery.example` });
    holder = await passwordCookie(HOLDER);
    neighbor = await passwordCookie(NEIGHBOUR);
    admin = await passwordCookie('admin@lagwise.example', DEMO_PASSWORD);
    [owner, otherOwner] = await Promise.all([ownerCookie(lead.ownerEmail), ownerCookie(other.ownerEmail)]);
    expect((await asPerson(holder, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
  });

  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('keeps a price table per consultant, refusing a grid whose rows do not match with the cell named', async () => {
    const before = await json<{ prices: unknown; demo: { priceTable: { label: string } } }>(await asPerson(holder, '/api/consultants/me/prices'));
    expect(before.prices).toBeNull();
    expect(before.demo.priceTable.label).toMatch(/demo/i);

    const ragged = await asPerson(holder, '/api/consultants/me/prices', {
      method: 'PUT',
      body: { ...ownTable, priceTable: { ...ownTable.priceTable, costPerMetre: [[52, 66], [58]] } },
    });
    expect(ragged.status).toBe(400);
    expect((await json<ErrorBody>(ragged)).error.issues?.map((i) => i.path)).toContain('priceTable.costPerMetre');

    const badCurrency = await asPerson(holder, '/api/consultants/me/prices', { method: 'PUT', body: { ...ownTable, currency: 'dollars' } });
    expect(badCurrency.status).toBe(400);
    expect((await json<ErrorBody>(badCurrency)).error.issues?.[0]?.path).toBe('currency');

    const saved = await asPerson(holder, '/api/consultants/me/prices', { method: 'PUT', body: ownTable });
    expect(saved.status).toBe(200);
    const after = await json<{ prices: { currency: string; priceTable: { label: string } } }>(await asPerson(holder, '/api/consultants/me/prices'));
    expect(after.prices).toMatchObject({ currency: 'AUD', priceTable: { label: 'Tallowwood Thermal 2026 rates' } });
    // Another consultant's table is their own.
    expect((await json<{ prices: unknown }>(await asPerson(neighbor, '/api/consultants/me/prices'))).prices).toBeNull();
    expect((await asPerson(owner, '/api/consultants/me/prices')).status).toBe(403);
    expect((await asPerson(null, '/api/consultants/me/prices')).status).toBe(401);
  });

  let draftId: string;

  it('opens one draft per lead, from the latest inventory, with the engine’s suggestion on the consultant’s own prices', async () => {
    const made = await asPerson(holder, `/api/leads/${lead.id}/reports`, { method: 'POST' });
    expect(made.status).toBe(201);
    const draft = (await json<ReportBody>(made)).report;
    draftId = draft.id;
    expect(draft).toMatchObject({ status: 'draft', version: null, allowed: { edit: true, send: true, answer: false }, priceBasis: { kind: 'own-table' } });
    expect(draft.result.assumptions).toMatchObject({ priceTableIllustrative: false, priceTable: 'Tallowwood Thermal 2026 rates' });
    expect(draft.suggestions?.map((s) => s.runId)).toEqual(['steam-1', 'hw-1']);

    const again = await asPerson(holder, `/api/leads/${lead.id}/reports`, { method: 'POST', body: {} });
    expect(again.status).toBe(200);
    expect((await json<ReportBody>(again)).report.id).toBe(draftId);
  });

  it('refuses bad input to a draft with the field’s path, and never a 500', async () => {
    const cases: [unknown, string][] = [
      [{ runs: [{ runId: 'steam-1', thicknessM: -0.01 }] }, 'runs.0.thicknessM'],
      [{ runs: [{ runId: 'no-such-run' }] }, 'runs.0.runId'],
      [{ runs: [{ runId: 'steam-1', material: 'flexible-elastomeric' }] }, 'runs.0.material'],
      [{ runs: [{ runId: 'steam-1', price: { lumpSum: 1000, perMetre: 40 } }] }, 'runs.0.price.lumpSum'],
      [{ incentives: [{ text: 'Gas utility rebate', amount: -5 }] }, 'incentives.0.amount'],
      [{ findings: [{ kind: 'lava', place: 'roof' }] }, 'findings.0.kind'],
      [{ photoIds: [randomUUID()] }, 'photoIds.0'],
      [{ notes: 'x'.repeat(4001) }, 'notes'],
      [{ notes: 'bad \u202e text' }, 'notes'],
      [{ color: 'teal' }, '(body)'],
    ];
    for (const [body, path] of cases) {
      const response = await asPerson(holder, `/api/reports/${draftId}`, { method: 'PATCH', body });
      expect(response.status, JSON.stringify(body)).toBe(400);
      const error = await json<ErrorBody>(response);
      expect(error.error.issues?.map((i) => i.path), JSON.stringify(body)).toContain(path);
    }
    const notJson = await asPerson(holder, `/api/reports/${draftId}`, { method: 'PATCH' });
    expect(notJson.status).toBe(415);
  });

  it('takes the consultant’s thickness and typed price for one run, and will not send the change without a reason', async () => {
    const saved = await asPerson(holder, `/api/reports/${draftId}`, {
      method: 'PATCH',
      body: {
        introduction: 'Thank you for the walk round on Tuesday.',
        runs: [{ runId: 'steam-1', option: 'insulate', material: 'mineral-wool', thicknessM: 0.0762, price: { lumpSum: 2400 } }],
        incentives: [{ text: 'Regional gas efficiency rebate', amount: 300 }],
        exclusions: ['Scaffolding above 4 m'],
        findings: [{ kind: 'burn-point', runId: 'steam-1', place: 'Header valve by the boiler door', surfaceTemperatureC: 148 }],
      },
    });
    expect(saved.status).toBe(200);
    const draft = (await json<ReportBody>(saved)).report;
    const steam = draft.result.runs.find((r) => r.id === 'steam-1');
    expect(steam?.proposed).toMatchObject({ option: 'insulate', thicknessM: 0.0762 });
    expect(steam?.installedCost).toBe(2400);

    const refused = await asPerson(holder, `/api/reports/${draftId}/send`, { method: 'POST', body: {} });
    expect(refused.status).toBe(400);
    expect((await json<ErrorBody>(refused)).error.issues?.map((i) => i.path)).toEqual(['runs.0.reason']);
  });

  let v1: string;

  it('sends a frozen version 1: the lead moves to report_sent with an activity entry; sending again changes nothing', async () => {
    const patched = await asPerson(holder, `/api/reports/${draftId}`, {
      method: 'PATCH',
      body: { runs: [{ runId: 'steam-1', option: 'insulate', material: 'mineral-wool', thicknessM: 0.0762, price: { lumpSum: 2400 }, reason: 'The header runs past the loading door: 3 in keeps it under the touch limit.' }] },
    });
    expect(patched.status).toBe(200);
    const [first, second] = await Promise.all([
      asPerson(holder, `/api/reports/${draftId}/send`, { method: 'POST', body: {} }),
      asPerson(holder, `/api/reports/${draftId}/send`, { method: 'POST', body: {} }),
    ]);
    expect([first.status, second.status].sort()).toEqual([200, 201]);
    const sent = (await json<ReportBody>(first)).report;
    expect((await json<ReportBody>(second)).report.version).toBe(1);
    expect(sent).toMatchObject({ id: draftId, status: 'sent', version: 1, allowed: { edit: false, send: false } });
    v1 = sent.id;

    const again = await asPerson(holder, `/api/reports/${v1}/send`, { method: 'POST', body: {} });
    expect(again.status).toBe(200);
    expect((await json<ReportBody>(again)).report.version).toBe(1);

    const edit = await asPerson(holder, `/api/reports/${v1}`, { method: 'PATCH', body: { notes: 'a late change' } });
    expect(edit.status).toBe(409);
    expect((await json<ErrorBody>(edit)).error.message).toMatch(/Version 1 was sent/);

    const [row] = await getDb().select({ status: assessments.status }).from(assessments).where(eq(assessments.id, lead.id));
    expect(row?.status).toBe('report_sent');
    const entries = await getDb().select().from(activityLog).where(eq(activityLog.assessmentId, lead.id));
    expect(entries.filter((e) => e.action === 'report.sent')).toHaveLength(1);
  });

  it('renders the PDF in the worker with the web page’s figures, same units and rounding, and mails it to the owner', async () => {
    await waitForPdf(holder, v1);
    const page = await asPerson(owner, `/my/reports/${v1}`);
    expect(page.status).toBe(200);
    const figures = pageFigures(await page.text());
    for (const key of ['saving', 'saving-range', 'installed', 'net-cost', 'payback', 'life-cycle', 'co2', 'co2-range', 'heat', 'steam', 'action-1-cost', 'action-1-saving', 'action-1-payback']) {
      expect(figures.get(key), key).toBeTruthy();
    }

    const pdf = await asPerson(owner, `/api/reports/${v1}/pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.headers.get('content-disposition')).toMatch(/^attachment; filename="Lagwise report LW-[^"]+ v1\.pdf"/);
    expect(pdf.headers.get('content-security-policy')).toContain('sandbox');
    const bytes = new Uint8Array(await pdf.arrayBuffer());
    const text = squeeze(pdfText(bytes));
    for (const [key, value] of figures) expect(text, `figure ${key}`).toContain(value);
    expect(text).toContain('Wren Tallowwood, Tallowwood Thermal');
    expect(text).toContain('ASTM C680');
    expect(text).toContain('Old lagging may contain asbestos');
    expect(text).toContain('Header valve by the boiler door');

    const mail = await waitForMessages(lead.ownerEmail, (all) => all.some((m) => m.subject.startsWith('Your follow-up report')));
    const message = mail.find((m) => m.subject.startsWith('Your follow-up report')) as unknown as { html: string; attachments: { filename: string; content_type: string; content: string }[] };
    expect(message.html).toContain(`/my/reports/${v1}`);
    expect(message.attachments).toHaveLength(1);
    expect(message.attachments[0]).toMatchObject({ content_type: 'application/pdf', filename: expect.stringMatching(/ v1\.pdf$/) });
    expect(Buffer.from(message.attachments[0]!.content, 'base64').equals(Buffer.from(bytes))).toBe(true);
  });

  it('keeps a report from everyone but the owner, the holder and admins', async () => {
    const missing = await (await asPerson(otherOwner, `/api/reports/${randomUUID()}`)).text();
    const probes = [
      { who: 'another owner', cookie: otherOwner, paths: [`/api/reports/${v1}`, `/api/reports/${v1}/pdf`, `/my/reports/${v1}`] },
      { who: 'a consultant of the region who does not hold the lead', cookie: neighbor, paths: [`/api/reports/${v1}`, `/api/reports/${v1}/pdf`, `/api/leads/${lead.id}/reports`, `/desk/reports/${v1}`] },
    ];
    for (const { who, cookie, paths } of probes) {
      for (const path of paths) expect((await asPerson(cookie, path)).status, `${who}: ${path}`).toBe(404);
      expect(await (await asPerson(cookie, `/api/reports/${v1}`)).text(), who).toBe(missing);
    }
    expect((await asPerson(null, `/api/reports/${v1}`)).status).toBe(401);
    expect((await asPerson(admin, `/api/reports/${v1}`)).status).toBe(200);
    expect((await asPerson(admin, `/api/reports/${v1}/pdf`)).status).toBe(200);
  });

  let v2: string;

  it('sends a correction as version 2, leaving version 1 readable and saying it was replaced', async () => {
    const opened = await asPerson(holder, `/api/leads/${lead.id}/reports`, { method: 'POST', body: {} });
    expect(opened.status).toBe(201);
    const draft = (await json<ReportBody>(opened)).report;
    // The owner never sees a draft, not even in the list.
    expect((await asPerson(owner, `/api/reports/${draft.id}`)).status).toBe(404);
    expect(await (await asPerson(owner, `/my/assessments/${lead.id}`)).text()).toContain('data-report-versions="1"');
    const listed = await json<{ reports: { id: string; status: string }[] }>(await asPerson(holder, `/api/leads/${lead.id}/reports`));
    expect(listed.reports.map((r) => [r.id, r.status])).toEqual([
      [draft.id, 'draft'],
      [v1, 'sent'],
    ]);
    expect((await asPerson(holder, `/api/reports/${draft.id}/pdf`)).status).toBe(409);

    expect((await asPerson(holder, `/api/reports/${draft.id}`, { method: 'PATCH', body: { notes: 'Corrected the rebate amount.', incentives: [{ text: 'Regional gas efficiency rebate', amount: 450 }] } })).status).toBe(200);
    const sent = await asPerson(holder, `/api/reports/${draft.id}/send`, { method: 'POST', body: {} });
    expect(sent.status).toBe(201);
    const second = (await json<ReportBody>(sent)).report;
    v2 = second.id;
    expect(second.version).toBe(2);

    const first = (await json<ReportBody>(await asPerson(owner, `/api/reports/${v1}`))).report;
    expect(first).toMatchObject({ version: 1, replacedBy: { version: 2 }, allowed: { answer: false } });
    const page = await (await asPerson(owner, `/my/reports/${v1}`)).text();
    expect(page).toContain('Replaced by version 2');
    expect((await asPerson(owner, `/api/reports/${v1}/pdf`)).status).toBe(200);
    const list = await (await asPerson(owner, `/my/assessments/${lead.id}`)).text();
    expect(list).toContain('data-report-versions="2"');
  });

  it('takes the owner’s answer on the latest version only, once, and tells the consultant', async () => {
    await waitForPdf(holder, v2);
    const stale = await asPerson(owner, `/api/reports/${v1}/answer`, { method: 'POST', body: { accept: true } });
    expect(stale.status).toBe(409);
    expect((await asPerson(holder, `/api/reports/${v2}/answer`, { method: 'POST', body: { accept: true } })).status).toBe(403);
    const bad = await asPerson(owner, `/api/reports/${v2}/answer`, { method: 'POST', body: { accept: 'yes' } });
    expect(bad.status).toBe(400);
    expect((await json<ErrorBody>(bad)).error.issues?.[0]?.path).toBe('accept');

    const accepted = await asPerson(owner, `/api/reports/${v2}/answer`, { method: 'POST', body: { accept: true, reason: 'Start with the steam header please.' } });
    expect(accepted.status).toBe(200);
    expect((await json<ReportBody>(accepted)).report.answer).toMatchObject({ accept: true, reason: 'Start with the steam header please.' });
    expect((await asPerson(owner, `/api/reports/${v2}/answer`, { method: 'POST', body: { accept: true } })).status).toBe(200);
    expect((await asPerson(owner, `/api/reports/${v2}/answer`, { method: 'POST', body: { accept: false } })).status).toBe(409);

    const mail = await waitForMessages(HOLDER, (all) => all.some((m) => m.subject.includes('wants to go ahead')));
    expect(mail.filter((m) => m.subject.includes('wants to go ahead'))).toHaveLength(1);
    const detail = await json<{ lead: { timeline: { action: string }[] } }>(await asPerson(holder, `/api/leads/${lead.id}`));
    expect(detail.lead.timeline.map((e) => e.action)).toContain('report.answered');

    // The consultant confirms through the pipeline; no further version can be sent then.
    expect((await asPerson(holder, `/api/leads/${lead.id}/moves`, { method: 'POST', body: { to: 'signed' } })).status).toBe(200);
    const late = await asPerson(holder, `/api/leads/${lead.id}/reports`, { method: 'POST', body: {} });
    expect(late.status).toBe(409);
  });

  it('starts a draft from the lead’s latest site walk, and moves it to a newer walk only when asked', async () => {
    const walkedLead = await submitLead('2203', { email: `reports-walked.${STAMP}@tallowwood-creamery.example` });
    expect((await asPerson(holder, `/api/leads/${walkedLead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const history = await json<{ original: { plant: { runs: { id: string; lengthM: number }[] } } }>(await asPerson(holder, `/api/leads/${walkedLead.id}/revisions`));
    const walk = async (baseNumber: number, lengthM: number) => {
      const runs = history.original.plant.runs.map((run) => (run.id === 'steam-1' ? { ...run, lengthM } : run));
      const saved = await asPerson(holder, `/api/leads/${walkedLead.id}/revisions`, { method: 'POST', body: { baseNumber, reason: `Paced the header: ${lengthM} m`, runs, areas: [] } });
      expect(saved.status, await saved.clone().text()).toBe(201);
    };
    const steamLength = (report: ReportBody['report']) => (report.result.runs as unknown as { id: string; lengthM: number }[]).find((r) => r.id === 'steam-1')?.lengthM;
    expect(history.original.plant.runs.find((r) => r.id === 'steam-1')?.lengthM).toBe(20);
    await walk(0, 31);

    const opened = await asPerson(holder, `/api/leads/${walkedLead.id}/reports`, { method: 'POST', body: {} });
    expect(opened.status).toBe(201);
    const draft = (await json<ReportBody & { report: { baseRevisionNumber: number } }>(opened)).report;
    expect(draft.baseRevisionNumber).toBe(1);
    expect(steamLength(draft)).toBe(31);

    // A second walk saved after the draft was started: the draft stays on walk 1 and says a newer one is there.
    await walk(1, 33);
    const kept = (await json<{ report: ReportBody['report'] & { baseRevisionNumber: number; lead: { latestRevisionNumber: number } } }>(await asPerson(holder, `/api/reports/${draft.id}`))).report;
    expect(kept).toMatchObject({ baseRevisionNumber: 1, lead: { latestRevisionNumber: 2 } });
    expect(steamLength(kept)).toBe(31);

    const missing = await asPerson(holder, `/api/reports/${draft.id}`, { method: 'PATCH', body: { baseRevisionNumber: 3 } });
    expect(missing.status).toBe(400);
    expect((await json<ErrorBody>(missing)).error.issues?.map((i) => i.path)).toEqual(['baseRevisionNumber']);

    const moved = (await json<{ report: ReportBody['report'] & { baseRevisionNumber: number } }>(await asPerson(holder, `/api/reports/${draft.id}`, { method: 'PATCH', body: { baseRevisionNumber: 2 } }))).report;
    expect(moved.baseRevisionNumber).toBe(2);
    expect(steamLength(moved)).toBe(33);

    const sent = await asPerson(holder, `/api/reports/${draft.id}/send`, { method: 'POST', body: {} });
    expect(sent.status).toBe(201);
    await waitForPdf(holder, draft.id);
    const page = await (await asPerson(holder, `/desk/reports/${draft.id}`)).text();
    expect(page).toContain('Based on site walk 2');
  });

  it('answers odd requests to every report route without a 500', async () => {
    const bodies = [null, [], 'text', 42, { accept: null }, { runs: 'all' }, { currency: 'AUD', priceTable: { label: 'x', pipeOuterDiametersM: [], thicknessesM: [], costPerMetre: [], fittingCoverCostEach: [] } }];
    const routes: [string, string][] = [
      ['POST', `/api/leads/${lead.id}/reports`],
      ['PATCH', `/api/reports/${v2}`],
      ['POST', `/api/reports/${v2}/send`],
      ['POST', `/api/reports/${v2}/answer`],
      ['PUT', '/api/consultants/me/prices'],
      ['GET', '/api/reports/not-a-uuid'],
      ['GET', '/api/reports/not-a-uuid/pdf'],
    ];
    for (const [method, path] of routes) {
      for (const body of bodies) {
        for (const cookie of [holder, owner]) {
          const response = await asPerson(cookie, path, { method, ...(method === 'GET' ? {} : { body }) });
          expect(response.status, `${method} ${path} ${JSON.stringify(body)}`).toBeLessThan(500);
        }
      }
    }
    expect((await messagesTo(lead.ownerEmail)).length).toBeGreaterThan(0);
  });
});
