/**
 * The temperature picture draws only faces a pipe has, steps from the surface to the air where
 * the outside film is, and follows ln(r) through insulation. An invented plant (the boiler room
 * of Harrow Vale Creamery): 2" steam at 600 kPa, bare today.
 */
import { describe, expect, it } from 'vitest';
import { estimatePlant, type RunEstimate } from '../../../engine';
import { displayFormat } from '../../../lib/presentation';
import { temperatureProfile } from './series';

function bareSteam(): RunEstimate {
  const result = estimatePlant({
    market: 'US',
    energy: { fuel: 'natural-gas', price: 1.35, priceUnit: 'therm', currency: 'USD' },
    runs: [{ id: 'header', label: 'Boiler steam header', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 30, steamGaugePressureKPa: 600 }],
  });
  const run = result.runs[0];
  if (!run) throw new Error('the plant has one run');
  return run;
}

describe('temperature against distance from the pipe center', () => {
  const run = bareSteam();
  const spec = temperatureProfile(run, displayFormat({ system: 'SI', currency: 'USD' }), 60);
  const [now, proposed, limit] = spec.series;

  it('is insulated by the proposal, so the table has an insulation face, which the bare pipe does not have ("—", not a carried value)', () => {
    expect(run.proposed.thicknessM).toBeGreaterThan(0);
    const row = spec.labels.indexOf('Insulation, outer face');
    expect(row).toBeGreaterThan(0);
    expect(now?.values[row]).toBeNull();
    expect(proposed?.values[row]).toBeCloseTo(run.proposed.surfaceTemperatureC, 6);
  });

  it("steps straight down from the bare pipe's surface to the air at the pipe's outer radius, and draws no point inside insulation it lacks", () => {
    const points = now?.points ?? [];
    const outerRadiusMm = ((run.current.profile?.faceDiametersM[1] ?? NaN) / 2) * 1000;
    const atSurface = points.filter((p) => Math.abs(p.x - outerRadiusMm) < 1e-9);
    expect(atSurface.map((p) => p.y)).toEqual([expect.closeTo(run.current.surfaceTemperatureC, 6), expect.closeTo(run.air.temperatureC, 6)]);
    const beyond = points.filter((p) => p.x > outerRadiusMm);
    expect(beyond.length).toBe(1);
    expect(beyond[0]?.y).toBeCloseTo(run.air.temperatureC, 6);
  });

  it('follows ln(r) through the insulation (the midpoint in radius is not the midpoint in temperature)', () => {
    const faces = run.proposed.profile;
    expect(faces).toBeDefined();
    const [, wallOut, surface] = (faces?.faceDiametersM ?? []).map((d) => (d / 2) * 1000);
    const [, tWall, tSurface] = faces?.faceTemperaturesC ?? [];
    expect(surface).toBeGreaterThan(wallOut ?? Infinity);
    const inside = (proposed?.points ?? []).filter((p) => p.x > (wallOut ?? 0) && p.x < (surface ?? 0));
    expect(inside.length).toBeGreaterThan(5);
    const middle = inside[Math.floor(inside.length / 2)];
    const share = Math.log((middle?.x ?? NaN) / (wallOut ?? NaN)) / Math.log((surface ?? NaN) / (wallOut ?? NaN));
    expect(middle?.y).toBeCloseTo((tWall ?? NaN) + ((tSurface ?? NaN) - (tWall ?? NaN)) * share, 6);
    const straight = (tWall ?? NaN) + ((tSurface ?? NaN) - (tWall ?? NaN)) * (((middle?.x ?? NaN) - (wallOut ?? NaN)) / ((surface ?? NaN) - (wallOut ?? NaN)));
    expect(Math.abs((middle?.y ?? NaN) - straight)).toBeGreaterThan(1);
  });

  it('draws every line outward only, and the touch limit across the whole picture', () => {
    for (const series of spec.series) {
      const xs = (series.points ?? []).map((p) => p.x);
      expect(xs.length).toBeGreaterThan(1);
      expect(xs.every((x, i) => i === 0 || x >= (xs[i - 1] ?? -Infinity))).toBe(true);
    }
    expect(limit?.dashed).toBe(true);
    expect(limit?.points?.map((p) => p.y)).toEqual([60, 60]);
    expect(limit?.points?.[1]?.x).toBe(Math.max(...(proposed?.points ?? []).map((p) => p.x)));
  });
});
