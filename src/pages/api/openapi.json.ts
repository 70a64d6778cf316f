import type { APIRoute } from 'astro';
import { openApiDocument } from '../../lib/openapi';

/** Prerendered: the document only changes when the code does. */
export const GET: APIRoute = () =>
  new Response(JSON.stringify(openApiDocument(), null, 2), { headers: { 'content-type': 'application/json; charset=utf-8' } });
