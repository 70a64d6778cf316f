/**
 * Forgotten passwords of consultants and admins. better-auth mints and checks the single-use
 * token (kept hashed, good for an hour); the link goes out through the mail queue and opens our
 * own page (/set-password), which sets the new password through better-auth and ends every
 * other session. Owners have no password (they sign in by e-mailed link), so the request is
 * quietly dropped for them — the answer never says whether an address has an account.
 */
import { eq } from 'drizzle-orm';
import { APIError } from 'better-auth/api';
import { getDb } from '../db/client';
import { recordActivity } from '../db/queries/assessments';
import { hitRateLimit } from '../db/queries/rate-limits';
import { hasPassword } from '../db/queries/team';
import { user } from '../db/schema';
import { getAuth } from './auth';
import { DomainError } from './errors';
import { enqueue, jobNames } from './jobs/queue';
import { appBaseUrl } from './site';

/** A reset link works for an hour. */
export const PASSWORD_RESET_SECONDS = 60 * 60;

export async function deliverPasswordReset({ email, name, token }: { email: string; name: string; token: string }): Promise<void> {
  const resetUrl = `${appBaseUrl()}/set-password?token=${encodeURIComponent(token)}`;
  await enqueue(jobNames.sendEmail, { email: { template: 'password-reset', to: email, props: { name, resetUrl } } });
}

export async function notePasswordReset(userId: string): Promise<void> {
  await recordActivity(getDb(), { actorUserId: userId, action: 'account.password-reset', detail: {} });
}

/**
 * Mails a reset link when the address belongs to an active consultant or admin with a password.
 * The same answer either way; limited per address and per client so it cannot flood an inbox.
 */
export async function requestPasswordReset(email: string, clientAddress: string): Promise<void> {
  const db = getDb();
  const perClient = await hitRateLimit(db, `password-reset:address:${clientAddress}`, { limit: 20, windowSeconds: 3600 });
  const perEmail = await hitRateLimit(db, `password-reset:email:${email}`, { limit: 3, windowSeconds: 3600 });
  if (!perClient.allowed || !perEmail.allowed) {
    const minutes = Math.max(1, Math.ceil(Math.max(perClient.retryAfterSeconds, perEmail.retryAfterSeconds) / 60));
    throw new DomainError('RATE_LIMITED', `Too many reset requests in the last hour; try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
  }
  const [account] = await db.select({ id: user.id, role: user.role, banned: user.banned }).from(user).where(eq(user.email, email));
  if (!account || account.banned || (account.role !== 'consultant' && account.role !== 'admin')) return;
  if (!(await hasPassword(db, account.id))) return;
  await getAuth().api.requestPasswordReset({ body: { email, redirectTo: '/set-password' }, headers: new Headers() });
}

/** Sets the new password; GONE when the link was used, has expired or is not one of ours. */
export async function resetPassword(token: string, password: string): Promise<void> {
  try {
    await getAuth().api.resetPassword({ body: { token, newPassword: password }, headers: new Headers() });
  } catch (error) {
    if (error instanceof APIError) {
      throw new DomainError('GONE', 'This link to choose a new password has been used or has expired (links work for an hour). Ask for a new one.');
    }
    throw error;
  }
}
