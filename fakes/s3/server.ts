/**
 * Local S3-compatible store: s3rver behind a gate that does what s3rver leaves out and the app
 * must not get away with locally. Start: `node --import tsx fakes/s3/server.ts`.
 * Env: FAKE_S3_PORT (4323), FAKE_S3_HOST (127.0.0.1), FAKE_S3_DATA_DIR (.lagwise/fakes/s3),
 * FAKE_S3_BUCKETS (lagwise-uploads), FAKE_S3_ACCESS_KEY_ID, FAKE_S3_SECRET_ACCESS_KEY.
 */
import { randomBytes } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import S3rver from 's3rver';
import AWSAccount from 's3rver/lib/models/account.js';
import { ConfigError, dataDirFromEnv, exitOnStartError, portFromEnv, serve } from '../serve.ts';
import { checkSignature, type S3Credentials, type S3Refusal } from './sigv4.ts';

const label = 's3 fake';

/** S3's own rule for bucket names (the subset path-style addressing cares about). */
const bucketNamePattern = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;

function escapeXml(value: string): string {
  return value.replace(/[<>&"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function sendError(req: IncomingMessage, res: ServerResponse, refusal: S3Refusal): void {
  const requestId = randomBytes(8).toString('hex').toUpperCase();
  const body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${escapeXml(refusal.code)}</Code><Message>${escapeXml(refusal.message)}</Message><RequestId>${requestId}</RequestId></Error>`;
  // drain first: answering while the client still uploads would reset the socket under it
  req.resume();
  const answer = (): void => {
    res.writeHead(refusal.status, {
      'content-type': 'application/xml',
      'x-amz-request-id': requestId,
      ...(req.method === 'HEAD' ? {} : { 'content-length': Buffer.byteLength(body) }),
    });
    res.end(req.method === 'HEAD' ? undefined : body);
  };
  if (req.readableEnded) answer();
  else req.once('end', answer);
}

function chunkedUpload(req: IncomingMessage): boolean {
  const encoding = req.headers['content-encoding'] ?? '';
  const payload = req.headers['x-amz-content-sha256'] ?? '';
  return /\baws-chunked\b/i.test(encoding) || (typeof payload === 'string' && payload.startsWith('STREAMING-'));
}

function envOr(name: string, fallback: string): string {
  const value = process.env[name];
  return value !== undefined && value !== '' ? value : fallback;
}

try {
  const port = portFromEnv('FAKE_S3_PORT', 4323);
  const host = process.env.FAKE_S3_HOST || '127.0.0.1';
  const directory = dataDirFromEnv('FAKE_S3_DATA_DIR', '.lagwise/fakes/s3');
  const buckets = envOr('FAKE_S3_BUCKETS', 'lagwise-uploads')
    .split(',')
    .map((b) => b.trim())
    .filter(Boolean);
  for (const bucket of buckets) {
    if (!bucketNamePattern.test(bucket)) throw new ConfigError(`FAKE_S3_BUCKETS: "${bucket}" is not a valid S3 bucket name.`);
  }
  const credentials: S3Credentials = {
    accessKeyId: envOr('FAKE_S3_ACCESS_KEY_ID', 'lagwise-dev'),
    secretAccessKey: envOr('FAKE_S3_SECRET_ACCESS_KEY', 'lagwise-dev-secret'),
  };

  mkdirSync(directory, { recursive: true });
  const s3rver = new S3rver({
    directory,
    silent: true,
    // the app addresses buckets path-style (forcePathStyle), so any Host header is just the server
    vhostBuckets: false,
    configureBuckets: buckets.map((name) => ({ name })),
  });
  // s3rver's own check only knows key ids it has registered; the signature itself is checked above it
  AWSAccount.DUMMY_ACCOUNT.createKeyPair(credentials.accessKeyId, credentials.secretAccessKey);
  AWSAccount.DUMMY_ACCOUNT.revokeAccessKey('S3RVER');
  s3rver.on('error', (err) => {
    if ((err.status ?? 500) >= 500) console.error('s3 fake: internal error', err);
  });
  await s3rver.configureBuckets();
  const store = s3rver.callback();

  const server = createServer((req, res) => {
    // CORS preflights carry no credentials in S3 either; s3rver answers them from bucket CORS rules
    if (req.method === 'OPTIONS') return store(req, res);
    if (chunkedUpload(req)) {
      // s3rver would store the aws-chunked framing as if it were the file; refuse loudly instead
      return sendError(req, res, {
        status: 501,
        code: 'NotImplemented',
        message:
          "This local S3 fake does not decode aws-chunked uploads. Configure the S3 client with requestChecksumCalculation: 'WHEN_REQUIRED' (see fakes/s3/README.md).",
      });
    }
    const refusal = checkSignature({ method: req.method ?? 'GET', url: req.url ?? '/', headers: req.headers }, credentials);
    if (refusal) return sendError(req, res, refusal);
    return store(req, res);
  });
  await serve(label, server, host, port);
} catch (err) {
  exitOnStartError(label, err);
}
