import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { reachReport } from '../../../../lib/reports/access';
import { answerReport } from '../../../../lib/reports/answer';
import { reportAnswerSchema } from '../../../../schemas/reports';

export const prerender = false;

/** POST /api/reports/{id}/answer `{ accept, reason? }`: the owner's answer to the latest version. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'report', 'answer');
  await reachReport(user, params.id);
  const answer = await parseJsonBody(request, reportAnswerSchema);
  return json({ report: await answerReport(user, params.id, answer) });
});
