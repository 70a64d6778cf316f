/**
 * People and leads for the desk's tests: regions of their own (Australian postal prefixes the
 * demo never uses), consultants with passwords and profiles, owners signed in through the link
 * their confirmation e-mail carries. Sessions are real better-auth sessions: consultants sign
 * in through better-auth's own API in this process (the web server's sign-in form is tested on
 * its own), owners with the token of the link their confirmation e-mail carries.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { upsertConsultantProfile } from '../../src/db/queries/leads';
import { regionConsultants, regionPostalPrefixes, regions, user } from '../../src/db/schema';
import { getAuth } from '../../src/lib/auth';
import { validSubmission, waitForMessages } from './fixtures';
import { appFetch } from './stack';

export const TEST_PASSWORD = 'lagwise-test-password-2026';

/** A region of the tests' own, by slug; idempotent. */
export async function ensureDeskRegion(slug: string, name: string, prefixes: string[]): Promise<string> {
  const db = getDb();
  const [region] = await db
    .insert(regions)
    .values({ slug, name, countryCode: 'AU' })
    .onConflictDoUpdate({ target: regions.slug, set: { name } })
    .returning({ id: regions.id });
  await db
    .insert(regionPostalPrefixes)
    .values(prefixes.map((prefix) => ({ regionId: region!.id, countryCode: 'AU', prefix })))
    .onConflictDoNothing();
  return region!.id;
}

export interface TestConsultant {
  email: string;
  name: string;
  firm: string;
  phone?: string;
  regionIds: string[];
  cap?: number;
  role?: 'consultant' | 'admin';
}

/** A consultant account with a password, a desk profile and their regions; idempotent. */
export async function ensureConsultant(person: TestConsultant): Promise<string> {
  const db = getDb();
  let [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, person.email));
  if (!existing) {
    const made = await getAuth().api.createUser({
      body: { email: person.email, password: TEST_PASSWORD, name: person.name, role: person.role ?? 'consultant' },
    });
    existing = { id: made.user.id };
  }
  await upsertConsultantProfile(db, { userId: existing.id, firm: person.firm, phone: person.phone ?? null, openClaimCap: person.cap ?? 5 });
  for (const regionId of person.regionIds) {
    await db.insert(regionConsultants).values({ regionId, userId: existing.id }).onConflictDoNothing();
  }
  return existing.id;
}

function cookieHeader(response: Response): string {
  return response.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

/** A fresh session cookie for an account with a password. */
export async function passwordCookie(email: string, password = TEST_PASSWORD): Promise<string> {
  const response = await getAuth().api.signInEmail({ body: { email, password }, asResponse: true });
  if (!response.ok) throw new Error(`signing in ${email} failed with ${response.status}: ${await response.text()}`);
  const cookie = cookieHeader(response);
  if (!cookie.includes('session_token=')) throw new Error(`signing in ${email} set no session cookie`);
  return cookie;
}

export interface SubmittedLead {
  id: string;
  reference: string;
  ownerEmail: string;
  company: string;
  contactName: string;
  phone: string;
}

/** Submits an assessment through the API, as an owner would; it is routed by its postal code. */
export async function submitLead(postalCode: string, overrides: { email?: string; company?: string } = {}): Promise<SubmittedLead> {
  const input = validSubmission({ postalCode, ...(overrides.email ? { email: overrides.email } : {}) });
  if (overrides.company) input.contact.company = overrides.company;
  const response = await appFetch('/api/assessments', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(input),
  });
  if (response.status !== 201) throw new Error(`submission answered ${response.status}: ${await response.text()}`);
  const body = (await response.json()) as { assessment: { id: string; reference: string } };
  return {
    id: body.assessment.id,
    reference: body.assessment.reference,
    ownerEmail: input.contact.email,
    company: input.contact.company,
    contactName: input.contact.name,
    phone: input.contact.phone ?? '',
  };
}

/** The owner's session, from the sign-in link in their submission's confirmation e-mail. */
export async function ownerCookie(ownerEmail: string): Promise<string> {
  const isConfirmation = (subject: string) => / is in$/.test(subject);
  const messages = await waitForMessages(ownerEmail, (all) => all.some((m) => isConfirmation(m.subject)));
  const confirmation = messages.find((m) => isConfirmation(m.subject));
  const link = /href="([^"]*magic-link\/verify[^"]*)"/.exec(confirmation?.html ?? '')?.[1]?.replaceAll('&amp;', '&');
  if (!link) throw new Error(`no sign-in link in the confirmation to ${ownerEmail}`);
  // The link's own token, verified by better-auth in this process: the server's limit of five
  // link sign-ins a minute per address is for people, and every test comes from one address.
  const url = new URL(link);
  const response = await getAuth().api.magicLinkVerify({
    query: { token: url.searchParams.get('token') ?? '', callbackURL: url.searchParams.get('callbackURL') ?? '/' },
    headers: new Headers(),
    asResponse: true,
  });
  const cookie = cookieHeader(response);
  if (!cookie.includes('session_token=')) throw new Error(`the sign-in link for ${ownerEmail} set no session (${response.status})`);
  return cookie;
}

/** A JSON request with a session cookie (or none). */
export function asPerson(cookie: string | null, path: string, init: { method?: string; body?: unknown } = {}): Promise<Response> {
  const headers = new Headers({ accept: 'application/json' });
  if (cookie) headers.set('cookie', cookie);
  if (init.body !== undefined) headers.set('content-type', 'application/json');
  return appFetch(path, { method: init.method ?? 'GET', headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) });
}
