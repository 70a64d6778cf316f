import { endpoint, json, parseValue } from '../../../lib/http';
import { requirePermission } from '../../../lib/guards';
import { listLeadsFor } from '../../../lib/leads/read';
import { leadListQuerySchema, leadQueryObject } from '../../../schemas/leads';

export const prerender = false;

/** GET /api/leads?view=open|mine: one page of the open leads in my regions, or of the leads I hold. */
export const GET = endpoint(async ({ locals, url }) => {
  requirePermission(locals, 'lead', 'list-open');
  const query = parseValue(leadListQuerySchema, leadQueryObject(url.searchParams));
  const user = query.view === 'mine' ? requirePermission(locals, 'lead', 'read-claimed') : requirePermission(locals, 'lead', 'list-open');
  return json(await listLeadsFor(user, query));
});
