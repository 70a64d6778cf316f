import { describe, expect, it } from 'vitest';
import fluidsTable from './fixtures/asme-b36-dimensions.json';
import { EngineError, PIPE_STANDARDS, lookupPipe, solveRun } from '../index';
import { expectWithin, type ReferenceRow } from './reference-rows';

const FLUIDS = 'ASME B36.10M via python3-fluids 1.0.22 fluids.piping (references.md §6, computed-with-library)';
const B88 = 'ASTM B88 Type L as tabulated in trade charts (references.md §6, read-here)';

// references.md §6: OD ±0.2 %, Schedule 40 wall ±0.5 %.
const b3610: ReferenceRow<{ size: string }>[] = (
  [
    ['0.5', '1/2', 0.0213, 0.00277],
    ['0.75', '3/4', 0.0267, 0.00287],
    ['1', '1', 0.0334, 0.00338],
    ['1.25', '1-1/4', 0.0422, 0.00356],
    ['1.5', '1-1/2', 0.0483, 0.00368],
    ['2', '2', 0.0603, 0.00391],
    ['2.5', '2-1/2', 0.073, 0.00516],
    ['3', '3', 0.0889, 0.00549],
    ['3.5', '3-1/2', 0.1016, 0.00574],
    ['4', '4', 0.1143, 0.00602],
    ['5', '5', 0.1413, 0.00655],
    ['6', '6', 0.1683, 0.00711],
    ['8', '8', 0.2191, 0.00818],
    ['10', '10', 0.273, 0.00927],
    ['12', '12', 0.3238, 0.01031],
  ] as const
).flatMap(([nps, size, od, wall]) => [
  { name: `T6-B3610-NPS${nps}-OD`, input: { size }, expected: od, tolerance: { relative: 0.002 }, source: FLUIDS },
  { name: `T6-B3610-NPS${nps}-S40wall`, input: { size }, expected: wall, tolerance: { relative: 0.005 }, source: FLUIDS },
]);

// references.md §6: copper OD ±0.1 %, Type L wall ±1 %.
const b88: ReferenceRow<{ size: string }>[] = (
  [
    ['0.5', '1/2', 0.015875, 0.001016],
    ['0.75', '3/4', 0.022225, 0.001143],
    ['1', '1', 0.028575, 0.00127],
    ['1.25', '1-1/4', 0.034925, 0.001397],
    ['1.5', '1-1/2', 0.041275, 0.001524],
    ['2', '2', 0.053975, 0.001778],
    ['2.5', '2-1/2', 0.066675, 0.002032],
    ['3', '3', 0.079375, 0.002286],
    ['4', '4', 0.104775, 0.002794],
  ] as const
).flatMap(([nominal, size, od, wall]) => [
  { name: `T6-B88L-${nominal}in-OD`, input: { size }, expected: od, tolerance: { relative: 0.001 }, source: B88 },
  { name: `T6-B88L-${nominal}in-wall`, input: { size }, expected: wall, tolerance: { relative: 0.01 }, source: B88 },
]);

describe('pipe dimensions', () => {
  it.each(b3610)('$name', (row) => {
    const dims = lookupPipe('ASME-B36.10M', row.input.size, '40');
    expectWithin(row.name.endsWith('-OD') ? dims.outerDiameterM : dims.wallThicknessM, row);
  });

  it.each(b88)('$name', (row) => {
    const dims = lookupPipe('ASTM-B88-L', row.input.size);
    expectWithin(row.name.endsWith('-OD') ? dims.outerDiameterM : dims.wallThicknessM, row);
  });

  // Every schedule of the engine's inch table against python3-fluids' metric table
  // (scripts/reference/asme_b36_dimensions.py), with references.md §6 tolerances
  // (OD ±0.2 %, wall ±0.5 %). NPS 22 is not carried by the engine.
  it.each(fluidsTable.rows.filter((row) => row.nps !== 22))(
    '$standard NPS $nps schedule $schedule matches python3-fluids',
    (row) => {
      const dims = lookupPipe(row.standard, String(row.nps), row.schedule);
      expect(Math.abs(dims.outerDiameterM / (row.outerDiameterMm / 1000) - 1), FLUIDS).toBeLessThanOrEqual(0.002);
      expect(Math.abs(dims.wallThicknessM / (row.wallMm / 1000) - 1), FLUIDS).toBeLessThanOrEqual(0.005);
    },
  );

  it('every catalog entry has a positive bore', () => {
    for (const standard of PIPE_STANDARDS) {
      for (const size of standard.sizes) {
        expect(size.wallsM[size.defaultSchedule], `${standard.id} ${size.size}`).toBeDefined();
        for (const wall of Object.values(size.wallsM)) expect(size.outerDiameterM - 2 * wall).toBeGreaterThan(0);
      }
    }
  });

  it('accepts the ways the trade writes sizes and schedules', () => {
    expect(lookupPipe('ASME-B36.10M', '1.5').size).toBe('1-1/2');
    expect(lookupPipe('ASME-B36.10M', '1 1/2"').size).toBe('1-1/2');
    expect(lookupPipe('ASME-B36.10M', 'DN40').size).toBe('1-1/2');
    expect(lookupPipe('ASME-B36.10M', '2', 'Sch 80').schedule).toBe('80');
    expect(lookupPipe('ASME-B36.19M', '2', 'sch10s').schedule).toBe('10S');
    expect(lookupPipe('EN-10220', 'DN50', '2.90').wallThicknessM).toBeCloseTo(0.0029, 9);
    expect(lookupPipe('EN-10220', '50').outerDiameterM).toBeCloseTo(0.0603, 9);
  });

  it('refuses unknown sizes and schedules with a typed code', () => {
    const codeOf = (f: () => unknown) => {
      try {
        f();
      } catch (error) {
        return error instanceof EngineError ? error.code : 'untyped';
      }
      return 'none';
    };
    expect(codeOf(() => lookupPipe('ASME-B36.10M', '7'))).toBe('UNKNOWN_PIPE_SIZE');
    expect(codeOf(() => lookupPipe('ASME-B36.10M', '2', '99'))).toBe('UNKNOWN_SCHEDULE');
    expect(codeOf(() => lookupPipe('ASME-B36.10M', '3-1/2', '160'))).toBe('UNKNOWN_SCHEDULE');
    expect(codeOf(() => lookupPipe('NOPE', '2'))).toBe('UNKNOWN_PIPE_SIZE');
    expect(codeOf(() => solveRun({ pipe: { standard: 'ASME-B36.10M', size: '7' }, fluidTemperatureC: 80 }))).toBe('INVALID_INPUT');
  });
});
