import { endpoint, json } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { claimLead } from '../../../../lib/leads/claim';

export const prerender = false;

/** POST /api/leads/{id}/claim: first claim wins; the others get 409 saying who was first and when. */
export const POST = endpoint(async ({ locals, params }) => {
  const user = requirePermission(locals, 'lead', 'claim');
  return json({ lead: await claimLead(user, params.id) });
});
