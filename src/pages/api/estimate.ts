import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema } from '../../engine';
import { withAnswerDigits } from '../../lib/answer-numbers';
import { answer, endpoint, parseJsonBody } from '../../lib/http';
import { estimateAnswerSchema } from '../../schemas/estimate';

export const prerender = false;

/**
 * The estimate for a plant as the form describes it; nothing is stored. The answer carries
 * what the result screens show (`?detail=summary`, the default); `?detail=full` adds each
 * run's thickness series, face profiles and every figure of its options, which a detail view
 * or chart opens later. Numbers carry six significant digits (../../lib/answer-numbers).
 */
export const POST = endpoint(async ({ request, url }) => {
  const input = await parseJsonBody(request, plantInputSchema);
  const detail = url.searchParams.get('detail') === 'full' ? 'full' : 'summary';
  return answer(estimateAnswerSchema, { engineVersion: ENGINE_VERSION, result: estimateParsedPlant(input, { detail }) }, 200, {}, withAnswerDigits);
});
