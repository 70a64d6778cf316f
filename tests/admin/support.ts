/**
 * Helpers for the admin area's tests: the demo admin's session, and the links the admin area's
 * e-mails carry, read from the mail fake's inbox.
 */
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { passwordCookie } from '../support/desk';
import { waitForMessages } from '../support/fixtures';

export function adminCookie(): Promise<string> {
  return passwordCookie('admin@lagwise.example', DEMO_PASSWORD);
}

/** The invitation tokens mailed to `email`, newest first (the mail fake lists newest first), once `count` have come. */
export async function invitationTokens(email: string, count: number): Promise<string[]> {
  const isInvitation = (subject: string) => subject.startsWith('Your Lagwise consultant account');
  const messages = await waitForMessages(email, (all) => all.filter((m) => isInvitation(m.subject)).length >= count);
  return messages
    .filter((m) => isInvitation(m.subject))
    .map((m) => /\/join\?token=([A-Za-z0-9_-]+)/.exec(m.html ?? '')?.[1])
    .filter((t): t is string => Boolean(t));
}

/** The token of a password-reset link mailed to `email`. */
export async function resetToken(email: string): Promise<string> {
  const messages = await waitForMessages(email, (all) => all.some((m) => m.subject === 'Choose a new Lagwise password'));
  const token = messages
    .filter((m) => m.subject === 'Choose a new Lagwise password')
    .map((m) => /\/set-password\?token=([A-Za-z0-9_-]+)/.exec(m.html ?? '')?.[1])
    .find(Boolean);
  if (!token) throw new Error(`no reset link in the mail to ${email}`);
  return token;
}
