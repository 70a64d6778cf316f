import { endpoint, json, parseValue } from '../../../lib/http';
import { requirePermission } from '../../../lib/guards';
import { getActivity } from '../../../lib/admin/oversight';
import { activityQuerySchema } from '../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/activity?lead=&person=&action=&from=&to=&page=&pageSize=: the log, newest first, paged. */
export const GET = endpoint(async ({ locals, url }) => {
  requirePermission(locals, 'activity', 'read-all');
  return json(await getActivity(parseValue(activityQuerySchema, Object.fromEntries(url.searchParams))));
});
