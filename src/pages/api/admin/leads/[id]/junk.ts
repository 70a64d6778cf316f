import { endpoint, json, parseJsonBody } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { junkLead } from '../../../../../lib/admin/handover';
import { junkLeadRequestSchema } from '../../../../../schemas/admin';

export const prerender = false;

/** POST /api/admin/leads/{id}/junk `{ reason }`: set it aside; it leaves every consultant's view. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const admin = requirePermission(locals, 'lead', 'mark-junk');
  const body = await parseJsonBody(request, junkLeadRequestSchema);
  return json(await junkLead(admin, params.id, body));
});
