/**
 * Every accepted message is one JSON file, so the inbox survives a restart of the fake and a
 * developer can still read what the app sent before it crashed. Idempotency records live beside
 * them for the same reason: a retry after a restart must not deliver a second copy.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { ParsedEmail } from './resend-api.ts';

export interface StoredAttachment {
  id: string;
  filename: string;
  content_type: string;
  content_id: string | null;
  size: number;
  /** base64, exactly as it will be handed back */
  content: string;
}

/** A parsed request as it is kept: its attachments decoded and measured. */
export interface StoredMessage extends Omit<ParsedEmail, 'attachments'> {
  object: 'email';
  id: string;
  created_at: string;
  attachments: StoredAttachment[];
}

export interface IdempotencyRecord {
  endpoint: string;
  key: string;
  fingerprint: string;
  created_at: string;
  status: number;
  response: unknown;
}

/** Resend forgets an idempotency key after a day; a key reused later is a new request. */
const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;

function writeJsonAtomically(file: string, value: unknown): void {
  // A crash mid-write must not leave half a message that breaks the next start.
  const tmp = `${file}.${process.pid}.tmp`;
  writeFileSync(tmp, JSON.stringify(value, null, 2));
  renameSync(tmp, file);
}

function readJsonFiles<T>(dir: string): T[] {
  const out: T[] = [];
  for (const name of readdirSync(dir)) {
    if (!name.endsWith('.json')) continue;
    try {
      out.push(JSON.parse(readFileSync(path.join(dir, name), 'utf8')) as T);
    } catch (err) {
      console.error(`mail fake: skipping unreadable ${path.join(dir, name)}: ${(err as Error).message}`);
    }
  }
  return out;
}

export class MailStore {
  private readonly messagesDir: string;
  private readonly idempotencyDir: string;
  private readonly messages = new Map<string, StoredMessage>();

  constructor(dataDir: string) {
    this.messagesDir = path.join(dataDir, 'messages');
    this.idempotencyDir = path.join(dataDir, 'idempotency');
    mkdirSync(this.messagesDir, { recursive: true });
    mkdirSync(this.idempotencyDir, { recursive: true });
    for (const message of readJsonFiles<StoredMessage>(this.messagesDir)) this.messages.set(message.id, message);
  }

  add(message: StoredMessage): void {
    writeJsonAtomically(path.join(this.messagesDir, `${message.id}.json`), message);
    this.messages.set(message.id, message);
  }

  get(id: string): StoredMessage | undefined {
    return this.messages.get(id);
  }

  /** Newest first, the order a person reads an inbox in. */
  list(): StoredMessage[] {
    return [...this.messages.values()].sort((a, b) => b.created_at.localeCompare(a.created_at));
  }

  clear(): number {
    const count = this.messages.size;
    this.messages.clear();
    for (const dir of [this.messagesDir, this.idempotencyDir]) {
      rmSync(dir, { recursive: true, force: true });
      mkdirSync(dir, { recursive: true });
    }
    return count;
  }

  private idempotencyFile(endpoint: string, key: string): string {
    const name = createHash('sha256').update(`${endpoint}\n${key}`).digest('hex');
    return path.join(this.idempotencyDir, `${name}.json`);
  }

  findIdempotent(endpoint: string, key: string, now = Date.now()): IdempotencyRecord | undefined {
    let record: IdempotencyRecord;
    try {
      record = JSON.parse(readFileSync(this.idempotencyFile(endpoint, key), 'utf8')) as IdempotencyRecord;
    } catch {
      return undefined;
    }
    if (now - Date.parse(record.created_at) > IDEMPOTENCY_TTL_MS) return undefined;
    return record;
  }

  saveIdempotent(record: IdempotencyRecord): void {
    writeJsonAtomically(this.idempotencyFile(record.endpoint, record.key), record);
  }
}
