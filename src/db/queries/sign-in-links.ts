import { and, eq, like, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { user, verification } from '../schema';

/**
 * Deletes every unused sign-in link of an address, so only the next one minted works.
 * better-auth stores each as `magic-link:<hashed token>` with the address in its JSON value.
 */
export async function revokeSignInLinks(db: Executor, email: string): Promise<number> {
  const removed = await db
    .delete(verification)
    .where(and(like(verification.identifier, 'magic-link:%'), sql`(${verification.value})::jsonb ->> 'email' = ${email}`))
    .returning({ id: verification.id });
  return removed.length;
}

/** Unused, unexpired sign-in links of an address (for tests and support). */
export async function countLiveSignInLinks(db: Executor, email: string): Promise<number> {
  const rows = await db
    .select({ id: verification.id })
    .from(verification)
    .where(
      and(
        like(verification.identifier, 'magic-link:%'),
        sql`(${verification.value})::jsonb ->> 'email' = ${email}`,
        sql`${verification.expiresAt} > now()`,
      ),
    );
  return rows.length;
}

/** The account behind an address, if it may sign in. */
export async function findSignInAccount(db: Executor, email: string): Promise<{ id: string } | undefined> {
  const [account] = await db.select({ id: user.id, banned: user.banned }).from(user).where(eq(user.email, email));
  return account && !account.banned ? { id: account.id } : undefined;
}
