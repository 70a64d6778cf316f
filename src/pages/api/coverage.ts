import { checkCoverage } from '../../lib/coverage';
import { answer, endpoint, parseValue } from '../../lib/http';
import { coverageAnswerSchema, coverageQuerySchema } from '../../schemas/coverage';

export const prerender = false;

/** Whether a consultant covers a postal code: public, nothing stored but a per-address count. */
export const GET = endpoint(async ({ url }) => {
  const query = parseValue(coverageQuerySchema, Object.fromEntries(url.searchParams));
  return answer(coverageAnswerSchema, await checkCoverage(query));
});
