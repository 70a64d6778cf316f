import { endpoint, json, parseJsonBody, parseValue } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { retireRegion, updateRegion } from '../../../../lib/admin/regions';
import { dryRunQuerySchema, updateRegionRequestSchema } from '../../../../schemas/admin';

export const prerender = false;

/** PATCH /api/admin/regions/{id}[?dryRun=1]: `{ name?, countryCode?, prefixes?, consultantIds? }`. */
export const PATCH = endpoint(async ({ locals, params, request, url }) => {
  const admin = requirePermission(locals, 'region', 'manage');
  const { dryRun } = parseValue(dryRunQuerySchema, Object.fromEntries(url.searchParams));
  const body = await parseJsonBody(request, updateRegionRequestSchema);
  return json(await updateRegion(admin, params.id, body, dryRun));
});

/** DELETE /api/admin/regions/{id}: retire the region; its open leads are routed again. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const admin = requirePermission(locals, 'region', 'manage');
  return json(await retireRegion(admin, params.id));
});
