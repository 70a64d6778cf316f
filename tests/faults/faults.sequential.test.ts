/**
 * Bad luck, on a private stack (./private-stack.ts): PostgreSQL restarted under load, the worker
 * killed mid-job, the web server killed mid-submission, the mail service frozen. Nothing is lost,
 * nothing is sent twice, no visitor meets a 500 or a refused connection while the database is away.
 */
import { createHmac, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { validSubmission } from '../support/fixtures';
import { startPrivateStack, type PrivateStack } from './private-stack';

let stack: PrivateStack;

/**
 * A session cookie signed as better-auth signs it (HMAC-SHA256 with the app's secret), so the
 * server must look the session up in the database rather than refuse it on its face.
 */
function signedSessionCookie(): string {
  const token = randomUUID().replaceAll('-', '');
  const signature = createHmac('sha256', process.env.BETTER_AUTH_SECRET!).update(token).digest('base64');
  return `better-auth.session_token=${encodeURIComponent(`${token}.${signature}`)}`;
}

beforeAll(async () => {
  stack = await startPrivateStack('faults');
}, 180_000);

afterAll(async () => {
  await stack?.stop();
});

interface Outcome {
  kind: 'estimate' | 'submit';
  sentAt: number;
  doneAt: number;
  status?: number;
  json?: boolean;
  retryAfter?: string | null;
  networkError?: string;
}

interface Submission {
  key: string;
  body: string;
  email: string;
  /** The 201/200 answer's assessment id, once accepted. */
  assessmentId?: string;
}

const estimateBody = JSON.stringify(validSubmission().estimate);

async function post(kind: Outcome['kind'], path: string, body: string, headers: Record<string, string> = {}): Promise<Outcome & { body?: unknown }> {
  const sentAt = Date.now();
  try {
    const response = await fetch(`${stack.appUrl}${path}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...headers },
      body,
      signal: AbortSignal.timeout(60_000),
    });
    const text = await response.text();
    let parsed: unknown;
    let json = false;
    try {
      parsed = JSON.parse(text);
      json = (response.headers.get('content-type') ?? '').includes('application/json');
    } catch {
      json = false;
    }
    return { kind, sentAt, doneAt: Date.now(), status: response.status, json, retryAfter: response.headers.get('retry-after'), body: parsed };
  } catch (error) {
    return { kind, sentAt, doneAt: Date.now(), networkError: (error as Error).cause ? String((error as { cause: unknown }).cause) : (error as Error).message };
  }
}

function newSubmission(): Submission {
  const input = validSubmission();
  return { key: `faults-${randomUUID()}`, body: JSON.stringify(input), email: input.contact.email };
}

async function submit(submission: Submission): Promise<Outcome> {
  const outcome = await post('submit', '/api/assessments', submission.body, { 'idempotency-key': submission.key });
  if (outcome.status === 201 || outcome.status === 200) {
    submission.assessmentId = (outcome.body as { assessment: { id: string } }).assessment.id;
  }
  return outcome;
}

/** Submits until accepted (the same key and body each time, as a client retrying should). */
async function submitUntilAccepted(submission: Submission, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!submission.assessmentId) {
    if (Date.now() > deadline) throw new Error(`submission ${submission.key} was never accepted`);
    const outcome = await submit(submission);
    if (!submission.assessmentId) {
      if (outcome.status !== undefined && outcome.status !== 503) throw new Error(`submission answered ${outcome.status}`);
      await new Promise((r) => setTimeout(r, 300));
    }
  }
}

/** A bounded load: `workers` loops, each an estimate then a submission, until stopped. */
function startLoad(workers: number) {
  const outcomes: Outcome[] = [];
  const submissions: Submission[] = [];
  let stopped = false;
  const loops = Array.from({ length: workers }, async () => {
    let pending: Submission | undefined;
    for (let round = 0; !stopped && round < 2_000; round += 1) {
      outcomes.push(await post('estimate', '/api/estimate', estimateBody));
      pending ??= newSubmission();
      if (!submissions.includes(pending)) submissions.push(pending);
      outcomes.push(await submit(pending));
      if (pending.assessmentId) pending = undefined;
      await new Promise((r) => setTimeout(r, 50));
    }
  });
  return {
    outcomes,
    submissions,
    async stop() {
      stopped = true;
      await Promise.all(loops);
    },
  };
}

async function query<T>(text: string, values: unknown[] = []): Promise<T[]> {
  return (await stack.pool.query(text, values)).rows as T[];
}

async function messagesTo(address: string): Promise<{ subject: string }[]> {
  const response = await fetch(`${stack.mailUrl}/_fake/messages?to=${encodeURIComponent(address)}`);
  return ((await response.json()) as { data: { subject: string }[] }).data;
}

/** Waits until the mail queue is empty (nothing waiting, retrying or running). */
async function mailQueueDrained(timeoutMs = 120_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [row] = await query<{ n: number }>(
      "select count(*)::int as n from pgboss.job where state in ('created', 'retry', 'active')",
    );
    if (row && row.n === 0) return;
    if (Date.now() > deadline) throw new Error(`${row?.n} jobs still waiting after ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** Every accepted submission stored whole, and its owner's confirmation mailed exactly once. */
async function expectStoredWholeAndMailedOnce(submissions: Submission[]): Promise<void> {
  for (const submission of submissions) await submitUntilAccepted(submission);
  const ids = submissions.map((s) => s.assessmentId!);
  const stored = await query<{ id: string; runs: number }>(
    'select a.id, (select count(*)::int from pipe_runs r where r.assessment_id = a.id) as runs from assessments a where a.id = any($1)',
    [ids],
  );
  expect(stored).toHaveLength(new Set(ids).size);
  for (const row of stored) expect(row.runs).toBe(2);
  const [orphans] = await query<{ n: number }>(
    'select count(*)::int as n from assessments a where not exists (select 1 from pipe_runs r where r.assessment_id = a.id)',
  );
  expect(orphans!.n).toBe(0);
  await mailQueueDrained();
  for (const submission of submissions) {
    const mails = (await messagesTo(submission.email)).filter((m) => /Your Lagwise assessment LW-/.test(m.subject));
    expect(mails, `confirmations to ${submission.email}`).toHaveLength(1);
  }
  // One consultant covers the tests' region: one alert per assessment, never two.
  const alerts = await messagesTo('juno@fernhill-insulation.example');
  const [all] = await query<{ n: number }>('select count(*)::int as n from assessments');
  expect(alerts.length).toBe(all!.n);
}

describe('a PostgreSQL restart under load', () => {
  it('answers 503 JSON with Retry-After while it is away, recovers within 5 s, loses and repeats nothing', async () => {
    const load = startLoad(3);
    await new Promise((r) => setTimeout(r, 1_500));
    // The supervisor's stop signal for PostgreSQL is SIGINT: `kill -INT` of the postmaster.
    await stack.supervisor.stop('postgres');
    const downAt = Date.now();
    await new Promise((r) => setTimeout(r, 1_000));
    // A signed-in person opening a page meanwhile gets the plain page, not an error or the sign-in form.
    const page = await fetch(`${stack.appUrl}/my/assessments`, { headers: { cookie: signedSessionCookie() }, redirect: 'manual' });
    expect(page.status).toBe(503);
    expect(page.headers.get('retry-after')).toMatch(/^\d+$/);
    expect(await page.text()).toContain('Back in a moment');
    const health = await fetch(`${stack.appUrl}/api/health`);
    expect(health.status).toBe(503);
    expect(((await health.json()) as { down: string[] }).down).toContain('database');
    await new Promise((r) => setTimeout(r, 2_000));
    // PostgreSQL may answer a moment before startPostgres notices: the outage ends when we start it.
    const restartAt = Date.now();
    await stack.startPostgres();
    const backAt = Date.now();
    await new Promise((r) => setTimeout(r, 6_000));
    await load.stop();

    const { outcomes } = load;
    const refused = outcomes.filter((o) => o.networkError);
    expect(refused.map((o) => o.networkError), 'no refused or dropped connections').toEqual([]);
    const serverErrors = outcomes.filter((o) => o.status !== undefined && o.status >= 500 && o.status !== 503);
    expect(serverErrors.map((o) => o.status), 'no 500s').toEqual([]);
    const unavailable = outcomes.filter((o) => o.status === 503);
    for (const o of unavailable) {
      expect(o.json, '503 answered as JSON').toBe(true);
      expect(o.retryAfter, '503 says when to retry').toMatch(/^\d+$/);
    }
    const duringOutage = outcomes.filter((o) => o.sentAt > downAt && o.doneAt < restartAt);
    expect(duringOutage.length).toBeGreaterThan(0);
    expect(duringOutage.filter((o) => o.status !== 503).map((o) => `${o.kind} ${o.status}`), 'every answer while away is 503').toEqual([]);
    for (const kind of ['estimate', 'submit'] as const) {
      const firstSuccess = outcomes.find((o) => o.kind === kind && o.sentAt >= backAt && o.status !== undefined && o.status < 300);
      expect(firstSuccess, `a ${kind} succeeded after the restart`).toBeDefined();
      expect(firstSuccess!.doneAt - backAt, `${kind} recovered within 5 s of PostgreSQL answering`).toBeLessThanOrEqual(5_000);
    }
    await expectStoredWholeAndMailedOnce(load.submissions);
  });
});

describe('the worker killed (kill -9) mid-job', () => {
  it('is started again, and every mail still arrives exactly once', async () => {
    await fetch(`${stack.mailUrl}/_fake/hang`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"hang":true}' });
    const submissions = [newSubmission(), newSubmission(), newSubmission()];
    for (const s of submissions) await submitUntilAccepted(s);
    // Wait until the worker is inside a mail call (the fake holds it), then kill it.
    for (let i = 0; i < 200; i += 1) {
      const held = ((await (await fetch(`${stack.mailUrl}/_fake/hang`)).json()) as { held: number }).held;
      if (held > 0) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    const worker = stack.supervisor.current('worker')!;
    process.kill(worker.pid!, 'SIGKILL');
    await fetch(`${stack.mailUrl}/_fake/hang`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"hang":false}' });
    const restarted = await stack.supervisor.whenRunning('worker', { previousPid: worker.pid });
    expect(restarted.pid).not.toBe(worker.pid);
    await expectStoredWholeAndMailedOnce(submissions);
  });
});

describe('the web server killed (kill -9) mid-submission', () => {
  it('is started again; retried submissions are stored once, whole, and mailed once', async () => {
    const submissions = Array.from({ length: 6 }, newSubmission);
    const inFlight = submissions.map((s) => submit(s));
    await new Promise((r) => setTimeout(r, 30));
    const web = stack.supervisor.current('web')!;
    process.kill(web.pid!, 'SIGKILL');
    await Promise.all(inFlight);
    const restarted = await stack.supervisor.whenRunning('web', { previousPid: web.pid });
    expect(restarted.pid).not.toBe(web.pid);
    await expectStoredWholeAndMailedOnce(submissions);
    const [row] = await query<{ n: number }>('select count(*)::int as n from assessments where idempotency_key = any($1)', [submissions.map((s) => s.key)]);
    expect(row!.n).toBe(submissions.length);
  });
});

describe('a mail service that hangs', () => {
  it('times the call out and retries it; the mail arrives once when the service answers again', async () => {
    await fetch(`${stack.mailUrl}/_fake/hang`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"hang":true}' });
    const submission = newSubmission();
    await submitUntilAccepted(submission);
    // The test stack's mail timeout is 2 s: wait until a timed-out call has been retried.
    let retried = false;
    for (let i = 0; i < 300 && !retried; i += 1) {
      const [row] = await query<{ n: number }>("select count(*)::int as n from pgboss.job where name = 'email-send' and retry_count > 0 and state in ('retry','active','created')");
      retried = (row?.n ?? 0) > 0;
      if (!retried) await new Promise((r) => setTimeout(r, 200));
    }
    expect(retried, 'a hung mail call failed and was queued again').toBe(true);
    await fetch(`${stack.mailUrl}/_fake/hang`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"hang":false}' });
    await expectStoredWholeAndMailedOnce([submission]);
  });
});
