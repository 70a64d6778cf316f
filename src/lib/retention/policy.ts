/**
 * How long Lagwise keeps what, declared once: the privacy page states these periods and the
 * daily retention sweep (./sweep.ts, a pg-boss schedule) makes them true.
 */
export const RETENTION = {
  /** Submissions caught as junk (the form's bot trap): deleted whole after this many days. */
  junkDays: 30,
  /**
   * An assessment with no activity for this many months loses what identifies a person: the
   * contact's name, e-mail, phone, company and plant name, the photos and PDFs (the reports' PDFs too), and the link to
   * the owner's account. The plant's figures stay, with nobody's name on them.
   */
  inactiveMonths: 24,
  /** An owner's account with no assessment left that names them is deleted (with its sessions). */
  ownerAccountWithoutAssessments: true,
  /** Sign-in links and sessions that have expired are deleted (links work within 24 hours). */
  expiredLinksAndSessions: true,
} as const;

/** When the retention sweep runs (cron, UTC): once a day, in the quiet of the night. */
export const RETENTION_SWEEP_CRON = '41 3 * * *';

/** What an anonymized assessment shows where a person's details were. */
export const REMOVED = '(removed)';
