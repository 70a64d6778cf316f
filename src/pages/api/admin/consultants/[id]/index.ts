import { endpoint, json, parseJsonBody } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { getConsultant, updateConsultant } from '../../../../../lib/admin/consultants';
import { updateConsultantRequestSchema } from '../../../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/consultants/{id} */
export const GET = endpoint(async ({ locals, params }) => {
  requirePermission(locals, 'consultant', 'list');
  return json({ consultant: await getConsultant(params.id) });
});

/** PATCH /api/admin/consultants/{id}: name, firm, phone, cap of open claims. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  const body = await parseJsonBody(request, updateConsultantRequestSchema);
  return json({ consultant: await updateConsultant(admin, params.id, body) });
});
