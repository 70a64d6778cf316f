import { describe, expect, it } from 'vitest';
import { clientAddressOf, trustedProxies } from './client-address';

describe('clientAddressOf', () => {
  const none = trustedProxies(undefined);
  const ours = trustedProxies('10.0.0.0/8, 127.0.0.1, ::1');

  it('ignores X-Forwarded-For from a peer that is not a named proxy (the default: none)', () => {
    expect(clientAddressOf('198.51.100.9', '203.0.113.1', none)).toBe('198.51.100.9');
    expect(clientAddressOf('127.0.0.1', '203.0.113.1', none)).toBe('127.0.0.1');
  });

  it('reads X-Forwarded-For from the right, through our proxies only, so a forged left entry is never taken', () => {
    expect(clientAddressOf('10.0.0.5', '203.0.113.1', ours)).toBe('203.0.113.1');
    expect(clientAddressOf('10.0.0.5', '6.6.6.6, 203.0.113.1', ours)).toBe('203.0.113.1');
    expect(clientAddressOf('10.0.0.5', '6.6.6.6, 203.0.113.1, 10.1.2.3', ours)).toBe('203.0.113.1');
    expect(clientAddressOf('::ffff:127.0.0.1', 'garbage, 198.51.100.2', ours)).toBe('198.51.100.2');
  });

  it('stops at an entry that is not an address', () => {
    expect(clientAddressOf('10.0.0.5', '203.0.113.1, not-an-ip', ours)).toBe('10.0.0.5');
  });

  it('refuses a TRUSTED_PROXIES entry that is not an address or range, saying which', () => {
    expect(() => trustedProxies('10.0.0.0/8, proxy.internal')).toThrow(/"proxy.internal" is not an IP address/);
    expect(() => trustedProxies('10.0.0.0/40')).toThrow(/prefix length/);
  });
});
