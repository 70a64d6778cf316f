import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema } from '../../engine';
import { answer, endpoint, parseJsonBody } from '../../lib/http';
import { estimateAnswerSchema } from '../../schemas/estimate';

export const prerender = false;

/** Significant digits of the numbers in the answer: more than any screen shows, far fewer bytes than 17. */
const SIGNIFICANT_DIGITS = 6;

function rounded(_key: string, value: unknown): unknown {
  return typeof value === 'number' && Number.isFinite(value) && !Number.isInteger(value) ? Number(value.toPrecision(SIGNIFICANT_DIGITS)) : value;
}

/**
 * The estimate for a plant as the form describes it; nothing is stored. The answer carries
 * what the result screens show (`?detail=summary`, the default); `?detail=full` adds each
 * run's thickness series, face profiles and every figure of its options, which a detail view
 * or chart opens later. Numbers carry six significant digits.
 */
export const POST = endpoint(async ({ request, url }) => {
  const input = await parseJsonBody(request, plantInputSchema);
  const detail = url.searchParams.get('detail') === 'full' ? 'full' : 'summary';
  return answer(estimateAnswerSchema, { engineVersion: ENGINE_VERSION, result: estimateParsedPlant(input, { detail }) }, 200, {}, rounded);
});
