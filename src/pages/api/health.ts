import type { APIRoute } from 'astro';
import { checkDatabase } from '../../db/health';
import { json } from '../../lib/http';
import { APP_VERSION } from '../../lib/site';

export const prerender = false;

/** For load balancers and people: the version, and whether the database answers. */
export const GET: APIRoute = async () => {
  const database = await checkDatabase();
  const body = { status: database.ok ? 'ok' : 'unavailable', version: APP_VERSION, database };
  return json(body, database.ok ? 200 : 503);
};
