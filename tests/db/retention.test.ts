/**
 * The privacy page's promises, kept: the retention sweep (a daily pg-boss schedule) deletes old
 * junk, takes the person off assessments inactive past the period, deletes their files (photos,
 * PDFs and the PDFs of reports sent to them) and the account no assessment names any more — and
 * leaves recent assessments alone. Real rows, made through the API, aged in the database.
 */
import { eq, inArray, sql } from 'drizzle-orm';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { ENGINE_VERSION } from '../../src/engine';
import { assessments, attachments, reports, user } from '../../src/db/schema';
import { jobNames } from '../../src/lib/jobs/names';
import { REMOVED, RETENTION, RETENTION_SWEEP_CRON } from '../../src/lib/retention/policy';
import { monthsBefore, sweepRetention } from '../../src/lib/retention/sweep';
import { renderAndStoreReportPdf } from '../../src/lib/reports/pdf-job';
import { getObject, putObject } from '../../src/lib/storage/objects';
import { ensureTestRegion, submissionForm, validSubmission } from '../support/fixtures';
import { appFetch, stack } from '../support/stack';

interface Created {
  assessment: { id: string };
}

async function submit(input: ReturnType<typeof validSubmission>, photo?: Uint8Array<ArrayBuffer>): Promise<string> {
  const response = await appFetch('/api/assessments', {
    method: 'POST',
    body: submissionForm(input, photo ? [{ field: 'photos.steam-1', name: 'hollow-oak-header.jpg', type: 'image/jpeg', bytes: photo }] : []),
  });
  expect(response.status).toBe(201);
  return ((await response.json()) as Created).assessment.id;
}

/** Moves an assessment's clock back, as if it had been made (and last touched) `days` ago. */
async function age(id: string, days: number): Promise<void> {
  await getDb()
    .update(assessments)
    .set({ createdAt: sql`now() - make_interval(days => ${days})`, updatedAt: sql`now() - make_interval(days => ${days})` })
    .where(eq(assessments.id, id));
}

const now = new Date();
const daysAgo = (date: Date) => Math.ceil((now.getTime() - date.getTime()) / 86_400_000);

describe('the retention sweep', () => {
  const ids = { oldJunk: '', newJunk: '', inactive: '', active: '' };
  let inactiveOwnerEmail = '';
  let photoKey = '';
  let reportPdfKey = '';
  let reportId = '';

  beforeAll(async () => {
    await ensureTestRegion();
    const { default: sharp } = await import('sharp');
    const jpeg = new Uint8Array(await sharp({ create: { width: 48, height: 32, channels: 3, background: '#8e3a15' } }).jpeg().toBuffer());
    const inactive = validSubmission();
    inactiveOwnerEmail = inactive.contact.email;
    ids.inactive = await submit(inactive, jpeg);
    ids.active = await submit(validSubmission());
    ids.oldJunk = await submit({ ...validSubmission(), website: 'https://spam.example' });
    ids.newJunk = await submit({ ...validSubmission(), website: 'https://spam.example' });
    const [file] = await getDb().select({ key: attachments.objectKey }).from(attachments).where(eq(attachments.assessmentId, ids.inactive));
    photoKey = file!.key;
    // A report sent to the inactive owner, its PDF stored as the worker stores one.
    reportPdfKey = `reports/${ids.inactive}/retention-check-v1.pdf`;
    await putObject(reportPdfKey, new TextEncoder().encode('%PDF-1.7 Report for Petra Lindqvist, Quarry Hill Dairy'), 'application/pdf');
    const [report] = await getDb()
      .insert(reports)
      .values({
        assessmentId: ids.inactive,
        status: 'sent',
        version: 1,
        baseRevisionNumber: 0,
        composition: {},
        plantInput: inactive.estimate,
        resultSnapshot: {},
        engineVersion: ENGINE_VERSION,
        sentAt: new Date(),
        pdfObjectKey: reportPdfKey,
        pdfByteSize: 55,
        pdfRenderedAt: new Date(),
      })
      .returning({ id: reports.id });
    reportId = report!.id;
    await age(ids.inactive, daysAgo(monthsBefore(now, RETENTION.inactiveMonths)) + 2);
    await age(ids.active, daysAgo(monthsBefore(now, RETENTION.inactiveMonths)) - 2);
    await age(ids.oldJunk, RETENTION.junkDays + 1);
    await age(ids.newJunk, RETENTION.junkDays - 1);
  });

  afterAll(async () => {
    await closeDb();
  });

  it('deletes junk past its days, takes the person off an inactive assessment, and leaves the rest alone', async () => {
    expect(await getObject(photoKey)).not.toBeNull();
    const outcome = await sweepRetention(getDb(), now);
    expect(outcome.junkDeleted).toBeGreaterThanOrEqual(1);
    expect(outcome.assessmentsAnonymised).toBeGreaterThanOrEqual(1);

    const rows = await getDb()
      .select({ id: assessments.id, contactName: assessments.contactName, contactEmail: assessments.contactEmail, contactPhone: assessments.contactPhone, companyName: assessments.companyName, plantName: assessments.plantName, ownerUserId: assessments.ownerUserId, runCount: assessments.runCount })
      .from(assessments)
      .where(inArray(assessments.id, Object.values(ids)));
    const byId = new Map(rows.map((row) => [row.id, row]));

    expect(byId.has(ids.oldJunk)).toBe(false);
    expect(byId.has(ids.newJunk)).toBe(true);

    expect(byId.get(ids.inactive)).toEqual({
      id: ids.inactive,
      contactName: REMOVED,
      contactEmail: REMOVED,
      contactPhone: null,
      companyName: REMOVED,
      plantName: null,
      ownerUserId: null,
      runCount: 2,
    });
    expect(await getDb().select().from(attachments).where(eq(attachments.assessmentId, ids.inactive))).toEqual([]);
    expect(await getObject(photoKey)).toBeNull();
    expect(await getObject(reportPdfKey)).toBeNull();
    const [report] = await getDb().select({ key: reports.pdfObjectKey, renderedAt: reports.pdfRenderedAt, version: reports.version }).from(reports).where(eq(reports.id, reportId));
    expect(report?.key).toBeNull();
    expect(report?.version).toBe(1);
    expect(report?.renderedAt).toBeInstanceOf(Date);
    expect(await getDb().select({ id: user.id }).from(user).where(eq(user.email, inactiveOwnerEmail))).toEqual([]);

    const active = byId.get(ids.active);
    expect(active?.contactName).toBe('Petra Lindqvist');
    expect(active?.ownerUserId).not.toBeNull();
  });

  it("a sent report's deleted PDF is not made again by a render job (it would name the owner again)", async () => {
    await renderAndStoreReportPdf(reportId);
    const [report] = await getDb().select({ key: reports.pdfObjectKey }).from(reports).where(eq(reports.id, reportId));
    expect(report?.key).toBeNull();
  });

  it('a second sweep finds nothing more to do with these rows', async () => {
    const before = await getDb().select({ id: assessments.id, contactName: assessments.contactName }).from(assessments).where(inArray(assessments.id, Object.values(ids)));
    await sweepRetention(getDb(), now);
    const after = await getDb().select({ id: assessments.id, contactName: assessments.contactName }).from(assessments).where(inArray(assessments.id, Object.values(ids)));
    expect(after).toEqual(before);
  });

  it('runs every day on the worker’s pg-boss schedule', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      const schedules = await client.query<{ name: string; cron: string }>('select name, cron from pgboss.schedule');
      expect(schedules.rows).toContainEqual({ name: jobNames.sweepRetention, cron: RETENTION_SWEEP_CRON });
    } finally {
      await client.end();
    }
  });
});
