/**
 * The admin's named queries over consultants, their invitations and their open work. Each takes
 * a database or transaction handle first.
 */
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../client';
import {
  account,
  assessments,
  consultantInvitations,
  consultantProfiles,
  DEFAULT_OPEN_CLAIM_CAP,
  regionConsultants,
  regions,
  session,
  user,
} from '../schema';
import type { AssessmentStatus } from '../statuses';

const openStages = sql.raw(`('claimed','in_touch','site_walk_booked')`);
const unfinishedStages = sql.raw(`('claimed','in_touch','site_walk_booked','report_sent')`);

/** Every consultant with their profile, waiting invitation and counts of open work. */
export async function listConsultantRows(db: Executor, userIds?: string[]) {
  if (userIds && userIds.length === 0) return [];
  return db
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      banned: user.banned,
      banReason: user.banReason,
      firm: consultantProfiles.firm,
      phone: consultantProfiles.phone,
      openClaimCap: sql<number>`coalesce(${consultantProfiles.openClaimCap}, ${DEFAULT_OPEN_CLAIM_CAP})`.mapWith(Number),
      invitationExpiresAt: consultantInvitations.expiresAt,
      invitationLastSentAt: consultantInvitations.lastSentAt,
      invitationSentCount: consultantInvitations.sentCount,
      openClaims: sql<number>`(select count(*) from ${assessments} a where a.claimed_by_user_id = ${user.id} and a.status in ${openStages})`.mapWith(Number),
      heldLeads: sql<number>`(select count(*) from ${assessments} a where a.claimed_by_user_id = ${user.id} and a.status in ${unfinishedStages})`.mapWith(Number),
      lastSignInAt: sql<Date | null>`(select max(s.created_at) from ${session} s where s.user_id = ${user.id})`.mapWith((v) => (v ? new Date(v) : null)),
    })
    .from(user)
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, user.id))
    .leftJoin(
      consultantInvitations,
      and(eq(consultantInvitations.userId, user.id), isNull(consultantInvitations.acceptedAt), isNull(consultantInvitations.withdrawnAt)),
    )
    .where(and(eq(user.role, 'consultant'), userIds ? inArray(user.id, userIds) : undefined))
    .orderBy(asc(user.name), asc(user.id));
}
export type ConsultantRow = Awaited<ReturnType<typeof listConsultantRows>>[number];

/** The live regions each consultant covers. */
export async function listConsultantRegions(db: Executor, userIds?: string[]) {
  if (userIds && userIds.length === 0) return [];
  return db
    .select({ userId: regionConsultants.userId, id: regions.id, name: regions.name })
    .from(regionConsultants)
    .innerJoin(regions, eq(regions.id, regionConsultants.regionId))
    .where(and(isNull(regions.retiredAt), userIds ? inArray(regionConsultants.userId, userIds) : undefined))
    .orderBy(asc(regions.name));
}

export async function findAccountByEmail(db: Executor, email: string) {
  const [row] = await db.select({ id: user.id, role: user.role, banned: user.banned, name: user.name }).from(user).where(eq(user.email, email));
  return row ?? null;
}

/** A consultant's account row, locked for the rest of the transaction. */
export async function lockConsultant(db: Executor, userId: string) {
  const rows = await db.execute<{ id: string; name: string; email: string; banned: boolean | null }>(sql`
    select id, name, email, banned from "user" where id = ${userId} and role = 'consultant' for update`);
  return rows.rows[0] ?? null;
}

/** The account of a new consultant, without a password until they accept the invitation. */
export async function insertConsultantAccount(db: Executor, person: { email: string; name: string }): Promise<string> {
  const [row] = await db
    .insert(user)
    .values({ email: person.email, name: person.name, role: 'consultant', emailVerified: false })
    .returning({ id: user.id });
  if (!row) throw new Error('the consultant account was not stored');
  return row.id;
}

export async function insertInvitation(
  db: Executor,
  invitation: { userId: string; email: string; tokenHash: string; expiresAt: Date; invitedByUserId: string },
) {
  await db.insert(consultantInvitations).values(invitation);
}

/** The waiting invitation of an account, locked. */
export async function lockPendingInvitation(db: Executor, userId: string) {
  const rows = await db.execute<{ id: string; email: string; expires_at: Date }>(sql`
    select id, email, expires_at from ${consultantInvitations}
    where user_id = ${userId} and accepted_at is null and withdrawn_at is null for update`);
  return rows.rows[0] ?? null;
}

/** A fresh token for a waiting invitation: the old link stops working. */
export async function renewInvitation(db: Executor, invitationId: string, tokenHash: string, expiresAt: Date) {
  await db
    .update(consultantInvitations)
    .set({ tokenHash, expiresAt, lastSentAt: sql`now()`, sentCount: sql`${consultantInvitations.sentCount} + 1` })
    .where(eq(consultantInvitations.id, invitationId));
}

export async function withdrawInvitationRow(db: Executor, invitationId: string) {
  await db.update(consultantInvitations).set({ withdrawnAt: sql`now()` }).where(eq(consultantInvitations.id, invitationId));
}

/** The invitation behind a link's token, locked, with the account it is for. */
export async function lockInvitationByToken(db: Executor, tokenHash: string) {
  const rows = await db.execute<{
    id: string;
    user_id: string | null;
    email: string;
    expires_at: Date;
    accepted_at: Date | null;
    withdrawn_at: Date | null;
    name: string | null;
    banned: boolean | null;
  }>(sql`
    select i.id, i.user_id, i.email, i.expires_at, i.accepted_at, i.withdrawn_at, u.name, u.banned
    from ${consultantInvitations} i left join "user" u on u.id = i.user_id
    where i.token_hash = ${tokenHash} for update of i`);
  return rows.rows[0] ?? null;
}

/** The invitation behind a link's token, for the page that shows it (no lock). */
export async function findInvitationByToken(db: Executor, tokenHash: string) {
  const [row] = await db
    .select({
      expiresAt: consultantInvitations.expiresAt,
      acceptedAt: consultantInvitations.acceptedAt,
      withdrawnAt: consultantInvitations.withdrawnAt,
      name: user.name,
      email: user.email,
      firm: consultantProfiles.firm,
    })
    .from(consultantInvitations)
    .leftJoin(user, eq(user.id, consultantInvitations.userId))
    .leftJoin(consultantProfiles, eq(consultantProfiles.userId, consultantInvitations.userId))
    .where(eq(consultantInvitations.tokenHash, tokenHash));
  return row ?? null;
}

/** Spends the invitation; false when another request spent it first. */
export async function markInvitationAccepted(db: Executor, invitationId: string): Promise<boolean> {
  const rows = await db
    .update(consultantInvitations)
    .set({ acceptedAt: sql`now()` })
    .where(and(eq(consultantInvitations.id, invitationId), isNull(consultantInvitations.acceptedAt), isNull(consultantInvitations.withdrawnAt)))
    .returning({ id: consultantInvitations.id });
  return rows.length === 1;
}

/** Gives the account its password (better-auth's credential account, hashed by better-auth). */
export async function setCredentialPassword(db: Executor, userId: string, passwordHash: string): Promise<void> {
  const updated = await db
    .update(account)
    .set({ password: passwordHash })
    .where(and(eq(account.userId, userId), eq(account.providerId, 'credential')))
    .returning({ id: account.id });
  if (updated.length === 0) {
    await db.insert(account).values({ userId, providerId: 'credential', accountId: userId, password: passwordHash });
  }
  await db.update(user).set({ emailVerified: true }).where(eq(user.id, userId));
}

export async function hasPassword(db: Executor, userId: string): Promise<boolean> {
  const rows = await db
    .select({ id: account.id })
    .from(account)
    .where(and(eq(account.userId, userId), eq(account.providerId, 'credential'), sql`${account.password} is not null`));
  return rows.length > 0;
}

/** Deactivates (bans, in better-auth's admin-plugin columns) and ends every session at once. */
export async function banAccount(db: Executor, userId: string, reason: string | null): Promise<void> {
  await db.update(user).set({ banned: true, banReason: reason, banExpires: null }).where(eq(user.id, userId));
  await db.delete(session).where(eq(session.userId, userId));
}

export async function unbanAccount(db: Executor, userId: string): Promise<void> {
  await db.update(user).set({ banned: false, banReason: null, banExpires: null }).where(eq(user.id, userId));
}

export async function deleteAccount(db: Executor, userId: string): Promise<void> {
  await db.delete(user).where(eq(user.id, userId));
}

export async function updateAccountName(db: Executor, userId: string, name: string): Promise<void> {
  await db.update(user).set({ name }).where(eq(user.id, userId));
}

/** Replaces the regions a consultant covers. */
export async function setConsultantRegions(db: Executor, userId: string, regionIds: string[]): Promise<void> {
  await db.delete(regionConsultants).where(eq(regionConsultants.userId, userId));
  if (regionIds.length) await db.insert(regionConsultants).values(regionIds.map((regionId) => ({ regionId, userId })));
}

/** Live regions among the ids given. */
export async function liveRegionIds(db: Executor, ids: string[]): Promise<string[]> {
  if (ids.length === 0) return [];
  const rows = await db.select({ id: regions.id }).from(regions).where(and(inArray(regions.id, ids), isNull(regions.retiredAt)));
  return rows.map((r) => r.id);
}

/** Leads a consultant holds at the given stages, locked. */
export async function lockHeldLeads(db: Executor, holderUserId: string, stages: readonly AssessmentStatus[]) {
  const rows = await db.execute<{ id: string; status: AssessmentStatus; region_id: string | null; reference: string }>(sql`
    select id, status, region_id, reference from ${assessments}
    where claimed_by_user_id = ${holderUserId} and status in (${sql.join(
      stages.map((s) => sql`${s}`),
      sql`, `,
    )}) for update`);
  return rows.rows;
}

/** Active admins, who are told about leads that need a person. */
export async function listActiveAdmins(db: Executor) {
  return db
    .select({ id: user.id, name: user.name, email: user.email })
    .from(user)
    .where(and(eq(user.role, 'admin'), sql`coalesce(${user.banned}, false) = false`));
}

/** Consultants who may take leads: signed up (no waiting invitation) and not deactivated. */
export async function isActiveConsultant(db: Executor, userId: string): Promise<{ name: string; email: string } | null> {
  const [row] = await db
    .select({ name: user.name, email: user.email })
    .from(user)
    .where(
      and(
        eq(user.id, userId),
        eq(user.role, 'consultant'),
        sql`coalesce(${user.banned}, false) = false`,
        sql`not exists (select 1 from ${consultantInvitations} i where i.user_id = ${user.id} and i.accepted_at is null and i.withdrawn_at is null)`,
      ),
    );
  return row ?? null;
}
