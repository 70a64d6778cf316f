/**
 * First claim wins, under load: 50 simultaneous claims on one lead from two consultants, each
 * on its own connection — against the test server, and again split across two server processes
 * on one database (the second started here from the built dist/server/entry.mjs). Exactly one
 * answer is 200; every other is a 409 JSON naming who was first.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { request } from 'node:http';
import { createServer } from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import { ensureConsultant, ensureDeskRegion, passwordCookie, submitLead } from '../support/desk';
import { stack } from '../support/stack';

const CLAIMS = 50;

let cookies: [string, string];
let secondServer: ChildProcess | undefined;
let secondUrl = '';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

async function waitForHealth(url: string, child: ChildProcess): Promise<void> {
  for (let attempt = 0; attempt < 300; attempt += 1) {
    if (child.exitCode !== null) throw new Error(`the second server exited with ${child.exitCode}`);
    try {
      if ((await fetch(`${url}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the second server did not answer /api/health');
}

interface Answer {
  status: number;
  type: string | null;
  body: { lead?: { status: string }; error?: { code: string; details?: { firm: string; claimedAt: string } } };
}

/** One claim on a connection of its own (`agent: false`: no socket is shared or reused). */
function claim(base: string, cookie: string, leadId: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = request(
      `${base}/api/leads/${leadId}/claim`,
      // Both servers answer for one public address (as behind a load balancer): a browser's Origin is that address.
      { method: 'POST', agent: false, headers: { cookie, origin: stack.appUrl, 'content-type': 'application/json', 'content-length': '2' } },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          try {
            resolve({ status: res.statusCode ?? 0, type: res.headers['content-type'] ?? null, body: JSON.parse(Buffer.concat(chunks).toString('utf8')) as Answer['body'] });
          } catch (error) {
            reject(error instanceof Error ? error : new Error(String(error)));
          }
        });
      },
    );
    req.on('error', reject);
    req.end('{}');
  });
}

function expectOneWinner(answers: Answer[]): void {
  const winners = answers.filter((a) => a.status === 200);
  const losers = answers.filter((a) => a.status !== 200);
  expect(winners).toHaveLength(1);
  expect(winners[0]!.body.lead?.status).toBe('claimed');
  expect(losers).toHaveLength(CLAIMS - 1);
  for (const loser of losers) {
    expect(loser.status).toBe(409);
    expect(loser.type).toContain('application/json');
    expect(loser.body.error?.code).toBe('ALREADY_CLAIMED');
    expect(['Kookaburra Thermal', 'Galah Lagging']).toContain(loser.body.error?.details?.firm);
  }
  // Everyone who lost was told the same winner and the same moment.
  expect(new Set(losers.map((l) => `${l.body.error?.details?.firm} ${l.body.error?.details?.claimedAt}`)).size).toBe(1);
}

describe('simultaneous claims', () => {
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-race-kookaburra', 'Kookaburra Bend (race)', ['38']);
    await ensureConsultant({ email: 'race-a@kookaburra-thermal.example', name: 'Remy Kookaburra', firm: 'Kookaburra Thermal', regionIds: [region] });
    await ensureConsultant({ email: 'race-b@galah-lagging.example', name: 'Suki Galah', firm: 'Galah Lagging', regionIds: [region] });
    cookies = [await passwordCookie('race-a@kookaburra-thermal.example'), await passwordCookie('race-b@galah-lagging.example')];

    const port = await freePort();
    secondUrl = `http://127.0.0.1:${port}`;
    secondServer = spawn(process.execPath, [path.resolve('dist/server/entry.mjs')], {
      env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port) },
      stdio: 'ignore',
    });
    await waitForHealth(secondUrl, secondServer);
  });

  afterAll(async () => {
    if (secondServer && secondServer.exitCode === null) {
      const exited = new Promise((resolve) => secondServer!.once('exit', resolve));
      secondServer.kill('SIGTERM');
      await exited;
    }
    await stopSender();
    await closeDb();
  });

  it(`${CLAIMS} claims from two consultants on separate connections: exactly one wins, the rest get 409 JSON`, async () => {
    const lead = await submitLead('3801');
    const answers = await Promise.all(Array.from({ length: CLAIMS }, (_, i) => claim(stack.appUrl, cookies[i % 2]!, lead.id)));
    expectOneWinner(answers);
  });

  it(`${CLAIMS} claims split across two server processes on one database: exactly one wins`, async () => {
    const lead = await submitLead('3802');
    const servers = [stack.appUrl, secondUrl];
    const answers = await Promise.all(
      Array.from({ length: CLAIMS }, (_, i) => claim(servers[Math.floor(i / 2) % 2]!, cookies[i % 2]!, lead.id)),
    );
    expectOneWinner(answers);
  });
});
