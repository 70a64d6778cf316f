import { endpoint } from '../../../../lib/http';
import { requireUser } from '../../../../lib/guards';
import { reportPdfFor } from '../../../../lib/reports/pdf-file';
import { pdfResponse } from '../../../../lib/reports/pdf-response';

export const prerender = false;

/** GET /api/reports/{id}/pdf: a sent version's PDF, as a download. */
export const GET = endpoint(async ({ locals, params }) => {
  const user = requireUser(locals);
  const file = await reportPdfFor(user, params.id);
  return pdfResponse(file.bytes, file.fileName);
});
