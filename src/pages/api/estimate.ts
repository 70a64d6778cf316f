import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema } from '../../engine';
import { endpoint, json, parseJsonBody } from '../../lib/http';

export const prerender = false;

/** The estimate for a plant as the form describes it; nothing is stored. */
export const POST = endpoint(async ({ request }) => {
  const input = await parseJsonBody(request, plantInputSchema);
  return json({ engineVersion: ENGINE_VERSION, result: estimateParsedPlant(input) });
});
