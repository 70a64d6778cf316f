import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { addLeadNote, reachableLead } from '../../../../lib/leads/work';
import { noteRequestSchema } from '../../../../schemas/leads';

export const prerender = false;

/** POST /api/leads/{id}/notes `{ text }`: adds a note to the lead's timeline. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'update');
  await reachableLead(user, params.id);
  const note = await parseJsonBody(request, noteRequestSchema);
  return json({ entry: await addLeadNote(user, params.id, note) }, 201);
});
