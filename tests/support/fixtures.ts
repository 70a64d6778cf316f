/**
 * Invented plants and a region of the tests' own (Australia, which the demo does not use),
 * so these tests never depend on the demo scenario.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { getDb, type Database } from '../../src/db/client';
import { regionConsultants, regionPostalPrefixes, regions, user } from '../../src/db/schema';
import type { CreateAssessmentInput } from '../../src/schemas/assessment';
import { stack } from './stack';

export const testRegion = {
  slug: 'test-wattle-valley',
  name: 'Wattle Valley',
  countryCode: 'AU',
  prefixes: ['35', '356'],
  consultant: { email: 'juno@fernhill-insulation.example', name: 'Juno Fernhill' },
};

/** Makes the tests' region and its consultant once; safe to call from every test file. */
export async function ensureTestRegion(db: Database = getDb()): Promise<{ regionId: string; consultantId: string }> {
  const [region] = await db
    .insert(regions)
    .values({ slug: testRegion.slug, name: testRegion.name, countryCode: testRegion.countryCode })
    .onConflictDoUpdate({ target: regions.slug, set: { name: testRegion.name } })
    .returning({ id: regions.id });
  await db
    .insert(regionPostalPrefixes)
    .values(testRegion.prefixes.map((prefix) => ({ regionId: region!.id, countryCode: testRegion.countryCode, prefix })))
    .onConflictDoNothing();
  await db
    .insert(user)
    .values({ email: testRegion.consultant.email, name: testRegion.consultant.name, role: 'consultant', emailVerified: true })
    .onConflictDoNothing({ target: user.email });
  const [consultant] = await db.select({ id: user.id }).from(user).where(eq(user.email, testRegion.consultant.email));
  await db.insert(regionConsultants).values({ regionId: region!.id, userId: consultant!.id }).onConflictDoNothing();
  return { regionId: region!.id, consultantId: consultant!.id };
}

/** A complete, valid submission from an invented plant; each call gets its own e-mail address. */
export function validSubmission(overrides: { postalCode?: string; email?: string } = {}): CreateAssessmentInput {
  const tag = randomUUID().slice(0, 8);
  return {
    contact: {
      name: 'Petra Lindqvist',
      company: 'Quarry Hill Dairy',
      email: overrides.email ?? `petra+${tag}@quarryhill.example`,
      phone: '+61 3 5550 1234',
    },
    consent: true,
    plant: { plantName: 'Quarry Hill Dairy', plantType: 'creamery', countryCode: 'AU', postalCode: overrides.postalCode ?? '3564' },
    estimate: {
      energy: { fuel: 'natural-gas', price: 0.09, priceUnit: 'kWh', currency: 'AUD' },
      runs: [
        { id: 'steam-1', label: 'Boiler steam header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 20, steamGaugePressureKPa: 600 },
        { id: 'hw-1', label: 'Hot water to wash bay', service: 'hot-water', pipe: { standard: 'ASTM-B88-L', size: '1' }, lengthM: 12 },
      ],
    },
  };
}

export interface FakeMessage {
  id: string;
  to: string[];
  subject: string;
  html: string | null;
  text: string | null;
}

export async function messagesTo(address: string): Promise<FakeMessage[]> {
  const response = await fetch(`${stack.mailFakeUrl}/_fake/messages?to=${encodeURIComponent(address)}`);
  const body = (await response.json()) as { data: FakeMessage[] };
  return body.data;
}

/** Polls the mail fake until `accept` holds, or fails after the deadline with what it saw. */
export async function waitForMessages(
  address: string,
  accept: (messages: FakeMessage[]) => boolean,
  timeoutMs = 45_000,
): Promise<FakeMessage[]> {
  const deadline = Date.now() + timeoutMs;
  let seen: FakeMessage[] = [];
  while (Date.now() < deadline) {
    seen = await messagesTo(address);
    if (accept(seen)) return seen;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`mail to ${address} did not arrive in ${timeoutMs / 1000} s; saw: ${seen.map((m) => m.subject).join(' | ') || 'nothing'}`);
}

export async function setMailOutage(down: boolean): Promise<void> {
  const response = await fetch(`${stack.mailFakeUrl}/_fake/outage`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ down }),
  });
  if (!response.ok) throw new Error(`outage switch answered ${response.status}`);
}

/** A multipart body as the estimate form sends it. */
export function submissionForm(input: unknown, files: { field: string; name: string; type: string; bytes: Uint8Array<ArrayBuffer> }[] = []): FormData {
  const form = new FormData();
  form.set('assessment', JSON.stringify(input));
  for (const file of files) form.append(file.field, new Blob([file.bytes], { type: file.type }), file.name);
  return form;
}
