import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from '@aws-sdk/client-s3';
// The SDK's own SigV4 signer, the one @aws-sdk/s3-request-presigner wraps; that package is not installed.
import { SignatureV4 } from '@smithy/signature-v4';
import type { HttpRequest } from '@smithy/types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFake, type RunningFake } from './start-fake.ts';

const bucket = 'lagwise-uploads';
const accessKeyId = 'lagwise-test-key';
const secretAccessKey = 'lagwise-test-secret-0123456789';

let dataDir: string;
let fake: RunningFake;

function fakeEnv(): Record<string, string> {
  return {
    FAKE_S3_PORT: '0',
    FAKE_S3_HOST: '127.0.0.1',
    FAKE_S3_DATA_DIR: dataDir,
    FAKE_S3_BUCKETS: 'lagwise-uploads, lagwise-reports',
    FAKE_S3_ACCESS_KEY_ID: accessKeyId,
    FAKE_S3_SECRET_ACCESS_KEY: secretAccessKey,
  };
}

/** The options fakes/s3/README.md tells the app to use. */
function appClient(overrides: Partial<S3ClientConfig> = {}): S3Client {
  return new S3Client({
    endpoint: fake.url,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId, secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    ...overrides,
  });
}

/** Bytes that cover every byte value, so an encoding slip anywhere shows up as a difference. */
function photoBytes(size: number): Buffer {
  const bytes = randomBytes(size);
  for (let i = 0; i < 256 && i < size; i++) bytes[i] = i;
  return bytes;
}

async function bodyBytes(body: { transformToByteArray(): Promise<Uint8Array> } | undefined): Promise<Buffer> {
  if (!body) throw new Error('no body');
  return Buffer.from(await body.transformToByteArray());
}

async function errorOf(promise: Promise<unknown>): Promise<Error & { $metadata?: { httpStatusCode?: number } }> {
  try {
    await promise;
  } catch (err) {
    return err as Error;
  }
  throw new Error('expected the request to be refused');
}

function escapeUri(value: string): string {
  return encodeURIComponent(value).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

class Captured extends Error {
  constructor(readonly request: HttpRequest) {
    super('captured');
  }
}

/**
 * A presigned GET as @aws-sdk/s3-request-presigner builds it: the client serializes the request,
 * then the SDK's SigV4 signer presigns it over an unsigned payload.
 */
async function presignGet(key: string, options: { expiresIn: number; signingDate?: Date }): Promise<string> {
  const client = appClient();
  const command = new GetObjectCommand({ Bucket: bucket, Key: key });
  command.middlewareStack.add(
    () => async (args) => {
      throw new Captured(args.request as HttpRequest);
    },
    { step: 'finalizeRequest', priority: 'high' },
  );
  let request: HttpRequest | undefined;
  try {
    await client.send(command);
  } catch (err) {
    if (!(err instanceof Captured)) throw err;
    request = err.request;
  }
  if (!request) throw new Error('request was not captured');
  const signer = new SignatureV4({
    service: 's3',
    region: 'us-east-1',
    credentials: { accessKeyId, secretAccessKey },
    sha256: client.config.sha256,
    uriEscapePath: false,
    applyChecksum: false,
  });
  const host = `${request.hostname}${request.port ? `:${request.port}` : ''}`;
  const signed = await signer.presign(
    { ...request, headers: { host, 'x-amz-content-sha256': 'UNSIGNED-PAYLOAD' } },
    { expiresIn: options.expiresIn, signingDate: options.signingDate },
  );
  const query = Object.entries(signed.query ?? {})
    .flatMap(([k, v]) => (Array.isArray(v) ? v : [v]).map((one) => `${escapeUri(k)}=${escapeUri(String(one ?? ''))}`))
    .join('&');
  return `${signed.protocol}//${host}${signed.path}?${query}`;
}

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'lagwise-s3-fake-'));
  fake = await startFake('fakes/s3/server.ts', fakeEnv());
});

afterAll(async () => {
  await fake?.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('s3 fake through @aws-sdk/client-s3', () => {
  it('stores a photo and gives back the same bytes, type, size and metadata', async () => {
    const s3 = appClient();
    const photo = photoBytes(300_000);
    const key = 'plants/harrowgate-creamery/runs/steam-main-1/photo-1.jpg';
    const put = await s3.send(
      new PutObjectCommand({ Bucket: bucket, Key: key, Body: photo, ContentType: 'image/jpeg', Metadata: { plant: 'harrowgate-creamery' } }),
    );
    const md5 = createHash('md5').update(photo).digest('hex');
    expect(put.ETag).toBe(`"${md5}"`);

    const head = await s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
    expect(head.ContentLength).toBe(photo.length);
    expect(head.ContentType).toBe('image/jpeg');
    expect(head.ETag).toBe(`"${md5}"`);

    const got = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    expect(got.ContentType).toBe('image/jpeg');
    expect(got.Metadata).toEqual({ plant: 'harrowgate-creamery' });
    expect((await bodyBytes(got.Body)).equals(photo)).toBe(true);
  });

  it('keeps keys with spaces, brackets, plus signs and non-ASCII letters', async () => {
    const s3 = appClient();
    const key = 'plants/Harrowgate Creamery/Kesselraum (Nord) ünd+ablauf*1.jpg';
    const photo = photoBytes(4_000);
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photo, ContentType: 'image/jpeg' }));
    const got = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    expect((await bodyBytes(got.Body)).equals(photo)).toBe(true);
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: 'plants/Harrowgate Creamery/' }));
    expect(listed.Contents?.map((c) => c.Key)).toEqual([key]);
  });

  it('stores a streamed body byte for byte with the recommended checksum settings', async () => {
    const s3 = appClient();
    const photo = photoBytes(200_000);
    const key = 'plants/harrowgate-creamery/streamed.jpg';
    await s3.send(
      new PutObjectCommand({ Bucket: bucket, Key: key, Body: Readable.from([photo]), ContentLength: photo.length, ContentType: 'image/jpeg' }),
    );
    const got = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    expect((await bodyBytes(got.Body)).equals(photo)).toBe(true);
  });

  it('with the SDK default checksums: a Buffer body round-trips, an aws-chunked stream is refused rather than stored corrupted', async () => {
    const s3 = appClient({ requestChecksumCalculation: undefined, responseChecksumValidation: undefined });
    const photo = photoBytes(50_000);
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: 'defaults/buffer.jpg', Body: photo, ContentType: 'image/jpeg' }));
    const got = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: 'defaults/buffer.jpg' }));
    expect((await bodyBytes(got.Body)).equals(photo)).toBe(true);

    const refused = await errorOf(
      s3.send(new PutObjectCommand({ Bucket: bucket, Key: 'defaults/stream.jpg', Body: Readable.from([photo]), ContentLength: photo.length })),
    );
    expect(refused.name).toBe('NotImplemented');
    expect(refused.message).toContain('WHEN_REQUIRED');
    const absent = await errorOf(appClient().send(new HeadObjectCommand({ Bucket: bucket, Key: 'defaults/stream.jpg' })));
    expect(absent.name).toBe('NotFound');
  });

  it('answers a missing key with NoSuchKey (GET) and 404 NotFound (HEAD), a missing bucket with NoSuchBucket', async () => {
    const s3 = appClient();
    const missing = await errorOf(s3.send(new GetObjectCommand({ Bucket: bucket, Key: 'plants/nowhere/none.jpg' })));
    expect(missing.name).toBe('NoSuchKey');
    expect(missing.$metadata?.httpStatusCode).toBe(404);
    const head = await errorOf(s3.send(new HeadObjectCommand({ Bucket: bucket, Key: 'plants/nowhere/none.jpg' })));
    expect(head.name).toBe('NotFound');
    expect(head.$metadata?.httpStatusCode).toBe(404);
    const noBucket = await errorOf(s3.send(new GetObjectCommand({ Bucket: 'lagwise-absent', Key: 'x.jpg' })));
    expect(noBucket.name).toBe('NoSuchBucket');
  });

  it('deletes an object', async () => {
    const s3 = appClient();
    const key = 'plants/harrowgate-creamery/to-delete.jpg';
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photoBytes(1_000), ContentType: 'image/jpeg' }));
    await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    const gone = await errorOf(s3.send(new GetObjectCommand({ Bucket: bucket, Key: key })));
    expect(gone.name).toBe('NoSuchKey');
  });

  it('lists objects under a prefix', async () => {
    const s3 = appClient();
    const keys = ['plants/elmbridge-dairy/a.jpg', 'plants/elmbridge-dairy/b.jpg', 'plants/elmbridgeton-mill/c.jpg'];
    for (const key of keys) await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photoBytes(100), ContentType: 'image/jpeg' }));
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: 'plants/elmbridge-dairy/' }));
    expect(listed.KeyCount).toBe(2);
    expect(listed.Contents?.map((c) => c.Key)).toEqual(keys.slice(0, 2));
  });

  it('creates the buckets named in FAKE_S3_BUCKETS and supports CreateBucket/HeadBucket', async () => {
    const s3 = appClient();
    await expect(s3.send(new HeadBucketCommand({ Bucket: 'lagwise-reports' }))).resolves.toBeDefined();
    const absent = await errorOf(s3.send(new HeadBucketCommand({ Bucket: 'lagwise-scratch' })));
    expect(absent.name).toBe('NotFound');
    await s3.send(new CreateBucketCommand({ Bucket: 'lagwise-scratch' }));
    await expect(s3.send(new HeadBucketCommand({ Bucket: 'lagwise-scratch' }))).resolves.toBeDefined();
  });

  it('serves a presigned GET URL to plain fetch, and refuses a tampered or expired one', async () => {
    const s3 = appClient();
    const key = 'plants/harrowgate-creamery/presigned photo.jpg';
    const photo = photoBytes(20_000);
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photo, ContentType: 'image/jpeg' }));

    const url = await presignGet(key, { expiresIn: 300 });
    expect(url).toContain('X-Amz-Signature=');
    const response = await fetch(url);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('image/jpeg');
    expect(Buffer.from(await response.arrayBuffer()).equals(photo)).toBe(true);

    const tampered = url.replace(/X-Amz-Signature=([0-9a-f])/, (_, first: string) => `X-Amz-Signature=${first === 'a' ? 'b' : 'a'}`);
    const refused = await fetch(tampered);
    expect(refused.status).toBe(403);
    expect(await refused.text()).toContain('<Code>SignatureDoesNotMatch</Code>');

    const expired = await fetch(await presignGet(key, { expiresIn: 60, signingDate: new Date(Date.now() - 2 * 60 * 60 * 1000) }));
    expect(expired.status).toBe(403);
    const expiredBody = await expired.text();
    expect(expiredBody).toContain('<Code>AccessDenied</Code>');
    expect(expiredBody).toContain('Request has expired');
  });

  it('refuses unsigned requests, a wrong secret and an unknown access key', async () => {
    const key = 'plants/harrowgate-creamery/private.jpg';
    await appClient().send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photoBytes(500), ContentType: 'image/jpeg' }));

    const anonymous = await fetch(`${fake.url}/${bucket}/${key}`);
    expect(anonymous.status).toBe(403);
    expect(await anonymous.text()).toContain('<Code>AccessDenied</Code>');

    const wrongSecret = await errorOf(
      appClient({ credentials: { accessKeyId, secretAccessKey: 'not-the-secret' } }).send(new GetObjectCommand({ Bucket: bucket, Key: key })),
    );
    expect(wrongSecret.name).toBe('SignatureDoesNotMatch');

    const unknownKey = await errorOf(
      appClient({ credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } }).send(new GetObjectCommand({ Bucket: bucket, Key: key })),
    );
    expect(unknownKey.name).toBe('InvalidAccessKeyId');
  });

  it('keeps objects across a restart and stops cleanly on SIGTERM', async () => {
    const key = 'plants/harrowgate-creamery/kept.jpg';
    const photo = photoBytes(10_000);
    await appClient().send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: photo, ContentType: 'image/jpeg' }));

    expect(await fake.stop()).toBe(0);
    expect(readdirSync(dataDir)).toEqual(expect.arrayContaining(['lagwise-uploads', 'lagwise-reports']));
    fake = await startFake('fakes/s3/server.ts', fakeEnv());

    const got = await appClient().send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    expect(got.ContentType).toBe('image/jpeg');
    expect((await bodyBytes(got.Body)).equals(photo)).toBe(true);
  });
});
