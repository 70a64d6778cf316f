/**
 * GET /api/coverage tells an owner at the plant step whether a consultant covers their postal
 * code — the routing's own answer, asked before sending rather than learnt after.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { regionConsultants, regionPostalPrefixes, regions, user } from '../../src/db/schema';
import { apiErrorSchema } from '../../src/schemas/api-error';
import { coverageAnswerSchema } from '../../src/schemas/coverage';
import { ensureTestRegion, testRegion } from '../support/fixtures';
import { appFetch } from '../support/stack';

/** A region of the tests' own whose only consultant has been deactivated. */
const idleRegion = { slug: 'test-coverage-dry-creek', name: 'Dry Creek', prefix: '2999', email: 'ossian@dry-creek-lagging.example' };

async function ask(country: string, postalCode: string): Promise<Response> {
  return appFetch(`/api/coverage?${new URLSearchParams({ country, postalCode })}`);
}

beforeAll(async () => {
  await ensureTestRegion();
  const db = getDb();
  const [region] = await db
    .insert(regions)
    .values({ slug: idleRegion.slug, name: idleRegion.name, countryCode: 'AU' })
    .onConflictDoUpdate({ target: regions.slug, set: { name: idleRegion.name } })
    .returning({ id: regions.id });
  await db.insert(regionPostalPrefixes).values({ regionId: region!.id, countryCode: 'AU', prefix: idleRegion.prefix }).onConflictDoNothing();
  const [consultant] = await db
    .insert(user)
    .values({ email: idleRegion.email, name: 'Ossian Tarrant', role: 'consultant', emailVerified: true, banned: true })
    .onConflictDoUpdate({ target: user.email, set: { banned: true } })
    .returning({ id: user.id });
  await db.insert(regionConsultants).values({ regionId: region!.id, userId: consultant!.id }).onConflictDoNothing();
});

afterAll(async () => {
  await closeDb();
});

describe('GET /api/coverage', () => {
  it('a code inside a region with an active consultant is covered, by that region', async () => {
    const response = await ask('AU', ' 3564 ');
    expect(response.status).toBe(200);
    expect(coverageAnswerSchema.parse(await response.json())).toEqual({
      countryCode: 'AU',
      postalCode: '3564',
      covered: true,
      regionName: testRegion.name,
    });
  });

  it('a code no region takes is not covered', async () => {
    const response = await ask('AU', '0870');
    expect(response.status).toBe(200);
    expect(coverageAnswerSchema.parse(await response.json())).toEqual({ countryCode: 'AU', postalCode: '0870', covered: false, regionName: null });
  });

  it('a region whose only consultant is deactivated does not count as covered', async () => {
    const response = await ask('au', idleRegion.prefix);
    expect(response.status).toBe(200);
    expect(coverageAnswerSchema.parse(await response.json())).toMatchObject({ covered: false, regionName: null });
  });

  it('a code that is not a postal code of the country is a 400 naming the field and the expected shape', async () => {
    const response = await ask('AU', 'SW1A 1AA');
    expect(response.status).toBe(400);
    const issue = apiErrorSchema.parse(await response.json()).error.issues?.[0];
    expect(issue).toMatchObject({ path: 'postalCode' });
    expect(issue?.message).toContain('it should look like 3056');
  });

  it('a country we do not serve, or no code at all, is a 400 per field', async () => {
    const response = await appFetch('/api/coverage?country=ZZ');
    expect(response.status).toBe(400);
    const paths = apiErrorSchema.parse(await response.json()).error.issues?.map((issue) => issue.path);
    expect(paths?.sort()).toEqual(['country', 'postalCode']);
  });

  it('is described in the OpenAPI document, answer included', async () => {
    const doc = (await (await appFetch('/api/openapi.json')).json()) as {
      paths: Record<string, { get?: { responses: Record<string, unknown> } }>;
      components: { schemas: Record<string, { required?: string[] }> };
    };
    expect(Object.keys(doc.paths['/api/coverage']?.get?.responses ?? {}).sort()).toEqual(['200', '400', '429']);
    expect(doc.components.schemas.Coverage?.required?.sort()).toEqual(['countryCode', 'covered', 'postalCode', 'regionName']);
  });
});
