/**
 * Hands rendered mail to Resend (or, by configuration, the local fake that speaks its API).
 * The SDK never throws on a refused connection; it resolves `{ error }`, so we throw to let
 * the queue retry.
 */
import { Resend } from 'resend';

export interface RenderedEmail {
  to: string;
  subject: string;
  html: string;
  text: string;
  attachments?: { filename: string; content: string; contentType: string }[];
}

let client: Resend | undefined;

function resend(): Resend {
  if (!client) {
    const key = process.env.RESEND_API_KEY;
    if (!key) throw new Error('RESEND_API_KEY is not set; `npm start` points it at the local mail fake.');
    const baseUrl = process.env.RESEND_BASE_URL?.replace(/\/+$/, '');
    client = new Resend(key, baseUrl ? { baseUrl } : undefined);
  }
  return client;
}

export class MailRefused extends Error {}

/**
 * How long one call to the mail service may take. A frozen connection would otherwise hold the
 * job (and every job queued behind it) for good; past this the call fails and the queue retries.
 */
export function mailTimeoutMs(): number {
  return Math.max(500, Number(process.env.LAGWISE_MAIL_TIMEOUT_MS ?? 15_000));
}

/** Sends once; the idempotency key makes a retry after a lost answer deliver one message. */
export async function sendEmail(email: RenderedEmail, idempotencyKey: string): Promise<string> {
  const from = process.env.MAIL_FROM ?? 'Lagwise <assessments@lagwise.example>';
  const timeoutMs = mailTimeoutMs();
  const signal = AbortSignal.timeout(timeoutMs);
  let answer;
  try {
    answer = await resend().emails.send(
      {
        from,
        to: email.to,
        subject: email.subject,
        html: email.html,
        text: email.text,
        attachments: email.attachments?.map((a) => ({ filename: a.filename, content: a.content, contentType: a.contentType })),
      },
      { idempotencyKey, signal },
    );
  } catch (error) {
    if (signal.aborted) throw new MailRefused(`mail service did not answer within ${timeoutMs / 1000} s`);
    throw error;
  }
  const { data, error } = answer;
  if (signal.aborted) throw new MailRefused(`mail service did not answer within ${timeoutMs / 1000} s`);
  if (error || !data) throw new MailRefused(`mail service refused the message: ${error?.message ?? 'no answer'}`);
  return data.id;
}
