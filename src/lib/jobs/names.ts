/** The queues Lagwise uses and what each job carries. Jobs carry ids and data, never HTML. */
import type { OutgoingEmail } from '../email/messages';

export const jobNames = {
  /** Render one e-mail and hand it to the mail service; retried until it is accepted. */
  sendEmail: 'email-send',
  /** Mint the owner's sign-in link for a new assessment and mail the confirmation. */
  confirmSubmission: 'submission-confirm',
  /** Tell the consultants of the assessment's region that a lead is waiting. */
  alertConsultants: 'consultants-alert',
  /** Tell every admin that an assessment matched no region. */
  alertAdminsUnrouted: 'admins-unrouted-alert',
  /** Hourly (pg-boss schedule): mail the admins about stale open leads, at most once a day. */
  checkStaleLeads: 'stale-leads-check',
  /** Someone asked for a sign-in link: mail one if the address has an account, else nothing. */
  requestSignInLink: 'sign-in-link-request',
  /** Render a sent report's PDF into object storage, then queue the owner's e-mail with it attached. */
  renderReportPdf: 'report-pdf-render',
  /** Daily (pg-boss schedule): remove or anonymize what the privacy page says goes (src/lib/retention). */
  sweepRetention: 'retention-sweep',
} as const;

export type JobName = (typeof jobNames)[keyof typeof jobNames];

export interface JobPayloads {
  'email-send': { email: OutgoingEmail };
  'submission-confirm': { assessmentId: string };
  /**
   * `reopened`: a consultant handed the lead back, so it is open again; `excludeUserIds`: who not
   * to tell (the one who handed it back).
   */
  'consultants-alert': { assessmentId: string; reopened?: boolean; excludeUserIds?: string[] };
  'admins-unrouted-alert': { assessmentId: string };
  'stale-leads-check': Record<string, never>;
  'sign-in-link-request': { email: string; next: string };
  'report-pdf-render': { reportId: string };
  'retention-sweep': Record<string, never>;
}

/** When the stale-lead check runs (cron, UTC): hourly, so a digest goes out soon after leads go stale. */
export const STALE_CHECK_CRON = '17 * * * *';

/**
 * Retry policy per queue: mail keeps trying for hours so an outage delays and loses nothing.
 * A job whose worker died is handed out again after `expireInSeconds` (every mail call has a
 * timeout well under it, src/lib/email/mailer.ts).
 */
export function queuePolicies(retryDelaySeconds: number, expireInSeconds = 300) {
  const patient = { retryLimit: 14, retryDelay: retryDelaySeconds, retryBackoff: true, retentionDays: 14, expireInSeconds };
  return {
    'email-send': patient,
    'submission-confirm': patient,
    'consultants-alert': patient,
    'admins-unrouted-alert': patient,
    'report-pdf-render': patient,
    // The next hour's run does the same work; no need to retry for long.
    'stale-leads-check': { retryLimit: 2, retryDelay: retryDelaySeconds, retryBackoff: true, retentionDays: 2 },
    'sign-in-link-request': { ...patient, retryLimit: 5 },
    // Tomorrow's run does the same work.
    'retention-sweep': { retryLimit: 2, retryDelay: retryDelaySeconds, retryBackoff: true, retentionDays: 7 },
  } satisfies Record<JobName, object>;
}
