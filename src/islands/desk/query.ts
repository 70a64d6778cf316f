/**
 * The desk list's query as the URL carries it, and the small wordings the list and its server
 * page share (so the first page rendered on the server reads exactly as later pages do).
 */
import type { OpenLead } from '../../schemas/leads';

/** Query-string values as typed: strings, and the repeatable `service`. */
export interface DeskQuery {
  page?: string;
  pageSize?: string;
  sort?: string;
  dir?: string;
  region?: string;
  plantType?: string;
  service?: string[];
  lossMin?: string;
  lossMax?: string;
  spreadMax?: string;
  runsMin?: string;
  runsMax?: string;
  photos?: string;
  maxAgeDays?: string;
  minAgeDays?: string;
  stage?: string;
}

const keys: (keyof DeskQuery)[] = [
  'region', 'plantType', 'service', 'lossMin', 'lossMax', 'spreadMax', 'runsMin', 'runsMax', 'photos', 'maxAgeDays', 'minAgeDays', 'stage', 'sort', 'dir', 'pageSize', 'page',
];

/** The query as a URL's search part, without empty values or the defaults. */
export function queryString(query: DeskQuery): string {
  const params = new URLSearchParams();
  for (const key of keys) {
    const value = query[key];
    if (value === undefined || value === '') continue;
    if (Array.isArray(value)) for (const v of value) params.append(key, v);
    else if (!(key === 'page' && value === '1') && !(key === 'sort' && value === 'posted' && query.dir !== 'asc') && !(key === 'dir' && value === 'desc')) {
      params.set(key, value);
    }
  }
  return params.toString();
}

/** A URL's search parameters as a DeskQuery. */
export function deskQueryOf(params: URLSearchParams): DeskQuery {
  const query: DeskQuery = {};
  for (const key of keys) {
    if (key === 'service') {
      const all = params.getAll('service').filter(Boolean);
      if (all.length) query.service = all;
    } else {
      const value = params.get(key);
      if (value) query[key] = value;
    }
  }
  return query;
}

/** ± half the 10–90 % range as a share of the likely figure, in whole percent. */
export function spreadPercent(lead: Pick<OpenLead, 'annualLoss'>): number {
  const { likely, low, high } = lead.annualLoss;
  return likely > 0 ? Math.round(((high - low) / 2 / likely) * 100) : 0;
}

/** "today", "yesterday", "5 days ago", "3 weeks ago". */
export function ageText(posted: Date, now: Date): string {
  const days = Math.floor((now.getTime() - posted.getTime()) / 86_400_000);
  if (days <= 0) return 'today';
  if (days === 1) return 'yesterday';
  if (days < 14) return `${days} days ago`;
  if (days < 60) return `${Math.floor(days / 7)} weeks ago`;
  return `${Math.floor(days / 30)} months ago`;
}
