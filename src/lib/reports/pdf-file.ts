/**
 * A sent version's PDF as stored by the worker: its key in object storage and the file name the
 * owner downloads it under. Drafts have no PDF; a version whose PDF is still being rendered says
 * so, and a storage outage is a 503 the reader can wait out.
 */
import type { Report } from '../../db/schema';
import { DomainError } from '../errors';
import type { SessionUser } from '../session';
import { getObject } from '../storage/objects';
import { reachReport } from './access';
import { RETENTION } from '../retention/policy';

/** Where a version's PDF is stored: one object per version, never overwritten with other figures. */
export function reportPdfKey(report: Pick<Report, 'assessmentId' | 'id' | 'version'>): string {
  return `reports/${report.assessmentId}/${report.id}-v${report.version}.pdf`;
}

/** The name a reader's browser saves the PDF under. */
export function reportPdfFileName(reference: string, version: number | null): string {
  return `Lagwise report ${reference} v${version ?? 0}.pdf`;
}

export async function reportPdfFor(user: SessionUser, reportId: string | undefined): Promise<{ bytes: Uint8Array; fileName: string }> {
  const { found, report } = await reachReport(user, reportId);
  if (report.status !== 'sent') throw new DomainError('CONFLICT', 'A draft has no PDF; the PDF is made when the report is sent.');
  if (!report.pdfObjectKey && report.pdfRenderedAt) {
    throw new DomainError('GONE', `The PDF of this version was deleted with the owner's details, ${RETENTION.inactiveMonths} months after the assessment's last change (see the privacy page); the report's figures are still on this page.`);
  }
  if (!report.pdfObjectKey) {
    throw new DomainError('SERVICE_UNAVAILABLE', 'The PDF of this version is still being prepared; try again in a few seconds.', undefined, { retryAfterSeconds: 5 });
  }
  const stored = await getObject(report.pdfObjectKey);
  if (!stored) throw new DomainError('SERVICE_UNAVAILABLE', 'The PDF of this version could not be read from storage just now; try again in a minute.');
  return { bytes: stored.bytes, fileName: reportPdfFileName(found.lead.reference, report.version) };
}
