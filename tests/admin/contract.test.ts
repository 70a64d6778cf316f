/**
 * The admin API's contract: every admin endpoint is in /api/openapi.json with its methods, and no
 * body or query an admin can send gets a server error.
 */
import fc from 'fast-check';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import { onDemandRoutes } from '../support/routes';
import { appFetch } from '../support/stack';
import { adminCookie } from './support';

let admin: string;

const adminApi = onDemandRoutes().filter((r) => /^\/api\/(admin|invitations|password)\//.test(r.route));

describe('the admin API', () => {
  beforeAll(async () => {
    admin = await adminCookie();
  });
  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('is documented in /api/openapi.json, every path and method', async () => {
    const doc = (await (await appFetch('/api/openapi.json')).json()) as { paths: Record<string, Record<string, unknown>>; components: { schemas: Record<string, unknown> } };
    expect(adminApi.length).toBeGreaterThanOrEqual(20);
    const missing = adminApi
      .map((r) => ({ path: r.route.replace(/\[(\w+)\]/g, '{$1}'), method: r.method.toLowerCase() }))
      .filter(({ path, method }) => !doc.paths[path]?.[method])
      .map(({ path, method }) => `${method.toUpperCase()} ${path}`);
    expect(missing).toEqual([]);
    const create = doc.components.schemas.CreateRegion as { properties: Record<string, unknown>; required: string[] };
    expect(Object.keys(create.properties)).toEqual(['name', 'countryCode', 'prefixes', 'consultantIds']);
    const update = doc.components.schemas.UpdateRegion as { properties: Record<string, unknown> };
    expect(Object.keys(update.properties)).toEqual(['name', 'countryCode', 'prefixes', 'consultantIds']);
    const assign = doc.components.schemas.AssignLead as { required: string[] };
    expect(assign.required.sort()).toEqual(['consultantId', 'reason']);
  });

  const bodies = fc.oneof(
    fc.json({ maxDepth: 3 }),
    fc.record(
      {
        name: fc.string({ maxLength: 90 }),
        countryCode: fc.constantFrom('US', 'CA', 'GB', 'NZ', 'ZZ', ''),
        prefixes: fc.array(fc.string({ maxLength: 12 }), { maxLength: 5 }),
        consultantIds: fc.array(fc.oneof(fc.uuid(), fc.string({ maxLength: 8 })), { maxLength: 3 }),
        email: fc.string({ maxLength: 40 }),
        firm: fc.string({ maxLength: 40 }),
        openClaimCap: fc.oneof(fc.integer(), fc.double(), fc.string({ maxLength: 4 })),
        leads: fc.constantFrom('reopen', 'colleague', 'x'),
        colleagueId: fc.oneof(fc.uuid(), fc.string({ maxLength: 8 })),
        consultantId: fc.oneof(fc.uuid(), fc.string({ maxLength: 8 })),
        reason: fc.string({ maxLength: 40 }),
        staleAfterHours: fc.oneof(fc.integer(), fc.string({ maxLength: 4 })),
        token: fc.string({ maxLength: 60 }),
        password: fc.string({ maxLength: 20 }),
      },
      { requiredKeys: [] },
    ).map((value) => JSON.stringify(value)),
  );

  // Settings are left out (a valid body would change the hours other tests count on); region
  // writes always run dry, so a body that happens to be valid stores nothing.
  const writes = adminApi.filter((r) => r.method !== 'GET' && r.route !== '/api/admin/settings');

  it.each(writes.map((r) => [r.method, r.route] as const))('%s %s answers every body below 500', async (method, route) => {
    await fc.assert(
      fc.asyncProperty(bodies, fc.constantFrom(randomUUID(), 'not-an-id', '00000000-0000-0000-0000-000000000000'), async (body, id) => {
        const path = route.replace(/\[\w+\]/g, id) + (route.startsWith('/api/admin/regions') && method !== 'DELETE' ? '?dryRun=1' : '');
        const response = await appFetch(path, { method, headers: { cookie: admin, 'content-type': 'application/json' }, body: typeof body === 'string' ? body : JSON.stringify(body) });
        await response.arrayBuffer();
        return response.status < 500;
      }),
      { numRuns: 25, seed: 808 },
    );
  });

  it.each([
    '/api/admin/activity?page=-1&pageSize=abc&from=2026-13-45',
    '/api/admin/activity?lead=LW-%00&person=%27',
    '/api/admin/funnel?months=1e9&region=%E0%A4%A',
    `/api/admin/consultants/${'x'.repeat(400)}`,
  ])('GET %s answers below 500', async (path) => {
    const response = await appFetch(path, { headers: { cookie: admin } });
    expect(response.status).toBeLessThan(500);
  });
});
