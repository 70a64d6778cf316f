import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { appFetch } from '../support/stack';

// Whatever arrives from outside, the answer is never a server error.
const bodies = fc.oneof(
  fc.string({ maxLength: 300 }).map((text) => ({ type: 'text/plain', body: text })),
  fc.json({ maxDepth: 3 }).map((text) => ({ type: 'application/json', body: text })),
  fc
    .dictionary(fc.constantFrom('email', 'password', 'next', 'assessment', 'photos', 'x'), fc.string({ maxLength: 80 }), { maxKeys: 4 })
    .map((fields) => ({ type: 'application/x-www-form-urlencoded', body: new URLSearchParams(fields).toString() })),
);

describe.each(['/api/estimate', '/api/assessments', '/api/sign-in/link', '/api/sign-in/password', '/api/sign-out'])('POST %s', (path) => {
  it('answers every body below 500', async () => {
    await fc.assert(
      fc.asyncProperty(bodies, async ({ type, body }) => {
        const response = await appFetch(path, { method: 'POST', headers: { 'content-type': type }, body });
        await response.arrayBuffer();
        return response.status < 500;
      }),
      { numRuns: 40, seed: 4321 },
    );
  });
});

describe('unknown and wrong-method requests', () => {
  it.each([
    ['GET', '/api/assessments'],
    ['PUT', '/api/estimate'],
    ['GET', '/api/no-such-endpoint'],
    ['GET', '/my/assessments/not-a-uuid'],
  ])('%s %s is answered below 500', async (method, path) => {
    const response = await appFetch(path, { method });
    expect(response.status).toBeLessThan(500);
  });
});
