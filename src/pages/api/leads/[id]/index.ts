import { endpoint, json } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { getLeadFor } from '../../../../lib/leads/read';

export const prerender = false;

/** GET /api/leads/{id}: one lead, with only the parts the viewer may see. */
export const GET = endpoint(async ({ locals, params }) => {
  const user = requirePermission(locals, 'lead', 'list-open');
  return json({ lead: await getLeadFor(user, params.id) });
});
