import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { reachableLead, releaseLead } from '../../../../lib/leads/work';
import { releaseRequestSchema } from '../../../../schemas/leads';

export const prerender = false;

/** POST /api/leads/{id}/release `{ reason, note? }`: hands a held lead back to its region. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'update');
  await reachableLead(user, params.id);
  const release = await parseJsonBody(request, releaseRequestSchema);
  return json({ lead: await releaseLead(user, params.id, release) });
});
