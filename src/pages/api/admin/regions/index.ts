import { endpoint, json, parseJsonBody, parseValue } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { createRegion, listRegions } from '../../../../lib/admin/regions';
import { createRegionRequestSchema, dryRunQuerySchema } from '../../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/regions: live regions, then retired ones, with prefixes, consultants and lead counts. */
export const GET = endpoint(async ({ locals }) => {
  requirePermission(locals, 'region', 'manage');
  return json({ regions: await listRegions() });
});

/** POST /api/admin/regions[?dryRun=1]: make a region; a dry run shows overlaps and re-routing without saving. */
export const POST = endpoint(async ({ locals, request, url }) => {
  const admin = requirePermission(locals, 'region', 'manage');
  const { dryRun } = parseValue(dryRunQuerySchema, Object.fromEntries(url.searchParams));
  const body = await parseJsonBody(request, createRegionRequestSchema);
  const outcome = await createRegion(admin, body, dryRun);
  return json(outcome, dryRun ? 200 : 201);
});
