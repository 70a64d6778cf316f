import { describe, expect, it } from 'vitest';
import { estimatePlant, type PlantInput, type PlantRunInput } from '../../engine';
import { diffHistory, diffStates, diffSummary, sameValue, type InventoryState } from './diff';

// An invented plant: a creamery's steam header and a hot-water line to its wash bay.
const header: PlantRunInput = {
  id: 'header',
  label: 'Boiler steam header',
  service: 'steam',
  pipe: { standard: 'ASME-B36.10M', size: '2', schedule: '40', material: 'carbon-steel' },
  lengthM: 20,
  steamGaugePressureKPa: 600,
  valves: 2,
};
const washLine: PlantRunInput = {
  id: 'wash',
  label: 'Hot water to wash bay',
  service: 'hot-water',
  pipe: { standard: 'ASTM-B88-L', size: '1' },
  lengthM: 12,
  current: { state: 'insulated', material: 'glass-fibre', thicknessM: 0.025 },
};

function plant(runs: PlantRunInput[], extra: Partial<PlantInput> = {}): PlantInput {
  return { energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', currency: 'USD' }, runs, ...extra };
}

function state(number: number, input: PlantInput): InventoryState {
  return { number, plant: input, result: estimatePlant(input, { detail: 'summary' }) };
}

const original = state(0, plant([header, washLine]));

describe('diffStates', () => {
  it('finds nothing between a state and itself', () => {
    const diff = diffStates(original, state(1, plant([header, washLine])));
    expect(diff.counts).toEqual({ changed: 0, unchanged: 2, added: 0, removed: 0 });
    expect(diff.runs.map((r) => [r.runId, r.status, r.inputs, r.figuresMoved, r.changedIn])).toEqual([
      ['header', 'unchanged', [], false, []],
      ['wash', 'unchanged', [], false, []],
    ]);
    for (const total of diff.totals) expect(total.after, total.figure).toBe(total.before);
  });

  it('compares inputs after the engine’s defaults, so a left-out count equals zero', () => {
    const explicit = state(1, plant([{ ...header }, { ...washLine, valves: 0, flangePairs: 0, current: { ...washLine.current!, jacket: 'all-service-jacket', condition: 'sound' } as PlantRunInput['current'] }]));
    expect(diffStates(original, explicit).counts.changed).toBe(0);
  });

  it('a measured length and a measured surface temperature show as those two inputs, with the figures before and after', () => {
    const walked = state(
      1,
      plant([{ ...header, measurements: { lengthM: 26.5, surfaceTemperatureC: 148, airTemperatureC: 24 } }, washLine]),
    );
    const diff = diffStates(original, walked);
    const run = diff.runs.find((r) => r.runId === 'header')!;
    expect(run.status).toBe('changed');
    expect(run.changedIn).toEqual([1]);
    expect(run.inputs).toEqual([
      { field: 'length', before: { lengthM: 20, measured: false }, after: { lengthM: 26.5, measured: true } },
      { field: 'surfaceReading', before: null, after: { surfaceTemperatureC: 148, method: 'contact', infraredEmittanceSetting: null, airTemperatureC: 24 } },
    ]);
    const before = original.result.runs[0]!;
    const after = walked.result.runs[0]!;
    expect(run.figures.find((f) => f.figure === 'annualCost')).toEqual({ figure: 'annualCost', before: before.current.annualCost, after: after.current.annualCost });
    expect(run.figures.find((f) => f.figure === 'heatLossWPerM')?.after).toBe(after.current.heatLossWPerM);
    expect(after.current.annualCost).not.toBe(before.current.annualCost);
    expect(diff.runs.find((r) => r.runId === 'wash')?.status).toBe('unchanged');
    expect(diff.totals.find((t) => t.figure === 'annualCost')).toEqual({
      figure: 'annualCost',
      before: original.result.range.currentAnnualCost.likely,
      after: walked.result.range.currentAnnualCost.likely,
    });
    expect(diff.lossRange.after).toEqual(walked.result.range.currentAnnualCost);
  });

  it('a run the owner missed is added and a run that is gone is removed, each with the other side empty', () => {
    const missed: PlantRunInput = { id: 'walk-1', label: 'Condensate return under the floor', service: 'condensate-return', pipe: { standard: 'ASME-B36.10M', size: '1-1/2' }, lengthM: 9 };
    const walked = state(1, plant([header, missed]));
    const diff = diffStates(original, walked);
    expect(diff.runs.map((r) => [r.runId, r.status])).toEqual([
      ['header', 'unchanged'],
      ['walk-1', 'added'],
      ['wash', 'removed'],
    ]);
    const added = diff.runs[1]!;
    expect(added.inputs.every((i) => i.before === null)).toBe(true);
    expect(added.inputs.find((i) => i.field === 'length')?.after).toEqual({ lengthM: 9, measured: false });
    expect(added.figures.every((f) => f.before === null)).toBe(true);
    const removed = diff.runs[2]!;
    expect(removed.label).toBe('Hot water to wash bay');
    expect(removed.inputs.every((i) => i.after === null)).toBe(true);
    expect(removed.figures.every((f) => f.after === null)).toBe(true);
    expect(diff.counts).toEqual({ changed: 0, unchanged: 1, added: 1, removed: 1 });
    expect(diffSummary(diff)).toEqual({ changed: 0, added: 1, removed: 1, runs: ['Condensate return under the floor', 'Hot water to wash bay'] });
  });

  it('lagging found wet, a new jacket and fittings counted again each show as their own input', () => {
    const walked = state(
      1,
      plant([{ ...header, valves: 3, flangePairs: 2 }, { ...washLine, current: { state: 'insulated', material: 'glass-fibre', thicknessM: 0.025, condition: 'wet', jacket: 'pvc-jacket' } }]),
    );
    const diff = diffStates(original, walked);
    const wash = diff.runs.find((r) => r.runId === 'wash')!;
    expect(wash.inputs.map((i) => i.field)).toEqual(['laggingCondition', 'jacket']);
    expect(wash.inputs[0]).toEqual({ field: 'laggingCondition', before: 'sound', after: 'wet' });
    const cost = wash.figures.find((f) => f.figure === 'annualCost')!;
    expect(cost.after!).toBeGreaterThan(cost.before!);
    const fittings = diff.runs.find((r) => r.runId === 'header')!.inputs;
    expect(fittings).toEqual([
      { field: 'fittings', before: { valves: 2, flangePairs: 0, covered: false, others: [] }, after: { valves: 3, flangePairs: 2, covered: false, others: [] } },
    ]);
  });

  it('a part-bare run shows its bare share; lagging the bare header removes its touch hazard', () => {
    const walked = state(
      1,
      plant([
        { ...header, current: { state: 'damaged', bareFraction: 0.3, material: 'mineral-wool', thicknessM: 0.05, jacket: 'all-service-jacket' } },
        washLine,
      ]),
    );
    const run = diffStates(original, walked).runs[0]!;
    expect(run.inputs.map((i) => i.field)).toEqual(['lagging', 'bareFraction', 'laggingCondition', 'jacket']);
    expect(run.inputs[0]).toEqual({ field: 'lagging', before: { state: 'bare', material: null, thicknessM: null }, after: { state: 'damaged', material: 'mineral-wool', thicknessM: 0.05 } });
    expect(run.inputs[1]).toEqual({ field: 'bareFraction', before: null, after: 0.3 });
    expect(run.hazards.before).toContain('SURFACE_ABOVE_TOUCH_LIMIT');

    const lagged = state(2, plant([{ ...header, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.05 } }, washLine]));
    const sealed = diffStates(original, lagged).runs[0]!;
    expect(sealed.hazards.before).toContain('SURFACE_ABOVE_TOUCH_LIMIT');
    expect(sealed.hazards.after).not.toContain('SURFACE_ABOVE_TOUCH_LIMIT');
  });

  it('the room a run sits in is compared by the air the engine used, and a pressure read on site as the line', () => {
    const boilerRoom = { id: 'walk-header', label: 'Boiler room by the header', preset: 'boiler-room' as const, average: { airTemperatureC: 31, relativeHumidityPercent: 35, airSpeedMPerS: 0.4 }, confidence: 'measured' as const };
    const walked = state(1, plant([{ ...header, areaId: 'walk-header', steamGaugePressureKPa: 520 }, washLine], { areas: [boilerRoom] }));
    const run = diffStates(original, walked).runs[0]!;
    expect(run.inputs.map((i) => i.field)).toEqual(['line', 'room']);
    expect(run.inputs[0]).toEqual({ field: 'line', before: { steamGaugePressureKPa: 600, fluidTemperatureC: null }, after: { steamGaugePressureKPa: 520, fluidTemperatureC: null } });
    expect(run.inputs[1]).toMatchObject({ field: 'room', after: { areaId: 'walk-header', airTemperatureC: 31, relativeHumidityPercent: 35, airSpeedMPerS: 0.4 } });
    expect((run.inputs[1]!.before as { areaId: string }).areaId).toBe('indoor');
  });

  it('an infrared reading keeps its emittance setting', () => {
    const walked = state(1, plant([{ ...header, measurements: { surfaceTemperatureC: 150, surfaceMethod: 'infrared', infraredEmittanceSetting: 0.95, airTemperatureC: 22 } }, washLine]));
    expect(diffStates(original, walked).runs[0]!.inputs).toEqual([
      { field: 'surfaceReading', before: null, after: { surfaceTemperatureC: 150, method: 'infrared', infraredEmittanceSetting: 0.95, airTemperatureC: 22 } },
    ]);
  });

  it('an unchanged run whose figures moved all the same says so', () => {
    const older = { ...original, result: { ...original.result, runs: original.result.runs.map((r) => (r.id === 'wash' ? { ...r, current: { ...r.current, annualCost: r.current.annualCost * 1.2 } } : r)) } };
    const diff = diffStates(older, state(1, plant([header, washLine])));
    expect(diff.runs.find((r) => r.runId === 'wash')).toMatchObject({ status: 'unchanged', figuresMoved: true });
    expect(diff.runs.find((r) => r.runId === 'header')).toMatchObject({ status: 'unchanged', figuresMoved: false });
  });
});

describe('diffHistory', () => {
  it('compares the first state with the last and names the saves that changed each run', () => {
    const first = state(1, plant([{ ...header, measurements: { lengthM: 24 } }, washLine]));
    const second = state(2, plant([{ ...header, measurements: { lengthM: 24 } }, { ...washLine, lengthM: 15 }]));
    const third = state(3, plant([{ ...header, measurements: { lengthM: 25 } }, { ...washLine, lengthM: 15 }]));
    const diff = diffHistory([original, first, second, third]);
    expect(diff.fromNumber).toBe(0);
    expect(diff.toNumber).toBe(3);
    expect(diff.runs.map((r) => [r.runId, r.status, r.changedIn])).toEqual([
      ['header', 'changed', [1, 3]],
      ['wash', 'changed', [2]],
    ]);
    expect(diff.runs[0]!.inputs).toEqual([{ field: 'length', before: { lengthM: 20, measured: false }, after: { lengthM: 25, measured: true } }]);
  });

  it('of one state is that state against itself', () => {
    expect(diffHistory([original]).counts).toEqual({ changed: 0, unchanged: 2, added: 0, removed: 0 });
  });
});

describe('sameValue', () => {
  it('treats numbers equal to the last bits as the same, and nothing else', () => {
    expect(sameValue({ a: [0.1 + 0.2] }, { a: [0.3] })).toBe(true);
    expect(sameValue({ a: 1 }, { a: 1.001 })).toBe(false);
    expect(sameValue({ a: 1 }, { a: 1, b: null })).toBe(false);
    expect(sameValue(null, { a: 1 })).toBe(false);
    expect(sameValue([1], { 0: 1 })).toBe(false);
  });
});
