/**
 * Whatever arrives from outside, the answer is never a server error. Routes are found, not
 * listed: every endpoint file under src/pages/api and every on-demand page (each with the
 * methods it exports), and every path of the OpenAPI document. Each is driven with wild bodies,
 * headers and ids, anonymously and as an owner, a consultant and an admin: ≥ 10,000 requests,
 * no 5xx. Runs alone: wrong passwords and limits it trips are cleared afterwards.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../scripts/stack/config';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { closeDb, getDb } from '../../src/db/client';
import { validSubmission, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';

interface Route {
  /** Path with `[param]` and `[...rest]` segments as in the file system. */
  pattern: string;
  methods: string[];
}

const ALL_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? filesUnder(full) : [full];
  });
}

/** Every on-demand route in src/pages, with the methods its file exports. */
function discoverRoutes(): Route[] {
  const pagesDir = path.join(projectRoot, 'src/pages');
  const routes: Route[] = [];
  for (const file of filesUnder(pagesDir)) {
    const source = readFileSync(file, 'utf8');
    const relative = path.relative(pagesDir, file).replace(/\\/g, '/');
    const isEndpoint = /\.(ts|js)$/.test(relative);
    if (!isEndpoint && !/\.astro$/.test(relative)) continue;
    if (!/prerender\s*=\s*false/.test(source)) continue;
    const pattern = `/${relative.replace(/\.(ts|js|astro)$/, '').replace(/(^|\/)index$/, '')}`.replace(/\/$/, '') || '/';
    const exported = [...source.matchAll(/export\s+const\s+(GET|POST|PUT|PATCH|DELETE|ALL)\b/g)].map((m) => m[1]!);
    const methods = !isEndpoint ? ['GET', 'POST'] : exported.includes('ALL') ? ALL_METHODS : exported;
    routes.push({ pattern, methods: methods.length ? methods : ['GET'] });
  }
  return routes;
}

/** Paths and methods of the OpenAPI document, `{param}` turned into `[param]`. */
async function openApiRoutes(): Promise<Route[]> {
  const response = await appFetch('/api/openapi.json');
  const doc = (await response.json()) as { paths?: Record<string, Record<string, unknown>> };
  return Object.entries(doc.paths ?? {}).map(([p, item]) => ({
    pattern: p.replace(/\{([^}]+)\}/g, '[$1]'),
    methods: Object.keys(item).map((m) => m.toUpperCase()).filter((m) => ALL_METHODS.includes(m)),
  }));
}

const wildSegment = fc.oneof(
  fc.uuid(),
  fc.constantFrom('not-a-uuid', '0', '-1', '00000000-0000-0000-0000-000000000000', '%00', '%ZZ', '..%2F..%2Fetc', '%E2%80%AE', '%ED%A0%80', 'a'.repeat(600)),
  fc.string({ maxLength: 40 }).map((s) => encodeURIComponent(s) || 'x'),
);

const wildBody = fc.oneof(
  fc.json({ maxDepth: 4 }).map((body) => ({ type: 'application/json', body })),
  fc.anything({ maxDepth: 3 }).map((v) => ({ type: 'application/json', body: JSON.stringify(v) ?? 'null' })),
  fc.string({ maxLength: 400 }).map((body) => ({ type: 'application/json', body })),
  fc.string({ unit: 'binary', maxLength: 200 }).map((body) => ({ type: 'application/json', body: JSON.stringify({ text: body, name: body, email: body }) })),
  fc
    .dictionary(fc.constantFrom('email', 'password', 'next', 'assessment', 'photos', 'status', 'note', 'role', 'userId', 'name'), fc.string({ unit: 'binary', maxLength: 80 }), { maxKeys: 5 })
    .map((fields) => ({ type: 'application/x-www-form-urlencoded', body: new URLSearchParams(fields).toString() })),
  fc.string({ maxLength: 200 }).map((body) => ({ type: 'multipart/form-data; boundary=lagwise', body: `--lagwise\r\nContent-Disposition: form-data; name="assessment"\r\n\r\n${body}\r\n--lagwise--\r\n` })),
  fc.uint8Array({ maxLength: 300 }).map((bytes) => ({ type: 'application/octet-stream', body: Buffer.from(bytes).toString('latin1') })),
  fc.constant({ type: 'text/plain', body: '' }),
);

const wildHeaders = fc.record(
  {
    accept: fc.constantFrom('application/json', 'text/html', '*/*', '', 'image/*;q=0'),
    'idempotency-key': fc.oneof(fc.uuid(), fc.string({ maxLength: 200 }).map((s) => s.replace(/[^\x20-\x7e]/g, '') || 'k')),
    'x-forwarded-for': fc.oneof(fc.ipV4(), fc.constant('not-an-ip, 1.2.3.4'), fc.ipV6()),
    'accept-language': fc.constantFrom('en', 'de-DE,de;q=0.9', '*', 'zz'),
    range: fc.constantFrom('bytes=0-10', 'bytes=-1', 'lines=1-2'),
  },
  { requiredKeys: [] },
);

let sessions: Record<'anonymous' | 'owner' | 'consultant' | 'admin', string> = { anonymous: '', owner: '', consultant: '', admin: '' };

function cookiesOf(response: Response): string {
  return response.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

async function passwordSession(email: string): Promise<string> {
  const response = await appFetch('/api/sign-in/password', { method: 'POST', body: new URLSearchParams({ email, password: DEMO_PASSWORD }) });
  expect(response.status).toBe(303);
  return cookiesOf(response);
}

async function ownerSession(): Promise<string> {
  const input = validSubmission();
  const response = await appFetch('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
  expect(response.status).toBe(201);
  const [mail] = await waitForMessages(input.contact.email, (m) => m.length > 0);
  const link = /href="([^"]*magic-link\/verify[^"]*)"/.exec(mail!.html ?? '')![1]!.replaceAll('&amp;', '&');
  return cookiesOf(await fetch(link, { redirect: 'manual' }));
}

async function clearCounters(): Promise<void> {
  await getDb().execute(sql`delete from rate_limit_windows where key like 'req:%' or key like 'sign-in-link:%' or key like 'submit:%'`);
  await getDb().execute(sql`delete from sign_in_throttles`);
}

let routes: Route[] = [];

beforeAll(async () => {
  await clearCounters();
  const found = new Map<string, Set<string>>();
  for (const route of [...discoverRoutes(), ...(await openApiRoutes())]) {
    const methods = found.get(route.pattern) ?? new Set<string>();
    for (const m of route.methods) methods.add(m);
    found.set(route.pattern, methods);
  }
  routes = [...found].map(([pattern, methods]) => ({ pattern, methods: [...methods] }));
  sessions = {
    anonymous: '',
    owner: await ownerSession(),
    consultant: await passwordSession('marisol@quintero-thermal.example'),
    admin: await passwordSession('admin@lagwise.example'),
  };
}, 120_000);

afterAll(async () => {
  await clearCounters();
  await closeDb();
});

function fillPattern(pattern: string, segments: string[]): string {
  let i = 0;
  return pattern.replace(/\[(\.\.\.)?[^\]]+\]/g, (_m, rest: string | undefined) => {
    const value = segments[i++ % segments.length] ?? 'x';
    return rest ? `${value}/${segments[(i + 1) % segments.length] ?? 'y'}` : value;
  });
}

describe('the fuzz', () => {
  it('finds the routes we know of', () => {
    const patterns = routes.map((r) => r.pattern);
    for (const known of ['/api/estimate', '/api/assessments', '/api/sign-in/password', '/api/sign-in/link', '/api/auth/[...all]', '/my/assessments/[id]']) {
      expect(patterns).toContain(known);
    }
  });

  it('answers ≥ 10,000 wild requests to every endpoint, as anyone, without a single 5xx', async () => {
    const failures: string[] = [];
    let sent = 0;
    const requestArb = fc.record({
      route: fc.constantFrom(...routes),
      methodPick: fc.nat(),
      segments: fc.array(wildSegment, { minLength: 1, maxLength: 3 }),
      query: fc.option(fc.string({ maxLength: 60 }).map((s) => `?${encodeURIComponent(s)}=${encodeURIComponent(s)}&id=%00`), { nil: '' }),
      body: wildBody,
      headers: wildHeaders,
      who: fc.constantFrom('anonymous', 'owner', 'consultant', 'admin') as fc.Arbitrary<keyof typeof sessions>,
    });
    // A few generated requests are refused by fetch itself (header values it will not send); the rest must reach 10,000.
    const runs = 10_500;
    const property = fc.asyncProperty(requestArb, async ({ route, methodPick, segments, query, body, headers, who }) => {
      const method = route.methods[methodPick % route.methods.length]!;
      const target = fillPattern(route.pattern, segments) + (query ?? '');
      // Signing out would end the session the rest of the run uses.
      const cookie = /sign-out/.test(target) ? '' : sessions[who];
      const init: RequestInit = {
        method,
        headers: { ...headers, ...(cookie ? { cookie } : {}), ...(method === 'GET' || method === 'HEAD' ? {} : { 'content-type': body.type }) },
        body: method === 'GET' || method === 'HEAD' ? undefined : body.body,
      };
      let status: number;
      try {
        const response = await appFetch(target, init);
        await response.arrayBuffer();
        status = response.status;
      } catch (error) {
        if (/Invalid URL|invalid|ByteString/i.test(String(error))) return true; // the client refused to send it
        throw error;
      }
      sent += 1;
      if (status >= 500) failures.push(`${status} ${method} ${target.slice(0, 120)} as ${who} (${body.type})`);
      return true;
    });
    await fc.assert(property, { numRuns: runs, seed: 1212, endOnFailure: false });
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(10_000);
  }, 900_000);
});
