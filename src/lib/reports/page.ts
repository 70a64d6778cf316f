/**
 * What the report's pages read: the report as the viewer may see it, presented, or the answer
 * for one they cannot reach (not found, whatever the reason).
 */
import type { ReportView } from '../../schemas/reports';
import { DomainError } from '../errors';
import type { SessionUser } from '../session';
import { presentReport, type PresentedReport } from './present';
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
