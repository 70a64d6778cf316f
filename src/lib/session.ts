/** The signed-in person as pages and endpoints see them. */
import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { session } from '../db/schema';
import { getAuth } from './auth';
import { isRoleName, type RoleName } from './permissions';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: RoleName;
}

/** Banned (deactivated) until `banExpires`, or for good when it is empty. */
export function isBanned(user: { banned?: boolean | null; banExpires?: Date | string | null }, now = new Date()): boolean {
  if (!user.banned) return false;
  return !user.banExpires || new Date(user.banExpires).getTime() > now.getTime();
}

/**
 * The person behind the request's session cookie, or null. Checked on every request: a person
 * banned (deactivated) after signing in has no session from their next request on, and their
 * sessions are ended so nothing else keeps them alive.
 */
export async function sessionFromHeaders(headers: Headers): Promise<{ user: SessionUser; sessionId: string } | null> {
  const found = await getAuth().api.getSession({ headers });
  if (!found) return null;
  if (isBanned(found.user)) {
    await getDb().delete(session).where(eq(session.userId, found.user.id));
    return null;
  }
  const role = isRoleName(found.user.role) ? found.user.role : 'owner';
  return {
    sessionId: found.session.id,
    user: { id: found.user.id, email: found.user.email, name: found.user.name, role },
  };
}
