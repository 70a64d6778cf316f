/**
 * Reading leads for the desk: the paged lists and one lead, shaped into the contracts of
 * src/schemas/leads.ts with only the parts the viewer may see (src/lib/leads/access.ts).
 */
import { getDb } from '../../db/client';
import {
  findLead,
  listHeldLeads,
  listLeadActivity,
  listLeadAttachments,
  listLeadRuns,
  listOpenLeads,
  regionIdsOf,
  type LeadFilters,
  type MyLeadRow,
  type OpenLeadRow,
} from '../../db/queries/leads';
import { SERVICE_IDS, serviceDefaults, type ServiceId } from '../../engine';
import { plantTypes } from '../../schemas/assessment';
import type { ActivityEntryView, LeadDetail, LeadListQuery, LeadListResponse, MyLead, OpenLead } from '../../schemas/leads';
import { DomainError } from '../errors';
import type { SessionUser } from '../session';
import { signedReadUrl } from '../storage/objects';
import { isLeadId, leadPartsFor, leadViewerOf, postalArea, reachCondition, type LeadViewer } from './access';
import { heldStages } from './pipeline';

/** The one answer for a lead that does not exist and for one the viewer may not reach. */
export function leadNotFound(): DomainError {
  return new DomainError('NOT_FOUND', 'There is no lead at this address among the leads you can reach.');
}

export function plantTypeName(id: string): string {
  return plantTypes.find((t) => t.id === id)?.name ?? 'Food plant';
}

export function serviceName(id: string): string {
  return (SERVICE_IDS as readonly string[]).includes(id) ? serviceDefaults(id as ServiceId).name : id;
}

function toOpenLead(row: OpenLeadRow): OpenLead {
  return {
    id: row.id,
    reference: row.reference,
    status: row.status,
    region: row.regionId && row.regionName ? { id: row.regionId, name: row.regionName } : null,
    plantType: { id: row.plantType, name: plantTypeName(row.plantType) },
    area: postalArea(row.postalCodeNormalised),
    countryCode: row.countryCode,
    currency: row.currency,
    annualLoss: { likely: row.annualLossCost, low: row.annualLossCostLow, high: row.annualLossCostHigh },
    annualSaving: row.annualSavingCost,
    runCount: row.runCount,
    photoCount: row.photoCount,
    hazardRunCount: row.hazardRunCount,
    services: row.services.map((id) => ({ id, name: serviceName(id) })),
    postedAt: row.createdAt.toISOString(),
  };
}

function toMyLead(row: MyLeadRow): MyLead {
  return {
    ...toOpenLead(row),
    company: row.companyName,
    contactName: row.contactName,
    claimedAt: row.claimedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

function filtersOf(query: LeadListQuery): LeadFilters {
  return {
    plantType: query.plantType,
    services: query.service,
    lossMin: query.lossMin,
    lossMax: query.lossMax,
    spreadMax: query.spreadMax === undefined ? undefined : (2 * query.spreadMax) / 100,
    runsMin: query.runsMin,
    runsMax: query.runsMax,
    photos: query.photos,
    maxAgeDays: query.maxAgeDays,
    minAgeDays: query.minAgeDays,
  };
}

/** The regions whose open leads `viewer` sees (undefined: every region). */
export async function openRegionsOf(viewer: LeadViewer): Promise<string[] | undefined> {
  return viewer.reach === 'all' ? undefined : regionIdsOf(getDb(), viewer.userId);
}

/** One page of the open leads in the viewer's regions, or of the leads they hold. */
export async function listLeadsFor(user: SessionUser, query: LeadListQuery): Promise<LeadListResponse> {
  const viewer = leadViewerOf(user);
  const db = getDb();
  const page = { page: query.page, pageSize: query.pageSize, sort: query.sort, dir: query.dir };
  const filters = filtersOf(query);
  let items: (OpenLead | MyLead)[];
  let total: number;
  if (query.view === 'mine') {
    const stages = query.stage ? [query.stage] : heldStages;
    const found = await listHeldLeads(db, viewer.userId, stages, { ...filters, regionIds: query.region ? [query.region] : undefined }, page);
    items = found.rows.map(toMyLead);
    total = found.total;
  } else {
    const mine = await openRegionsOf(viewer);
    const regionIds = query.region ? (mine === undefined || mine.includes(query.region) ? [query.region] : []) : mine;
    const found = await listOpenLeads(db, { ...filters, regionIds }, page);
    items = found.rows.map(toOpenLead);
    total = found.total;
  }
  return { view: query.view, items, page: query.page, pageSize: query.pageSize, total, pageCount: Math.max(1, Math.ceil(total / query.pageSize)) };
}

function toActivity(row: Awaited<ReturnType<typeof listLeadActivity>>[number]): ActivityEntryView {
  return {
    id: row.id,
    at: row.at.toISOString(),
    action: row.action,
    actor: row.actorName ? { name: row.actorName, firm: row.actorFirm ?? null } : null,
    detail: (row.detail ?? {}) as Record<string, unknown>,
  };
}

/** One lead as `user` may see it; NOT_FOUND when it does not exist or is out of their reach. */
export async function getLeadFor(user: SessionUser, leadId: string | undefined): Promise<LeadDetail> {
  if (!isLeadId(leadId)) throw leadNotFound();
  const viewer = leadViewerOf(user);
  const db = getDb();
  const found = await findLead(db, leadId, reachCondition(viewer));
  if (!found) throw leadNotFound();
  const { lead } = found;
  const parts = leadPartsFor(viewer, lead);
  const [runs, files, activity] = await Promise.all([
    listLeadRuns(db, leadId),
    parts.photos ? listLeadAttachments(db, leadId) : Promise.resolve([]),
    parts.timeline ? listLeadActivity(db, leadId) : Promise.resolve([]),
  ]);
  const photos = parts.photos
    ? await Promise.all(
        files.map(async (file) => {
          const signed = await signedReadUrl(file.objectKey);
          return { id: file.id, runId: file.pipeRunId, contentType: file.contentType, url: signed.url, expiresAt: signed.expiresAt.toISOString() };
        }),
      )
    : null;
  const questionnaire = (lead.questionnaire ?? {}) as { estimate?: Record<string, unknown> };
  return {
    ...toOpenLead({ ...lead, regionName: found.regionName }),
    claimedAt: lead.claimedAt?.toISOString() ?? null,
    claimedBy: lead.claimedByUserId && found.holderName ? { name: found.holderName, firm: found.holderFirm ?? null } : null,
    contact: parts.contact
      ? {
          name: lead.contactName,
          company: lead.companyName,
          email: lead.contactEmail,
          phone: lead.contactPhone,
          plantName: lead.plantName,
          postalCode: lead.postalCode,
        }
      : null,
    answers: questionnaire.estimate ?? {},
    runs: runs.map((run) => ({ ...run, spec: (run.spec ?? {}) as Record<string, unknown> })),
    photos,
    engineVersion: lead.engineVersion,
    result: lead.resultSnapshot as Record<string, unknown>,
    timeline: parts.timeline ? activity.map(toActivity) : null,
    allowed: { claim: parts.claim, moves: parts.moves, release: parts.release, note: parts.note },
  };
}
