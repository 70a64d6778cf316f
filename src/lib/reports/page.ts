/**
 * What the report's pages read: the report as the viewer may see it, presented, or the answer
 * for one they cannot reach (not found, whatever the reason).
 */
import type { ReportView } from '../../schemas/reports';
import { DomainError } from '../errors';
import type { SessionUser } from '../session';
import { presentReport, type PresentedReport } from './present';
import { RETENTION } from '../retention/policy';
import { getReportFor } from './read';
import { viewSource } from './source';

export interface ReportPage {
  view: ReportView;
  presented: PresentedReport;
}

/** The report for a page, or null when the viewer cannot reach it. */
export async function reportPageFor(user: SessionUser, reportId: string | undefined): Promise<ReportPage | null> {
  try {
    const view = await getReportFor(user, reportId);
    return { view, presented: presentReport(viewSource(view)) };
  } catch (error) {
    if (error instanceof DomainError && error.code === 'NOT_FOUND') return null;
    throw error;
  }
}

/** What a page says while a sent version's PDF is still being made. */
export const PDF_PENDING_NOTE = 'The PDF is being prepared; reload the page in a few seconds to download it.';

/** What a page says where the PDF should be: being made, or deleted after the retention period. */
export function pdfNoteFor(view: Pick<ReportView, 'pdfRemoved'>): string {
  return view.pdfRemoved
    ? `The PDF was deleted with the owner's details ${RETENTION.inactiveMonths} months after the assessment's last change, as the privacy page says; the figures are all here.`
    : PDF_PENDING_NOTE;
}
