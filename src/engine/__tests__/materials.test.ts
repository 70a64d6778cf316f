import { describe, expect, it } from 'vitest';
import { INSULATION_MATERIALS, SURFACES, conductivityAt, meanConductivity, type InsulationMaterialId } from '../index';
import { deviation, expectWithin, type ReferenceRow } from './reference-rows';

const material = (id: InsulationMaterialId) => {
  const found = INSULATION_MATERIALS.find((m) => m.id === id);
  if (!found) throw new Error(id);
  return found;
};

const NIA = 'NIA Insulation Materials Specification Chart, April 2024 — maximum apparent conductivity (references.md §7, read-here)';
// Upper bounds ("le"): the catalog's design curve must not exceed the specification maximum.
const ceilings: { name: string; id: InsulationMaterialId; meanC: number; max: number; source: string }[] = [
  { name: 'T7-NIA-C534G1-0F', id: 'flexible-elastomeric', meanC: -17.7778, max: 0.0374993, source: NIA },
  { name: 'T7-NIA-C534G1-75F', id: 'flexible-elastomeric', meanC: 23.8889, max: 0.0403838, source: NIA },
  { name: 'T7-NIA-C552G6T2-0F', id: 'cellular-glass', meanC: -17.7778, max: 0.0418261, source: NIA },
  { name: 'T7-NIA-C552G6T2-75F', id: 'cellular-glass', meanC: 23.8889, max: 0.0490375, source: NIA },
  { name: 'T7-NIA-C552G6T2-200F', id: 'cellular-glass', meanC: 93.3333, max: 0.062018, source: NIA },
  { name: 'T7-NIA-C552G6T2-400F', id: 'cellular-glass', meanC: 204.444, max: 0.0908636, source: NIA },
  { name: 'T7-NIA-C591G2-75F', id: 'polyisocyanurate', meanC: 23.8889, max: 0.0317301, source: NIA },
  { name: 'T7-NIA-C591G2-200F', id: 'polyisocyanurate', meanC: 93.3333, max: 0.0432684, source: NIA },
  { name: 'T7-C547-TypeI-100F', id: 'glass-fibre', meanC: 37.7778, max: 0.036057, source: 'ASTM C547-17 Table 1 — from memory' },
  { name: 'T7-C533-TypeI-200F', id: 'calcium-silicate', meanC: 93.3333, max: 0.0649025, source: 'ASTM C533-17 Table 1 — from memory' },
  { name: 'T7-C533-TypeI-400F', id: 'calcium-silicate', meanC: 204.444, max: 0.0721139, source: 'ASTM C533-17 Table 1 — from memory' },
  { name: 'T7-C533-TypeI-600F', id: 'calcium-silicate', meanC: 315.556, max: 0.0865367, source: 'ASTM C533-17 Table 1 — from memory' },
];

const FRANKEL = "Frankel, Facility Piping Systems Handbook, Table 5.3 K factor at 50 °F mean (references.md §7, read-here)";
const design: (ReferenceRow<{ id: InsulationMaterialId; meanC: number }>)[] = [
  { name: 'T7-FPSH53-C547', input: { id: 'glass-fibre', meanC: 10 }, expected: 0.036057, tolerance: { relative: 0.15 }, source: FRANKEL },
  { name: 'T7-FPSH53-C533', input: { id: 'calcium-silicate', meanC: 10 }, expected: 0.0540855, tolerance: { relative: 0.15 }, source: FRANKEL },
  { name: 'T7-FPSH53-C591', input: { id: 'polyisocyanurate', meanC: 10 }, expected: 0.0237976, tolerance: { relative: 0.15 }, source: FRANKEL },
  { name: 'T7-FPSH53-C534', input: { id: 'flexible-elastomeric', meanC: 10 }, expected: 0.0418261, tolerance: { relative: 0.15 }, source: FRANKEL },
  {
    name: 'T7-EMH-calsil-377F',
    input: { id: 'calcium-silicate', meanC: 191.667 },
    expected: 0.0663448,
    tolerance: { relative: 0.1 },
    source: "Turner (ed.), Energy Management Handbook, ch. 15 worked example (references.md §7, read-here)",
  },
];

describe('insulation conductivity curves', () => {
  it.each(ceilings)('$name: k at the mean temperature is at most the specification maximum', (row) => {
    expect(conductivityAt(material(row.id).conductivity, row.meanC), `${row.name} (${row.source})`).toBeLessThanOrEqual(row.max);
  });

  it.each(design)('$name', (row) => {
    expectWithin(conductivityAt(material(row.input.id).conductivity, row.input.meanC), row);
  });

  // Frankel's cellular-glass K (0.40 Btu·in/h·ft²·°F at 50 °F) is the older product;
  // the current C552 Grade 6 ceiling is 0.34 at 75 °F (NIA chart, above), so no curve
  // can meet both. The catalog follows the current specification: −21.7 % here, kept as data.
  it('T7-FPSH53-C552 misses by its recorded −21.7 % (older product, see comment)', () => {
    const row = { name: 'T7-FPSH53-C552', expected: 0.0576912, tolerance: { relative: 0.15 }, source: FRANKEL } as const;
    const measured = deviation(conductivityAt(material('cellular-glass').conductivity, 10), row);
    expect(measured).toBeLessThan(-0.15);
    expect(measured).toBeCloseTo(-0.2171, 3);
  });

  it('every curve is positive down to absolute zero and up to 700 °C, so the conductivity integral only rises', () => {
    for (const m of INSULATION_MATERIALS) {
      for (let t = -273; t <= 700; t += 1) expect(conductivityAt(m.conductivity, t), m.id).toBeGreaterThan(0.01);
    }
  });

  it('the curves pass through their cited fit points within 3 %', () => {
    for (const m of INSULATION_MATERIALS) {
      for (const [t, k] of m.fitPoints) expect(Math.abs(conductivityAt(m.conductivity, t) / k - 1), m.id).toBeLessThan(0.03);
    }
  });

  it('the mean over a span is the integral divided by the span (ASTM C680 k̄)', () => {
    const curve = material('calcium-silicate').conductivity;
    let sum = 0;
    const n = 20000;
    for (let i = 0; i < n; i++) sum += conductivityAt(curve, 30 + ((i + 0.5) * 170) / n);
    expect(meanConductivity(curve, 30, 200)).toBeCloseTo(sum / n, 10);
  });
});

const EMITTANCE = 'Typical jacket emittances used with ASTM C680 practice (references.md §8, from memory)';
describe('jacket emittances', () => {
  const rows: ReferenceRow<{ id: string }>[] = (
    [
      ['T8-MEM-ASJ', 'all-service-jacket', 0.9, 0.05],
      ['T8-MEM-PVC', 'pvc-jacket', 0.9, 0.05],
      ['T8-MEM-painted-metal', 'painted-metal', 0.9, 0.05],
      ['T8-MEM-al-jacket-new', 'aluminium-jacket', 0.1, 0.05],
      ['T8-MEM-ss-jacket', 'stainless-steel-jacket', 0.3, 0.1],
      ['T8-MEM-galv-new', 'galvanised-steel-jacket', 0.1, 0.05],
    ] as const
  ).map(([name, id, expected, absolute]) => ({ name, input: { id }, expected, tolerance: { absolute }, source: EMITTANCE }));
  it.each(rows)('$name', (row) => {
    expectWithin(SURFACES.find((s) => s.id === row.input.id)?.emittance ?? Number.NaN, row);
  });
});
