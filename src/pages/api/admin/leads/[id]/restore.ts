import { endpoint, json, parseJsonBody } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { restoreLead } from '../../../../../lib/admin/handover';
import { junkLeadRequestSchema } from '../../../../../schemas/admin';

export const prerender = false;

/** POST /api/admin/leads/{id}/restore `{ reason }`: take a lead back from junk. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const admin = requirePermission(locals, 'lead', 'mark-junk');
  const body = await parseJsonBody(request, junkLeadRequestSchema);
  return json(await restoreLead(admin, params.id, body));
});
