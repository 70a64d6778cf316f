/**
 * Sign-in refusals worth keeping in the activity log: a deactivated account that tried to sign
 * in, and tries stopped by the limiter. Each is kept at most once an hour per account and kind,
 * so a script hammering the form cannot flood the log. Plain wrong passwords are not logged here:
 * counting them is the limiter's job.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { recordActivity } from '../db/queries/assessments';
import { hitRateLimit } from '../db/queries/rate-limits';
import { user } from '../db/schema';

export type RefusalKind = 'deactivated' | 'too-many-tries';

export async function noteRefusedSignIn(email: string, kind: RefusalKind): Promise<void> {
  const db = getDb();
  const [account] = await db.select({ id: user.id, banned: user.banned, role: user.role }).from(user).where(eq(user.email, email));
  // Only staff accounts: owners do not sign in with passwords, and unknown addresses are noise.
  if (!account || (account.role !== 'consultant' && account.role !== 'admin')) return;
  if (kind === 'deactivated' && !account.banned) return;
  const once = await hitRateLimit(db, `activity:sign-in-refused:${kind}:${account.id}`, { limit: 1, windowSeconds: 3600 });
  if (!once.allowed) return;
  await recordActivity(db, { subjectUserId: account.id, action: 'sign-in.refused', detail: { email, reason: kind } });
}
