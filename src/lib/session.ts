/** The signed-in person as pages and endpoints see them. */
import { getAuth } from './auth';
import { isRoleName, type RoleName } from './permissions';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: RoleName;
}

export async function sessionFromHeaders(headers: Headers): Promise<{ user: SessionUser; sessionId: string } | null> {
  const found = await getAuth().api.getSession({ headers });
  if (!found) return null;
  const role = isRoleName(found.user.role) ? found.user.role : 'owner';
  return {
    sessionId: found.session.id,
    user: { id: found.user.id, email: found.user.email, name: found.user.name, role },
  };
}
