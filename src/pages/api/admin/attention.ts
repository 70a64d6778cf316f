import { endpoint, json } from '../../../lib/http';
import { requirePermission } from '../../../lib/guards';
import { getAttention } from '../../../lib/admin/oversight';

export const prerender = false;

/** GET /api/admin/attention: unrouted and stale leads, leads of deactivated consultants, consultants over their cap. */
export const GET = endpoint(async ({ locals }) => {
  requirePermission(locals, 'lead', 'reassign');
  return json(await getAttention());
});
