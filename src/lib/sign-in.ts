/**
 * Signing in from plain HTML forms (no JavaScript needed): an e-mailed link for owners,
 * e-mail and password for consultants and admins. better-auth does the work.
 */
import { z } from 'zod';
import { getDb } from '../db/client';
import { hitRateLimit } from '../db/queries/rate-limits';
import { enqueue, jobNames } from './jobs/queue';

/**
 * Only local paths, so a crafted link cannot send someone to another site after sign-in; anything
 * else is dropped and the person lands on their role's home (`homeFor`).
 */
export const nextPathSchema = z
  .string()
  .regex(/^\/(?!\/)[A-Za-z0-9\-._~/?=&%]*$/)
  .max(300)
  .optional()
  .catch(undefined);

export const linkRequestSchema = z.object({
  email: z
    .string({ error: 'Enter your e-mail address.' })
    .trim()
    .toLowerCase()
    .pipe(z.email({ error: 'Enter an e-mail address like name@plant.com.' })),
  next: nextPathSchema,
});

export const passwordSignInSchema = z.object({
  email: z
    .string({ error: 'Enter your e-mail address.' })
    .trim()
    .toLowerCase()
    .pipe(z.email({ error: 'Enter an e-mail address like name@firm.com.' })),
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(200),
  next: nextPathSchema,
});

/**
 * Mails a sign-in link when the address has an account. The answer is the same either way,
 * so the form cannot be used to find out who has submitted an assessment.
 */
export async function requestSignInLink(email: string, nextPath: string, clientAddress: string): Promise<'sent' | 'limited'> {
  const db = getDb();
  const perAddress = await hitRateLimit(db, `sign-in-link:address:${clientAddress}`, { limit: 20, windowSeconds: 3600 });
  const perEmail = await hitRateLimit(db, `sign-in-link:email:${email}`, { limit: 5, windowSeconds: 3600 });
  if (!perAddress.allowed || !perEmail.allowed) return 'limited';
  // The worker looks the address up and mints the link; here every address takes the same path.
  await enqueue(jobNames.requestSignInLink, { email, next: nextPath });
  return 'sent';
}

/** The sign-in page with a message, keeping where the visitor was going. */
export function signInPageUrl(query: Record<string, string>, next: unknown, anchor: 'owner' | 'team'): string {
  const params = new URLSearchParams(query);
  const local = nextPathSchema.parse(next);
  if (local) params.set('next', local);
  return `/sign-in?${params.toString()}#${anchor}`;
}

/** The page a role lands on after signing in: the desk, the admin area, or the owner's assessments. */
export function homeFor(role: string | null | undefined): string {
  if (role === 'consultant') return '/desk';
  if (role === 'admin') return '/admin';
  return '/my/assessments';
}
