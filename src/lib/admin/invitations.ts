/**
 * A consultant's invitation link: a random token that only its SHA-256 is stored of, good once,
 * for INVITATION_DAYS. Accepting it sets the account's password (hashed by better-auth's own
 * hasher, in better-auth's credential account) and spends the link in one transaction.
 */
import { createHash, randomBytes } from 'node:crypto';
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { findInvitationByToken, lockInvitationByToken, markInvitationAccepted, setCredentialPassword } from '../../db/queries/team';
import { inTransaction } from '../../db/transaction';
import type { SqlRunner } from '../../db/transaction';
import { getAuth } from '../auth';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import { appBaseUrl } from '../site';

/** How long an invitation link works. */
export const INVITATION_DAYS = 7;

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function newInvitationToken(now = new Date()): { token: string; tokenHash: string; expiresAt: Date } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + INVITATION_DAYS * 86_400_000) };
}

export function invitationUrl(token: string): string {
  return `${appBaseUrl()}/join?token=${encodeURIComponent(token)}`;
}

/** Queues the invitation mail inside the transaction that stored the token. */
export async function queueInvitationMail(
  sqlRunner: SqlRunner,
  mail: { to: string; name: string; firm: string; invitedByName: string; token: string; expiresAt: Date },
): Promise<void> {
  await enqueue(
    jobNames.sendEmail,
    {
      email: {
        template: 'consultant-invitation',
        to: mail.to,
        props: { name: mail.name, firm: mail.firm, invitedByName: mail.invitedByName, inviteUrl: invitationUrl(mail.token), expiresAt: mail.expiresAt.toISOString() },
      },
    },
    { sqlRunner },
  );
}

export type InvitationState =
  | { kind: 'open'; name: string; email: string; firm: string | null; expiresAt: Date }
  | { kind: 'used' | 'expired' | 'withdrawn' | 'unknown' };

/** What the join page shows for a link, without spending it. */
export async function lookUpInvitation(token: string): Promise<InvitationState> {
  if (!/^[A-Za-z0-9_-]{20,200}$/.test(token)) return { kind: 'unknown' };
  const found = await findInvitationByToken(getDb(), hashToken(token));
  if (!found) return { kind: 'unknown' };
  if (found.withdrawnAt) return { kind: 'withdrawn' };
  if (found.acceptedAt) return { kind: 'used' };
  if (!found.email || !found.name) return { kind: 'unknown' };
  if (found.expiresAt.getTime() <= Date.now()) return { kind: 'expired' };
  return { kind: 'open', name: found.name, email: found.email, firm: found.firm, expiresAt: found.expiresAt };
}

/** The refusal for a link that no longer works, worded for the person holding it. */
export function invitationRefusal(kind: 'used' | 'expired' | 'withdrawn' | 'unknown'): DomainError {
  switch (kind) {
    case 'used':
      return new DomainError('GONE', 'This invitation link has been used already. Sign in with the password you chose, or ask for a new password.');
    case 'expired':
      return new DomainError('GONE', `This invitation link has expired (links work for ${INVITATION_DAYS} days). Ask your Lagwise admin to send a new one.`);
    case 'withdrawn':
      return new DomainError('GONE', 'This invitation has been withdrawn. Ask your Lagwise admin if you think that is a mistake.');
    case 'unknown':
      return new DomainError('NOT_FOUND', 'This invitation link is not one we know; open it again from the e-mail, whole.', 'token');
  }
}

/**
 * Spends the invitation and gives the account its password. Throws GONE (used, expired,
 * withdrawn) or NOT_FOUND (no such link); two requests with one link: one wins.
 */
export async function acceptInvitation(token: string, password: string): Promise<{ userId: string; email: string }> {
  const context = await getAuth().$context;
  // Hashed before the transaction: scrypt is slow, and no row should stay locked meanwhile.
  const passwordHash = await context.password.hash(password);
  return inTransaction(async (tx) => {
    const found = await lockInvitationByToken(tx, hashToken(token));
    if (!found) throw invitationRefusal('unknown');
    if (found.withdrawn_at) throw invitationRefusal('withdrawn');
    if (found.accepted_at) throw invitationRefusal('used');
    if (!found.user_id) throw invitationRefusal('unknown');
    if (new Date(found.expires_at).getTime() <= Date.now()) throw invitationRefusal('expired');
    if (found.banned) throw invitationRefusal('withdrawn');
    if (!(await markInvitationAccepted(tx, found.id))) throw invitationRefusal('used');
    await setCredentialPassword(tx, found.user_id, passwordHash);
    await recordActivity(tx, { actorUserId: found.user_id, action: 'consultant.joined', detail: { email: found.email } });
    return { userId: found.user_id, email: found.email };
  });
}
