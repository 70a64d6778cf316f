import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission, requireUser } from '../../../../lib/guards';
import { reachReport } from '../../../../lib/reports/access';
import { saveDraft } from '../../../../lib/reports/drafts';
import { getReportFor } from '../../../../lib/reports/read';
import { reportPatchSchema } from '../../../../schemas/reports';

export const prerender = false;

/** GET /api/reports/{id}: one report whole, for the owner (sent versions), the consultant holding the lead and admins. */
export const GET = endpoint(async ({ locals, params }) => {
  const user = requireUser(locals);
  return json({ report: await getReportFor(user, params.id) });
});

/** PATCH /api/reports/{id}: saves part of a draft; a sent version answers 409. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'send-report');
  await reachReport(user, params.id);
  const patch = await parseJsonBody(request, reportPatchSchema);
  return json({ report: await saveDraft(user, params.id, patch) });
});
