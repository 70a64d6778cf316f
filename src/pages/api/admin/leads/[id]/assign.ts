import { endpoint, json, parseJsonBody } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { assignLead } from '../../../../../lib/admin/handover';
import { assignLeadRequestSchema } from '../../../../../schemas/admin';

export const prerender = false;

/** POST /api/admin/leads/{id}/assign `{ consultantId, reason }`: hand a lead to a consultant. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const admin = requirePermission(locals, 'lead', 'reassign');
  const body = await parseJsonBody(request, assignLeadRequestSchema);
  return json(await assignLead(admin, params.id, body));
});
