/**
 * The string round the pipe: a circumference is π times the outside diameter, and the nearest
 * listed size is offered first. Outside diameters from the standards' tables as the engine
 * holds them (ASME B36.10M NPS 2: 2.375 in; ASTM B88 ¾: 0.875 in; ASTM A270 2 in tube: 2.000 in;
 * EN 10220 DN50: 60.3 mm).
 */
import { describe, expect, it } from 'vitest';
import { sizesForCircumference, MATCH_TOLERANCE } from './size-from-circumference';

const inch = 0.0254;

describe('sizes from the distance round a pipe', () => {
  it.each([
    { around: 7.46 * inch, market: 'US' as const, first: ['ASME-B36.10M', '2'] },
    { around: 2.75 * inch, market: 'US' as const, first: ['ASTM-B88-L', '3/4'] },
    { around: 6.28 * inch, market: 'US' as const, first: ['ASTM-A270-SANITARY', '2'] },
    { around: 0.1894, market: 'EU' as const, first: ['EN-10220', 'DN50'] },
  ])('$around m round in the $market market is first $first', ({ around, market, first }) => {
    const [best] = sizesForCircumference(around, market);
    expect([best?.standard, best?.size]).toEqual(first);
    expect(Math.abs(best!.deviation)).toBeLessThan(0.01);
  });

  it('offers nothing farther than a snug string is ever off, and nothing for no measurement', () => {
    for (const match of sizesForCircumference(5 * inch, 'US')) expect(Math.abs(match.deviation)).toBeLessThanOrEqual(MATCH_TOLERANCE);
    expect(sizesForCircumference(0, 'US')).toEqual([]);
    expect(sizesForCircumference(Number.NaN, 'US')).toEqual([]);
  });
});
