import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { reachableLead } from '../../../../lib/leads/work';
import { getRevisionsFor } from '../../../../lib/revisions/read';
import { saveRevision } from '../../../../lib/revisions/save';
import { revisionRequestSchema } from '../../../../schemas/revisions';

export const prerender = false;

/** GET /api/leads/{id}/revisions: the owner's original, every site-walk revision, and what changed. */
export const GET = endpoint(async ({ locals, params }) => {
  const user = requirePermission(locals, 'lead', 'list-open');
  return json(await getRevisionsFor(user, params.id));
});

/** POST /api/leads/{id}/revisions: saves the holder's corrected inventory as the next revision. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'update');
  // The id is checked before the body, so a lead out of reach answers 404 whatever was sent.
  await reachableLead(user, params.id);
  const body = await parseJsonBody(request, revisionRequestSchema);
  const saved = await saveRevision(user, params.id, body);
  return json(saved, saved.replayed ? 200 : 201);
});
