import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { moveLead, reachableLead } from '../../../../lib/leads/work';
import { moveRequestSchema } from '../../../../schemas/leads';

export const prerender = false;

/** POST /api/leads/{id}/moves `{ to, note?, reason? }`: moves a held lead along the pipeline. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'update');
  // The id is checked before the body, so a lead out of reach answers 404 whatever was sent.
  await reachableLead(user, params.id);
  const move = await parseJsonBody(request, moveRequestSchema);
  return json({ lead: await moveLead(user, params.id, move) });
});
