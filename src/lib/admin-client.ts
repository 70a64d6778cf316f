/**
 * The admin islands' part of the typed client (./api-client): every answer is checked against
 * the same zod schema the server answers with (src/schemas/admin.ts).
 */
import type { z } from 'zod';
import {
  activityResponseSchema,
  adminLeadResponseSchema,
  attentionResponseSchema,
  consultantListResponseSchema,
  regionListResponseSchema,
  consultantResponseSchema,
  deactivateConsultantResponseSchema,
  regionChangeResponseSchema,
  settingsResponseSchema,
  type ActivityResponse,
  type assignLeadRequestSchema,
  type createRegionRequestSchema,
  type deactivateConsultantRequestSchema,
  type inviteConsultantRequestSchema,
  type updateConsultantRequestSchema,
  type updateRegionRequestSchema,
  type updateSettingsRequestSchema,
} from '../schemas/admin';
import { send, type ApiResult } from './api-client';

const parsesWith =
  <S extends z.ZodType>(schema: S) =>
  (body: unknown): body is z.infer<S> =>
    schema.safeParse(body).success;

function withBody(method: string, body?: unknown): RequestInit {
  return {
    method,
    headers: { accept: 'application/json', ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
  };
}

const path = (id: string) => encodeURIComponent(id);

export type ConsultantAnswer = z.infer<typeof consultantResponseSchema>;

export const inviteConsultant = (body: z.input<typeof inviteConsultantRequestSchema>) =>
  send('/api/admin/consultants', withBody('POST', body), parsesWith(consultantResponseSchema));

export const updateConsultant = (id: string, body: z.input<typeof updateConsultantRequestSchema>) =>
  send(`/api/admin/consultants/${path(id)}`, withBody('PATCH', body), parsesWith(consultantResponseSchema));

export const deactivateConsultant = (id: string, body: z.input<typeof deactivateConsultantRequestSchema>) =>
  send(`/api/admin/consultants/${path(id)}/deactivate`, withBody('POST', body), parsesWith(deactivateConsultantResponseSchema));

export const reactivateConsultant = (id: string) =>
  send(`/api/admin/consultants/${path(id)}/reactivate`, withBody('POST', {}), parsesWith(consultantResponseSchema));

export const resendInvitation = (id: string) =>
  send(`/api/admin/consultants/${path(id)}/invitation`, withBody('POST', {}), parsesWith(consultantResponseSchema));

export const withdrawInvitation = (id: string): Promise<ApiResult<null>> =>
  send(`/api/admin/consultants/${path(id)}/invitation`, withBody('DELETE'), (body: unknown): body is null => body === null);

export const saveRegion = (
  id: string | null,
  body: z.input<typeof createRegionRequestSchema> | z.input<typeof updateRegionRequestSchema>,
  dryRun: boolean,
) =>
  send(
    `/api/admin/regions${id ? `/${path(id)}` : ''}${dryRun ? '?dryRun=1' : ''}`,
    withBody(id ? 'PATCH' : 'POST', body),
    parsesWith(regionChangeResponseSchema),
  );

export const retireRegion = (id: string) => send(`/api/admin/regions/${path(id)}`, withBody('DELETE'), parsesWith(regionChangeResponseSchema));

export const assignLead = (id: string, body: z.input<typeof assignLeadRequestSchema>) =>
  send(`/api/admin/leads/${path(id)}/assign`, withBody('POST', body), parsesWith(adminLeadResponseSchema));

export const junkLead = (id: string, reason: string) =>
  send(`/api/admin/leads/${path(id)}/junk`, withBody('POST', { reason }), parsesWith(adminLeadResponseSchema));

export const restoreLead = (id: string, reason: string) =>
  send(`/api/admin/leads/${path(id)}/restore`, withBody('POST', { reason }), parsesWith(adminLeadResponseSchema));

export const fetchActivity = (search: string, signal?: AbortSignal): Promise<ApiResult<ActivityResponse>> =>
  send(`/api/admin/activity?${search}`, { headers: { accept: 'application/json' }, ...(signal ? { signal } : {}) }, parsesWith(activityResponseSchema));

export const saveSettings = (body: z.input<typeof updateSettingsRequestSchema>) =>
  send('/api/admin/settings', withBody('PATCH', body), parsesWith(settingsResponseSchema));

export const fetchConsultants = () =>
  send('/api/admin/consultants', { headers: { accept: 'application/json' } }, parsesWith(consultantListResponseSchema));

export const fetchRegions = () => send('/api/admin/regions', { headers: { accept: 'application/json' } }, parsesWith(regionListResponseSchema));

export const fetchAttention = () => send('/api/admin/attention', { headers: { accept: 'application/json' } }, parsesWith(attentionResponseSchema));
