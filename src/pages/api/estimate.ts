import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema } from '../../engine';
import { endpoint, json, parseJsonBody } from '../../lib/http';

export const prerender = false;

/**
 * The estimate for a plant as the form describes it; nothing is stored. The answer carries
 * what the result screens show (`?detail=summary`, the default); `?detail=full` adds each
 * run's thickness series and face profiles, which a detail view or chart opens later.
 */
export const POST = endpoint(async ({ request, url }) => {
  const input = await parseJsonBody(request, plantInputSchema);
  const detail = url.searchParams.get('detail') === 'full' ? 'full' : 'summary';
  return json({ engineVersion: ENGINE_VERSION, result: estimateParsedPlant(input, { detail }) });
});
