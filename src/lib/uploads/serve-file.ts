/**
 * How a stored upload goes back out: never as something the browser runs in our origin. A PDF
 * (or anything that is not one of our re-encoded images) is a download, sandboxed by its own
 * Content-Security-Policy should a browser open it anyway; images may show inline but still
 * sandboxed. Endpoints that hand out uploads answer with `storedFileResponse`.
 */
import { displayFileName } from './photos';

const INLINE_TYPES = new Set(['image/jpeg', 'image/png', 'image/webp']);

/** RFC 6266 file name: a plain ASCII fallback and the UTF-8 original. */
function dispositionFor(kind: 'inline' | 'attachment', name: string): string {
  const ascii = name.replace(/[^\x20-\x7E]|["\\]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export function storedFileResponse(bytes: Uint8Array, contentType: string, name: string): Response {
  const inline = INLINE_TYPES.has(contentType);
  return new Response(Buffer.from(bytes), {
    status: 200,
    headers: {
      'content-type': inline ? contentType : contentType === 'application/pdf' ? 'application/pdf' : 'application/octet-stream',
      'content-length': String(bytes.byteLength),
      'content-disposition': dispositionFor(inline ? 'inline' : 'attachment', displayFileName(name) || 'file'),
      'content-security-policy': "sandbox; default-src 'none'; img-src 'self'; style-src 'unsafe-inline'",
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      'cross-origin-resource-policy': 'same-origin',
    },
  });
}
