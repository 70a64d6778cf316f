import { endpoint, json, parseValue } from '../../../lib/http';
import { requirePermission } from '../../../lib/guards';
import { getFunnel } from '../../../lib/admin/oversight';
import { funnelQuerySchema } from '../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/funnel?months=6&region=…: submitted → claimed → in touch → site walk → report sent → signed. */
export const GET = endpoint(async ({ locals, url }) => {
  requirePermission(locals, 'activity', 'read-all');
  return json(await getFunnel(parseValue(funnelQuerySchema, Object.fromEntries(url.searchParams))));
});
