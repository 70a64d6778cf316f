/**
 * Who may do what, as data. better-auth's admin plugin checks these statements for its own
 * routes; our endpoints check them through `can()` so one table rules both.
 */
import { createAccessControl } from 'better-auth/plugins/access';
import { adminAc, defaultStatements } from 'better-auth/plugins/admin/access';

export const statements = {
  ...defaultStatements,
  assessment: ['read-own'],
  lead: ['list-open', 'claim', 'read-claimed', 'update', 'send-report', 'reassign', 'mark-junk'],
  region: ['list', 'manage'],
  consultant: ['list', 'manage'],
  activity: ['read-all'],
} as const;

export const accessControl = createAccessControl(statements);

export const ownerRole = accessControl.newRole({
  assessment: ['read-own'],
});

export const consultantRole = accessControl.newRole({
  assessment: [],
  lead: ['list-open', 'claim', 'read-claimed', 'update', 'send-report'],
  region: ['list'],
});

export const adminRole = accessControl.newRole({
  ...adminAc.statements,
  assessment: ['read-own'],
  lead: ['list-open', 'claim', 'read-claimed', 'update', 'send-report', 'reassign', 'mark-junk'],
  region: ['list', 'manage'],
  consultant: ['list', 'manage'],
  activity: ['read-all'],
});

export const roles = { owner: ownerRole, consultant: consultantRole, admin: adminRole } as const;
export type RoleName = keyof typeof roles;
export const roleNames = Object.keys(roles) as RoleName[];

type Statements = typeof statements;
export type Resource = Exclude<keyof Statements, 'user' | 'session'>;

export function isRoleName(value: unknown): value is RoleName {
  return typeof value === 'string' && value in roles;
}

/** Whether a role may perform `action` on `resource`. Unknown roles may do nothing. */
export function can<R extends Resource>(role: string | null | undefined, resource: R, action: Statements[R][number]): boolean {
  if (!isRoleName(role)) return false;
  const granted = roles[role].statements as Partial<Record<Resource, readonly string[]>>;
  return granted[resource]?.includes(action) ?? false;
}
