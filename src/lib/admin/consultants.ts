/**
 * The admin's consultants: inviting them, changing their details and cap, deactivating them
 * (sessions end at once; their open leads go where the admin says) and bringing them back.
 * Each change is one transaction with its activity entries and the mail it causes.
 *
 * Accounts live in better-auth's tables and follow its admin plugin's model (role, banned,
 * banReason): the plugin refuses a banned account's sign-in and our session check ends a banned
 * account's sessions on its next request. The rows are written here, inside our own transaction,
 * because the plugin's endpoints run on a connection of their own and could not commit together
 * with the lead moves, the activity entries and the queued mail.
 */
import { getDb } from '../../db/client';
import { upsertConsultantProfile } from '../../db/queries/leads';
import { recordActivity } from '../../db/queries/assessments';
import {
  banAccount,
  deleteAccount,
  findAccountByEmail,
  insertConsultantAccount,
  insertInvitation,
  isActiveConsultant,
  listConsultantRegions,
  listConsultantRows,
  liveRegionIds,
  lockConsultant,
  lockHeldLeads,
  lockPendingInvitation,
  renewInvitation,
  setConsultantRegions,
  unbanAccount,
  updateAccountName,
  withdrawInvitationRow,
  type ConsultantRow,
} from '../../db/queries/team';
import { regionIdsOf } from '../../db/queries/leads';
import { inTransaction } from '../../db/transaction';
import type {
  ConsultantView,
  DeactivateConsultantRequest,
  InviteConsultantRequest,
  UpdateConsultantRequest,
} from '../../schemas/admin';
import { DomainError } from '../errors';
import { isLeadId } from '../leads/access';
import { openClaimStages } from '../leads/pipeline';
import type { SessionUser } from '../session';
import { handLeadTo, reopenLead } from './handover';
import { newInvitationToken, queueInvitationMail } from './invitations';

function toView(row: ConsultantRow, regions: { id: string; name: string }[], now = Date.now()): ConsultantView {
  const status = row.banned ? 'deactivated' : row.invitationExpiresAt ? 'invited' : 'active';
  return {
    id: row.id,
    name: row.name,
    email: row.email,
    firm: row.firm,
    phone: row.phone,
    status,
    openClaimCap: row.openClaimCap,
    openClaims: row.openClaims,
    heldLeads: row.heldLeads,
    overCap: row.openClaims > row.openClaimCap,
    regions,
    invitation:
      row.invitationExpiresAt && row.invitationLastSentAt
        ? {
            expiresAt: row.invitationExpiresAt.toISOString(),
            lastSentAt: row.invitationLastSentAt.toISOString(),
            sentCount: row.invitationSentCount ?? 1,
            expired: row.invitationExpiresAt.getTime() <= now,
          }
        : null,
    deactivation: row.banned ? { reason: row.banReason } : null,
    lastSignInAt: row.lastSignInAt?.toISOString() ?? null,
  };
}

/** Every consultant as the admin's list shows them. */
export async function listConsultants(): Promise<ConsultantView[]> {
  const db = getDb();
  const [rows, regions] = await Promise.all([listConsultantRows(db), listConsultantRegions(db)]);
  return rows.map((row) => toView(row, regions.filter((r) => r.userId === row.id).map(({ id, name }) => ({ id, name }))));
}

function consultantNotFound(): DomainError {
  return new DomainError('NOT_FOUND', 'There is no consultant with this id.');
}

/** One consultant; NOT_FOUND for an id that is not a consultant's. */
export async function getConsultant(userId: string | undefined): Promise<ConsultantView> {
  if (!isLeadId(userId)) throw consultantNotFound();
  const db = getDb();
  const [rows, regions] = await Promise.all([listConsultantRows(db, [userId]), listConsultantRegions(db, [userId])]);
  const row = rows[0];
  if (!row) throw consultantNotFound();
  return toView(row, regions.map(({ id, name }) => ({ id, name })));
}

async function checkRegions(regionIds: string[] | undefined): Promise<string[]> {
  if (!regionIds?.length) return [];
  const unique = [...new Set(regionIds)];
  const live = new Set(await liveRegionIds(getDb(), unique));
  const index = regionIds.findIndex((id) => !live.has(id));
  if (index >= 0) throw new DomainError('INVALID_INPUT', 'There is no live region with this id; reload the page to see the regions.', `regionIds.${index}`);
  return unique;
}

/** Invites a consultant: their account (no password yet), profile, regions, and the mailed link. */
export async function inviteConsultant(admin: SessionUser, request: InviteConsultantRequest): Promise<ConsultantView> {
  const regionIds = await checkRegions(request.regionIds);
  const existing = await findAccountByEmail(getDb(), request.email);
  if (existing) {
    const why =
      existing.role === 'consultant'
        ? existing.banned
          ? 'This consultant was deactivated; reactivate them from the list instead.'
          : 'This address already belongs to a consultant; send their invitation again from the list if they have not joined.'
        : existing.role === 'admin'
          ? 'This address belongs to an admin.'
          : 'This address belongs to a plant owner who has sent us an assessment; use another address for the consultant account.';
    throw new DomainError('CONFLICT', why, 'email');
  }
  const { token, tokenHash, expiresAt } = newInvitationToken();
  const userId = await inTransaction(async (tx, sqlRunner) => {
    const id = await insertConsultantAccount(tx, { email: request.email, name: request.name });
    await upsertConsultantProfile(tx, { userId: id, firm: request.firm, phone: request.phone ?? null, ...(request.openClaimCap ? { openClaimCap: request.openClaimCap } : {}) });
    await setConsultantRegions(tx, id, regionIds);
    await insertInvitation(tx, { userId: id, email: request.email, tokenHash, expiresAt, invitedByUserId: admin.id });
    await recordActivity(tx, {
      actorUserId: admin.id,
      subjectUserId: id,
      action: 'consultant.invited',
      detail: { email: request.email, name: request.name, firm: request.firm, regionIds, expiresAt: expiresAt.toISOString() },
    });
    await queueInvitationMail(sqlRunner, { to: request.email, name: request.name, firm: request.firm, invitedByName: admin.name, token, expiresAt });
    return id;
  }).catch((error: unknown) => {
    // Two admins inviting one address at once: the second finds the first's account.
    if (error instanceof Error && /user_email_unique|duplicate key/.test(String((error as { cause?: unknown }).cause ?? error.message))) {
      throw new DomainError('CONFLICT', 'This address was invited a moment ago; reload the list.', 'email');
    }
    throw error;
  });
  return getConsultant(userId);
}

/** Sends a waiting invitation again with a new link (the old one stops working) and a new expiry. */
export async function resendInvitation(admin: SessionUser, userId: string | undefined): Promise<ConsultantView> {
  if (!isLeadId(userId)) throw consultantNotFound();
  await inTransaction(async (tx, sqlRunner) => {
    const consultant = await lockConsultant(tx, userId);
    if (!consultant) throw consultantNotFound();
    const invitation = await lockPendingInvitation(tx, userId);
    if (!invitation) throw new DomainError('CONFLICT', `${consultant.name} has already chosen a password; there is no invitation to send.`);
    const { token, tokenHash, expiresAt } = newInvitationToken();
    await renewInvitation(tx, invitation.id, tokenHash, expiresAt);
    const [row] = await listConsultantRows(tx, [userId]);
    await recordActivity(tx, { actorUserId: admin.id, subjectUserId: userId, action: 'consultant.invitation-resent', detail: { email: consultant.email, expiresAt: expiresAt.toISOString() } });
    await queueInvitationMail(sqlRunner, { to: consultant.email, name: consultant.name, firm: row?.firm ?? consultant.name, invitedByName: admin.name, token, expiresAt });
  });
  return getConsultant(userId);
}

/** Withdraws a waiting invitation: the link stops working and the unused account is removed. */
export async function withdrawInvitation(admin: SessionUser, userId: string | undefined): Promise<void> {
  if (!isLeadId(userId)) throw consultantNotFound();
  await inTransaction(async (tx) => {
    const consultant = await lockConsultant(tx, userId);
    if (!consultant) throw consultantNotFound();
    const invitation = await lockPendingInvitation(tx, userId);
    if (!invitation) {
      throw new DomainError('CONFLICT', `${consultant.name} has already chosen a password; deactivate the account instead.`);
    }
    await withdrawInvitationRow(tx, invitation.id);
    await recordActivity(tx, { actorUserId: admin.id, action: 'consultant.invitation-withdrawn', detail: { email: consultant.email, name: consultant.name } });
    await deleteAccount(tx, userId);
  });
}

/** Changes a consultant's name, firm, phone or cap of open claims. */
export async function updateConsultant(admin: SessionUser, userId: string | undefined, change: UpdateConsultantRequest): Promise<ConsultantView> {
  const before = await getConsultant(userId);
  await inTransaction(async (tx) => {
    if (!(await lockConsultant(tx, before.id))) throw consultantNotFound();
    if (change.name !== undefined) await updateAccountName(tx, before.id, change.name);
    await upsertConsultantProfile(tx, {
      userId: before.id,
      firm: change.firm ?? before.firm ?? before.name,
      ...(change.phone !== undefined ? { phone: change.phone } : {}),
      ...(change.openClaimCap !== undefined ? { openClaimCap: change.openClaimCap } : {}),
    });
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    for (const key of ['name', 'firm', 'phone', 'openClaimCap'] as const) {
      if (change[key] !== undefined && change[key] !== before[key]) changed[key] = { from: before[key], to: change[key] };
    }
    if (Object.keys(changed).length) {
      await recordActivity(tx, { actorUserId: admin.id, subjectUserId: before.id, action: 'consultant.updated', detail: { changed } });
    }
  });
  return getConsultant(before.id);
}

/**
 * Deactivates a consultant: banned, every session ended in the same transaction, and each lead
 * they hold open (claimed, in touch, walk booked) reopened for its region — whose other
 * consultants are alerted — or handed to the named colleague, who must be active and cover the
 * region of every lead handed over. Leads past the report stay with them and show on the
 * attention list.
 */
export async function deactivateConsultant(
  admin: SessionUser,
  userId: string | undefined,
  request: DeactivateConsultantRequest,
): Promise<{ consultant: ConsultantView; leads: { reopened: number; unrouted: number; handedOver: number } }> {
  const before = await getConsultant(userId);
  if (before.status === 'deactivated') throw new DomainError('CONFLICT', `${before.name} is deactivated already.`);
  if (before.status === 'invited') {
    throw new DomainError('CONFLICT', `${before.name} has not joined yet; withdraw the invitation instead.`);
  }
  let colleague: { id: string; name: string; email: string; regionIds: Set<string> } | null = null;
  if (request.leads === 'colleague' && request.colleagueId) {
    if (request.colleagueId === before.id) throw new DomainError('INVALID_INPUT', 'Name a colleague other than the consultant being deactivated.', 'colleagueId');
    const found = await isActiveConsultant(getDb(), request.colleagueId);
    if (!found) throw new DomainError('INVALID_INPUT', 'The colleague must be an active consultant who has joined.', 'colleagueId');
    colleague = { id: request.colleagueId, ...found, regionIds: new Set(await regionIdsOf(getDb(), request.colleagueId)) };
  }
  const leads = { reopened: 0, unrouted: 0, handedOver: 0 };
  await inTransaction(async (tx, sqlRunner) => {
    if (!(await lockConsultant(tx, before.id))) throw consultantNotFound();
    const held = await lockHeldLeads(tx, before.id, openClaimStages);
    if (colleague) {
      const outside = held.filter((lead) => lead.region_id && !colleague.regionIds.has(lead.region_id));
      if (outside.length) {
        throw new DomainError(
          'INVALID_INPUT',
          `${colleague.name} does not cover the region of ${outside.map((l) => l.reference).join(', ')}; choose a colleague of that region, or open the leads again.`,
          'colleagueId',
        );
      }
    }
    await banAccount(tx, before.id, request.reason || null);
    const why = `${before.name} was deactivated`;
    for (const lead of held) {
      if (colleague) {
        await handLeadTo(tx, sqlRunner, { id: lead.id, status: lead.status, holderUserId: before.id }, colleague, admin.id, why);
        leads.handedOver += 1;
      } else {
        const reopened = await reopenLead(tx, sqlRunner, { id: lead.id, status: lead.status, holderUserId: before.id }, admin.id, why);
        if (reopened === 'unrouted') leads.unrouted += 1;
        else leads.reopened += 1;
      }
    }
    await recordActivity(tx, {
      actorUserId: admin.id,
      subjectUserId: before.id,
      action: 'consultant.deactivated',
      detail: { reason: request.reason || null, leads: request.leads, colleagueId: colleague?.id ?? null, ...leads },
    });
  });
  return { consultant: await getConsultant(before.id), leads };
}

/** Lets a deactivated consultant sign in again; their regions are as they were. */
export async function reactivateConsultant(admin: SessionUser, userId: string | undefined): Promise<ConsultantView> {
  const before = await getConsultant(userId);
  if (before.status !== 'deactivated') throw new DomainError('CONFLICT', `${before.name} is not deactivated.`);
  await inTransaction(async (tx) => {
    if (!(await lockConsultant(tx, before.id))) throw consultantNotFound();
    await unbanAccount(tx, before.id);
    await recordActivity(tx, { actorUserId: admin.id, subjectUserId: before.id, action: 'consultant.reactivated', detail: {} });
  });
  return getConsultant(before.id);
}
