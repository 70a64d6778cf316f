/**
 * Who may do what, as data. better-auth's admin plugin checks these statements for its own
 * routes; the areas built on top read the same table.
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
  settings: ['manage'],
  /** A follow-up report: reading one (who may read which is decided per report), and the owner's answer. */
  report: ['read', 'answer'],
  /** A consultant's own installed-price table. */
  prices: ['manage-own'],
} as const;

export const accessControl = createAccessControl(statements);

export const ownerRole = accessControl.newRole({
  assessment: ['read-own'],
  report: ['read', 'answer'],
});

export const consultantRole = accessControl.newRole({
  assessment: [],
  lead: ['list-open', 'claim', 'read-claimed', 'update', 'send-report'],
  region: ['list'],
  report: ['read'],
  prices: ['manage-own'],
});

export const adminRole = accessControl.newRole({
  ...adminAc.statements,
  assessment: ['read-own'],
  lead: ['list-open', 'claim', 'read-claimed', 'update', 'send-report', 'reassign', 'mark-junk'],
  region: ['list', 'manage'],
  consultant: ['list', 'manage'],
  activity: ['read-all'],
  settings: ['manage'],
  report: ['read'],
  prices: ['manage-own'],
});

export const roles = { owner: ownerRole, consultant: consultantRole, admin: adminRole } as const;
export type RoleName = keyof typeof roles;
export function isRoleName(value: unknown): value is RoleName {
  return typeof value === 'string' && value in roles;
}
