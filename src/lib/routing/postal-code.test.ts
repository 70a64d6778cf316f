import { describe, expect, it } from 'vitest';
import { checkRegionPrefix, countryCodes, normalisePostalCode, postalFormats, prefixCandidates } from './postal-code';

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

describe('checkRegionPrefix', () => {
  it.each([
    ['US', '9', '9'],
    ['US', '972', '972'],
    ['US', '97214', '97214'],
    ['CA', 'l', 'L'],
    ['CA', 'L2R', 'L2R'],
    ['CA', 'l2r 7k', 'L2R7K'],
    ['GB', 'hg', 'HG'],
    ['GB', 'HG1', 'HG1'],
    ['GB', 'SW1A', 'SW1A'],
    ['GB', 'M1', 'M1'],
    ['IE', 'D02', 'D02'],
    ['NL', '3511 L', '3511L'],
    ['NZ', '90', '90'],
    ['SE', '411', '411'],
  ] as const)('%s "%s" is the start of a routed code (%s)', (country, typed, prefix) => {
    expect(checkRegionPrefix(country, typed)).toEqual({ ok: true, prefix });
  });

  it.each([
    ['US', '97X', /1 to 5 digits of a ZIP code/],
    ['US', '972145', /1 to 5 digits/], // US routes on the 5-digit ZIP: a sixth digit can never match
    ['CA', 'D2', /letter then digit then letter/], // D is not a first letter Canada Post uses
    ['CA', 'L2RR', /letter then digit then letter/],
    ['GB', '12', /postcode area or district/],
    ['GB', 'HGX', /postcode area or district/],
    ['NL', '0351', /first not 0/],
    ['NZ', '90123', /1 to 4 digits/],
    ['DE', '', /1 to 5 digits/],
  ] as const)('refuses %s "%s", naming the prefix and the format', (country, typed, format) => {
    const checked = checkRegionPrefix(country, typed);
    expect(checked).toEqual({ ok: false, message: expect.stringContaining(`"${typed.trim() || '(empty)'}"`) });
    expect((checked as { message: string }).message).toMatch(format);
  });

  it('every leading part of every example code is a valid prefix of its country', () => {
    for (const code of countryCodes) {
      for (const example of postalFormats[code].example.split(' or ')) {
        const normalized = normalisePostalCode(code, example);
        expect(normalized.ok, `${code} ${example}`).toBe(true);
        const key = normalized.ok ? normalized.routingKey : '';
        for (let n = 1; n <= key.length; n += 1) {
          expect(checkRegionPrefix(code, key.slice(0, n)).ok, `${code} ${key.slice(0, n)}`).toBe(true);
        }
      }
    }
  });
});
