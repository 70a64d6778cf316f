/**
 * The owner's answer to a report: accept (asks to be contacted to go ahead) or decline, with an
 * optional reason. It is recorded on the latest version, written to the lead's history and
 * mailed to the consultant holding the lead through the queue — in one transaction. The lead
 * moves to `signed` or `closed` only when the consultant confirms it with a pipeline move.
 */
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { findConsultantProfile } from '../../db/queries/leads';
import { findReport, latestVersionNumber, recordReportAnswer } from '../../db/queries/reports';
import { inTransaction } from '../../db/transaction';
import type { ReportAnswerRequest, ReportView } from '../../schemas/reports';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import type { SessionUser } from '../session';
import { reachReport } from './access';
import { reportView } from './read';

/** POST /api/reports/{id}/answer. Answering again the same way changes nothing. */
export async function answerReport(user: SessionUser, reportId: string | undefined, request: ReportAnswerRequest): Promise<ReportView> {
  const { found, role, report } = await reachReport(user, reportId);
  if (role !== 'owner') throw new DomainError('FORBIDDEN', 'Only the plant’s owner answers a report.');
  if (report.status !== 'sent') throw new DomainError('CONFLICT', 'This report has not been sent.');
  const wanted = request.accept ? 'accepted' : 'declined';
  if (report.answer !== null) {
    if (report.answer === wanted) return reportView(found, role, report, user);
    throw new DomainError(
      'CONFLICT',
      `You ${report.answer === 'accepted' ? 'accepted' : 'declined'} this report already; to change your answer, contact your consultant.`,
      'accept',
    );
  }
  const latest = await latestVersionNumber(getDb(), found.lead.id);
  if (report.version !== latest) {
    throw new DomainError('CONFLICT', `Version ${latest} of this report replaced version ${report.version}; read and answer version ${latest}.`, undefined, { latestVersion: latest });
  }
  if (found.lead.status !== 'report_sent') {
    throw new DomainError('CONFLICT', 'This assessment has moved on since the report was sent; contact your consultant.');
  }
  const holderId = found.lead.claimedByUserId;
  const holder = holderId ? await findConsultantProfile(getDb(), holderId) : null;
  const reason = request.reason?.trim() ? request.reason.trim() : null;
  const answered = await inTransaction(async (tx, sqlRunner) => {
    const row = await recordReportAnswer(tx, report.id, { answer: wanted, answerReason: reason });
    if (!row) return null;
    await recordActivity(tx, {
      assessmentId: found.lead.id,
      actorUserId: user.id,
      action: 'report.answered',
      detail: { reportId: report.id, version: report.version, accept: request.accept, ...(reason ? { reason } : {}) },
    });
    if (holder?.email) {
      await enqueue(jobNames.sendEmail, { email: { template: 'report-answered', to: holder.email, props: { reportId: report.id } } }, { sqlRunner });
    }
    return row;
  });
  // Answered at the same moment from another tab: read what was recorded and answer as above.
  const now = answered ?? (await findReport(getDb(), report.id));
  if (!now) throw new Error('a sent report is never deleted');
  if (!answered && now.answer !== wanted) {
    throw new DomainError('CONFLICT', 'This report was answered the other way a moment ago; contact your consultant to change it.', 'accept');
  }
  return reportView(found, role, now, user);
}
