import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { getMyPrices, putMyPrices } from '../../../../lib/reports/prices';
import { priceTableRequestSchema } from '../../../../schemas/reports';

export const prerender = false;

/** GET /api/consultants/me/prices: the consultant's own installed prices (null before the first save) and the demo grid. */
export const GET = endpoint(async ({ locals }) => {
  const user = requirePermission(locals, 'prices', 'manage-own');
  return json(await getMyPrices(user));
});

/** PUT /api/consultants/me/prices `{ currency, priceTable }`: replaces them whole. */
export const PUT = endpoint(async ({ locals, request }) => {
  const user = requirePermission(locals, 'prices', 'manage-own');
  const body = await parseJsonBody(request, priceTableRequestSchema);
  return json(await putMyPrices(user, body));
});
