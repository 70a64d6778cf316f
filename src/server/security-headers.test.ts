import { describe, expect, it } from 'vitest';
import { baselineHeaders } from './security-headers';

describe('baseline headers', () => {
  it('forbid framing, sniffing and cross-site referrers everywhere', () => {
    const headers = baselineHeaders({ https: false });
    expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['referrer-policy']).toBe('same-origin');
    expect(headers['strict-transport-security']).toBeUndefined();
  });

  it('add HSTS only when the public address is https', () => {
    expect(baselineHeaders({ https: true })['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
  });
});
