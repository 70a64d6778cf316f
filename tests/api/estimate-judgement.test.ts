/**
 * The cases of the estimate's judgment (issue 9), each run through POST /api/estimate and
 * named after what it catches. Before/after figures are in the issue's closing note.
 */
import { describe, expect, it } from 'vitest';
import { appFetch } from '../support/stack';

type Json = Record<string, any>;
const energy = { fuel: 'natural-gas', price: 1.2, priceUnit: 'therm', electricityPricePerKWh: 0.15 };

async function estimate(body: Json, detail = ''): Promise<Json> {
  const response = await appFetch(`/api/estimate${detail}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  expect(response.status).toBe(200);
  return ((await response.json()) as { result: Json }).result;
}

const dryRoom = { id: 'dry', label: 'Process room', preset: 'process-room', average: { airTemperatureC: 20, relativeHumidityPercent: 60, airSpeedMPerS: 0 }, design: { wetAirTemperatureC: 20, wetRelativeHumidityPercent: 60 } };

describe('the estimate’s judgment, through /api/estimate', () => {
  it('a cheap warm copper line is left as it is, not insulated at a 130-year payback', async () => {
    const r = await estimate({ operatingHoursPerYear: 6000, energy, runs: [{ id: 'a', label: 'Wash hose line', service: 'hot-water', fluidTemperatureC: 40, pipe: { standard: 'ASTM-B88-L', size: '3/4' }, lengthM: 10, operatingHoursPerYear: 500 }] });
    expect(r.runs[0].proposed.option).toBe('leave');
    expect(r.runs[0].choice.code).toBe('NOTHING_PAYS');
    expect(r.totals.installedCost).toBe(0);
    expect(r.runs[0].options.map((o: Json) => o.kind)).toEqual(['leave', 'insulate']);
  });

  it('an insulated line in good order is left as it is', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.1016 } }] });
    expect(r.runs[0].proposed.option).toBe('leave');
    expect(r.runs[0].savings.annualCost).toBe(0);
    expect(r.totals.installedCost).toBe(0);
  });

  it('a whole, dry glycol line is left as it is and adds nothing to the totals', async () => {
    const r = await estimate({ energy, areas: [dryRoom], runs: [{ id: 'a', label: 'Glycol', service: 'glycol', areaId: 'dry', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, current: { state: 'insulated', material: 'flexible-elastomeric', thicknessM: 0.013, jacket: 'elastomeric-skin' } }] });
    expect(r.runs[0].proposed.option).toBe('leave');
    expect(r.totals.installedCost).toBe(0);
    expect(r.totals.simplePaybackYears).toBeNull();
  });

  it('a run with a bare fifth is repaired on its bare meters, not re-insulated end to end', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Main', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '3' }, lengthM: 40, current: { state: 'damaged', bareFraction: 0.2, material: 'mineral-wool', thicknessM: 0.0508 } }] }, '?detail=full');
    const run = r.runs[0];
    expect(run.proposed.option).toBe('repair');
    const repair = run.options.find((o: Json) => o.kind === 'repair');
    expect(repair.lengthInsulatedM).toBeCloseTo(8, 9);
    expect(run.installedCost).toBeLessThan(1000);
    expect(run.simplePaybackYears).toBeLessThan(1);
  });

  it('burns are checked on the hot still day, not at the year’s windy average', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Yard', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '1' }, lengthM: 20, ambient: { kind: 'outdoor' }, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.0127, jacket: 'pvc-jacket' } }] });
    const run = r.runs[0];
    expect(run.current.surfaceTemperatureC).toBeLessThan(30);
    expect(run.current.designSurfaceTemperatureC).toBeGreaterThan(60);
    expect(run.hazards.map((h: Json) => h.code)).toContain('SURFACE_ABOVE_TOUCH_LIMIT');
    expect(run.proposed.option).not.toBe('leave');
    expect(run.proposed.designSurfaceTemperatureC).toBeLessThanOrEqual(60);
  });

  it('a washdown room’s humidity sizes the glycol insulation, and the gap is said plainly where no stock thickness suffices', async () => {
    const room = (rh: number) => ({ id: 'wash', label: 'Washdown', preset: 'washdown-room', average: { airTemperatureC: 20, relativeHumidityPercent: rh, airSpeedMPerS: 0 }, design: { wetAirTemperatureC: 20, wetRelativeHumidityPercent: rh } });
    const run = { id: 'g', label: 'Glycol', service: 'glycol', areaId: 'wash', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30 };
    const at = async (rh: number) => estimate({ energy, areas: [room(rh)], runs: [run] });
    expect((await at(60)).runs[0].condensationControl.leastThicknessM).toBe(0.013);
    expect((await at(85)).runs[0].condensationControl.leastThicknessM).toBe(0.05);
    const wet = await at(92);
    expect(wet.runs[0].condensationControl.leastThicknessM).toBeNull();
    expect(wet.runs[0].choice.code).toBe('NO_OPTION_MEETS_SAFETY');
    const warning = wet.warnings.find((w: Json) => w.code === 'NO_STOCK_MEETS_NEED');
    expect(warning.runId).toBe('g');
    expect(warning.message).toMatch(/dew point.*K short/);
  });

  it('bare valves on an insulated cold line are flagged for sweating and covered', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Glycol', service: 'glycol', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, valves: 2, current: { state: 'insulated', material: 'flexible-elastomeric', thicknessM: 0.025 } }] });
    const run = r.runs[0];
    expect(run.hazards.map((h: Json) => h.code)).toContain('BARE_FITTINGS_BELOW_DEW_POINT');
    expect(run.proposed.option).toBe('repair');
    expect(run.proposed.coverFittings).toBe(true);
  });

  it('chilled water losing heat to cold outdoor air is reported, not billed as boiler gas', async () => {
    const r = await estimate({ energy, conditions: { outdoorAirTemperatureC: 2 }, runs: [{ id: 'a', label: 'Chiller loop', service: 'chilled-water', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 50, ambient: { kind: 'outdoor' } }] });
    const run = r.runs[0];
    expect(run.cold).toBe(true);
    expect(run.current.annualFuelGJ).toBe(0);
    expect(run.current.annualCost).toBe(0);
    expect(run.current.wrongWayHeatW).toBeGreaterThan(500);
  });

  it('a sweating chilled line also gains the latent heat of the water condensing on it', async () => {
    const room = (rh: number) => ({ id: 'r', label: 'Room', average: { airTemperatureC: 20, relativeHumidityPercent: rh, airSpeedMPerS: 0 } });
    const run = { id: 'c', label: 'Chilled', service: 'chilled-water', areaId: 'r', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 10 };
    const dry = await estimate({ energy, areas: [room(20)], runs: [run] });
    const humid = await estimate({ energy, areas: [room(85)], runs: [run] });
    expect(dry.runs[0].current.latentGainW).toBe(0);
    expect(humid.runs[0].current.latentGainW).toBeGreaterThan(0);
    expect(humid.runs[0].current.heatW / dry.runs[0].current.heatW).toBeGreaterThan(1.5);
  });

  it('the range counts installed price, air and surface among its uncertainties', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 40 }] });
    const p = r.range.simplePaybackYears;
    expect(p.high / p.low).toBeGreaterThan(1.5);
    expect(r.range.installedCost.high).toBeGreaterThan(r.range.installedCost.likely * 1.1);
    expect(r.range.sampled.join(' ')).toMatch(/installed price.*air temperature.*air speed.*emittance/s);
  });

  it('a 2-in sanitary tube is 2.000 in across, not NPS 2', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'CIP', service: 'cip-supply', pipe: { standard: 'ASTM-A270-SANITARY', size: '2' }, lengthM: 10 }] });
    expect(r.runs[0].pipeOuterDiameterM).toBeCloseTo(0.0508, 9);
  });

  it('a shiny copper finish loses less than a tarnished one', async () => {
    const run = (finish: string) => ({ id: 'a', label: 'HW', service: 'hot-water', fluidTemperatureC: 60, finish, pipe: { standard: 'ASTM-B88-L', size: '3/4' }, lengthM: 10 });
    const bright = await estimate({ energy, runs: [run('bright-metal')] });
    const dark = await estimate({ energy, runs: [run('dark-tarnish')] });
    expect(bright.runs[0].bare.heatLossWPerM / dark.runs[0].bare.heatLossWPerM).toBeLessThan(0.75);
  });

  it('an older request without areas, market or fittings still gets an answer', async () => {
    const r = await estimate({ unitSystem: 'US', energy, runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, valves: 2 }] });
    expect(r.market).toBe('US');
    expect(r.assumptions.stockSeries).toBe('inch');
    expect(r.runs[0].options.length).toBeGreaterThan(1);
  });

  it('the display units do not move money: the market decides the stock series', async () => {
    const body = (unitSystem: string) => ({ market: 'GB', unitSystem, energy, runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30 }] });
    const si = await estimate(body('SI'));
    const us = await estimate(body('US'));
    expect(us.totals.installedCost).toBe(si.totals.installedCost);
    expect(us.range).toEqual(si.range);
  });

  it('the summary answer leaves out what a detail view opens later; ?detail=full has it', async () => {
    const body = { energy, runs: [{ id: 'a', label: 'Header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30 }] };
    const summary = await estimate(body);
    const full = await estimate(body, '?detail=full');
    expect(summary.detail).toBe('summary');
    expect('thicknessSeries' in summary.runs[0]).toBe(false);
    expect(full.runs[0].thicknessSeries.length).toBeGreaterThan(3);
    expect(full.runs[0].proposed.profile.faceTemperaturesC.length).toBe(3);
  });

  it('a consultant can force the option and type a price, and still sees the others', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Main', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '3' }, lengthM: 40, current: { state: 'damaged', bareFraction: 0.2, material: 'mineral-wool', thicknessM: 0.0508 }, proposed: { option: 'replace', price: { lumpSum: 5000 } } }] });
    const run = r.runs[0];
    expect(run.proposed.option).toBe('replace');
    expect(run.choice.code).toBe('FORCED');
    expect(run.installedCost).toBe(5000);
    expect(run.options.map((o: Json) => o.kind)).toEqual(expect.arrayContaining(['leave', 'repair', 'add-layer', 'replace']));
  });

  it('a measured bare steam surface well under saturation is flagged, with a code and a sentence', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Header', service: 'steam', steamGaugePressureKPa: 700, pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, measurements: { surfaceTemperatureC: 120, airTemperatureC: 20 } }] });
    const run = r.runs[0];
    expect(run.notices.map((n: Json) => n.code)).toContain('MEASURED_BELOW_SATURATION');
    expect(run.measurements.lineTemperatureC).toBeGreaterThan(120);
    expect(run.measurements.lineTemperatureC).toBeLessThan(125);
    expect(run.fluidTemperatureC).toBe(run.measurements.lineTemperatureC);
  });

  it('a range refusal carries params a form can re-word in its own units', async () => {
    const response = await appFetch('/api/estimate', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ energy, operatingHoursPerYear: 9000, runs: [{ id: 'a', label: 'H', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30 }] }) });
    expect(response.status).toBe(400);
    const issue = ((await response.json()) as Json).error.issues.find((i: Json) => i.path === 'operatingHoursPerYear');
    expect(issue.params).toEqual({ quantity: 'hours', limit: 'max', limitSI: 8760, givenSI: 9000, exclusive: false, unitSI: 'h/yr' });
    expect(issue.message).toMatch(/8760 h\/yr.*leap year 8784/);
  });

  it('soft notices: a run over a kilometer and glycol above 60 °C are said at the field, not refused', async () => {
    const r = await estimate({ energy, runs: [{ id: 'a', label: 'Long', service: 'glycol', fluidTemperatureC: 70, pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 1500 }] });
    const codes = r.runs[0].notices.map((n: Json) => n.code);
    expect(codes).toEqual(expect.arrayContaining(['RUN_LONGER_THAN_1_KM', 'GLYCOL_ABOVE_60C']));
    expect(r.runs[0].notices.find((n: Json) => n.code === 'RUN_LONGER_THAN_1_KM').path).toBe('runs.0.lengthM');
  });
});
