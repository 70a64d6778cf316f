/**
 * What Resend accepts on POST /emails and how it refuses what it does not. The app must meet the
 * same refusals here as in production, so a bad address fails on a developer's machine first.
 */
import { z } from 'zod';

export type ResendErrorName =
  | 'validation_error'
  | 'missing_required_field'
  | 'missing_api_key'
  | 'invalid_idempotency_key'
  | 'invalid_idempotent_request'
  | 'concurrent_idempotent_requests'
  | 'invalid_attachment'
  | 'invalid_from_address'
  | 'not_found'
  | 'method_not_allowed'
  | 'application_error';

export interface ResendErrorBody {
  statusCode: number;
  name: ResendErrorName;
  message: string;
}

/** Thrown anywhere in request handling; the server turns it into Resend's error body. */
export class ResendRefusal extends Error {
  readonly body: ResendErrorBody;
  constructor(statusCode: number, name: ResendErrorName, message: string) {
    super(message);
    this.body = { statusCode, name, message };
  }
}

const addressFormat = 'The email address needs to follow the `email@example.com` or `Name <email@example.com>` format.';
const bareAddressPattern = /^[^\s@<>",;]+@[^\s@<>",;]+\.[^\s@<>",;]+$/;
const namedAddressPattern = /^(?:"[^"]*"|[^<>"]*)\s*<([^<>\s]+)>$/;

/** The address inside `Name <address>`, or the whole string when there is no display name. */
export function bareAddress(address: string): string {
  const trimmed = address.trim();
  const named = namedAddressPattern.exec(trimmed);
  return named?.[1] ?? trimmed;
}

function isAddress(address: string): boolean {
  const trimmed = address.trim();
  const named = namedAddressPattern.exec(trimmed);
  return bareAddressPattern.test(named ? (named[1] ?? '') : trimmed);
}

const addressList = z.union([z.string(), z.array(z.string())]);
const tagPart = /^[A-Za-z0-9_-]{1,256}$/;

const attachmentSchema = z.object({
  content: z.string().nullish(),
  // the SDK types allow `false` for "no file name"
  filename: z.union([z.string(), z.literal(false)]).nullish(),
  path: z.string().nullish(),
  content_type: z.string().nullish(),
  content_id: z.string().nullish(),
});

const emailSchema = z.object({
  from: z.string(),
  to: addressList,
  subject: z.string(),
  html: z.string().nullish(),
  text: z.string().nullish(),
  cc: addressList.nullish(),
  bcc: addressList.nullish(),
  reply_to: addressList.nullish(),
  headers: z.record(z.string(), z.string()).nullish(),
  attachments: z.array(attachmentSchema).nullish(),
  tags: z.array(z.object({ name: z.string(), value: z.string() })).nullish(),
  scheduled_at: z.string().nullish(),
  topic_id: z.string().nullish(),
  template: z.unknown().optional(),
});

export type AttachmentInput = z.infer<typeof attachmentSchema>;

export interface ParsedEmail {
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
  attachments: AttachmentInput[];
}

function asList(value: string | string[] | null | undefined): string[] | null {
  if (value === null || value === undefined) return null;
  return Array.isArray(value) ? value : [value];
}

function checkAddresses(field: string, list: string[] | null): void {
  for (const address of list ?? []) {
    if (!isAddress(address)) throw new ResendRefusal(422, 'validation_error', `Invalid \`${field}\` field. ${addressFormat}`);
  }
}

const base64Pattern = /^[A-Za-z0-9+/\r\n]*={0,2}[\r\n]*$/;

export function parseEmail(raw: unknown, options: { batch: boolean }): ParsedEmail {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    throw new ResendRefusal(422, 'validation_error', 'The request body must be a JSON object.');
  }
  const body = raw as Record<string, unknown>;
  for (const field of ['from', 'to', 'subject'] as const) {
    if (body[field] === undefined || body[field] === null) {
      throw new ResendRefusal(422, 'missing_required_field', `Missing \`${field}\` field.`);
    }
  }
  if (body.template !== undefined && body.template !== null) {
    throw new ResendRefusal(422, 'validation_error', 'Templates are not supported by the local mail fake; send `html` or `text`.');
  }
  if (options.batch && body.attachments !== undefined && body.attachments !== null) {
    throw new ResendRefusal(422, 'validation_error', 'Attachments are not supported in the batch endpoint.');
  }
  if (options.batch && body.scheduled_at !== undefined && body.scheduled_at !== null) {
    throw new ResendRefusal(422, 'validation_error', '`scheduled_at` is not supported in the batch endpoint.');
  }

  const parsed = emailSchema.safeParse(body);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const field = issue?.path.map(String).join('.') || 'body';
    throw new ResendRefusal(422, 'validation_error', `Invalid \`${field}\` field. ${issue?.message ?? ''}`.trim());
  }
  const email = parsed.data;

  if (!isAddress(email.from)) {
    throw new ResendRefusal(422, 'invalid_from_address', `Invalid \`from\` field. ${addressFormat}`);
  }
  const to = asList(email.to) ?? [];
  if (to.length === 0) throw new ResendRefusal(422, 'missing_required_field', 'Missing `to` field.');
  if (to.length > 50) throw new ResendRefusal(422, 'validation_error', 'Invalid `to` field. At most 50 recipients are allowed.');
  checkAddresses('to', to);
  const cc = asList(email.cc);
  const bcc = asList(email.bcc);
  const replyTo = asList(email.reply_to);
  checkAddresses('cc', cc);
  checkAddresses('bcc', bcc);
  checkAddresses('reply_to', replyTo);

  const html = email.html ?? null;
  const text = email.text ?? null;
  if (html === null && text === null) {
    throw new ResendRefusal(422, 'validation_error', 'Missing `html` or `text` field.');
  }

  for (const tag of email.tags ?? []) {
    if (!tagPart.test(tag.name) || !tagPart.test(tag.value)) {
      throw new ResendRefusal(
        422,
        'validation_error',
        'Invalid `tags` field. Tag names and values may only contain ASCII letters, numbers, underscores and dashes, up to 256 characters.',
      );
    }
  }

  const attachments = email.attachments ?? [];
  for (const attachment of attachments) {
    const hasContent = typeof attachment.content === 'string';
    const hasPath = typeof attachment.path === 'string' && attachment.path !== '';
    if (!hasContent && !hasPath) {
      throw new ResendRefusal(422, 'invalid_attachment', 'Attachment must have either a `content` or `path`.');
    }
    if (hasContent && !base64Pattern.test(attachment.content ?? '')) {
      throw new ResendRefusal(422, 'invalid_attachment', 'Attachment `content` must be a base64 string.');
    }
  }

  return {
    from: email.from,
    to,
    cc,
    bcc,
    reply_to: replyTo,
    subject: email.subject,
    html,
    text,
    headers: email.headers ?? null,
    tags: email.tags ?? null,
    attachments,
  };
}

const contentTypes: Record<string, string> = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  gif: 'image/gif',
  webp: 'image/webp',
  svg: 'image/svg+xml',
  heic: 'image/heic',
  csv: 'text/csv',
  txt: 'text/plain',
  htm: 'text/html',
  html: 'text/html',
  ics: 'text/calendar',
  json: 'application/json',
  xml: 'application/xml',
  zip: 'application/zip',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  docx: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  eml: 'message/rfc822',
};

/** Resend derives the type from the file name when the sender gives none. */
export function contentTypeFor(filename: string): string {
  const extension = filename.toLowerCase().split('.').pop() ?? '';
  return contentTypes[extension] ?? 'application/octet-stream';
}
