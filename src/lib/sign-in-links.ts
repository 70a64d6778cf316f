/**
 * better-auth hands us each e-mailed sign-in link; we queue the mail rather than send it
 * inline, so a mail outage delays the link instead of failing the request.
 */
import { enqueue, jobNames } from './jobs/queue';
import type { OutgoingEmail } from './email/messages';

export interface SignInLinkRequest {
  email: string;
  url: string;
  metadata?: Record<string, unknown>;
}

/** Metadata every link of ours carries: the id of the mail job, so a retried job mails once. */
export interface LinkMailMetadata {
  mailJobId: string;
}

/** The metadata a submission passes when it asks for the owner's first link. */
export interface SubmissionLinkMetadata {
  purpose: 'submission-confirmation';
  assessmentId: string;
}

function isSubmissionMetadata(metadata: Record<string, unknown> | undefined): metadata is Record<string, unknown> & SubmissionLinkMetadata {
  return metadata?.purpose === 'submission-confirmation' && typeof metadata.assessmentId === 'string';
}

export function signInLinkEmail({ email, url, metadata }: SignInLinkRequest): OutgoingEmail {
  if (isSubmissionMetadata(metadata)) {
    return {
      template: 'submission-confirmation',
      to: email,
      props: { signInUrl: url, assessmentId: metadata.assessmentId },
    };
  }
  return { template: 'sign-in-link', to: email, props: { signInUrl: url } };
}

export async function deliverSignInLink(request: SignInLinkRequest): Promise<void> {
  const mailJobId = typeof request.metadata?.mailJobId === 'string' ? request.metadata.mailJobId : undefined;
  await enqueue(jobNames.sendEmail, { email: signInLinkEmail(request) }, { id: mailJobId });
}
