import { endpoint, json } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { sendReport } from '../../../../lib/reports/send';

export const prerender = false;

/** POST /api/reports/{id}/send: freezes the draft as the next version (201); a version sent again answers 200 as it is. */
export const POST = endpoint(async ({ locals, params }) => {
  const user = requirePermission(locals, 'lead', 'send-report');
  const { sentNow, report } = await sendReport(user, params.id);
  return json({ report }, sentNow ? 201 : 200);
});
