/**
 * A sign-in link works once, within 24 hours. One that was used or is too old lands on a page
 * that says so and sends a fresh link in one click: the link's own error address carries the
 * owner's e-mail sealed (AES-256-GCM under a key derived from the auth secret), so the page can
 * ask for a new link without showing or asking for the address, and nobody can forge one for
 * an address of their choosing.
 */
import { createCipheriv, createDecipheriv, createHash, randomBytes } from 'node:crypto';

const IV_BYTES = 12;
const TAG_BYTES = 16;

function key(): Buffer {
  const secret = process.env.BETTER_AUTH_SECRET;
  if (!secret) throw new Error('BETTER_AUTH_SECRET is not set; start the app with `npm start`, which sets it.');
  return createHash('sha256').update(`lagwise:sign-in-again:${secret}`).digest();
}

/** The address sealed for the page behind a spent link. */
export function sealAddress(email: string): string {
  const iv = randomBytes(IV_BYTES);
  const cipher = createCipheriv('aes-256-gcm', key(), iv);
  const sealed = Buffer.concat([cipher.update(email, 'utf8'), cipher.final()]);
  return Buffer.concat([iv, cipher.getAuthTag(), sealed]).toString('base64url');
}

/** The address a sealed value stands for; undefined when it was altered or made elsewhere. */
export function openAddress(value: unknown): string | undefined {
  if (typeof value !== 'string' || value.length > 600) return undefined;
  const bytes = Buffer.from(value, 'base64url');
  if (bytes.length <= IV_BYTES + TAG_BYTES) return undefined;
  try {
    const decipher = createDecipheriv('aes-256-gcm', key(), bytes.subarray(0, IV_BYTES));
    decipher.setAuthTag(bytes.subarray(IV_BYTES, IV_BYTES + TAG_BYTES));
    return Buffer.concat([decipher.update(bytes.subarray(IV_BYTES + TAG_BYTES)), decipher.final()]).toString('utf8');
  } catch {
    return undefined;
  }
}

/** Where a spent or stale link sends its reader: the page that explains, with the way back to `next`. */
export function spentLinkPath(email: string, next: string): string {
  return `/sign-in/link-used?${new URLSearchParams({ again: sealAddress(email), next })}`;
}
