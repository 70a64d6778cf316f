/**
 * Headers every answer carries, static files and prerendered pages included (the server sets
 * them before Astro or its static handler write theirs). Script and style sources come from
 * Astro's own CSP (hashes of what it bundles); this adds what a <meta> policy cannot say.
 */
import type { ServerResponse } from 'node:http';

export interface HeaderOptions {
  /** PUBLIC_BASE_URL is https: browsers are told to use nothing else (HSTS). */
  https: boolean;
}

/** The policy sent as a header beside Astro's: framing, plugins, base and form targets. */
export const FRAME_AND_EMBED_POLICY = "frame-ancestors 'none'; object-src 'none'; base-uri 'none'; form-action 'self'";

export function baselineHeaders({ https }: HeaderOptions): Record<string, string> {
  return {
    'content-security-policy': FRAME_AND_EMBED_POLICY,
    'x-content-type-options': 'nosniff',
    'x-frame-options': 'DENY',
    'referrer-policy': 'same-origin',
    'cross-origin-opener-policy': 'same-origin',
    'permissions-policy': 'camera=(), microphone=(), geolocation=(), payment=()',
    ...(https ? { 'strict-transport-security': 'max-age=31536000; includeSubDomains' } : {}),
  };
}

/**
 * Sets the baseline on a response before anyone writes it. A second Content-Security-Policy
 * (Astro's, on a page) is appended rather than replacing ours: browsers enforce both.
 */
export function applyBaselineHeaders(res: ServerResponse, options: HeaderOptions): void {
  for (const [name, value] of Object.entries(baselineHeaders(options))) res.setHeader(name, value);
  const setHeader = res.setHeader;
  res.setHeader = function patchedSetHeader(this: ServerResponse, name: string, value: number | string | readonly string[]) {
    if (name.toLowerCase() === 'content-security-policy' && typeof value === 'string' && value !== FRAME_AND_EMBED_POLICY) {
      return setHeader.call(this, name, [FRAME_AND_EMBED_POLICY, value]);
    }
    return setHeader.call(this, name, value);
  } as typeof res.setHeader;
  const writeHead = res.writeHead;
  res.writeHead = function patchedWriteHead(this: ServerResponse, ...args: unknown[]) {
    const headersArg = args.find((a) => a && typeof a === 'object' && !Array.isArray(a)) as Record<string, unknown> | undefined;
    const theirs = headersArg?.['content-security-policy'] ?? headersArg?.['Content-Security-Policy'];
    if (typeof theirs === 'string' && theirs !== FRAME_AND_EMBED_POLICY) {
      delete headersArg!['content-security-policy'];
      delete headersArg!['Content-Security-Policy'];
      res.setHeader('content-security-policy', [FRAME_AND_EMBED_POLICY, theirs]);
    }
    return (writeHead as (...a: unknown[]) => ServerResponse).apply(this, args);
  } as typeof res.writeHead;
}
