import type { APIRoute } from 'astro';
import { checkDatabase } from '../../db/health';
import { answer } from '../../lib/http';
import { APP_VERSION } from '../../lib/site';
import { healthAnswerSchema } from '../../schemas/health';

export const prerender = false;

/** For load balancers and people: the version, and whether the database answers. */
export const GET: APIRoute = async () => {
  const database = await checkDatabase();
  return answer(healthAnswerSchema, { status: database.ok ? 'ok' : 'unavailable', version: APP_VERSION, database }, database.ok ? 200 : 503);
};
