import fc from 'fast-check';
import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import { atmosphericPressureKPaAtAltitude, dewPointC, EngineError } from '../index';
import { expectWithin, type ReferenceRow } from './reference-rows';

psychrolib.SetUnitSystem(psychrolib.SI);

const PSYCHROLIB = 'psychrolib 1.1.1 (npm; ASHRAE Handbook Fundamentals 2017) GetTDewPointFromRelHum — references.md §10, computed-with-library';

// references.md §10: dew points ±0.3 K.
const rows: ReferenceRow<{ dryBulbC: number; rhPercent: number }>[] = (
  [
    ['T10-DEW-30C-80', 30, 80, 26.1686],
    ['T10-DEW-25C-60', 25, 60, 16.7011],
    ['T10-DEW-20C-50', 20, 50, 9.27239],
    ['T10-DEW-21.11C-50', 21.1111, 50, 10.2935],
    ['T10-DEW-21.11C-70', 21.1111, 70, 15.4303],
    ['T10-DEW-21.11C-80', 21.1111, 80, 17.5278],
    ['T10-DEW-21.11C-90', 21.1111, 90, 19.4068],
    ['T10-DEW-32C-70', 32, 70, 25.8377],
    ['T10-DEW-35C-85', 35, 85, 32.0931],
    ['T10-DEW-27C-75', 27, 75, 22.1895],
    ['T10-DEW-24C-55', 24, 55, 14.411],
    ['T10-DEW-15C-90', 15, 90, 13.3745],
    ['T10-DEW-10C-95', 10, 95, 9.23674],
    ['T10-DEW-40C-50', 40, 50, 27.5852],
  ] as const
).map(([name, dryBulbC, rhPercent, expected]) => ({
  name,
  input: { dryBulbC, rhPercent },
  expected,
  tolerance: { absolute: 0.3 },
  source: PSYCHROLIB,
}));

describe('dew point (Magnus form) against ASHRAE psychrometrics', () => {
  it.each(rows)('$name', (row) => {
    expectWithin(dewPointC(row.input.dryBulbC, row.input.rhPercent), row);
  });

  it('agrees with psychrolib, called here, within 0.3 K from −30 °C to 50 °C and 5–100 % RH', () => {
    fc.assert(
      fc.property(fc.double({ min: -30, max: 50, noNaN: true }), fc.double({ min: 5, max: 100, noNaN: true }), (t, rh) => {
        const reference = psychrolib.GetTDewPointFromRelHum(t, rh / 100);
        expect(Math.abs(dewPointC(t, rh) - reference)).toBeLessThanOrEqual(0.3);
      }),
      { numRuns: 500, seed: 7 },
    );
  });

  it('equals the air temperature at saturation and falls with humidity', () => {
    expect(dewPointC(20, 100)).toBeCloseTo(20, 9);
    expect(dewPointC(20, 40)).toBeLessThan(dewPointC(20, 41));
  });

  it('refuses humidity outside (0, 100] % with a typed error', () => {
    expect(() => dewPointC(20, 0)).toThrow(EngineError);
    expect(() => dewPointC(20, 101)).toThrow(/at most 100 %/);
    expect(() => dewPointC(Number.NaN, 50)).toThrow(EngineError);
  });

  it('gives the standard atmosphere at sea level and the ASHRAE value at 1 500 m', () => {
    expect(atmosphericPressureKPaAtAltitude(0)).toBeCloseTo(101.325, 6);
    // ASHRAE Handbook—Fundamentals 2017 ch. 1 Table 1 lists 84.556 kPa at 1 500 m (from memory); ±0.05 kPa.
    expect(Math.abs(atmosphericPressureKPaAtAltitude(1500) - 84.556)).toBeLessThanOrEqual(0.05);
  });
});
