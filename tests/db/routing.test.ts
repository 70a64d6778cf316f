import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { findRegionForPostalCode } from '../../src/db/queries/regions';
import { regionPostalPrefixes, regions } from '../../src/db/schema';
import { normalisePostalCode } from '../../src/lib/routing/postal-code';

// Regions of this test's own in a country the demo does not use, so demo edits cannot break it.
const fixtures = [
  { slug: 'test-routing-tasman', name: 'Tasman Bays', prefixes: ['7'] },
  { slug: 'test-routing-nelson-inner', name: 'Inner Harbour', prefixes: ['701', '7020'] },
];

async function route(typed: string): Promise<string | null> {
  const normalized = normalisePostalCode('NZ', typed);
  if (!normalized.ok) throw new Error(normalized.message);
  const match = await findRegionForPostalCode(getDb(), 'NZ', normalized.routingKey);
  return match?.regionName ?? null;
}

describe('routing a postal code to a region', () => {
  beforeAll(async () => {
    const db = getDb();
    for (const f of fixtures) {
      const [row] = await db.insert(regions).values({ slug: f.slug, name: f.name, countryCode: 'NZ' }).returning();
      await db.insert(regionPostalPrefixes).values(f.prefixes.map((prefix) => ({ regionId: row!.id, countryCode: 'NZ', prefix })));
    }
  });
  afterAll(async () => {
    for (const f of fixtures) await getDb().delete(regions).where(eq(regions.slug, f.slug));
    await closeDb();
  });

  it('picks the longest matching prefix', async () => {
    expect(await route('7010')).toBe('Inner Harbour');
    expect(await route('7020')).toBe('Inner Harbour');
    expect(await route('7022')).toBe('Tasman Bays');
  });

  it('finds no region for a code outside every prefix', async () => {
    expect(await route('8011')).toBeNull();
  });

  it('does not match a prefix of another country', async () => {
    expect(await findRegionForPostalCode(getDb(), 'AU', '7010')).toBeNull();
  });
});
