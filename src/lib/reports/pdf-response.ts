/**
 * How a report's PDF goes out: always a download, never a page the browser runs in our origin —
 * sandboxed by its own Content-Security-Policy should a browser open it anyway.
 */

/** RFC 6266 file name: a plain ASCII fallback and the UTF-8 original. */
function disposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7E]|["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export function pdfResponse(bytes: Uint8Array, fileName: string): Response {
  return new Response(Buffer.from(bytes), {
    status: 200,
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(bytes.byteLength),
      'content-disposition': disposition(fileName),
      'content-security-policy': "sandbox; default-src 'none'; style-src 'unsafe-inline'",
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      'cross-origin-resource-policy': 'same-origin',
    },
  });
}
