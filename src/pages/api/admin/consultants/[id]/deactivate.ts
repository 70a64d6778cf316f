import { endpoint, json, parseJsonBody } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { deactivateConsultant } from '../../../../../lib/admin/consultants';
import { deactivateConsultantRequestSchema } from '../../../../../schemas/admin';

export const prerender = false;

/** POST /api/admin/consultants/{id}/deactivate: sessions end at once; open leads reopen or go to a colleague. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  const body = await parseJsonBody(request, deactivateConsultantRequestSchema);
  return json(await deactivateConsultant(admin, params.id, body));
});
