/**
 * As an attacker would: guessing passwords, forging X-Forwarded-For, calling better-auth's own
 * routes, sending giant or poisoned bodies, reusing idempotency keys, framing the site. The limits
 * run at their real numbers here, on a web server of this suite's own (the shared one multiplies
 * them, since every test comes from 127.0.0.1), against the shared test database.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, projectRoot } from '../../scripts/stack/config';
import { waitForHttp } from '../../scripts/stack/wait';
import { closeDb, getDb } from '../../src/db/client';
import { countLiveSignInLinks } from '../../src/db/queries/sign-in-links';
import { DEMO_PASSWORD } from '../../scripts/seed/demo-people';
import { ensureTestRegion, messagesTo, validSubmission, waitForMessages } from '../support/fixtures';

let server: ChildProcess;
let base = '';
const origin = () => base;

async function clearCounters(): Promise<void> {
  await getDb().execute(sql`delete from rate_limit_windows where key like 'req:%' or key like 'sign-in-link:%'`);
  await getDb().execute(sql`delete from sign_in_throttles`);
}

beforeAll(async () => {
  await ensureTestRegion();
  await clearCounters();
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  server = spawn(process.execPath, ['--import', 'tsx', path.join(projectRoot, 'src/server/serve.ts')], {
    cwd: projectRoot,
    env: {
      ...process.env,
      PORT: String(port),
      PUBLIC_BASE_URL: base,
      BETTER_AUTH_URL: base,
      NODE_ENV: 'production',
      LAGWISE_REQUEST_LIMIT_MULTIPLIER: '1',
      TRUSTED_PROXIES: '',
    },
    stdio: 'ignore',
  });
  await waitForHttp(`${base}/api/health`, { hasExited: () => server.exitCode !== null, timeoutMs: 60_000 });
}, 90_000);

afterAll(async () => {
  server?.kill('SIGTERM');
  await clearCounters();
  await closeDb();
});

function request(pathname: string, init: RequestInit = {}): Promise<Response> {
  const headers = new Headers(init.headers);
  if (!headers.has('origin')) headers.set('origin', origin());
  return fetch(`${base}${pathname}`, { ...init, headers, redirect: 'manual' });
}

function passwordTry(email: string, password: string, forwardedFor?: string): Promise<Response> {
  const headers: Record<string, string> = { 'content-type': 'application/x-www-form-urlencoded', accept: 'application/json' };
  if (forwardedFor) headers['x-forwarded-for'] = forwardedFor;
  return request('/api/sign-in/password', { method: 'POST', headers, body: new URLSearchParams({ email, password }).toString() });
}

function serverRssBytes(): number {
  const status = readFileSync(`/proc/${server.pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+) kB/.exec(status)![1]) * 1024;
}

describe('password guessing', () => {
  it('refuses with 429 and Retry-After long before 50 wrong tries, even the right password, whatever X-Forwarded-For says', async () => {
    const email = 'anders@kvale-insulation.example';
    const statuses: number[] = [];
    let retryAfter: string | null = null;
    for (let i = 0; i < 50; i += 1) {
      const response = await passwordTry(email, `wrong-guess-${i}`, `203.0.113.${i}`);
      statuses.push(response.status);
      if (response.status === 429) retryAfter ??= response.headers.get('retry-after');
      await response.arrayBuffer();
    }
    const first429 = statuses.indexOf(429);
    expect(first429).toBeGreaterThan(0);
    expect(first429).toBeLessThanOrEqual(6);
    expect(statuses.slice(first429).every((s) => s === 429)).toBe(true);
    expect(Number(retryAfter)).toBeGreaterThan(0);
    const right = await passwordTry(email, DEMO_PASSWORD, '198.51.100.7');
    expect(right.status).toBe(429);
    const body = (await right.json()) as { error: { message: string } };
    expect(body.error.message).toMatch(/Too many wrong passwords.*try again in/);
  });

  it('counts a client spraying many accounts, and a forged X-Forwarded-For does not make it a new client', async () => {
    await clearCounters();
    const statuses: number[] = [];
    for (let i = 0; i < 25; i += 1) {
      const response = await passwordTry(`nobody-${i}@spray.example`, 'guess-guess', `192.0.2.${i}`);
      statuses.push(response.status);
      await response.arrayBuffer();
    }
    expect(statuses.slice(0, 19).every((s) => s === 303)).toBe(true);
    expect(statuses.slice(21).every((s) => s === 429)).toBe(true);
    await clearCounters();
  });

  it('sends a browser back to the form with the wait spelled out', async () => {
    await clearCounters();
    for (let i = 0; i < 6; i += 1) await (await passwordTry('tobias@wendt-energy.example', `nope-${i}`)).arrayBuffer();
    const response = await request('/api/sign-in/password', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html' },
      body: new URLSearchParams({ email: 'tobias@wendt-energy.example', password: DEMO_PASSWORD }).toString(),
    });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toMatch(/error=team-limited&wait=\d+/);
    await clearCounters();
  });
});

describe("better-auth's own sign-in routes", () => {
  it.each(['/api/auth/sign-in/magic-link', '/api/auth/sign-in/email', '/api/auth/sign-up/email', '/api/auth/forget-password', '/api/auth/request-password-reset'])(
    'POST %s is refused',
    async (route) => {
      const response = await request(route, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: 'ines@tamsincreek.example', password: DEMO_PASSWORD, callbackURL: '/' }),
      });
      expect(response.status).toBe(404);
    },
  );
});

describe('sign-in links', () => {
  it('answer a known and an unknown address alike, mail only the known one, and a new link revokes the older ones', async () => {
    await clearCounters();
    const input = validSubmission();
    const submitted = await request('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
    expect(submitted.status).toBe(201);
    const owner = input.contact.email;
    await waitForMessages(owner, (m) => m.length >= 1);
    const ask = (email: string) =>
      request('/api/sign-in/link', { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ email }).toString() });
    const unknownAddress = `nobody-${randomUUID().slice(0, 8)}@wicker-falls.example`;
    const [known1, unknown] = [await ask(owner), await ask(unknownAddress)];
    expect(known1.status).toBe(unknown.status);
    expect(known1.headers.get('location')).toBe(unknown.headers.get('location'));
    await waitForMessages(owner, (m) => m.length >= 2);
    const known2 = await ask(owner);
    expect(known2.headers.get('location')).toBe('/sign-in?sent=1#owner');
    await waitForMessages(owner, (m) => m.length >= 3);
    expect(await countLiveSignInLinks(getDb(), owner)).toBe(1);
    expect(await messagesTo(unknownAddress)).toHaveLength(0);
  });
});

describe('bodies', () => {
  it('refuses a 200 MB body by its Content-Length before reading it (server RSS grows < 50 MB)', async () => {
    const before = serverRssBytes();
    // The body is offered in full, but the answer must come from the header alone.
    const status = await new Promise<number>((resolve) => {
      let answered = 0;
      const req = http.request(`${base}/api/estimate`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'content-length': String(200 * 1024 * 1024), origin: origin() },
      });
      req.on('response', (res) => {
        answered = res.statusCode ?? 0;
        res.resume();
        req.destroy();
      });
      req.on('error', () => {});
      req.on('close', () => resolve(answered));
      req.flushHeaders();
      const chunk = Buffer.alloc(1024 * 1024, 0x20);
      let sent = 0;
      const pump = () => {
        while (sent < 200 && !req.destroyed && req.write(chunk)) sent += 1;
        if (sent < 200 && !req.destroyed) req.once('drain', pump);
      };
      pump();
    });
    expect(status).toBe(413);
    expect(serverRssBytes() - before).toBeLessThan(50 * 1024 * 1024);
  });

  it('stops reading a chunked body at the cap', async () => {
    const before = serverRssBytes();
    const result = await new Promise<{ status: number; sentMb: number }>((resolve) => {
      const req = http.request(`${base}/api/estimate`, { method: 'POST', headers: { 'content-type': 'application/json', origin: origin() } });
      const chunk = Buffer.alloc(1024 * 1024, 0x20);
      let sent = 0;
      let status = 0;
      req.on('response', (res) => {
        status = res.statusCode ?? 0;
        res.resume();
      });
      const finish = () => resolve({ status, sentMb: sent });
      req.on('error', finish);
      req.on('close', finish);
      const pump = () => {
        while (sent < 600 && !req.destroyed && req.write(chunk)) sent += 1;
        if (sent < 600 && !req.destroyed) req.once('drain', pump);
        else if (!req.destroyed) req.end();
      };
      pump();
    });
    expect(result.sentMb).toBeLessThan(600);
    expect(serverRssBytes() - before).toBeLessThan(50 * 1024 * 1024);
  });

  it('answers Expect: 100-continue past the cap with 413, never 100 Continue', async () => {
    const outcome = await new Promise<{ continued: boolean; status: number }>((resolve, reject) => {
      let continued = false;
      const req = http.request(`${base}/api/assessments`, {
        method: 'POST',
        headers: { 'content-type': 'multipart/form-data; boundary=x', 'content-length': String(300 * 1024 * 1024), expect: '100-continue', origin: origin() },
      });
      req.on('continue', () => (continued = true));
      req.on('response', (res) => {
        res.resume();
        resolve({ continued, status: res.statusCode ?? 0 });
        req.destroy();
      });
      req.on('error', reject);
      req.flushHeaders();
    });
    expect(outcome).toEqual({ continued: false, status: 413 });
  });

  it.each([
    ['NUL', 'Quarry\u0000Hill'],
    ['a lone surrogate', 'Quarry \uD800 Hill'],
    ['a bidi override', 'Quarry \u202E lliH'],
    ['a control character', 'Quarry\u0007Hill'],
  ])('refuses %s in a text field with 400 naming the field', async (_what, company) => {
    const input = validSubmission();
    input.contact.company = company;
    const response = await request('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(input) });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { issues: { path: string; message: string }[] } };
    expect(body.error.issues[0]!.path).toBe('contact.company');
    expect(body.error.issues[0]!.message).toMatch(/retype it/);
  });

  it('refuses NUL in a run label of an estimate with 400', async () => {
    const estimate = validSubmission().estimate;
    estimate.runs[0]!.label = 'Steam\u0000header';
    const response = await request('/api/estimate', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(estimate) });
    expect(response.status).toBe(400);
  });
});

describe('idempotency keys', () => {
  it('refuses a key reused with another body with 422 saying so, and replays it with the same body', async () => {
    const key = `abuse-${randomUUID()}`;
    const first = validSubmission();
    const send = (input: unknown) =>
      request('/api/assessments', { method: 'POST', headers: { 'content-type': 'application/json', 'idempotency-key': key }, body: JSON.stringify(input) });
    const created = await send(first);
    expect(created.status).toBe(201);
    const again = await send(first);
    expect(again.status).toBe(200);
    const other = await send(validSubmission());
    expect(other.status).toBe(422);
    expect(((await other.json()) as { error: { message: string } }).error.message).toMatch(/already used for a different assessment/);
  });
});

describe('request limits', () => {
  it('answers /api/estimate past its per-client limit with 429 and Retry-After', async () => {
    await clearCounters();
    let limited: Response | undefined;
    // The limit counts per clock minute: a run that crosses into the next minute starts again at
    // zero there, so up to three limits' worth are sent (one of two adjacent minutes must pass it).
    for (let i = 0; i < 3 * 240 && !limited; i += 1) {
      const response = await request('/api/estimate', { method: 'POST', headers: { 'content-type': 'application/json', 'x-forwarded-for': `10.9.${i % 256}.${1 + Math.floor(i / 256)}` }, body: '{}' });
      if (response.status === 429) limited = response;
      else await response.arrayBuffer();
    }
    expect(limited?.status).toBe(429);
    expect(Number(limited!.headers.get('retry-after'))).toBeGreaterThan(0);
    await clearCounters();
  });
});

describe('headers and origins', () => {
  it.each(['/', '/how-it-works', '/sign-in', '/api/health', '/favicon.svg'])('%s carries the security headers', async (route) => {
    const response = await request(route);
    await response.arrayBuffer();
    const csp = response.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("frame-ancestors 'none'");
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('referrer-policy')).toBe('same-origin');
  });

  it('a prerendered page carries its script and style hashes as a header too', async () => {
    const response = await request('/estimate');
    await response.arrayBuffer();
    expect(response.headers.get('content-security-policy')).toMatch(/script-src 'self'/);
  });

  it('a signed-in or on-demand page is never cached', async () => {
    const response = await request('/sign-in');
    await response.arrayBuffer();
    expect(response.headers.get('cache-control')).toBe('no-store');
  });

  it('refuses a JSON POST from another site', async () => {
    const response = await request('/api/estimate', {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: 'https://elsewhere.example' },
      body: JSON.stringify(validSubmission().estimate),
    });
    expect(response.status).toBe(403);
  });

  it("closes Astro's image endpoint", async () => {
    const response = await request('/_image?href=/favicon.svg&f=png&w=20000&h=20000');
    expect(response.status).toBe(404);
  });
});
