import { endpoint, json } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { reactivateConsultant } from '../../../../../lib/admin/consultants';

export const prerender = false;

/** POST /api/admin/consultants/{id}/reactivate */
export const POST = endpoint(async ({ locals, params }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  return json({ consultant: await reactivateConsultant(admin, params.id) });
});
