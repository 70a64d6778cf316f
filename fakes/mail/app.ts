/**
 * The mail fake as an HTTP handler: Resend's API for the app, an inbox for people, and `/_fake/*`
 * for tests. Kept apart from server.ts so the listening process and the behavior stay separate.
 */
import { createHash, randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { z } from 'zod';
import { attachmentUrl, renderInbox, renderMessage, renderNotFound } from './inbox.ts';
import {
  bareAddress,
  contentTypeFor,
  parseEmail,
  ResendRefusal,
  type AttachmentInput,
  type ParsedEmail,
  type ResendErrorBody,
} from './resend-api.ts';
import { MailStore, type StoredAttachment, type StoredMessage } from './store.ts';

/** Resend caps a message, attachments included, at 40 MB; the body may be a little larger. */
const MAX_ATTACHMENT_BYTES = 40 * 1024 * 1024;
const MAX_BODY_BYTES = 60 * 1024 * 1024;
const MAX_BATCH = 100;
const ATTACHMENT_FETCH_TIMEOUT_MS = 15_000;
const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

interface Reply {
  status: number;
  body: unknown;
}

class BodyTooLarge extends Error {}

function readBody(req: IncomingMessage): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      // keep draining rather than cutting the socket, so the client still reads our refusal
      if (size <= MAX_BODY_BYTES) chunks.push(chunk);
    });
    req.on('end', () => (size > MAX_BODY_BYTES ? reject(new BodyTooLarge()) : resolve(Buffer.concat(chunks))));
    req.on('error', reject);
  });
}

async function readJson(req: IncomingMessage): Promise<unknown> {
  let raw: Buffer;
  try {
    raw = await readBody(req);
  } catch (err) {
    if (err instanceof BodyTooLarge) throw new ResendRefusal(413, 'validation_error', 'The request body is too large.');
    throw err;
  }
  try {
    return JSON.parse(raw.toString('utf8')) as unknown;
  } catch {
    throw new ResendRefusal(400, 'validation_error', 'The request body is not valid JSON.');
  }
}

/** Key order must not make two equal requests look different to the idempotency check. */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const payload = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(payload) });
  res.end(payload);
}

const inboxCsp = [
  "default-src 'none'",
  "style-src 'unsafe-inline'",
  "img-src 'self' data: http: https:",
  "frame-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');

function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, {
    'content-type': 'text/html; charset=utf-8',
    'content-length': Buffer.byteLength(html),
    'content-security-policy': inboxCsp,
    'x-content-type-options': 'nosniff',
  });
  res.end(html);
}

function contentDisposition(filename: string): string {
  const fallback = filename.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(filename)}`;
}

function toApiEmail(message: StoredMessage) {
  return {
    object: 'email' as const,
    id: message.id,
    to: message.to,
    from: message.from,
    created_at: message.created_at,
    subject: message.subject,
    html: message.html,
    text: message.text,
    bcc: message.bcc,
    cc: message.cc,
    reply_to: message.reply_to,
    last_event: 'delivered' as const,
    scheduled_at: null,
    tags: message.tags ?? [],
    message_id: `<${message.id}@mail-fake.lagwise.example>`,
  };
}

function toApiAttachment(message: StoredMessage, index: number, origin: string) {
  const attachment = message.attachments[index];
  if (!attachment) throw new ResendRefusal(404, 'not_found', 'Attachment not found');
  return {
    id: attachment.id,
    filename: attachment.filename,
    size: attachment.size,
    content_type: attachment.content_type,
    content_disposition: attachment.content_id ? ('inline' as const) : ('attachment' as const),
    ...(attachment.content_id ? { content_id: attachment.content_id } : {}),
    download_url: `${origin}${attachmentUrl(message.id, index)}`,
    expires_at: new Date(Date.now() + 60 * 60 * 1000).toISOString(),
  };
}

function filenameFromUrl(url: URL): string | undefined {
  const last = url.pathname.split('/').filter(Boolean).pop();
  if (!last) return undefined;
  try {
    return decodeURIComponent(last);
  } catch {
    return last;
  }
}

async function resolveAttachment(input: AttachmentInput, index: number): Promise<StoredAttachment> {
  const givenName = typeof input.filename === 'string' && input.filename !== '' ? input.filename : undefined;
  let bytes: Buffer;
  let filename: string;
  let servedType: string | undefined;
  if (typeof input.content === 'string') {
    bytes = Buffer.from(input.content, 'base64');
    filename = givenName ?? `attachment-${index + 1}`;
  } else {
    // Resend downloads `path` itself; doing the same lets the app attach e.g. a presigned photo URL.
    let url: URL;
    try {
      url = new URL(input.path ?? '');
    } catch {
      throw new ResendRefusal(422, 'invalid_attachment', 'Attachment `path` must be an http or https URL.');
    }
    if (url.protocol !== 'http:' && url.protocol !== 'https:') {
      throw new ResendRefusal(422, 'invalid_attachment', 'Attachment `path` must be an http or https URL.');
    }
    let response: Response;
    try {
      response = await fetch(url, { signal: AbortSignal.timeout(ATTACHMENT_FETCH_TIMEOUT_MS) });
    } catch (err) {
      throw new ResendRefusal(422, 'invalid_attachment', `Could not download the attachment at \`path\`: ${(err as Error).message}`);
    }
    if (!response.ok) {
      throw new ResendRefusal(422, 'invalid_attachment', `Could not download the attachment at \`path\`: HTTP ${response.status}.`);
    }
    bytes = Buffer.from(await response.arrayBuffer());
    filename = givenName ?? filenameFromUrl(url) ?? `attachment-${index + 1}`;
    servedType = response.headers.get('content-type')?.split(';')[0]?.trim() || undefined;
  }
  const derived = contentTypeFor(filename);
  const contentType =
    input.content_type || (derived !== 'application/octet-stream' ? derived : (servedType ?? derived));
  return {
    id: randomUUID(),
    filename,
    content_type: contentType,
    content_id: input.content_id ?? null,
    size: bytes.length,
    content: bytes.toString('base64'),
  };
}

export interface MailFake {
  handle(req: IncomingMessage, res: ServerResponse): void;
  store: MailStore;
}

export function createMailFake(options: { dataDir: string }): MailFake {
  const store = new MailStore(options.dataDir);
  let down = false;
  /** The hang switch: API calls are held open, never answered, as a frozen provider connection is. */
  let hanging = false;
  const held = new Set<ServerResponse>();
  let lastCreated = 0;
  const inFlight = new Set<string>();

  /** Strictly increasing times keep "newest first" equal to send order, even inside one batch. */
  function nextCreatedAt(): string {
    lastCreated = Math.max(Date.now(), lastCreated + 1);
    return new Date(lastCreated).toISOString();
  }

  async function buildMessage(email: ParsedEmail): Promise<StoredMessage> {
    const attachments: StoredAttachment[] = [];
    for (const [index, input] of email.attachments.entries()) attachments.push(await resolveAttachment(input, index));
    if (attachments.reduce((sum, a) => sum + a.content.length, 0) > MAX_ATTACHMENT_BYTES) {
      throw new ResendRefusal(422, 'invalid_attachment', 'Attachments may not exceed 40 MB per email.');
    }
    return {
      object: 'email',
      id: randomUUID(),
      created_at: nextCreatedAt(),
      from: email.from,
      to: email.to,
      cc: email.cc,
      bcc: email.bcc,
      reply_to: email.reply_to,
      subject: email.subject,
      html: email.html,
      text: email.text,
      headers: email.headers,
      tags: email.tags,
      attachments,
    };
  }

  async function sendOne(body: unknown): Promise<Reply> {
    const message = await buildMessage(parseEmail(body, { batch: false }));
    store.add(message);
    return { status: 200, body: { id: message.id } };
  }

  async function sendBatch(body: unknown, mode: string): Promise<Reply> {
    if (mode !== 'strict' && mode !== 'permissive') {
      throw new ResendRefusal(422, 'validation_error', 'Invalid `x-batch-validation` header. Use `strict` or `permissive`.');
    }
    if (!Array.isArray(body)) throw new ResendRefusal(422, 'validation_error', 'The request body must be an array of emails.');
    if (body.length === 0 || body.length > MAX_BATCH) {
      throw new ResendRefusal(422, 'validation_error', `A batch holds between 1 and ${MAX_BATCH} emails.`);
    }
    const built: StoredMessage[] = [];
    const errors: { index: number; message: string }[] = [];
    for (const [index, item] of body.entries()) {
      try {
        built.push(await buildMessage(parseEmail(item, { batch: true })));
      } catch (err) {
        if (!(err instanceof ResendRefusal)) throw err;
        // strict mode is all or nothing, as in Resend: one bad email refuses the whole batch
        if (mode === 'strict') {
          throw new ResendRefusal(err.body.statusCode, err.body.name, `emails[${index}]: ${err.body.message}`);
        }
        errors.push({ index, message: err.body.message });
      }
    }
    for (const message of built) store.add(message);
    const data = built.map((m) => ({ id: m.id }));
    return { status: 200, body: mode === 'permissive' ? { data, errors } : { data } };
  }

  async function idempotent(req: IncomingMessage, endpoint: string, fingerprintOf: string, run: () => Promise<Reply>): Promise<Reply> {
    const header = req.headers['idempotency-key'];
    if (header === undefined) return run();
    const key = Array.isArray(header) ? header.join(',') : header;
    if (key.length < 1 || key.length > 256) {
      throw new ResendRefusal(400, 'invalid_idempotency_key', 'The key must be between 1-256 chars.');
    }
    const fingerprint = createHash('sha256').update(fingerprintOf).digest('hex');
    const previous = store.findIdempotent(endpoint, key);
    if (previous) {
      if (previous.fingerprint !== fingerprint) {
        throw new ResendRefusal(409, 'invalid_idempotent_request', 'Same idempotency key used with a different request payload.');
      }
      return { status: previous.status, body: previous.response };
    }
    const slot = `${endpoint}\n${key}`;
    if (inFlight.has(slot)) {
      throw new ResendRefusal(409, 'concurrent_idempotent_requests', 'Same idempotency key used while original request is still in progress.');
    }
    inFlight.add(slot);
    try {
      const reply = await run();
      // only a success is remembered: a refused request may be corrected and retried under its key
      if (reply.status < 300) {
        store.saveIdempotent({ endpoint, key, fingerprint, created_at: new Date().toISOString(), status: reply.status, response: reply.body });
      }
      return reply;
    } finally {
      inFlight.delete(slot);
    }
  }

  function findForApi(id: string): StoredMessage {
    if (!uuidPattern.test(id)) throw new ResendRefusal(422, 'validation_error', 'The `id` must be a valid UUID.');
    const message = store.get(id);
    if (!message) throw new ResendRefusal(404, 'not_found', 'Email not found');
    return message;
  }

  async function resendApi(req: IncomingMessage, segments: string[], origin: string): Promise<Reply> {
    if (down) {
      return {
        status: 503,
        body: {
          statusCode: 503,
          name: 'application_error',
          message: 'The mail service is temporarily unavailable. Please try again later.',
        } satisfies ResendErrorBody,
      };
    }
    const authorization = req.headers.authorization ?? '';
    const token = /^Bearer\s+(\S.*)$/i.exec(authorization)?.[1]?.trim();
    if (!token) throw new ResendRefusal(401, 'missing_api_key', 'Missing API key in the authorization header.');

    const method = req.method ?? 'GET';
    const [root, id, sub, subId, ...rest] = segments;
    if (root !== 'emails' || rest.length > 0) throw new ResendRefusal(404, 'not_found', 'The requested endpoint does not exist.');

    if (id === undefined) {
      if (method !== 'POST') throw new ResendRefusal(405, 'method_not_allowed', 'Method not allowed');
      const body = await readJson(req);
      return idempotent(req, 'POST /emails', canonicalJson(body), () => sendOne(body));
    }
    if (id === 'batch' && sub === undefined) {
      if (method !== 'POST') throw new ResendRefusal(405, 'method_not_allowed', 'Method not allowed');
      const body = await readJson(req);
      const header = req.headers['x-batch-validation'];
      const mode = (Array.isArray(header) ? header[0] : header) ?? 'strict';
      return idempotent(req, 'POST /emails/batch', `${mode}\n${canonicalJson(body)}`, () => sendBatch(body, mode));
    }
    if (method !== 'GET') throw new ResendRefusal(405, 'method_not_allowed', 'Method not allowed');
    const message = findForApi(id);
    if (sub === undefined) return { status: 200, body: toApiEmail(message) };
    if (sub !== 'attachments') throw new ResendRefusal(404, 'not_found', 'The requested endpoint does not exist.');
    if (subId === undefined) {
      return {
        status: 200,
        body: { object: 'list', has_more: false, data: message.attachments.map((_, index) => toApiAttachment(message, index, origin)) },
      };
    }
    const index = message.attachments.findIndex((a) => a.id === subId);
    if (index < 0) throw new ResendRefusal(404, 'not_found', 'Attachment not found');
    return { status: 200, body: { object: 'attachment', ...toApiAttachment(message, index, origin) } };
  }

  const outageSchema = z.object({ down: z.boolean() });
  const hangSchema = z.object({ hang: z.boolean() });

  async function fakeControl(req: IncomingMessage, res: ServerResponse, segments: string[], url: URL): Promise<void> {
    const method = req.method ?? 'GET';
    const [, name, id, ...rest] = segments;
    const notFound = (): void => sendJson(res, 404, { statusCode: 404, name: 'not_found', message: 'No such fake endpoint.' });
    if (rest.length > 0) return notFound();

    if (name === 'health' && id === undefined && method === 'GET') {
      return sendJson(res, 200, { ok: true, down, messages: store.list().length });
    }
    if (name === 'outage' && id === undefined) {
      if (method === 'GET') return sendJson(res, 200, { down });
      if (method !== 'POST') return sendJson(res, 405, { statusCode: 405, name: 'method_not_allowed', message: 'Method not allowed' });
      const parsed = outageSchema.safeParse(await readJson(req));
      if (!parsed.success) {
        return sendJson(res, 422, { statusCode: 422, name: 'validation_error', message: 'Send {"down": true} or {"down": false}.' });
      }
      down = parsed.data.down;
      console.log(`mail fake: outage switch ${down ? 'ON, Resend API answers 503' : 'OFF'}`);
      return sendJson(res, 200, { down });
    }
    if (name === 'hang' && id === undefined) {
      if (method === 'GET') return sendJson(res, 200, { hang: hanging, held: held.size });
      if (method !== 'POST') return sendJson(res, 405, { statusCode: 405, name: 'method_not_allowed', message: 'Method not allowed' });
      const parsed = hangSchema.safeParse(await readJson(req));
      if (!parsed.success) {
        return sendJson(res, 422, { statusCode: 422, name: 'validation_error', message: 'Send {"hang": true} or {"hang": false}.' });
      }
      hanging = parsed.data.hang;
      // Switching off drops the held calls, as a provider's connection reset would.
      if (!hanging) for (const response of held) response.destroy();
      if (!hanging) held.clear();
      console.log(`mail fake: hang switch ${hanging ? 'ON, Resend API calls are never answered' : 'OFF'}`);
      return sendJson(res, 200, { hang: hanging });
    }
    if (name === 'messages' && id === undefined) {
      if (method === 'DELETE') return sendJson(res, 200, { deleted: store.clear() });
      if (method !== 'GET') return sendJson(res, 405, { statusCode: 405, name: 'method_not_allowed', message: 'Method not allowed' });
      const to = url.searchParams.get('to');
      const wanted = to === null ? null : bareAddress(to).toLowerCase();
      const data =
        wanted === null
          ? store.list()
          : store.list().filter((m) =>
              [...m.to, ...(m.cc ?? []), ...(m.bcc ?? [])].some((address) => bareAddress(address).toLowerCase() === wanted),
            );
      return sendJson(res, 200, { data });
    }
    if (name === 'messages' && id !== undefined && method === 'GET') {
      const message = store.get(id);
      return message ? sendJson(res, 200, message) : sendJson(res, 404, { statusCode: 404, name: 'not_found', message: 'Email not found' });
    }
    return notFound();
  }

  function inbox(req: IncomingMessage, res: ServerResponse, segments: string[]): void {
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      res.writeHead(405, { allow: 'GET, HEAD' });
      res.end();
      return;
    }
    if (segments.length === 0) return sendHtml(res, 200, renderInbox(store.list(), down));
    const [, id, sub, index, ...rest] = segments;
    const message = id === undefined ? undefined : store.get(id);
    if (!message || rest.length > 0) return sendHtml(res, 404, renderNotFound(down));
    if (sub === undefined) return sendHtml(res, 200, renderMessage(message, down));
    const attachment = sub === 'attachments' && index !== undefined && /^\d+$/.test(index) ? message.attachments[Number(index)] : undefined;
    if (!attachment) return sendHtml(res, 404, renderNotFound(down));
    const bytes = Buffer.from(attachment.content, 'base64');
    res.writeHead(200, {
      'content-type': attachment.content_type,
      'content-length': bytes.length,
      'content-disposition': contentDisposition(attachment.filename),
      // an attached HTML file must not run as a page of the inbox's own origin
      'content-security-policy': 'sandbox',
      'x-content-type-options': 'nosniff',
    });
    res.end(req.method === 'HEAD' ? undefined : bytes);
  }

  async function route(req: IncomingMessage, res: ServerResponse): Promise<void> {
    // a base URL with a trailing slash makes the SDK ask for `//emails`
    const url = new URL((req.url ?? '/').replace(/^\/+/, '/'), 'http://mail-fake.invalid');
    let segments: string[];
    try {
      segments = url.pathname.split('/').filter(Boolean).map(decodeURIComponent);
    } catch {
      return sendJson(res, 400, { statusCode: 400, name: 'validation_error', message: 'The request path is not valid.' });
    }
    if (segments[0] === '_fake') return fakeControl(req, res, segments, url);
    if (segments.length === 0 || segments[0] === 'messages') return inbox(req, res, segments);
    if (segments[0] === 'favicon.ico') {
      res.writeHead(404);
      res.end();
      return;
    }
    if (hanging) {
      held.add(res);
      res.on('close', () => held.delete(res));
      return;
    }
    const origin = `http://${req.headers.host ?? 'localhost'}`;
    const reply = await resendApi(req, segments, origin);
    sendJson(res, reply.status, reply.body);
  }

  function handle(req: IncomingMessage, res: ServerResponse): void {
    route(req, res).catch((err: unknown) => {
      if (res.headersSent) {
        res.destroy();
        return;
      }
      if (err instanceof ResendRefusal) {
        sendJson(res, err.body.statusCode, err.body);
        return;
      }
      console.error('mail fake: unexpected error', err);
      sendJson(res, 500, { statusCode: 500, name: 'application_error', message: 'Internal server error.' });
    });
  }

  return { handle, store };
}
