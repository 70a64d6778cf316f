import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission, requireUser } from '../../../../lib/guards';
import { reachLeadReports } from '../../../../lib/reports/access';
import { openDraft } from '../../../../lib/reports/drafts';
import { listReportsFor } from '../../../../lib/reports/read';
import { createReportSchema } from '../../../../schemas/reports';

export const prerender = false;

/** GET /api/leads/{id}/reports: the lead's versions (and, for the composer, its draft), newest first. */
export const GET = endpoint(async ({ locals, params }) => {
  const user = requireUser(locals);
  return json(await listReportsFor(user, params.id));
});

/** POST /api/leads/{id}/reports: opens the lead's draft (201 when made now, 200 when one was open). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'lead', 'send-report');
  // The id is checked before the body, so a lead out of reach answers 404 whatever was sent.
  await reachLeadReports(user, params.id);
  // A POST with no body at all opens the draft with the defaults.
  const body = request.headers.get('content-type') === null ? {} : await parseJsonBody(request, createReportSchema);
  const { created, report } = await openDraft(user, params.id, body);
  return json({ report }, created ? 201 : 200);
});
