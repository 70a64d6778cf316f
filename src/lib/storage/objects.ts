/**
 * Object storage for assessment photos, through the S3 API: the hosted service in production,
 * the local fake (fakes/s3) on a developer's machine and in tests. Keys are ours
 * (`assessments/<assessmentId>/<uuid>.jpg`), never an uploader's file name.
 */
import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { DomainError } from '../errors';

export interface StoredObject {
  bytes: Buffer;
  contentType: string;
}

interface Storage {
  client: S3Client;
  bucket: string;
}

let storage: Storage | undefined;

function requiredEnv(name: string): string {
  const value = process.env[name]?.trim();
  if (!value) {
    throw new Error(`${name} is not set: photo storage needs S3_ENDPOINT, S3_REGION, S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY.`);
  }
  return value;
}

/** Made on first use, so pages that never touch photos need no storage settings. */
function connect(): Storage {
  if (storage) return storage;
  const endpoint = requiredEnv('S3_ENDPOINT');
  const region = requiredEnv('S3_REGION');
  const bucket = requiredEnv('S3_BUCKET');
  const accessKeyId = requiredEnv('S3_ACCESS_KEY_ID');
  const secretAccessKey = requiredEnv('S3_SECRET_ACCESS_KEY');
  const pathStyle = (process.env.S3_FORCE_PATH_STYLE ?? '').trim().toLowerCase();
  const client = new S3Client({
    endpoint,
    region,
    forcePathStyle: pathStyle === '1' || pathStyle === 'true',
    credentials: { accessKeyId, secretAccessKey },
    // Checksums only where S3 demands them: otherwise the SDK may send aws-chunked bodies,
    // which the local fake refuses (fakes/s3/README.md); S3 itself accepts both.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    // A hung connection would otherwise hold a submission open indefinitely.
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 60_000 },
  });
  storage = { client, bucket };
  return storage;
}

// Our keys are plain paths; anything else is a bug in the caller, not something to store.
const KEY_PATTERN = /^[A-Za-z0-9_-]+(?:\/[A-Za-z0-9_-]+)*(?:\.[A-Za-z0-9]+)?$/;

function checkKey(key: string): void {
  if (key.length > 512 || !KEY_PATTERN.test(key)) {
    throw new Error(`Not a storage key of ours: ${JSON.stringify(key)}.`);
  }
}

const NETWORK_FAILURES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH']);

/**
 * Storage that does not answer, or answers with its own failure, is an outage the person can
 * wait out: SERVICE_UNAVAILABLE, logged here since the person sees only the sentence. Refusals
 * such as a wrong secret or bucket are our configuration and stay as they are.
 */
function asOutage(error: unknown, what: string): unknown {
  const status = error instanceof S3ServiceException ? error.$metadata.httpStatusCode : undefined;
  const code = (error as { code?: unknown } | null)?.code;
  const name = error instanceof Error ? error.name : undefined;
  const outage =
    (status !== undefined && status >= 500) ||
    (typeof code === 'string' && NETWORK_FAILURES.has(code)) ||
    name === 'TimeoutError';
  if (!outage) return error;
  console.error(`[storage] ${what}: storage unavailable`, error);
  const domainError = new DomainError('SERVICE_UNAVAILABLE', 'Photo storage is not answering just now; try again in a few minutes.');
  domainError.cause = error;
  return domainError;
}

/** Stores bytes under our key, replacing any object already there. */
export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
  checkKey(key);
  const { client, bucket } = connect();
  try {
    await client.send(
      new PutObjectCommand({ Bucket: bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }),
    );
  } catch (error) {
    throw asOutage(error, `put ${key}`);
  }
}

/** The object's bytes and content type, or null when there is no object under the key. */
export async function getObject(key: string): Promise<StoredObject | null> {
  checkKey(key);
  const { client, bucket } = connect();
  try {
    const answer = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    if (!answer.Body) return { bytes: Buffer.alloc(0), contentType: answer.ContentType ?? 'application/octet-stream' };
    const bytes = Buffer.from(await answer.Body.transformToByteArray());
    return { bytes, contentType: answer.ContentType ?? 'application/octet-stream' };
  } catch (error) {
    if (error instanceof NoSuchKey) return null;
    throw asOutage(error, `get ${key}`);
  }
}

/**
 * Deletes the objects; keys with no object are fine. One DeleteObject per key, in turn: an
 * assessment has at most a dozen photos, and the local fake's multi-object delete fails when it
 * empties a folder (it removes the folder once per key, racing itself), so DeleteObjects would
 * pass there only by the SDK's retry.
 */
export async function deleteObjects(keys: readonly string[]): Promise<void> {
  for (const key of keys) checkKey(key);
  if (keys.length === 0) return;
  const { client, bucket } = connect();
  for (const key of keys) {
    try {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    } catch (error) {
      throw asOutage(error, `delete ${key}`);
    }
  }
}

/** How long a signed photo link works: long enough to look, too short to pass around. */
export const SIGNED_LINK_SECONDS = 300;

/**
 * A short-lived link that lets a browser fetch one private object directly from storage.
 * Signing is local (no request to storage), so it cannot fail for an outage.
 */
export async function signedReadUrl(key: string, expiresInSeconds = SIGNED_LINK_SECONDS): Promise<{ url: string; expiresAt: Date }> {
  checkKey(key);
  const { client, bucket } = connect();
  const url = await getSignedUrl(client, new GetObjectCommand({ Bucket: bucket, Key: key }), { expiresIn: expiresInSeconds });
  return { url, expiresAt: new Date(Date.now() + expiresInSeconds * 1000) };
}
