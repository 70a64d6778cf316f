import { eq } from 'drizzle-orm';
import type { Executor } from '../client';
import { user } from '../schema';

/**
 * The account an owner signs in to with e-mailed links, made when they first submit.
 * Someone who already has an account (any role) keeps it and their role.
 */
export async function findOrCreateOwner(db: Executor, email: string, name: string): Promise<string> {
  const inserted = await db
    .insert(user)
    .values({ email, name, role: 'owner', emailVerified: false })
    .onConflictDoNothing({ target: user.email })
    .returning({ id: user.id });
  if (inserted[0]) return inserted[0].id;
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, email));
  if (!existing) throw new Error(`account for ${email} vanished while being made`);
  return existing.id;
}
