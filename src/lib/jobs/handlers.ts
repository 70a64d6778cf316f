/** What each queue's job does. The worker runs these; tests can call them directly. */
import type PgBoss from 'pg-boss';
import { getDb } from '../../db/client';
import { getAssessmentForMail } from '../../db/queries/assessments';
import { listRegionConsultants } from '../../db/queries/consultants';
import { findSignInAccount, revokeSignInLinks } from '../../db/queries/sign-in-links';
import { inTransaction } from '../../db/transaction';
import { getAuth } from '../auth';
import { sendEmail } from '../email/mailer';
import { NothingToSend, renderEmail } from '../email/render';
import type { LinkMailMetadata, SubmissionLinkMetadata } from '../sign-in-links';
import { spentLinkPath } from '../sign-in-again';
import { sweepRetention } from '../retention/sweep';
import { alertAdminsOfUnrouted, mailStaleDigest } from '../admin/oversight';
import { derivedJobId, enqueue, jobExists, jobNames } from './queue';
import type { JobName, JobPayloads } from './names';
import { NoReportToRender, renderAndStoreReportPdf } from '../reports/pdf-job';

type Handler<N extends JobName> = (job: PgBoss.Job<JobPayloads[N]>) => Promise<void>;

/** Logs and swallows a job that can never succeed, so it is not retried for hours. */
async function unlessGone(work: () => Promise<void>): Promise<void> {
  try {
    await work();
  } catch (error) {
    if (error instanceof NothingToSend) {
      console.warn(`[worker] dropped: ${error.message}`);
      return;
    }
    throw error;
  }
}

export const jobHandlers: { [N in JobName]: Handler<N> } = {
  'email-send': (job) =>
    unlessGone(async () => {
      const rendered = await renderEmail(job.data.email);
      // The job id is stable across retries, so the mail service stores the message once.
      await sendEmail(rendered, `lagwise-${job.id}`);
    }),

  'submission-confirm': (job) =>
    unlessGone(async () => {
      const assessment = await getAssessmentForMail(getDb(), job.data.assessmentId);
      if (!assessment) throw new NothingToSend(`assessment ${job.data.assessmentId} no longer exists`);
      // Run twice (its worker killed after queuing the mail), the job finds the mail already queued.
      const mailJobId = derivedJobId('submission-confirmation', assessment.id);
      if (await jobExists(jobNames.sendEmail, mailJobId)) return;
      const metadata: SubmissionLinkMetadata & LinkMailMetadata = { purpose: 'submission-confirmation', assessmentId: assessment.id, mailJobId };
      // A new link revokes the older ones; better-auth mints it and hands it to deliverSignInLink, which queues the mail.
      await revokeSignInLinks(getDb(), assessment.contactEmail);
      await getAuth().api.signInMagicLink({
        body: {
          email: assessment.contactEmail,
          callbackURL: `/my/assessments/${assessment.id}`,
          errorCallbackURL: spentLinkPath(assessment.contactEmail, `/my/assessments/${assessment.id}`),
          metadata: { ...metadata },
        },
        headers: new Headers(),
      });
    }),

  'consultants-alert': (job) =>
    unlessGone(async () => {
      const assessment = await getAssessmentForMail(getDb(), job.data.assessmentId);
      if (!assessment) throw new NothingToSend(`assessment ${job.data.assessmentId} no longer exists`);
      if (!assessment.regionId) return;
      // Someone claimed the reopened lead before this job ran: nobody needs telling.
      if (job.data.reopened && assessment.status !== 'fresh') return;
      const excluded = new Set(job.data.excludeUserIds ?? []);
      const consultants = (await listRegionConsultants(getDb(), assessment.regionId)).filter((c) => !excluded.has(c.id));
      // One transaction: a retry after a crash queues every alert again or none twice.
      await inTransaction(async (_tx, sqlRunner) => {
        for (const consultant of consultants) {
          await enqueue(
            jobNames.sendEmail,
            {
              email: {
                template: 'consultant-alert',
                to: consultant.email,
                props: { assessmentId: assessment.id, consultantName: consultant.name, ...(job.data.reopened ? { reopened: true } : {}) },
              },
            },
            { sqlRunner, id: derivedJobId('consultant-alert', job.id, consultant.email) },
          );
        }
      });
    }),

  'admins-unrouted-alert': (job) =>
    unlessGone(async () => {
      const assessment = await getAssessmentForMail(getDb(), job.data.assessmentId);
      if (!assessment) throw new NothingToSend(`assessment ${job.data.assessmentId} no longer exists`);
      // Routed or handed over before the job ran: nobody needs telling.
      if (assessment.status !== 'unrouted') return;
      await alertAdminsOfUnrouted(assessment.id);
    }),

  'stale-leads-check': async () => {
    await mailStaleDigest();
  },

  'sign-in-link-request': async (job) => {
    // Only here, off the request, do we look the address up: the form answers the same, in the
    // same time, for an address with an account and one without.
    const account = await findSignInAccount(getDb(), job.data.email);
    if (!account) return;
    const mailJobId = derivedJobId('sign-in-link', job.id);
    if (await jobExists(jobNames.sendEmail, mailJobId)) return;
    const metadata: LinkMailMetadata = { mailJobId };
    await revokeSignInLinks(getDb(), job.data.email);
    await getAuth().api.signInMagicLink({
      body: { email: job.data.email, callbackURL: job.data.next, errorCallbackURL: spentLinkPath(job.data.email, job.data.next), metadata: { ...metadata } },
      headers: new Headers(),
    });
  },

  'report-pdf-render': async (job) => {
    try {
      await renderAndStoreReportPdf(job.data.reportId);
    } catch (error) {
      if (error instanceof NoReportToRender) {
        console.warn(`[worker] dropped: ${error.message}`);
        return;
      }
      throw error;
    }
  },
  'retention-sweep': async () => {
    const outcome = await sweepRetention(getDb());
    console.log(`[worker] retention sweep: ${JSON.stringify(outcome)}`);
  },
};
