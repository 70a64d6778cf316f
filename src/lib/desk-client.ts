/**
 * The desk's part of the typed client (./api-client): lead lists, claims, pipeline moves and
 * site-walk revisions. Answers are checked against the same zod schemas the server answers with
 * (src/schemas/leads.ts, src/schemas/revisions.ts). Apart from ./api-client so the estimate page
 * does not load them.
 */
import type { z } from 'zod';
import {
  claimResponseSchema,
  leadListResponseSchema,
  moveResponseSchema,
  noteResponseSchema,
  releaseResponseSchema,
  type LeadListResponse,
  type moveRequestSchema,
  type noteRequestSchema,
  type releaseRequestSchema,
} from '../schemas/leads';
import {
  revisionListResponseSchema,
  revisionSavedResponseSchema,
  type RevisionListResponse,
  type RevisionRequestInput,
  type RevisionSavedResponse,
} from '../schemas/revisions';
import { send, type ApiResult } from './api-client';

function jsonPost(body: unknown): RequestInit {
  return { method: 'POST', headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) };
}

/** One page of leads; `search` is the query string the desk's filters make (view, page, sort, filters). */
export function fetchLeads(search: string, signal?: AbortSignal): Promise<ApiResult<LeadListResponse>> {
  return send(`/api/leads?${search}`, { headers: { accept: 'application/json' }, ...(signal ? { signal } : {}) }, leadListResponseSchema);
}

export function claimLead(leadId: string): Promise<ApiResult<z.infer<typeof claimResponseSchema>>> {
  return send(`/api/leads/${encodeURIComponent(leadId)}/claim`, jsonPost({}), claimResponseSchema);
}

export function moveLead(leadId: string, move: z.input<typeof moveRequestSchema>): Promise<ApiResult<z.infer<typeof moveResponseSchema>>> {
  return send(`/api/leads/${encodeURIComponent(leadId)}/moves`, jsonPost(move), moveResponseSchema);
}

export function releaseLead(leadId: string, release: z.input<typeof releaseRequestSchema>): Promise<ApiResult<z.infer<typeof releaseResponseSchema>>> {
  return send(`/api/leads/${encodeURIComponent(leadId)}/release`, jsonPost(release), releaseResponseSchema);
}

export function addLeadNote(leadId: string, note: z.input<typeof noteRequestSchema>): Promise<ApiResult<z.infer<typeof noteResponseSchema>>> {
  return send(`/api/leads/${encodeURIComponent(leadId)}/notes`, jsonPost(note), noteResponseSchema);
}

/** A lead's original, its site-walk revisions and what changed. */
export function fetchRevisions(leadId: string, signal?: AbortSignal): Promise<ApiResult<RevisionListResponse>> {
  return send(
    `/api/leads/${encodeURIComponent(leadId)}/revisions`,
    { headers: { accept: 'application/json' }, ...(signal ? { signal } : {}) },
    revisionListResponseSchema,
  );
}

/** Saves a site-walk revision; a 409 CONFLICT means someone saved a newer one first. */
export function saveRevision(leadId: string, revision: RevisionRequestInput, signal?: AbortSignal): Promise<ApiResult<RevisionSavedResponse>> {
  return send(
    `/api/leads/${encodeURIComponent(leadId)}/revisions`,
    { ...jsonPost(revision), ...(signal ? { signal } : {}) },
    revisionSavedResponseSchema,
  );
}
