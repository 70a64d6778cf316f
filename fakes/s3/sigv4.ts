/**
 * AWS Signature Version 4 checking for the S3 fake. s3rver only looks at the access key id and
 * lets unsigned requests through; real S3 checks the signature and refuses anonymous access to a
 * private bucket. Checking here means a wrong secret, a public (unsigned) photo URL or an expired
 * presigned link fails on a developer's machine the way it would in production.
 *
 * Not checked: the body against x-amz-content-sha256 (the SDK computes it; S3 would verify it).
 */
import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import type { IncomingHttpHeaders } from 'node:http';

export interface S3Credentials {
  accessKeyId: string;
  secretAccessKey: string;
}

export interface S3Refusal {
  status: number;
  code: string;
  message: string;
}

const ALGORITHM = 'AWS4-HMAC-SHA256';
const MAX_SKEW_MS = 15 * 60 * 1000;
const MAX_PRESIGNED_SECONDS = 7 * 24 * 60 * 60;

const refuse = (status: number, code: string, message: string): S3Refusal => ({ status, code, message });
const signatureMismatch = (): S3Refusal =>
  refuse(
    403,
    'SignatureDoesNotMatch',
    'The request signature we calculated does not match the signature you provided. Check your key and signing method.',
  );

/** RFC 3986 escaping, the one SigV4 uses for query keys and values. */
function escapeUri(value: string): string {
  return encodeURIComponent(value).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

function parseQuery(raw: string): Map<string, string[]> | undefined {
  const query = new Map<string, string[]>();
  for (const part of raw.split('&')) {
    if (part === '') continue;
    const eq = part.indexOf('=');
    let key: string;
    let value: string;
    try {
      key = decodeURIComponent(eq < 0 ? part : part.slice(0, eq));
      value = eq < 0 ? '' : decodeURIComponent(part.slice(eq + 1));
    } catch {
      return undefined;
    }
    query.set(key, [...(query.get(key) ?? []), value]);
  }
  return query;
}

function canonicalQuery(query: Map<string, string[]>, without?: string): string {
  const serialized: [string, string][] = [];
  for (const [key, values] of query) {
    if (without !== undefined && key.toLowerCase() === without) continue;
    const encodedKey = escapeUri(key);
    const pairs = values.map((v) => `${encodedKey}=${escapeUri(v)}`).sort();
    serialized.push([encodedKey, pairs.join('&')]);
  }
  return serialized
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([, pairs]) => pairs)
    .join('&');
}

function headerValue(headers: IncomingHttpHeaders, name: string): string {
  const value = headers[name];
  const joined = Array.isArray(value) ? value.join(',') : (value ?? '');
  return joined.replace(/[\r\n]/g, ' ').replace(/[ \t]+/g, ' ').trim();
}

function hmac(key: Buffer | string, data: string): Buffer {
  return createHmac('sha256', key).update(data, 'utf8').digest();
}

/** `20250102T030405Z` → Date, or undefined when it is not that shape. */
function parseAmzDate(value: string): Date | undefined {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(value);
  if (!m) return undefined;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5]), Number(m[6])));
  return Number.isNaN(date.getTime()) ? undefined : date;
}

interface Signed {
  accessKeyId: string;
  scopeDate: string;
  region: string;
  service: string;
  amzDate: string;
  signedHeaders: string[];
  signature: string;
  payloadHash: string;
  query: string;
}

function parseCredential(credential: string): Pick<Signed, 'accessKeyId' | 'scopeDate' | 'region' | 'service'> | undefined {
  const parts = credential.split('/');
  if (parts.length !== 5 || parts[4] !== 'aws4_request') return undefined;
  const [accessKeyId, scopeDate, region, service] = parts as [string, string, string, string, string];
  return { accessKeyId, scopeDate, region, service };
}

function fromHeader(authorization: string, headers: IncomingHttpHeaders, query: Map<string, string[]>, now: Date): Signed | S3Refusal {
  if (!authorization.startsWith(`${ALGORITHM} `)) {
    return refuse(400, 'InvalidArgument', 'Unsupported Authorization Type; only AWS4-HMAC-SHA256 is accepted.');
  }
  const fields = new Map<string, string>();
  for (const component of authorization.slice(ALGORITHM.length + 1).split(',')) {
    const eq = component.indexOf('=');
    if (eq > 0) fields.set(component.slice(0, eq).trim(), component.slice(eq + 1).trim());
  }
  const credential = parseCredential(fields.get('Credential') ?? '');
  const signedHeaders = fields.get('SignedHeaders');
  const signature = fields.get('Signature');
  if (!credential || !signedHeaders || !signature) {
    return refuse(
      400,
      'AuthorizationHeaderMalformed',
      'The authorization header is malformed; it requires Credential, SignedHeaders and Signature.',
    );
  }
  const payloadHash = headerValue(headers, 'x-amz-content-sha256');
  if (payloadHash === '') return refuse(400, 'InvalidRequest', 'Missing required header for this request: x-amz-content-sha256');
  const amzDate = headerValue(headers, 'x-amz-date');
  const signedAt = parseAmzDate(amzDate);
  if (!signedAt) return refuse(403, 'AccessDenied', 'AWS authentication requires a valid x-amz-date header');
  if (Math.abs(now.getTime() - signedAt.getTime()) > MAX_SKEW_MS) {
    return refuse(403, 'RequestTimeTooSkewed', 'The difference between the request time and the current time is too large.');
  }
  return { ...credential, amzDate, signedHeaders: signedHeaders.split(';'), signature, payloadHash, query: canonicalQuery(query) };
}

function fromQuery(query: Map<string, string[]>, now: Date): Signed | S3Refusal {
  const one = (name: string): string | undefined => query.get(name)?.[0];
  if (one('X-Amz-Algorithm') !== ALGORITHM) {
    return refuse(400, 'AuthorizationQueryParametersError', `X-Amz-Algorithm only supports "${ALGORITHM}"`);
  }
  const credential = parseCredential(one('X-Amz-Credential') ?? '');
  const amzDate = one('X-Amz-Date') ?? '';
  const expires = Number(one('X-Amz-Expires'));
  const signedHeaders = one('X-Amz-SignedHeaders');
  const signature = one('X-Amz-Signature');
  const signedAt = parseAmzDate(amzDate);
  if (!credential || !signedAt || !signedHeaders || !signature || !Number.isInteger(expires)) {
    return refuse(
      400,
      'AuthorizationQueryParametersError',
      'Query-string authentication version 4 requires the X-Amz-Algorithm, X-Amz-Credential, X-Amz-Signature, X-Amz-Date, X-Amz-SignedHeaders, and X-Amz-Expires parameters.',
    );
  }
  if (expires < 1 || expires > MAX_PRESIGNED_SECONDS) {
    return refuse(400, 'AuthorizationQueryParametersError', 'X-Amz-Expires must be between 1 and 604800 seconds.');
  }
  if (now.getTime() > signedAt.getTime() + expires * 1000) return refuse(403, 'AccessDenied', 'Request has expired');
  return {
    ...credential,
    amzDate,
    signedHeaders: signedHeaders.split(';'),
    signature,
    // S3 signs presigned requests over an unsigned payload
    payloadHash: one('X-Amz-Content-Sha256') ?? 'UNSIGNED-PAYLOAD',
    query: canonicalQuery(query, 'x-amz-signature'),
  };
}

export interface IncomingSigned {
  method: string;
  url: string;
  headers: IncomingHttpHeaders;
}

/** undefined when the request is signed by `credentials`; otherwise S3's refusal. */
export function checkSignature(req: IncomingSigned, credentials: S3Credentials, now = new Date()): S3Refusal | undefined {
  const queryStart = req.url.indexOf('?');
  const path = queryStart < 0 ? req.url : req.url.slice(0, queryStart);
  const query = parseQuery(queryStart < 0 ? '' : req.url.slice(queryStart + 1));
  if (!query) return refuse(400, 'InvalidArgument', 'The query string is not validly encoded.');

  const authorization = headerValue(req.headers, 'authorization');
  const presigned = query.has('X-Amz-Algorithm');
  if (authorization !== '' && presigned) {
    return refuse(
      400,
      'InvalidArgument',
      'Only one auth mechanism allowed; only the X-Amz-Algorithm query parameter or the Authorization header should be specified',
    );
  }
  if (authorization === '' && !presigned) {
    if (query.has('Signature') || query.has('AWSAccessKeyId')) {
      return refuse(400, 'InvalidRequest', 'The authorization mechanism you have provided is not supported. Please use AWS4-HMAC-SHA256.');
    }
    return refuse(403, 'AccessDenied', 'Access Denied');
  }

  const signed = presigned ? fromQuery(query, now) : fromHeader(authorization, req.headers, query, now);
  if ('code' in signed) return signed;
  if (signed.accessKeyId !== credentials.accessKeyId) {
    return refuse(403, 'InvalidAccessKeyId', 'The AWS Access Key Id you provided does not exist in our records.');
  }
  if (signed.service !== 's3') {
    return refuse(400, 'AuthorizationHeaderMalformed', `The authorization is malformed; service '${signed.service}' is wrong; expecting 's3'.`);
  }
  if (signed.scopeDate !== signed.amzDate.slice(0, 8)) return signatureMismatch();

  const canonicalRequest = [
    req.method,
    path,
    signed.query,
    ...signed.signedHeaders.map((name) => `${name}:${headerValue(req.headers, name)}`),
    '',
    signed.signedHeaders.join(';'),
    signed.payloadHash,
  ].join('\n');
  const scope = `${signed.scopeDate}/${signed.region}/${signed.service}/aws4_request`;
  const stringToSign = [ALGORITHM, signed.amzDate, scope, createHash('sha256').update(canonicalRequest, 'utf8').digest('hex')].join('\n');
  let key = hmac(`AWS4${credentials.secretAccessKey}`, signed.scopeDate);
  for (const part of [signed.region, signed.service, 'aws4_request']) key = hmac(key, part);
  const expected = Buffer.from(hmac(key, stringToSign).toString('hex'));
  const provided = Buffer.from(signed.signature.toLowerCase());
  if (expected.length !== provided.length || !timingSafeEqual(expected, provided)) return signatureMismatch();
  return undefined;
}
