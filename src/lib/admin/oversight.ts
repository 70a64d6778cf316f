/**
 * What the admin watches, shaped into the contracts of src/schemas/admin.ts: the leads that need
 * a person, the funnel by region and month, the activity log, and the picture of coverage.
 * Also the two notices the admin gets by mail: an assessment that matched no region, and (at most
 * once a day) open leads nobody has taken on.
 */
import { getDb, type Executor } from '../../db/client';
import { hitRateLimit } from '../../db/queries/rate-limits';
import { listActiveAdmins } from '../../db/queries/team';
import {
  claimsPerConsultant,
  funnelCounts,
  listActivity,
  listAttentionLeads,
  listConsultantLoads,
  listStaleLeads,
  recentRegionLeads,
  unroutedByStart,
  unroutedUsZip3,
} from '../../db/queries/oversight';
import { listPrefixRows } from '../../db/queries/region-admin';
import type { AssessmentStatus } from '../../db/statuses';
import { inTransaction } from '../../db/transaction';
import type { ActivityQuery, ActivityResponse, AttentionResponse, FunnelResponse, RegionView } from '../../schemas/admin';
import { funnelSteps } from '../../schemas/admin';
import { enqueue, jobNames } from '../jobs/queue';
import { plantTypeName } from '../leads/read';
import { activityLine } from './activity-words';
import { listRegions } from './regions';
import { readSettings } from './settings';
import { stateCoverage, stateShapes, type StateCoverage, type StateShape } from './us-map';

/** The attention list: leads that need a person, and consultants over their cap. */
export async function getAttention(db: Executor = getDb()): Promise<AttentionResponse> {
  const { staleAfterHours } = await readSettings(db);
  const [rows, loads] = await Promise.all([listAttentionLeads(db, staleAfterHours), listConsultantLoads(db)]);
  const now = Date.now();
  return {
    staleAfterHours,
    leads: rows.map((row) => ({
      id: row.id,
      reference: row.reference,
      status: row.status,
      reason: row.reason,
      plantType: plantTypeName(row.plantType),
      place: `${row.postalCode} (${row.countryCode})`,
      region: row.regionId && row.regionName ? { id: row.regionId, name: row.regionName } : null,
      holder: row.holderId && row.holderName ? { id: row.holderId, name: row.holderName, firm: row.holderFirm } : null,
      postedAt: row.createdAt.toISOString(),
      waitingHours: Math.max(0, Math.floor((now - (row.reason === 'unrouted' ? row.createdAt : row.openSince).getTime()) / 3_600_000)),
      currency: row.currency,
      annualLoss: row.annualLoss,
    })),
    overCap: loads.filter((c) => c.openClaims > c.cap).map(({ id, name, firm, openClaims, cap }) => ({ id, name, firm, openClaims, cap })),
    consultants: loads,
  };
}

/** The last `months` months, oldest first, as YYYY-MM (UTC). */
export function monthsBack(months: number, now = new Date()): string[] {
  const out: string[] = [];
  for (let i = months - 1; i >= 0; i -= 1) {
    const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - i, 1));
    out.push(d.toISOString().slice(0, 7));
  }
  return out;
}

/** The funnel by region and month of submission. */
export async function getFunnel(query: { months: number; region?: string }, db: Executor = getDb()): Promise<FunnelResponse> {
  const months = monthsBack(query.months);
  const since = new Date(`${months[0]}-01T00:00:00Z`);
  const rows = await funnelCounts(db, since, query.region);
  const totals = Object.fromEntries(funnelSteps.map((s) => [s, 0])) as FunnelResponse['totals'];
  for (const row of rows) for (const step of funnelSteps) totals[step] += row.counts[step];
  return {
    months,
    rows: rows.map((r) => ({ month: r.month, region: r.regionId ? { id: r.regionId, name: r.regionName ?? 'a region' } : null, counts: r.counts })),
    totals,
  };
}

/** One page of the activity log, each entry in words. */
export async function getActivity(query: ActivityQuery, db: Executor = getDb()): Promise<ActivityResponse> {
  const isId = query.lead && /^[0-9a-f-]{36}$/i.test(query.lead);
  const { rows, total } = await listActivity(
    db,
    {
      leadId: isId ? query.lead : undefined,
      leadReference: query.lead && !isId ? query.lead : undefined,
      personId: query.person,
      action: query.action,
      from: query.from,
      to: query.to,
    },
    { page: query.page, pageSize: query.pageSize },
  );
  return {
    entries: rows.map((row) => {
      const at = row.at.toISOString();
      const line = activityLine({
        id: row.id,
        at,
        action: row.action,
        detail: (row.detail ?? {}) as Record<string, unknown>,
        actorName: row.actorName,
        actorFirm: row.actorFirm,
        subjectName: row.subjectName,
      });
      return {
        id: row.id,
        at,
        action: row.action,
        what: line.what,
        note: line.note,
        actor: row.actorId && row.actorName ? { id: row.actorId, name: row.actorName, firm: row.actorFirm } : null,
        subject: row.subjectId && row.subjectName ? { id: row.subjectId, name: row.subjectName } : null,
        lead: row.leadId && row.leadReference ? { id: row.leadId, reference: row.leadReference } : null,
      };
    }),
    page: query.page,
    pageSize: query.pageSize,
    total,
    pageCount: Math.max(1, Math.ceil(total / query.pageSize)),
  };
}

export interface CoverageCell {
  /** The first two characters of a postal code. */
  start: string;
  /** The region that wins the whole cell, or the regions that take parts of it. */
  whole: string | null;
  parts: string[];
  unrouted: number;
}

export interface CoverageCountry {
  countryCode: string;
  rows: { lead: string; cells: CoverageCell[] }[];
}

export interface Coverage {
  regions: (RegionView & {
    consultantLoads: { id: string; name: string; firm: string | null; openClaims: number; cap: number; claims30d: number; active: boolean }[];
    /** The newest open and held leads, a few of them. */
    leads: { id: string; reference: string; status: AssessmentStatus; holderName: string | null }[];
  })[];
  countries: CoverageCountry[];
  staleAfterHours: number;
  /** The United States map's shapes and per-state coverage, when any US region or unrouted US assessment exists. */
  usMap: { shapes: StateShape[]; states: Map<string, StateCoverage> } | null;
}

const DIGITS = '0123456789'.split('');

/**
 * The picture of coverage: per region its consultants, open, stale and held leads and each
 * consultant's load; per country a grid of postal-code starts (first two characters) showing
 * which region wins each, which are split between regions by longer prefixes, which nobody
 * covers, and where unrouted assessments sit.
 */
export async function getCoverage(db: Executor = getDb()): Promise<Coverage> {
  const [{ staleAfterHours }, regions, prefixes, loads, claims, unrouted, recent, unroutedZip3] = await Promise.all([
    readSettings(db),
    listRegions(db),
    listPrefixRows(db),
    listConsultantLoads(db),
    claimsPerConsultant(db, 30),
    unroutedByStart(db),
    recentRegionLeads(db, 6),
    unroutedUsZip3(db),
  ]);
  const usPrefixes = prefixes.filter((p) => p.countryCode === 'US');
  const live = regions.filter((r) => !r.retiredAt);
  const loadById = new Map(loads.map((l) => [l.id, l]));
  const countries = [...new Set([...live.map((r) => r.countryCode), ...unrouted.map((u) => u.countryCode)])].sort();
  return {
    staleAfterHours,
    usMap: usPrefixes.length || unroutedZip3.size ? { shapes: stateShapes(), states: stateCoverage(usPrefixes, unroutedZip3) } : null,
    regions: live.map((region) => ({
      ...region,
      consultantLoads: region.consultants.map((c) => {
        const load = loadById.get(c.id);
        return { id: c.id, name: c.name, firm: c.firm, openClaims: load?.openClaims ?? 0, cap: load?.cap ?? 0, claims30d: claims.get(c.id) ?? 0, active: Boolean(load) };
      }),
      leads: recent
        .filter((l) => l.region_id === region.id)
        .map((l) => ({ id: l.id, reference: l.reference, status: l.status as AssessmentStatus, holderName: l.holder_name })),
    })),
    countries: countries.map((countryCode) => {
      const own = prefixes.filter((p) => p.countryCode === countryCode);
      const lost = unrouted.filter((u) => u.countryCode === countryCode);
      const firsts = /^\d/.test(own[0]?.prefix ?? lost[0]?.start ?? '0')
        ? DIGITS
        : [...new Set([...own.map((p) => p.prefix[0]!), ...lost.map((u) => u.start[0]!)])].sort();
      return {
        countryCode,
        rows: firsts.map((lead) => {
          const seconds = /^\d$/.test(lead) && countryCode !== 'GB'
            ? DIGITS
            : [...new Set([...own.filter((p) => p.prefix.length >= 2 && p.prefix[0] === lead).map((p) => p.prefix[1]!), ...lost.filter((u) => u.start[0] === lead).map((u) => u.start[1] ?? '')])].filter(Boolean).sort();
          const starts = seconds.length ? seconds.map((s) => `${lead}${s}`) : [lead];
          return {
            lead,
            cells: starts.map((start) => {
              const covering = own.filter((p) => start.startsWith(p.prefix)).sort((a, b) => b.prefix.length - a.prefix.length)[0];
              const inside = own.filter((p) => p.prefix.length > start.length && p.prefix.startsWith(start));
              return {
                start,
                whole: covering?.regionName ?? null,
                parts: [...new Set(inside.map((p) => p.regionName))].filter((name) => name !== covering?.regionName),
                unrouted: lost.filter((u) => u.start.startsWith(start) || start.startsWith(u.start)).reduce((n, u) => n + u.count, 0),
              };
            }),
          };
        }),
      };
    }),
  };
}

/** Tells every admin that an assessment matched no region (the unrouted-alert job). */
export async function alertAdminsOfUnrouted(assessmentId: string): Promise<void> {
  const admins = await listActiveAdmins(getDb());
  await inTransaction(async (_tx, sqlRunner) => {
    for (const admin of admins) {
      await enqueue(jobNames.sendEmail, { email: { template: 'admin-unrouted', to: admin.email, props: { adminName: admin.name, assessmentId } } }, { sqlRunner });
    }
  });
}

/** Leads listed in the daily mail; the rest are counted. */
const DIGEST_LIST_LIMIT = 20;

/**
 * The hourly check (pg-boss schedule): when open leads have waited past the setting, mails every
 * admin a list — at most once per day (UTC), counted in the database so every worker agrees.
 * Returns whether a mail was queued.
 */
export async function mailStaleDigest(now = new Date()): Promise<boolean> {
  return inTransaction(async (tx, sqlRunner) => {
    const { staleAfterHours } = await readSettings(tx);
    const { rows, total } = await listStaleLeads(tx, staleAfterHours, DIGEST_LIST_LIMIT);
    if (total === 0) return false;
    const today = await hitRateLimit(tx, 'admin-mail:stale-digest', { limit: 1, windowSeconds: 86_400, now });
    if (!today.allowed) return false;
    const leads = rows.map((r) => ({ id: r.id, reference: r.reference, regionName: r.regionName ?? 'no region', waitingHours: r.waitingHours }));
    for (const admin of await listActiveAdmins(tx)) {
      await enqueue(
        jobNames.sendEmail,
        { email: { template: 'admin-stale-digest', to: admin.email, props: { adminName: admin.name, staleAfterHours, leads, more: total - leads.length } } },
        { sqlRunner },
      );
    }
    return true;
  });
}
