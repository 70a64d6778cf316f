/**
 * Public endpoints that a plain HTML form posts to (so the page works without JavaScript) and a
 * script may call with JSON. A form gets a redirect back to its page with a short error code; JSON
 * gets the usual answers (400 with each field's path).
 */
import type { z } from 'zod';
import { HttpResponseError, parseJsonBody } from './http';

export function isFormPost(request: Request): boolean {
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  return type.includes('application/x-www-form-urlencoded') || type.includes('multipart/form-data');
}

export type FormOrJson<T> = { kind: 'json'; body: T } | { kind: 'form'; body: T } | { kind: 'form-invalid'; fields: Record<string, string>; firstPath: string };

/** Reads the body as JSON (throws the 400/415 for `endpoint()`) or as a form (never throws). */
export async function readFormOrJson<S extends z.ZodType>(request: Request, schema: S): Promise<FormOrJson<z.output<S>>> {
  if (!isFormPost(request)) return { kind: 'json', body: await parseJsonBody(request, schema) };
  const form = await request.formData().catch(() => new FormData());
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === 'string') fields[key] = value;
  const parsed = schema.safeParse(fields);
  if (parsed.success) return { kind: 'form', body: parsed.data };
  return { kind: 'form-invalid', fields, firstPath: parsed.error.issues[0]?.path.map(String).join('.') ?? '(body)' };
}

/** A 303 back to a page, keeping only the query given. */
export function backTo(path: string, query: Record<string, string | undefined>): Response {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  return new Response(null, { status: 303, headers: { location: `${path}?${params.toString()}` } });
}

export { HttpResponseError };
