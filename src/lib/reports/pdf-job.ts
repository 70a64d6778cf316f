/**
 * The worker's part of sending a report: render the version's PDF from what it froze, store it
 * in object storage, then — in one transaction with recording where it is — queue the owner's
 * e-mail that carries it. A retry after a crash renders the same bytes under the same key and
 * queues the e-mail once.
 */
import sharp from 'sharp';
import { getDb } from '../../db/client';
import { findLead, listLeadAttachments, listLeadRuns } from '../../db/queries/leads';
import { findReport, recordReportPdf } from '../../db/queries/reports';
import { inTransaction } from '../../db/transaction';
import { enqueue, jobNames } from '../jobs/queue';
import { getObject, putObject } from '../storage/objects';
import { paperSizeFor } from './paper';
import { reportPdfKey } from './pdf-file';
import { renderReportPdf, type PdfPhoto } from './pdf/render';
import { frozenSource } from './source';

/** Thrown when there is nothing to render (the report or its lead is gone): retrying cannot help. */
export class NoReportToRender extends Error {}

/** Photos at a size that prints well and keeps the PDF small enough to mail. */
const PHOTO_WIDTH_PX = 900;

async function photosFor(leadId: string, ids: readonly string[], labels: ReadonlyMap<string, string>): Promise<PdfPhoto[]> {
  const files = await listLeadAttachments(getDb(), leadId);
  const photos: PdfPhoto[] = [];
  for (const id of ids) {
    const file = files.find((f) => f.id === id && f.contentType.startsWith('image/'));
    if (!file) continue;
    const stored = await getObject(file.objectKey);
    if (!stored) continue;
    const data = await sharp(stored.bytes).rotate().resize({ width: PHOTO_WIDTH_PX, withoutEnlargement: true }).jpeg({ quality: 78 }).toBuffer();
    photos.push({ data, caption: file.pipeRunId ? (labels.get(file.pipeRunId) ?? 'A run') : 'The plant' });
  }
  return photos;
}

/** Renders and stores a sent version's PDF, then queues the owner's e-mail. */
export async function renderAndStoreReportPdf(reportId: string): Promise<void> {
  const report = await findReport(getDb(), reportId);
  if (!report || report.status !== 'sent') throw new NoReportToRender(`report ${reportId} is not a sent version`);
  // Made already — or made and deleted after the retention period, which must not bring it back.
  if (report.pdfObjectKey || report.pdfRenderedAt) return;
  const found = await findLead(getDb(), report.assessmentId, undefined);
  if (!found) throw new NoReportToRender(`the lead of report ${reportId} no longer exists`);
  const source = frozenSource(report, found.lead, null);
  const runLabels = new Map((await listLeadRuns(getDb(), found.lead.id)).map((run) => [run.id, run.label]));
  const photos = await photosFor(found.lead.id, source.composition.photoIds, runLabels);
  const bytes = await renderReportPdf(source, { pageSize: paperSizeFor(found.lead.countryCode), createdAt: report.sentAt ?? report.createdAt, photos });
  const key = reportPdfKey(report);
  await putObject(key, bytes, 'application/pdf');
  await inTransaction(async (tx, sqlRunner) => {
    const recorded = await recordReportPdf(tx, report.id, key, bytes.byteLength);
    if (!recorded) return;
    await enqueue(jobNames.sendEmail, { email: { template: 'report-sent', to: found.lead.contactEmail, props: { reportId: report.id } } }, { sqlRunner });
  });
}
