import { endpoint, json, parseJsonBody } from '../../../lib/http';
import { requirePermission } from '../../../lib/guards';
import { changeSettings, readSettings } from '../../../lib/admin/settings';
import { getDb } from '../../../db/client';
import { updateSettingsRequestSchema } from '../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/settings */
export const GET = endpoint(async ({ locals }) => {
  requirePermission(locals, 'settings', 'manage');
  return json({ settings: await readSettings(getDb()) });
});

/** PATCH /api/admin/settings `{ staleAfterHours? }` */
export const PATCH = endpoint(async ({ locals, request }) => {
  const admin = requirePermission(locals, 'settings', 'manage');
  const body = await parseJsonBody(request, updateSettingsRequestSchema);
  return json({ settings: await changeSettings(admin, body) });
});
