import { describe, expect, it } from 'vitest';
import { normalisePostalCode, prefixCandidates } from './postal-code';

describe('normalisePostalCode', () => {
  it.each([
    ['US', '97214', '97214', '97214'],
    ['US', ' 97214-3302 ', '972143302', '97214'],
    ['CA', 'l2r 7k6', 'L2R7K6', 'L2R7K6'],
    ['GB', 'hg1 2qt', 'HG12QT', 'HG12QT'],
    ['NL', '3511 lx', '3511LX', '3511LX'],
    ['SE', '411 06', '41106', '41106'],
  ] as const)('%s "%s" → %s (routes on %s)', (country, typed, canonical, routingKey) => {
    expect(normalisePostalCode(country, typed)).toEqual({ ok: true, canonical, routingKey });
  });

  it.each([
    ['US', '9721'],
    ['US', 'ABCDE'],
    ['CA', 'D2R 7K6'], // D is not a first letter Canada Post uses
    ['GB', '12345'],
    ['DE', '7909'],
  ] as const)('refuses %s "%s" with an example of the right shape', (country, typed) => {
    const result = normalisePostalCode(country, typed);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.message).toMatch(/should look like/);
  });
});

describe('prefixCandidates', () => {
  it('lists every leading part, longest first', () => {
    expect(prefixCandidates('L2R7K6')).toEqual(['L2R7K6', 'L2R7K', 'L2R7', 'L2R', 'L2', 'L']);
  });
});
