/**
 * The report's part of the typed client (./api-client): drafts, sending, the owner's answer and
 * the consultant's price table. Answers are parsed by the same zod schemas the server
 * answers with (src/schemas/reports.ts). Apart from ./api-client so other pages do not load them.
 */
import {
  priceTableResponseSchema,
  reportResponseSchema,
  type PriceTableRequest,
  type PriceTableResponse,
  type ReportPatch,
  type ReportResponse,
} from '../schemas/reports';
import { send, type ApiResult } from './api-client';

function jsonRequest(method: string, body: unknown): RequestInit {
  return { method, headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) };
}


/** Opens the lead's draft (the one open, or a new one). */
export function openDraft(leadId: string, body: { fromVersion?: number; blank?: boolean } = {}): Promise<ApiResult<ReportResponse>> {
  return send(`/api/leads/${encodeURIComponent(leadId)}/reports`, jsonRequest('POST', body), reportResponseSchema);
}

export function saveDraft(reportId: string, patch: ReportPatch, signal?: AbortSignal): Promise<ApiResult<ReportResponse>> {
  return send(`/api/reports/${encodeURIComponent(reportId)}`, { ...jsonRequest('PATCH', patch), ...(signal ? { signal } : {}) }, reportResponseSchema);
}

export function sendReport(reportId: string): Promise<ApiResult<ReportResponse>> {
  return send(`/api/reports/${encodeURIComponent(reportId)}/send`, jsonRequest('POST', {}), reportResponseSchema);
}

export function answerReport(reportId: string, answer: { accept: boolean; reason?: string }): Promise<ApiResult<ReportResponse>> {
  return send(`/api/reports/${encodeURIComponent(reportId)}/answer`, jsonRequest('POST', answer), reportResponseSchema);
}

export function fetchPrices(): Promise<ApiResult<PriceTableResponse>> {
  return send('/api/consultants/me/prices', { headers: { accept: 'application/json' } }, priceTableResponseSchema);
}

export function savePrices(body: PriceTableRequest): Promise<ApiResult<PriceTableResponse>> {
  return send('/api/consultants/me/prices', jsonRequest('PUT', body), priceTableResponseSchema);
}
