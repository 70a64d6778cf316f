/**
 * The web server: Astro's built handler (static files, prerendered pages, on-demand routes)
 * behind a thin Node HTTP layer that does what must happen before a request reaches Astro:
 * the client's address from trusted proxies only, body sizes checked before a byte is read
 * (and `Expect: 100-continue` refused past the cap), the baseline security headers on every
 * answer, compressed answers (brotli or gzip, as the client accepts) for text, JSON, scripts and
 * styles, server timeouts, and a process that outlives a database restart.
 *
 * Run after `astro build`: `node --import tsx src/server/serve.ts` (npm start does).
 */
import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import compression from 'compression';
import { installProcessGuards } from '../lib/process-guards';
import { BodyTooLarge, describeBytes, maxBodyBytesFor } from './body-limits';
import { clientAddressOf, isTrustedPeer, trustedProxies } from './client-address';
import { compressionOptions } from './compression-options';
import { applyBaselineHeaders } from './security-headers';

installProcessGuards('web');

const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);
const proxies = trustedProxies(process.env.TRUSTED_PROXIES);
const publicHttps = (process.env.PUBLIC_BASE_URL ?? '').startsWith('https:');

// Astro's entry would start its own server on import; we start ours around its handler.
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const distEntry = path.resolve(process.env.LAGWISE_DIST_DIR ?? 'dist', 'server', 'entry.mjs');
const { handler } = (await import(pathToFileURL(distEntry).href)) as {
  handler: (req: IncomingMessage, res: ServerResponse) => void;
};

function pathnameOf(req: IncomingMessage): string {
  try {
    return new URL(req.url ?? '/', 'http://x').pathname;
  } catch {
    return '/';
  }
}

/**
 * 413 before a byte of the body is read. With the client still sending, closing at once would
 * reset the connection and the client could lose the answer; so the connection stays open a
 * moment while Node discards what arrives (nothing is kept), then it is cut. A client waiting on
 * `Expect: 100-continue` has sent nothing, so its connection closes at once.
 */
function refuseTooLarge(res: ServerResponse, maxBytes: number, { bodyOnTheWay }: { bodyOnTheWay: boolean }): void {
  const body = JSON.stringify({
    error: { code: 'PAYLOAD_TOO_LARGE', message: `The request body is over ${describeBytes(maxBytes)}; send less.` },
  });
  res.writeHead(413, {
    'content-type': 'application/json; charset=utf-8',
    'cache-control': 'no-store',
    ...(bodyOnTheWay ? {} : { connection: 'close' }),
  });
  res.end(body);
  if (bodyOnTheWay) {
    const socket = res.socket;
    const cut = setTimeout(() => socket?.destroy(), 2_000);
    socket?.once('close', () => clearTimeout(cut));
  }
}

function declaredLength(req: IncomingMessage): number | undefined {
  const raw = req.headers['content-length'];
  if (raw === undefined) return undefined;
  const bytes = Number(raw);
  return Number.isFinite(bytes) ? bytes : undefined;
}

/** The request's body as Astro will read it, stopping at the route's cap. */
async function* cappedBody(req: IncomingMessage, maxBytes: number): AsyncGenerator<Buffer> {
  let total = 0;
  for await (const chunk of req as AsyncIterable<Buffer>) {
    total += chunk.byteLength;
    if (total > maxBytes) {
      req.destroy();
      throw new BodyTooLarge(maxBytes);
    }
    yield chunk;
  }
}

const compress = compression(compressionOptions);

function handle(req: IncomingMessage, res: ServerResponse): void {
  res.on('error', (error) => console.error(`[web] response failed: ${error.message}`));
  applyBaselineHeaders(res, { https: publicHttps });
  // Astro takes the first X-Forwarded-For entry as the client; it gets only ours.
  req.headers['x-forwarded-for'] = clientAddressOf(req.socket.remoteAddress, req.headers['x-forwarded-for'], proxies);
  if (!isTrustedPeer(proxies, req.socket.remoteAddress)) {
    delete req.headers['x-forwarded-host'];
    delete req.headers['x-forwarded-proto'];
    delete req.headers['x-forwarded-port'];
  }
  const maxBytes = maxBodyBytesFor(pathnameOf(req));
  const declared = declaredLength(req);
  if (declared !== undefined && declared > maxBytes) return refuseTooLarge(res, maxBytes, { bodyOnTheWay: true });
  if (req.method !== 'GET' && req.method !== 'HEAD') {
    Object.defineProperty(req, 'body', { value: cappedBody(req, maxBytes), configurable: true });
  }
  // The middleware wraps res.write/end; errors it passes on have no place to go but the log.
  compress(req as Parameters<typeof compress>[0], res as Parameters<typeof compress>[1], (error?: unknown) => {
    if (error) console.error(`[web] compression failed: ${String(error)}`);
    handler(req, res);
  });
}

const server = http.createServer({ requestTimeout: 120_000, headersTimeout: 30_000, keepAliveTimeout: 5_000 }, handle);

// Node answers `Expect: 100-continue` itself unless told otherwise: past the cap, refuse instead.
server.on('checkContinue', (req: IncomingMessage, res: ServerResponse) => {
  const maxBytes = maxBodyBytesFor(pathnameOf(req));
  const declared = declaredLength(req);
  if (declared === undefined || declared > maxBytes) {
    applyBaselineHeaders(res, { https: publicHttps });
    if (declared === undefined) {
      res.writeHead(411, { 'content-type': 'application/json; charset=utf-8', connection: 'close' });
      res.end(JSON.stringify({ error: { code: 'LENGTH_REQUIRED', message: 'Send Content-Length with Expect: 100-continue.' } }));
      return;
    }
    refuseTooLarge(res, maxBytes, { bodyOnTheWay: false });
    return;
  }
  res.writeContinue();
  handle(req, res);
});

server.listen(port, host, () => console.log(`[web] serving http://${host}:${port}`));

function stop(): void {
  server.close(() => process.exit(0));
  server.closeIdleConnections();
  setTimeout(() => process.exit(0), 10_000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
