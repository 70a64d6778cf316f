import type { APIRoute } from 'astro';
import { checkHealth } from '../../lib/health';
import { answer } from '../../lib/http';
import { healthAnswerSchema } from '../../schemas/health';

export const prerender = false;

/** For load balancers and people: the version, and which part (if any) is down. */
export const GET: APIRoute = async () => {
  const health = await checkHealth();
  const unavailable = health.status === 'unavailable';
  return answer(healthAnswerSchema, health, unavailable ? 503 : 200, unavailable ? { 'retry-after': '5' } : {});
};
