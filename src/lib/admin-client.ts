/**
 * The admin islands' part of the typed client (./api-client): every answer is checked against
 * the same zod schema the server answers with (src/schemas/admin.ts).
 */
import { z } from 'zod';
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
  send('/api/admin/consultants', withBody('POST', body), consultantResponseSchema);

export const updateConsultant = (id: string, body: z.input<typeof updateConsultantRequestSchema>) =>
  send(`/api/admin/consultants/${path(id)}`, withBody('PATCH', body), consultantResponseSchema);

export const deactivateConsultant = (id: string, body: z.input<typeof deactivateConsultantRequestSchema>) =>
  send(`/api/admin/consultants/${path(id)}/deactivate`, withBody('POST', body), deactivateConsultantResponseSchema);

export const reactivateConsultant = (id: string) =>
  send(`/api/admin/consultants/${path(id)}/reactivate`, withBody('POST', {}), consultantResponseSchema);

export const resendInvitation = (id: string) =>
  send(`/api/admin/consultants/${path(id)}/invitation`, withBody('POST', {}), consultantResponseSchema);

export const withdrawInvitation = (id: string): Promise<ApiResult<null>> =>
  send(`/api/admin/consultants/${path(id)}/invitation`, withBody('DELETE'), z.null());

export const saveRegion = (
  id: string | null,
  body: z.input<typeof createRegionRequestSchema> | z.input<typeof updateRegionRequestSchema>,
  dryRun: boolean,
) =>
  send(
    `/api/admin/regions${id ? `/${path(id)}` : ''}${dryRun ? '?dryRun=1' : ''}`,
    withBody(id ? 'PATCH' : 'POST', body),
    regionChangeResponseSchema,
  );

export const retireRegion = (id: string) => send(`/api/admin/regions/${path(id)}`, withBody('DELETE'), regionChangeResponseSchema);

export const assignLead = (id: string, body: z.input<typeof assignLeadRequestSchema>) =>
  send(`/api/admin/leads/${path(id)}/assign`, withBody('POST', body), adminLeadResponseSchema);

export const junkLead = (id: string, reason: string) =>
  send(`/api/admin/leads/${path(id)}/junk`, withBody('POST', { reason }), adminLeadResponseSchema);

export const restoreLead = (id: string, reason: string) =>
  send(`/api/admin/leads/${path(id)}/restore`, withBody('POST', { reason }), adminLeadResponseSchema);

export const fetchActivity = (search: string, signal?: AbortSignal): Promise<ApiResult<ActivityResponse>> =>
  send(`/api/admin/activity?${search}`, { headers: { accept: 'application/json' }, ...(signal ? { signal } : {}) }, activityResponseSchema);

export const saveSettings = (body: z.input<typeof updateSettingsRequestSchema>) =>
  send('/api/admin/settings', withBody('PATCH', body), settingsResponseSchema);

export const fetchConsultants = () =>
  send('/api/admin/consultants', { headers: { accept: 'application/json' } }, consultantListResponseSchema);

export const fetchRegions = () => send('/api/admin/regions', { headers: { accept: 'application/json' } }, regionListResponseSchema);

export const fetchAttention = () => send('/api/admin/attention', { headers: { accept: 'application/json' } }, attentionResponseSchema);
