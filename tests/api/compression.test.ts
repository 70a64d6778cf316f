/**
 * The server compresses what compresses well (pages, scripts, JSON) in the encoding the client
 * asks for, and leaves the rest as it is. Read with node:http so the bytes on the wire are seen.
 */
import http from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { stack } from '../support/stack';

interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

function rawRequest(path: string, { method = 'GET', acceptEncoding, body }: { method?: string; acceptEncoding?: string; body?: string } = {}): Promise<Raw> {
  const url = new URL(path, stack.appUrl);
  return new Promise((resolve, reject) => {
    const req = http.request(
      url,
      {
        method,
        headers: {
          ...(acceptEncoding ? { 'accept-encoding': acceptEncoding } : {}),
          ...(body ? { 'content-type': 'application/json', origin: stack.appUrl, 'content-length': Buffer.byteLength(body) } : {}),
        },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

/** A 30-run plant of the invented Harrow Vale Creamery. */
function plantOfThirtyRuns(): string {
  const services = ['steam', 'hot-water', 'glycol', 'condensate-return'] as const;
  return JSON.stringify({
    market: 'US',
    energy: { fuel: 'natural-gas', price: 1.35, priceUnit: 'therm', currency: 'USD' },
    runs: Array.from({ length: 30 }, (_, i) => ({
      id: `run-${i + 1}`,
      label: `Line ${i + 1}`,
      service: services[i % services.length],
      pipe: { standard: 'ASME-B36.10M', size: ['1', '2', '3', '4'][i % 4] },
      lengthM: 10 + (i % 7) * 6,
    })),
  });
}

describe('compressed answers', () => {
  it('a page goes brotli-compressed to a browser that accepts it, and reads the same as uncompressed', async () => {
    const plain = await rawRequest('/estimate');
    const compressed = await rawRequest('/estimate', { acceptEncoding: 'gzip, deflate, br' });
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(compressed.headers['content-encoding']).toBe('br');
    expect(compressed.headers.vary).toMatch(/accept-encoding/i);
    expect(brotliDecompressSync(compressed.body).toString('utf8')).toBe(plain.body.toString('utf8'));
    expect(compressed.body.length).toBeLessThan(plain.body.length / 2);
  });

  it('a script of the site goes gzip-compressed to a client that asks only for gzip', async () => {
    const page = (await rawRequest('/estimate')).body.toString('utf8');
    // React's renderer: a script well over the size below which nothing is compressed.
    const script = /renderer-url="(\/_astro\/[^"]+\.js)"/.exec(page)?.[1];
    expect(script).toBeDefined();
    const plain = await rawRequest(script!);
    expect(plain.body.length).toBeGreaterThan(10_000);
    const gz = await rawRequest(script!, { acceptEncoding: 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).equals(plain.body)).toBe(true);
  });

  it('the estimate answer for 30 runs goes compressed, at a fraction of its raw size', async () => {
    const body = plantOfThirtyRuns();
    const plain = await rawRequest('/api/estimate', { method: 'POST', body });
    const gz = await rawRequest('/api/estimate', { method: 'POST', body, acceptEncoding: 'gzip' });
    const br = await rawRequest('/api/estimate', { method: 'POST', body, acceptEncoding: 'br' });
    expect(plain.status).toBe(200);
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(br.headers['content-encoding']).toBe('br');
    expect(JSON.parse(gunzipSync(gz.body).toString('utf8'))).toEqual(JSON.parse(plain.body.toString('utf8')));
    expect(JSON.parse(brotliDecompressSync(br.body).toString('utf8'))).toEqual(JSON.parse(plain.body.toString('utf8')));
    expect(gz.body.length).toBeLessThan(plain.body.length / 4);
    expect(br.body.length).toBeLessThan(gz.body.length);
  });

  it('a font, already compressed, goes as it is', async () => {
    const css = (await rawRequest('/estimate')).body.toString('utf8');
    const stylesheet = /href="(\/_astro\/[^"]+\.css)"/.exec(css)?.[1];
    expect(stylesheet).toBeDefined();
    const font = /url\((\/_astro\/[^)]+\.woff2)\)/.exec((await rawRequest(stylesheet!)).body.toString('utf8'))?.[1];
    expect(font).toBeDefined();
    const answer = await rawRequest(font!, { acceptEncoding: 'gzip, br' });
    expect(answer.status).toBe(200);
    expect(answer.headers['content-encoding']).toBeUndefined();
  });
});
