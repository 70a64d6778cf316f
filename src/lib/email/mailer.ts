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

/** Sends once; the idempotency key makes a retry after a lost answer deliver one message. */
export async function sendEmail(email: RenderedEmail, idempotencyKey: string): Promise<string> {
  const from = process.env.MAIL_FROM ?? 'Lagwise <assessments@lagwise.example>';
  const { data, error } = await resend().emails.send(
    {
      from,
      to: email.to,
      subject: email.subject,
      html: email.html,
      text: email.text,
      attachments: email.attachments?.map((a) => ({ filename: a.filename, content: a.content, contentType: a.contentType })),
    },
    { idempotencyKey },
  );
  if (error || !data) throw new MailRefused(`mail service refused the message: ${error?.message ?? 'no answer'}`);
  return data.id;
}
