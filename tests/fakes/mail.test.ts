import { randomBytes, randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Resend } from 'resend';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFake, type RunningFake } from './start-fake.ts';

interface FakeAttachment {
  id: string;
  filename: string;
  content_type: string;
  content_id: string | null;
  size: number;
  content: string;
}

interface FakeMessage {
  id: string;
  created_at: string;
  from: string;
  to: string[];
  cc: string[] | null;
  bcc: string[] | null;
  reply_to: string[] | null;
  subject: string;
  html: string | null;
  text: string | null;
  headers: Record<string, string> | null;
  tags: { name: string; value: string }[] | null;
  attachments: FakeAttachment[];
}

const from = 'Lagwise Assessments <assessments@lagwise.example>';
let dataDir: string;
let fake: RunningFake;

function fakeEnv(): Record<string, string> {
  return { FAKE_MAIL_PORT: '0', FAKE_MAIL_HOST: '127.0.0.1', FAKE_MAIL_DATA_DIR: dataDir };
}

function resend(): Resend {
  return new Resend('re_lagwise_test_key', { baseUrl: fake.url });
}

/** A recipient no other test uses, so each test reads only its own mail. */
function recipient(name: string): string {
  return `${name}.${randomUUID().slice(0, 8)}@harrowgate-creamery.example`;
}

async function messagesTo(address: string): Promise<FakeMessage[]> {
  const response = await fetch(`${fake.url}/_fake/messages?to=${encodeURIComponent(address)}`);
  expect(response.status).toBe(200);
  return ((await response.json()) as { data: FakeMessage[] }).data;
}

async function setOutage(down: boolean): Promise<void> {
  const response = await fetch(`${fake.url}/_fake/outage`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ down }),
  });
  expect(await response.json()).toEqual({ down });
}

async function postEmails(body: string, headers: Record<string, string> = { authorization: 'Bearer re_lagwise_test_key' }) {
  const response = await fetch(`${fake.url}/emails`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body });
  return { status: response.status, body: (await response.json()) as unknown };
}

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'lagwise-mail-fake-'));
  fake = await startFake('fakes/mail/server.ts', fakeEnv());
});

afterAll(async () => {
  await fake?.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('mail fake through the Resend SDK', () => {
  it('accepts a message with an attachment and gives every field back', async () => {
    const to = recipient('plant-manager');
    const cc = recipient('engineer');
    const report = randomBytes(5_000);
    const { data, error } = await resend().emails.send({
      from,
      to: [to],
      cc,
      bcc: ['Records <records@lagwise.example>'],
      replyTo: 'Consultant Desk <consultants@lagwise.example>',
      subject: 'Heat-loss assessment for Harrowgate Creamery',
      html: '<h1>Your assessment</h1><p>Steam main 1 loses <strong>3.2 kW</strong>.</p>',
      text: 'Your assessment\nSteam main 1 loses 3.2 kW.',
      headers: { 'X-Lagwise-Assessment': 'hc-2024-017' },
      tags: [{ name: 'kind', value: 'assessment_report' }],
      attachments: [{ filename: 'harrowgate-assessment.pdf', content: report, contentType: 'application/pdf' }],
    });
    expect(error).toBeNull();
    const id = data?.id ?? '';
    expect(id).toMatch(/^[0-9a-f-]{36}$/);

    const got = await resend().emails.get(id);
    expect(got.error).toBeNull();
    expect(got.data).toMatchObject({
      object: 'email',
      id,
      from,
      to: [to],
      cc: [cc],
      bcc: ['Records <records@lagwise.example>'],
      reply_to: ['Consultant Desk <consultants@lagwise.example>'],
      subject: 'Heat-loss assessment for Harrowgate Creamery',
      html: '<h1>Your assessment</h1><p>Steam main 1 loses <strong>3.2 kW</strong>.</p>',
      text: 'Your assessment\nSteam main 1 loses 3.2 kW.',
      last_event: 'delivered',
      tags: [{ name: 'kind', value: 'assessment_report' }],
    });

    const [stored] = await messagesTo(to);
    expect(stored?.headers).toEqual({ 'X-Lagwise-Assessment': 'hc-2024-017' });
    expect(stored?.attachments).toHaveLength(1);
    const attachment = stored?.attachments[0];
    expect(attachment).toMatchObject({ filename: 'harrowgate-assessment.pdf', content_type: 'application/pdf', size: report.length });
    expect(Buffer.from(attachment?.content ?? '', 'base64').equals(report)).toBe(true);

    const listed = await resend().emails.attachments.list({ emailId: id });
    expect(listed.error).toBeNull();
    const meta = listed.data?.data[0];
    expect(meta).toMatchObject({ filename: 'harrowgate-assessment.pdf', content_type: 'application/pdf', size: report.length });
    const download = await fetch(meta?.download_url ?? '');
    expect(download.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await download.arrayBuffer()).equals(report)).toBe(true);
    const one = await resend().emails.attachments.get({ emailId: id, id: meta?.id ?? '' });
    expect(one.data).toMatchObject({ object: 'attachment', id: meta?.id, filename: 'harrowgate-assessment.pdf' });

    const byId = await fetch(`${fake.url}/_fake/messages/${id}`);
    expect(((await byId.json()) as FakeMessage).subject).toBe('Heat-loss assessment for Harrowgate Creamery');
  });

  it('reads its base URL from RESEND_BASE_URL when the constructor gets none', async () => {
    const previous = process.env.RESEND_BASE_URL;
    process.env.RESEND_BASE_URL = fake.url;
    try {
      const to = recipient('env-configured');
      const { data, error } = await new Resend('re_lagwise_test_key').emails.send({ from, to, subject: 'Env base URL', text: 'via env' });
      expect(error).toBeNull();
      const [stored] = await messagesTo(to);
      expect(stored?.id).toBe(data?.id);
      // the SDK glues base URL and path together, so a trailing slash asks for `//emails`
      const slashed = await new Resend('re_lagwise_test_key', { baseUrl: `${fake.url}/` }).emails.get(data?.id ?? '');
      expect(slashed.data?.id).toBe(data?.id);
    } finally {
      if (previous === undefined) delete process.env.RESEND_BASE_URL;
      else process.env.RESEND_BASE_URL = previous;
    }
  });

  it('downloads an attachment given by `path`, as Resend does', async () => {
    const photo = randomBytes(3_000);
    const files: Server = createServer((req, res) => {
      if (req.url !== '/photos/boiler-room.jpg') {
        res.writeHead(404).end();
        return;
      }
      res.writeHead(200, { 'content-type': 'image/jpeg' }).end(photo);
    });
    await new Promise<void>((resolve) => files.listen(0, '127.0.0.1', resolve));
    try {
      const address = files.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      const to = recipient('path-attachment');
      const { error } = await resend().emails.send({
        from,
        to,
        subject: 'Photo of the boiler room',
        text: 'Attached.',
        attachments: [{ path: `http://127.0.0.1:${port}/photos/boiler-room.jpg` }],
      });
      expect(error).toBeNull();
      const [stored] = await messagesTo(to);
      expect(stored?.attachments[0]).toMatchObject({ filename: 'boiler-room.jpg', content_type: 'image/jpeg', size: photo.length });
      expect(Buffer.from(stored?.attachments[0]?.content ?? '', 'base64').equals(photo)).toBe(true);

      const missing = await resend().emails.send({
        from,
        to,
        subject: 'Broken link',
        text: 'x',
        attachments: [{ path: `http://127.0.0.1:${port}/photos/none.jpg` }],
      });
      expect(missing.error).toMatchObject({ statusCode: 422, name: 'invalid_attachment' });
    } finally {
      await new Promise((resolve) => files.close(resolve));
    }
  });

  it('answers 409 to a retry that arrives while the first request with its key is still running', async () => {
    let release: () => void = () => {};
    let requested: () => void = () => {};
    const firstArrived = new Promise<void>((resolve) => (requested = resolve));
    const files: Server = createServer((_req, res) => {
      requested();
      release = () => res.writeHead(200, { 'content-type': 'application/pdf' }).end(Buffer.from('%PDF-1.7'));
    });
    await new Promise<void>((resolve) => files.listen(0, '127.0.0.1', resolve));
    try {
      const address = files.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      const to = recipient('concurrent');
      const key = `concurrent-${randomUUID()}`;
      const payload = { from, to, subject: 'Report', text: 'x', attachments: [{ path: `http://127.0.0.1:${port}/report.pdf` }] };
      const first = resend().emails.send(payload, { idempotencyKey: key });
      await firstArrived;
      const second = await resend().emails.send(payload, { idempotencyKey: key });
      expect(second.error).toMatchObject({ statusCode: 409, name: 'concurrent_idempotent_requests' });
      release();
      const done = await first;
      expect(done.error).toBeNull();
      expect((await messagesTo(to)).map((m) => m.id)).toEqual([done.data?.id]);
    } finally {
      files.closeAllConnections();
      await new Promise((resolve) => files.close(resolve));
    }
  });

  it('refuses bad requests the way Resend does and stores nothing for them', async () => {
    const to = recipient('refusals');
    const badFrom = await resend().emails.send({ from: 'Lagwise Assessments', to, subject: 'x', text: 'x' });
    expect(badFrom.error).toMatchObject({ statusCode: 422, name: 'invalid_from_address' });

    const badTo = await resend().emails.send({ from, to: [to, 'not-an-address'], subject: 'x', text: 'x' });
    expect(badTo.error).toMatchObject({ statusCode: 422, name: 'validation_error' });
    expect(badTo.error?.message).toContain('`to`');

    const noBody = await resend().emails.send({ from, to, subject: 'x' } as unknown as Parameters<Resend['emails']['send']>[0]);
    expect(noBody.error).toMatchObject({ statusCode: 422, name: 'validation_error' });

    const badAttachment = await resend().emails.send({ from, to, subject: 'x', text: 'x', attachments: [{ filename: 'empty.pdf' }] });
    expect(badAttachment.error).toMatchObject({ statusCode: 422, name: 'invalid_attachment' });

    const badTag = await resend().emails.send({ from, to, subject: 'x', text: 'x', tags: [{ name: 'plant name', value: 'Harrowgate Creamery' }] });
    expect(badTag.error).toMatchObject({ statusCode: 422, name: 'validation_error' });

    expect(await postEmails(JSON.stringify({ from, to, text: 'no subject' }))).toEqual({
      status: 422,
      body: { statusCode: 422, name: 'missing_required_field', message: 'Missing `subject` field.' },
    });
    expect(await postEmails('{"from": "broken')).toMatchObject({ status: 400, body: { statusCode: 400, name: 'validation_error' } });
    expect(await postEmails('[1, 2, 3]')).toMatchObject({ status: 422, body: { name: 'validation_error' } });
    expect(await postEmails(JSON.stringify({ from, to, subject: 'x', text: 'x' }), {})).toMatchObject({
      status: 401,
      body: { statusCode: 401, name: 'missing_api_key' },
    });

    const unknown = await resend().emails.get(randomUUID());
    expect(unknown.error).toMatchObject({ statusCode: 404, name: 'not_found' });

    expect(await messagesTo(to)).toEqual([]);
    const health = await fetch(`${fake.url}/_fake/health`);
    expect(await health.json()).toMatchObject({ ok: true, down: false });
  });

  it('honours Idempotency-Key: same body gives the same id once, a different body gives 409', async () => {
    const to = recipient('idempotent');
    const key = `assessment-hc-2024-017-${randomUUID()}`;
    const payload = { from, to, subject: 'Your Lagwise report', html: '<p>Report attached.</p>', text: 'Report attached.' };
    const first = await resend().emails.send(payload, { idempotencyKey: key });
    const retry = await resend().emails.send(payload, { idempotencyKey: key });
    expect(first.error).toBeNull();
    expect(retry.error).toBeNull();
    expect(retry.data?.id).toBe(first.data?.id);
    expect(await messagesTo(to)).toHaveLength(1);

    const changed = await resend().emails.send({ ...payload, subject: 'Your Lagwise report (revised)' }, { idempotencyKey: key });
    expect(changed.error).toMatchObject({ statusCode: 409, name: 'invalid_idempotent_request' });
    expect(await messagesTo(to)).toHaveLength(1);

    const tooLong = await resend().emails.send(payload, { idempotencyKey: 'k'.repeat(257) });
    expect(tooLong.error).toMatchObject({ statusCode: 400, name: 'invalid_idempotency_key' });
  });

  it('sends a batch, strict by default and permissive on request', async () => {
    const a = recipient('batch-a');
    const b = recipient('batch-b');
    const sent = await resend().batch.send([
      { from, to: a, subject: 'New assessment routed to you', text: 'Harrowgate Creamery, 6 pipe runs.' },
      { from, to: b, subject: 'Your assessment was routed', text: 'A consultant will contact you.' },
    ]);
    expect(sent.error).toBeNull();
    const ids = sent.data?.data.map((d) => d.id) ?? [];
    expect(ids).toHaveLength(2);
    expect((await messagesTo(a))[0]?.id).toBe(ids[0]);
    expect((await messagesTo(b))[0]?.id).toBe(ids[1]);

    const c = recipient('batch-c');
    const strict = await resend().batch.send([
      { from, to: c, subject: 'ok', text: 'ok' },
      { from, to: 'nobody', subject: 'bad', text: 'bad' },
    ]);
    expect(strict.error).toMatchObject({ statusCode: 422, name: 'validation_error' });
    expect(await messagesTo(c)).toEqual([]);

    const permissive = await resend().batch.send(
      [
        { from, to: c, subject: 'ok', text: 'ok' },
        { from, to: 'nobody', subject: 'bad', text: 'bad' },
      ],
      { batchValidation: 'permissive' },
    );
    expect(permissive.error).toBeNull();
    expect(permissive.data?.data).toHaveLength(1);
    expect(permissive.data?.errors).toEqual([{ index: 1, message: expect.stringContaining('`to`') }]);
    expect(await messagesTo(c)).toHaveLength(1);
  });

  it('filters the JSON API by exact address across to, cc and bcc', async () => {
    const to = recipient('filter-to');
    const cc = recipient('filter-cc');
    const bcc = recipient('filter-bcc');
    await resend().emails.send({ from, to, cc, bcc: `Records Desk <${bcc}>`, subject: 'Filter me', text: 'x' });
    for (const address of [to, cc, bcc, bcc.toUpperCase()]) expect(await messagesTo(address)).toHaveLength(1);
    expect(await messagesTo(to.slice(0, -3))).toEqual([]);
    expect(await messagesTo(`x${to}`)).toEqual([]);
  });

  it('shows the inbox newest first, a message page with a sandboxed HTML body, and attachment downloads', async () => {
    const to = recipient('inbox');
    const older = await resend().emails.send({ from, to, subject: 'Older <draft> notice', text: 'first' });
    const csv = Buffer.from('run,loss_kw\nsteam main 1,3.2\n');
    const newer = await resend().emails.send({
      from,
      to,
      subject: 'Newer notice',
      html: '<p onclick="x()">Loss table "attached"</p><img src="cid:loss-chart">',
      text: 'Loss table attached.',
      tags: [{ name: 'kind', value: 'loss_table' }],
      attachments: [
        { filename: 'loss table.csv', content: csv },
        { filename: 'chart.png', content: Buffer.from('chart'), contentId: 'loss-chart' },
      ],
    });

    const inbox = await fetch(`${fake.url}/`);
    expect(inbox.headers.get('content-type')).toContain('text/html');
    const listing = await inbox.text();
    expect(listing).toContain('Older &lt;draft&gt; notice');
    expect(listing).not.toContain('<draft>');
    expect(listing.indexOf(`/messages/${newer.data?.id}`)).toBeGreaterThan(-1);
    expect(listing.indexOf(`/messages/${newer.data?.id}`)).toBeLessThan(listing.indexOf(`/messages/${older.data?.id}`));

    const page = await (await fetch(`${fake.url}/messages/${newer.data?.id}`)).text();
    expect(page).toContain('<iframe sandbox');
    // inline images point at the fake's own download of the attachment they name by content id
    expect(page).toContain(
      `srcdoc="&lt;p onclick=&quot;x()&quot;&gt;Loss table &quot;attached&quot;&lt;/p&gt;&lt;img src=&quot;/messages/${newer.data?.id}/attachments/1&quot;&gt;"`,
    );
    expect(page).toContain('<pre>Loss table attached.</pre>');
    expect(page).toContain('loss_table');
    expect(page).toContain(`/messages/${newer.data?.id}/attachments/0`);

    const download = await fetch(`${fake.url}/messages/${newer.data?.id}/attachments/0`);
    expect(download.status).toBe(200);
    expect(download.headers.get('content-type')).toBe('text/csv');
    expect(download.headers.get('content-disposition')).toContain("filename*=UTF-8''loss%20table.csv");
    expect(Buffer.from(await download.arrayBuffer()).equals(csv)).toBe(true);

    const chart = await fetch(`${fake.url}/messages/${newer.data?.id}/attachments/1`);
    expect(chart.headers.get('content-type')).toBe('image/png');
    expect(await chart.text()).toBe('chart');
    expect((await fetch(`${fake.url}/messages/${newer.data?.id}/attachments/2`)).status).toBe(404);
  });

  it('answers 503 during an outage while the inbox and /_fake keep working, then recovers', async () => {
    const to = recipient('outage');
    await setOutage(true);
    try {
      const during = await resend().emails.send({ from, to, subject: 'During outage', text: 'x' });
      expect(during.error).toMatchObject({ statusCode: 503, name: 'application_error' });
      const inbox = await fetch(`${fake.url}/`);
      expect(inbox.status).toBe(200);
      expect(await inbox.text()).toContain('Outage switch is ON');
      expect(await messagesTo(to)).toEqual([]);
    } finally {
      await setOutage(false);
    }
    const after = await resend().emails.send({ from, to, subject: 'After outage', text: 'x' });
    expect(after.error).toBeNull();
    expect((await messagesTo(to)).map((m) => m.subject)).toEqual(['After outage']);
  });

  it('keeps messages and idempotency keys across a restart, and clears on DELETE', async () => {
    const to = recipient('restart');
    const key = `restart-${randomUUID()}`;
    const payload = { from, to, subject: 'Kept across restart', text: 'still here' };
    const sent = await resend().emails.send(payload, { idempotencyKey: key });
    expect(sent.error).toBeNull();

    expect(await fake.stop()).toBe(0);
    expect(readdirSync(path.join(dataDir, 'messages'))).toContain(`${sent.data?.id}.json`);
    fake = await startFake('fakes/mail/server.ts', fakeEnv());

    const got = await resend().emails.get(sent.data?.id ?? '');
    expect(got.data).toMatchObject({ id: sent.data?.id, subject: 'Kept across restart', text: 'still here', to: [to] });
    const retried = await resend().emails.send(payload, { idempotencyKey: key });
    expect(retried.data?.id).toBe(sent.data?.id);
    expect(await messagesTo(to)).toHaveLength(1);

    const cleared = await fetch(`${fake.url}/_fake/messages`, { method: 'DELETE' });
    expect(cleared.status).toBe(200);
    const all = (await (await fetch(`${fake.url}/_fake/messages`)).json()) as { data: FakeMessage[] };
    expect(all.data).toEqual([]);
    expect(readdirSync(path.join(dataDir, 'messages'))).toEqual([]);
  });
});
