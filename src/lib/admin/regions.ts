/**
 * The admin's regions: create, edit, retire, with the consultants who cover them. A change of
 * prefixes re-routes, in the same transaction, every assessment nobody holds that it concerns
 * (unrouted ones that now match, open ones whose winning prefix changed) and alerts the
 * consultants of each lead's new region. A dry run makes the same change, reports it and rolls
 * it back, so the preview and the save cannot disagree.
 */
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { lockRouting } from '../../db/queries/regions';
import {
  consultantIdsAmong,
  findTakenPrefixes,
  freeSlug,
  insertRegion,
  listPrefixRows,
  listRegionConsultantRows,
  listRegionRows,
  lockRegion,
  rerouteOpenAssessments,
  setRegionConsultantIds,
  setRegionPrefixes,
  updateRegionRow,
  type Rerouted,
} from '../../db/queries/region-admin';
import type { Executor } from '../../db/client';
import { inTransaction, type SqlRunner } from '../../db/transaction';
import type { CreateRegionRequest, RegionChangeResponse, RegionView, RoutingChange, UpdateRegionRequest } from '../../schemas/admin';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import { isLeadId } from '../leads/access';
import { canonicalPrefix, checkRegionPrefix, isCountryCode, postalFormats } from '../routing/postal-code';
import type { SessionUser } from '../session';
import { readSettings } from './settings';

function regionNotFound(): DomainError {
  return new DomainError('NOT_FOUND', 'There is no region with this id.');
}

/** Regions as the admin sees them, with their prefixes, consultants and lead counts. */
export async function listRegions(db: Executor = getDb(), regionIds?: string[]): Promise<RegionView[]> {
  const { staleAfterHours } = await readSettings(db);
  const [rows, prefixes, consultants] = await Promise.all([
    listRegionRows(db, staleAfterHours, regionIds),
    listPrefixRows(db),
    listRegionConsultantRows(db, regionIds),
  ]);
  return rows.map((row) => ({
    id: row.id,
    slug: row.slug,
    name: row.name,
    countryCode: row.countryCode,
    countryName: isCountryCode(row.countryCode) ? postalFormats[row.countryCode].name : row.countryCode,
    prefixes: prefixes.filter((p) => p.regionId === row.id).map((p) => p.prefix),
    consultants: consultants.filter((c) => c.regionId === row.id).map((c) => ({ id: c.id, name: c.name, firm: c.firm, active: !c.banned })),
    retiredAt: row.retiredAt?.toISOString() ?? null,
    openLeads: row.openLeads,
    staleLeads: row.staleLeads,
    heldLeads: row.heldLeads,
  }));
}

interface Target {
  name: string;
  countryCode: string;
  prefixes: string[];
  consultantIds?: string[];
}

/** Where each new prefix meets another region's, and which of the two wins the codes both match. */
async function overlapsOf(db: Executor, regionId: string, target: Target) {
  const others = (await listPrefixRows(db, target.countryCode)).filter((p) => p.regionId !== regionId);
  const overlaps: RegionChangeResponse['overlaps'] = [];
  for (const prefix of target.prefixes) {
    for (const other of others) {
      if (other.prefix === prefix) continue;
      if (prefix.startsWith(other.prefix)) {
        overlaps.push({
          prefix,
          otherRegion: { id: other.regionId, name: other.regionName },
          otherPrefix: other.prefix,
          winner: 'this',
          explanation: `Codes starting ${prefix} go to ${target.name}: ${prefix} is longer than ${other.regionName}’s ${other.prefix}, which keeps the rest of ${other.prefix}.`,
        });
      } else if (other.prefix.startsWith(prefix)) {
        overlaps.push({
          prefix,
          otherRegion: { id: other.regionId, name: other.regionName },
          otherPrefix: other.prefix,
          winner: 'other',
          explanation: `Codes starting ${other.prefix} stay with ${other.regionName}: its ${other.prefix} is longer than ${prefix}; ${target.name} gets the rest of ${prefix}.`,
        });
      }
    }
  }
  return overlaps;
}

/** Leads moved, in words and counts, by region name. */
async function summarize(db: Executor, rerouted: Rerouted[]): Promise<RoutingChange> {
  const names = new Map((await listRegionRows(db, 1)).map((r) => [r.id, r.name]));
  const name = (id: string | null) => (id ? (names.get(id) ?? 'a region') : null);
  const moved = new Map<string, { from: string | null; to: string | null; count: number }>();
  let routedFromUnrouted = 0;
  let nowUnrouted = 0;
  for (const row of rerouted) {
    if (row.old_status === 'unrouted') {
      routedFromUnrouted += 1;
      continue;
    }
    if (!row.new_region) nowUnrouted += 1;
    const key = `${row.old_region}→${row.new_region}`;
    const entry = moved.get(key) ?? { from: name(row.old_region), to: name(row.new_region), count: 0 };
    entry.count += 1;
    moved.set(key, entry);
  }
  return {
    routedFromUnrouted,
    moved: [...moved.values()],
    nowUnrouted,
    leads: rerouted.slice(0, 50).map((r) => ({ id: r.id, reference: r.reference, from: name(r.old_region), to: name(r.new_region) })),
  };
}

/** Records each re-routed lead and alerts the consultants of its new region. */
async function announceRerouted(tx: Executor, sqlRunner: SqlRunner, admin: SessionUser, regionId: string, rerouted: Rerouted[]) {
  for (const row of rerouted) {
    await recordActivity(tx, {
      assessmentId: row.id,
      actorUserId: admin.id,
      action: row.new_region ? 'lead.routed' : 'lead.unrouted',
      detail: { fromRegionId: row.old_region, toRegionId: row.new_region, from: row.old_status, becauseOfRegionId: regionId },
    });
    if (row.new_region) await enqueue(jobNames.alertConsultants, { assessmentId: row.id }, { sqlRunner });
  }
}

class DryRun extends Error {
  constructor(readonly outcome: RegionChangeResponse) {
    super('dry run');
  }
}

/** Runs a change in a transaction; on a dry run reports it and rolls it back. */
async function runChange(dryRun: boolean, change: (tx: Executor, sqlRunner: SqlRunner) => Promise<Omit<RegionChangeResponse, 'dryRun'>>) {
  try {
    return await inTransaction(async (tx, sqlRunner) => {
      const outcome = { dryRun, ...(await change(tx, sqlRunner)) };
      if (dryRun) throw new DryRun(outcome);
      return outcome;
    });
  } catch (error) {
    if (error instanceof DryRun) return error.outcome;
    throw error;
  }
}

async function checkConsultants(tx: Executor, ids: string[] | undefined): Promise<string[] | undefined> {
  if (!ids) return undefined;
  const known = await consultantIdsAmong(tx, ids);
  const index = ids.findIndex((id) => !known.has(id));
  if (index >= 0) throw new DomainError('INVALID_INPUT', 'This is not the id of a consultant; reload the page to see the consultants.', `consultantIds.${index}`);
  return [...new Set(ids)];
}

async function checkTaken(tx: Executor, regionId: string | null, target: Target) {
  const taken = await findTakenPrefixes(tx, regionId, target.countryCode, target.prefixes);
  if (taken.length) {
    const first = taken[0]!;
    const index = target.prefixes.indexOf(first.prefix);
    throw new DomainError(
      'CONFLICT',
      `${first.prefix} is already a prefix of ${first.regionName}; a prefix belongs to one region. Take it out there first, or use a longer one here.`,
      `prefixes.${index}`,
    );
  }
}

/** The prefixes given, canonical; the schema has checked them against the country's format. */
function canonical(prefixes: string[]): string[] {
  return prefixes.map(canonicalPrefix);
}

/** POST /api/admin/regions (with `dryRun`: only what it would do). */
export async function createRegion(admin: SessionUser, request: CreateRegionRequest, dryRun: boolean): Promise<RegionChangeResponse> {
  const target: Target = { name: request.name, countryCode: request.countryCode, prefixes: canonical(request.prefixes), consultantIds: request.consultantIds };
  return runChange(dryRun, async (tx, sqlRunner) => {
    await lockRouting(tx, 'exclusive');
    const consultantIds = await checkConsultants(tx, target.consultantIds);
    await checkTaken(tx, null, target);
    const regionId = await insertRegion(tx, { slug: await freeSlug(tx, target.name), name: target.name, countryCode: target.countryCode });
    const overlaps = await overlapsOf(tx, regionId, target);
    await setRegionPrefixes(tx, regionId, target.countryCode, target.prefixes);
    if (consultantIds) await setRegionConsultantIds(tx, regionId, consultantIds);
    const rerouted = await rerouteOpenAssessments(tx, target.countryCode, target.prefixes);
    await recordActivity(tx, {
      actorUserId: admin.id,
      action: 'region.created',
      detail: { regionId, name: target.name, countryCode: target.countryCode, prefixes: target.prefixes, consultantIds: consultantIds ?? [], rerouted: rerouted.length },
    });
    await announceRerouted(tx, sqlRunner, admin, regionId, rerouted);
    const [region] = await listRegions(tx, [regionId]);
    return { region: region!, overlaps, routing: await summarize(tx, rerouted) };
  });
}

/** PATCH /api/admin/regions/{id} (with `dryRun`: only what it would do). */
export async function updateRegion(admin: SessionUser, regionId: string | undefined, request: UpdateRegionRequest, dryRun: boolean): Promise<RegionChangeResponse> {
  if (!isLeadId(regionId)) throw regionNotFound();
  return runChange(dryRun, async (tx, sqlRunner) => {
    await lockRouting(tx, 'exclusive');
    const row = await lockRegion(tx, regionId);
    if (!row) throw regionNotFound();
    if (row.retired_at) throw new DomainError('CONFLICT', `${row.name} is retired; make a new region instead.`);
    const [before] = await listRegions(tx, [regionId]);
    if (!before) throw regionNotFound();
    const countryCode = request.countryCode ?? before.countryCode;
    if (!isCountryCode(countryCode)) throw new DomainError('INVALID_INPUT', 'The region’s country is not one Lagwise routes.', 'countryCode');
    let prefixes = before.prefixes;
    if (request.prefixes) {
      prefixes = canonical(request.prefixes);
    } else if (request.countryCode && request.countryCode !== before.countryCode) {
      // The country changed and the prefixes did not: they must still fit the new country.
      prefixes.forEach((prefix, index) => {
        const checked = checkRegionPrefix(countryCode, prefix);
        if (!checked.ok) throw new DomainError('INVALID_INPUT', `${checked.message} Send the prefixes for the new country with it.`, `prefixes.${index}`);
      });
    }
    if (request.prefixes && !request.countryCode) {
      // The schema checked these against no country; check them against the region's own.
      request.prefixes.forEach((typed, index) => {
        const checked = checkRegionPrefix(countryCode, typed);
        if (!checked.ok) throw new DomainError('INVALID_INPUT', checked.message, `prefixes.${index}`);
      });
    }
    const target: Target = { name: request.name ?? before.name, countryCode, prefixes, consultantIds: request.consultantIds };
    const consultantIds = await checkConsultants(tx, target.consultantIds);
    await checkTaken(tx, regionId, target);
    const overlaps = await overlapsOf(tx, regionId, target);
    if (target.name !== before.name || countryCode !== before.countryCode) {
      await updateRegionRow(tx, regionId, { name: target.name, countryCode });
    }
    await setRegionPrefixes(tx, regionId, countryCode, target.prefixes);
    if (consultantIds) await setRegionConsultantIds(tx, regionId, consultantIds);
    const added = target.prefixes.filter((p) => countryCode !== before.countryCode || !before.prefixes.includes(p));
    const removed = before.prefixes.filter((p) => countryCode !== before.countryCode || !target.prefixes.includes(p));
    const rerouted = [
      ...(await rerouteOpenAssessments(tx, before.countryCode, countryCode === before.countryCode ? [...added, ...removed] : removed)),
      ...(countryCode !== before.countryCode ? await rerouteOpenAssessments(tx, countryCode, added) : []),
    ];
    const beforeIds = new Set(before.consultants.map((c) => c.id));
    const afterIds = new Set(consultantIds ?? beforeIds);
    await recordActivity(tx, {
      actorUserId: admin.id,
      action: 'region.updated',
      detail: {
        regionId,
        name: target.name,
        ...(target.name !== before.name ? { renamedFrom: before.name } : {}),
        ...(countryCode !== before.countryCode ? { countryFrom: before.countryCode, countryTo: countryCode } : {}),
        prefixesAdded: added,
        prefixesRemoved: removed,
        consultantsAdded: [...afterIds].filter((id) => !beforeIds.has(id)),
        consultantsRemoved: [...beforeIds].filter((id) => !afterIds.has(id)),
        rerouted: rerouted.length,
      },
    });
    await announceRerouted(tx, sqlRunner, admin, regionId, rerouted);
    const [region] = await listRegions(tx, [regionId]);
    return { region: region!, overlaps, routing: await summarize(tx, rerouted) };
  });
}

/**
 * DELETE /api/admin/regions/{id}: retires a region. Its prefixes and consultants are let go; its
 * open leads go to whichever region now wins their postal code, or back to the admin as
 * unrouted. Leads already held stay with their consultants and keep the region's name.
 */
export async function retireRegion(admin: SessionUser, regionId: string | undefined): Promise<RegionChangeResponse> {
  if (!isLeadId(regionId)) throw regionNotFound();
  return runChange(false, async (tx, sqlRunner) => {
    await lockRouting(tx, 'exclusive');
    const row = await lockRegion(tx, regionId);
    if (!row) throw regionNotFound();
    if (row.retired_at) throw new DomainError('CONFLICT', `${row.name} is retired already.`);
    const [before] = await listRegions(tx, [regionId]);
    if (!before) throw regionNotFound();
    await setRegionPrefixes(tx, regionId, before.countryCode, []);
    await setRegionConsultantIds(tx, regionId, []);
    await updateRegionRow(tx, regionId, { retiredAt: new Date() });
    const rerouted = await rerouteOpenAssessments(tx, before.countryCode, before.prefixes);
    await recordActivity(tx, {
      actorUserId: admin.id,
      action: 'region.retired',
      detail: { regionId, name: before.name, prefixes: before.prefixes, consultantIds: before.consultants.map((c) => c.id), rerouted: rerouted.length },
    });
    await announceRerouted(tx, sqlRunner, admin, regionId, rerouted);
    const [region] = await listRegions(tx, [regionId]);
    return { region: region!, overlaps: [], routing: await summarize(tx, rerouted) };
  });
}
