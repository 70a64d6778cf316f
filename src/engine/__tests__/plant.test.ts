import { describe, expect, it } from 'vitest';
import {
  annualEnergyJ,
  estimatePlant,
  estimateParsedPlant,
  plantInputSchema,
  EngineError,
  fuelCostPerJoule,
  FUELS,
  mmbtuToJoules,
  solveRun,
  type Fuel,
  type PlantInput,
} from '../index';
import { expectWithin } from './reference-rows';

const DOE2_EXAMPLE =
  'US DOE Steam Tip Sheet #2 worked example: 1 120 ft bare 1-in and 175 ft bare 2-in at 150 psig, 250 ft bare 4-in at 15 psig; $8.00/MMBtu, boiler 80 %, insulation 90 % efficient (references.md §2, read-here)';
const gas = FUELS.find((f) => f.id === 'natural-gas') as Fuel;

// The example's per-length losses are the tip sheet's table values (W/m, references.md §1).
const segments = [
  { name: 'T2-DOE2EX-seg1in', lengthM: 341.376, tableWPerM: 312.823, expectedGJ: 3367.74, nps: '1', gaugeKPa: 1034.2135939752 },
  { name: 'T2-DOE2EX-seg2in', lengthM: 53.34, tableWPerM: 526.86, expectedGJ: 886.247, nps: '2', gaugeKPa: 1034.2135939752 },
  { name: 'T2-DOE2EX-seg4in', lengthM: 76.2, tableWPerM: 455.514, expectedGJ: 1094.09, nps: '4', gaugeKPa: 103.42135939752 },
];

describe('US DOE Steam Tip Sheet #2 worked example', () => {
  it.each(segments)('$name: table value × length × 8 760 h (±0.2 %)', (s) => {
    expectWithin(annualEnergyJ(s.tableWPerM * s.lengthM, 8760) / 1e9, { name: s.name, expected: s.expectedGJ, tolerance: { relative: 0.002 }, source: DOE2_EXAMPLE });
  });

  it('T2-DOE2EX-total and -saving: 5 348.08 GJ/yr (±0.2 %), $45 620/yr (±0.1 %)', () => {
    const totalJ = segments.reduce((sum, s) => sum + annualEnergyJ(s.tableWPerM * s.lengthM, 8760), 0);
    expectWithin(totalJ / 1e9, { name: 'T2-DOE2EX-total', expected: 5348.08, tolerance: { relative: 0.002 }, source: DOE2_EXAMPLE });
    const saving = (0.9 * totalJ * fuelCostPerJoule(gas, 8, 'MMBtu')) / 0.8;
    expectWithin(saving, { name: 'T2-DOE2EX-saving', expected: 45620, tolerance: { relative: 0.001 }, source: DOE2_EXAMPLE });
    expect(fuelCostPerJoule(gas, 8, 'MMBtu') * mmbtuToJoules(1)).toBeCloseTo(8, 12);
  });

  const examplePlant: PlantInput = {
    label: 'DOE example as a plant',
    operatingHoursPerYear: 8760,
    conditions: { indoorAirTemperatureC: 23.8889 },
    energy: { fuel: 'natural-gas', price: 8, priceUnit: 'MMBtu', boilerEfficiency: 0.8 },
    runs: segments.map((s, i) => ({
      id: `seg-${i}`,
      label: s.name,
      service: 'steam' as const,
      pipe: { standard: 'ASME-B36.10M', size: s.nps },
      lengthM: s.lengthM,
      steamGaugePressureKPa: s.gaugeKPa,
    })),
  };

  it('the full engine gives the example total within the table tolerance (±15 %) and a 90 % ±7 % saving (T10-DOE2-90pct)', () => {
    const result = estimatePlant(examplePlant);
    expectWithin(result.totals.current.annualHeatGJ, { name: 'T2-DOE2EX-total (engine)', expected: 5348.08, tolerance: { relative: 0.15 }, source: DOE2_EXAMPLE });
    const reduction = result.totals.savings.annualHeatGJ / result.totals.current.annualHeatGJ;
    expectWithin(reduction, { name: 'T10-DOE2-90pct', expected: 0.9, tolerance: { absolute: 0.07 }, source: 'US DOE Steam Tip Sheet #2 text (read-here)' });
    const cost = result.totals.current.annualCost;
    expect(cost).toBeCloseTo((result.totals.current.annualFuelGJ * 1e9 * 8) / mmbtuToJoules(1), 6);
  });

  it('T10-EMH-first-inch: the first inch of insulation cuts bare losses by 85–95 % (0.9 ±0.05)', () => {
    for (const s of segments) {
      const base = { pipe: { standard: 'ASME-B36.10M', size: s.nps }, steam: { gaugePressureKPa: s.gaugeKPa }, ambientTemperatureC: 23.8889 } as const;
      const bare = solveRun(base).heatLossWPerM;
      const lagged = solveRun({ ...base, insulation: [{ thicknessM: 0.0254, material: 'mineral-wool' }] }).heatLossWPerM;
      expectWithin(1 - lagged / bare, {
        name: `T10-EMH-first-inch NPS ${s.nps}`,
        expected: 0.9,
        tolerance: { absolute: 0.05 },
        source: "Turner (ed.), Energy Management Handbook §15 'Determine insulation thickness' (read-here)",
      });
    }
  });
});

/** An invented plant: Hollin Bridge Dairy, a creamery in an invented town. */
const dairy: PlantInput = {
  label: 'Hollin Bridge Dairy (invented)',
  operatingHoursPerYear: 5000,
  energy: { fuel: 'natural-gas', price: 1.2, priceUnit: 'therm', electricityPricePerKWh: 0.15 },
  runs: [
    { id: 'boiler-header', label: 'Boiler header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '3' }, lengthM: 25, steamGaugePressureKPa: 800, valves: 3, flangePairs: 4 },
    { id: 'cip', label: 'CIP supply', service: 'cip-supply', pipe: { standard: 'ASME-B36.19M', size: '2', schedule: '10S' }, lengthM: 40, lengthConfidence: 'guessed', current: { state: 'damaged', bareFraction: 0.3 } },
    { id: 'yard', label: 'Yard steam', service: 'steam', pipe: { standard: 'EN-10220', size: 'DN50' }, lengthM: 60, ambient: { kind: 'outdoor', windSpeedMPerS: 4 }, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.025 } },
    { id: 'glycol', label: 'Glycol to vat room', service: 'glycol', pipe: { standard: 'ASTM-B88-L', size: '1-1/2' }, lengthM: 30 },
  ],
};

describe('plant estimate', () => {
  const result = estimatePlant(dairy);

  it('totals are the sums of the runs and savings are current minus proposed', () => {
    const sum = (pick: (r: (typeof result.runs)[number]) => number) => result.runs.reduce((s, r) => s + pick(r), 0);
    expect(result.totals.current.annualCost).toBeCloseTo(sum((r) => r.current.annualCost), 6);
    expect(result.totals.installedCost).toBeCloseTo(sum((r) => r.installedCost), 6);
    for (const r of result.runs) {
      expect(r.savings.annualHeatGJ).toBeCloseTo(r.current.annualHeatGJ - r.proposed.annualHeatGJ, 9);
      expect(r.savings.annualCo2Kg).toBeCloseTo(r.current.annualCo2Kg - r.proposed.annualCo2Kg, 6);
    }
  });

  it('steam lost follows the latent heat at the line pressure', () => {
    const header = result.runs.find((r) => r.id === 'boiler-header')!;
    expect(header.latentHeatJPerKg).toBeGreaterThan(2.0e6);
    expect(header.current.steamKgPerHour).toBeCloseTo((header.current.heatW * 3600) / header.latentHeatJPerKg!, 9);
    expect(header.current.steamKgPerYear).toBeCloseTo(header.current.steamKgPerHour * 5000, 6);
    expect(result.runs.find((r) => r.id === 'glycol')?.current.steamKgPerHour).toBe(0);
  });

  it('the economic thickness is the least life-cycle cost of the series, and the chosen option meets every safety need', () => {
    for (const r of result.runs) {
      const least = Math.min(...r.thicknessSeries!.map((o) => o.lifeCycleCost));
      expect(r.economicThickness?.lifeCycleCost).toBe(least);
      const chosen = r.options.find((o) => o.kind === r.proposed.option)!;
      expect(r.choice.code).not.toBe('NO_OPTION_MEETS_SAFETY');
      expect(chosen.meetsTouchLimit && chosen.meetsDewPoint).toBe(true);
    }
    const header = result.runs.find((r) => r.id === 'boiler-header')!;
    expect(header.personnelProtection.applies).toBe(true);
    expect(header.proposed.designSurfaceTemperatureC).toBeLessThanOrEqual(60);
    const glycol = result.runs.find((r) => r.id === 'glycol')!;
    expect(glycol.cold).toBe(true);
    expect(glycol.condensationControl.applies).toBe(true);
    expect(glycol.proposed.designSurfaceTemperatureC).toBeGreaterThanOrEqual(glycol.condensationControl.dewPointC + 1);
    expect(glycol.bare.heatLossWPerM).toBeLessThan(0);
  });

  it('the range is reproducible from its seed, brackets the likely value and widens with guessed inputs', () => {
    const again = estimatePlant(dairy);
    expect(again.range).toEqual(result.range);
    const other = estimatePlant({ ...dairy, range: { seed: 99 } });
    expect(other.range.currentAnnualCost.low).not.toBe(result.range.currentAnnualCost.low);
    const r = result.range.currentAnnualCost;
    expect(r.low).toBeLessThan(r.likely);
    expect(r.high).toBeGreaterThan(r.likely);
    const measured = estimatePlant({
      ...dairy,
      operatingHoursConfidence: 'measured',
      runs: dairy.runs.map((run) => ({ ...run, lengthConfidence: 'measured' as const })),
    });
    const width = (x: { low: number; high: number }) => x.high - x.low;
    expect(width(measured.range.currentAnnualCost)).toBeLessThan(width(r));
  });

  it('posts as JSON: a JSON round trip of the input gives the same estimate', () => {
    expect(estimatePlant(JSON.parse(JSON.stringify(dairy)) as PlantInput)).toEqual(result);
  });

  it('uses the consultant’s price table when given and says when prices are illustrative', () => {
    expect(result.warnings.map((w) => w.code)).toContain('ILLUSTRATIVE_PRICES');
    const priced = estimatePlant({
      ...dairy,
      priceTable: {
        label: 'Fenwick Insulation 2025 rates',
        pipeOuterDiametersM: [0.02, 0.2],
        thicknessesM: [0.025, 0.1],
        costPerMetre: [
          [50, 90],
          [120, 260],
        ],
        fittingCoverCostEach: [150, 400],
      },
    });
    expect(priced.assumptions.priceTable).toBe('Fenwick Insulation 2025 rates');
    expect(priced.warnings.map((w) => w.code)).not.toContain('ILLUSTRATIVE_PRICES');
    expect(priced.totals.installedCost).not.toBeCloseTo(result.totals.installedCost, 0);
  });

  it('searches the inch series for US users and the mm series otherwise', () => {
    const us = estimatePlant({ ...dairy, unitSystem: 'US' });
    const header = us.runs.find((r) => r.id === 'boiler-header');
    for (const o of header?.thicknessSeries ?? []) expect(Math.abs((o.thicknessM / 0.0254) * 2 - Math.round((o.thicknessM / 0.0254) * 2))).toBeLessThan(1e-9);
  });

  it('refuses an unsuitable proposal and a bad price unit, with paths', () => {
    const bad = {
      ...dairy,
      energy: { ...dairy.energy, priceUnit: 'gallon' as const },
      runs: [{ ...dairy.runs[0], id: 'x', label: 'Header', service: 'steam' as const, pipe: { standard: 'ASME-B36.10M', size: '3' }, lengthM: 10, proposed: { material: 'flexible-elastomeric' as const } }],
    } as PlantInput;
    try {
      estimatePlant(bad);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(EngineError);
      const issues = (error as EngineError).issues;
      expect(issues.map((i) => i.path.join('.'))).toEqual(expect.arrayContaining(['energy.priceUnit', 'runs.0.proposed.material']));
      expect(issues.find((i) => i.path.join('.') === 'runs.0.proposed.material')?.message).toMatch(/rated for -40 °C to 104 °C/);
    }
  });
});

describe('the face profile and the cash flow of a plant estimate', () => {
  const plant: PlantInput = {
    energy: { fuel: 'natural-gas', price: 1.2, priceUnit: 'therm' },
    economics: { horizonYears: 12, discountRatePercent: 6, fuelEscalationPercent: 3 },
    runs: [
      { id: 'hdr', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30 },
      { id: 'gly', label: 'Glycol', service: 'glycol', pipe: { standard: 'ASTM-B88-L', size: '1' }, lengthM: 20 },
    ],
  };
  const result = estimatePlant(plant);

  it('runs from the inner wall to the surface, one face more for each insulation layer', () => {
    for (const run of result.runs) {
      expect(run.current.profile!.faceTemperaturesC).toHaveLength(2);
      expect(run.proposed.profile!.faceTemperaturesC).toHaveLength(3);
      expect(run.proposed.profile!.faceDiametersM).toHaveLength(3);
      expect(run.proposed.profile!.faceTemperaturesC.at(-1)).toBeCloseTo(run.proposed.surfaceTemperatureC, 9);
      expect(run.current.profile!.faceTemperaturesC.at(-1)).toBeCloseTo(run.current.surfaceTemperatureC, 9);
      const d = run.proposed.profile!.faceDiametersM;
      expect(d[0]! < d[1]! && d[1]! < d[2]!).toBe(true);
      expect(d[1]).toBeCloseTo(run.pipeOuterDiameterM, 12);
      // Temperature falls outward on a hot line and rises outward on a cold one.
      const t = [run.fluidTemperatureC, ...run.proposed.profile!.faceTemperaturesC, run.air.temperatureC];
      for (let i = 1; i < t.length; i++) expect(run.cold ? t[i]! >= t[i - 1]! : t[i]! <= t[i - 1]!).toBe(true);
    }
  });

  it('pays the installed cost in year 0 and ends, discounted, at the life-cycle net saving', () => {
    const flow = result.totals.cashFlow;
    expect(flow).toHaveLength(13);
    expect(flow[0]).toEqual({ year: 0, cumulative: -result.totals.installedCost, cumulativePresentValue: -result.totals.installedCost });
    expect(flow.at(-1)!.cumulativePresentValue).toBeCloseTo(result.totals.lifeCycle.netSaving, 6);
    const firstYear = flow[1]!.cumulative - flow[0]!.cumulative;
    const secondYear = flow[2]!.cumulative - flow[1]!.cumulative;
    expect(firstYear).toBeCloseTo(result.totals.savings.annualCost, 6);
    expect(secondYear / firstYear).toBeCloseTo(1.03, 12);
  });
});

describe('estimateParsedPlant', () => {
  it('gives what estimatePlant gives, for input already parsed by plantInputSchema', () => {
    const input: PlantInput = {
      energy: { fuel: 'natural-gas', price: 0.9, priceUnit: 'therm' },
      runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '3' }, lengthM: 12, lengthConfidence: 'guessed' }],
    };
    expect(estimateParsedPlant(plantInputSchema.parse(input))).toEqual(estimatePlant(input));
  });
});
