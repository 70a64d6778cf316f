import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runInputSchema, type RunInput } from '../index';
import { prepareRun } from '../run';
import { solveLean, solveResolvedRun, type ResolvedRun } from '../run-solver';

const MATERIALS = ['glass-fibre', 'mineral-wool', 'calcium-silicate', 'cellular-glass', 'flexible-elastomeric', 'polyisocyanurate'] as const;

/**
 * Lines hot and cold, bare and under up to three layers, in still or moving air, level or
 * upright, dry or humid enough to sweat, with the outer coefficient left to the correlations
 * or fixed by the caller — the spread of runs a plant's options and thickness series solve.
 */
const anyRun = fc.record({
  od: fc.double({ min: 0.01, max: 0.6, noNaN: true }),
  wallFraction: fc.double({ min: 0, max: 0.2, noNaN: true }),
  fluid: fc.oneof(fc.double({ min: -40, max: 15, noNaN: true }), fc.double({ min: 30, max: 400, noNaN: true })),
  ambient: fc.double({ min: -20, max: 40, noNaN: true }),
  surroundingsOffset: fc.oneof(fc.constant(0), fc.double({ min: -15, max: 15, noNaN: true })),
  wind: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 15, noNaN: true })),
  emittance: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
  vertical: fc.boolean(),
  heightM: fc.double({ min: 0.5, max: 12, noNaN: true }),
  humidity: fc.option(fc.double({ min: 20, max: 98, noNaN: true }), { nil: undefined }),
  fixed: fc.constantFrom('none', 'combined', 'convection'),
  layers: fc.array(
    fc.record({ t: fc.double({ min: 0.005, max: 0.12, noNaN: true }), m: fc.constantFrom(...MATERIALS), k: fc.option(fc.double({ min: 0.02, max: 0.2, noNaN: true }), { nil: undefined }) }),
    { maxLength: 3 },
  ),
});

type AnyRun = typeof anyRun extends fc.Arbitrary<infer T> ? T : never;

function resolved(r: AnyRun): ResolvedRun {
  const input: RunInput = {
    pipe: { outerDiameterM: r.od, wallThicknessM: r.od * r.wallFraction * 0.5, conductivityWPerMK: 50 },
    fluidTemperatureC: r.fluid,
    ambientTemperatureC: r.ambient,
    surroundingsTemperatureC: r.ambient + r.surroundingsOffset,
    windSpeedMPerS: r.wind,
    surfaceEmittance: r.emittance,
    orientation: r.vertical ? 'vertical' : 'horizontal',
    runHeightM: r.heightM,
    ...(r.humidity !== undefined ? { relativeHumidityPercent: r.humidity } : {}),
    ...(r.fixed === 'combined' ? { surfaceCoefficientWPerM2K: 9 } : r.fixed === 'convection' ? { convectionCoefficientWPerM2K: 4 } : {}),
    // A conductivity of its own where one is drawn, so a layer's service limits never refuse the line's temperature.
    insulation: r.layers.map((l) => (l.k !== undefined ? { thicknessM: l.t, conductivityWPerMK: l.k } : { thicknessM: l.t, material: l.m })),
  };
  const parsed = runInputSchema.safeParse(input);
  // A catalog material rated for other temperatures is refused at the door; the same layers with a plain conductivity are solved instead.
  if (!parsed.success) {
    const plain = { ...input, insulation: r.layers.map((l) => ({ thicknessM: l.t, conductivityWPerMK: l.k ?? 0.05 })) };
    return prepareRun(runInputSchema.parse(plain)).resolved;
  }
  return prepareRun(parsed.data).resolved;
}

describe('the lean solve of the thickness series and options', () => {
  it('gives exactly the heat flow, surface temperature and latent gain of the full solve from the same start', () => {
    fc.assert(
      fc.property(anyRun, (r) => {
        const run = resolved(r);
        const full = solveResolvedRun(run);
        const lean = solveLean(run);
        expect(lean.heatLossWPerM).toBe(full.heatLossWPerM);
        expect(lean.surfaceTemperatureC).toBe(full.surfaceTemperatureC);
        expect(lean.latentGainWPerM).toBe(full.latentGainWPerM);
      }),
      { numRuns: 400, seed: 9 },
    );
  });

  it('warm-started as a series is, lands on the full solve’s root within the root finder’s tolerance', () => {
    fc.assert(
      fc.property(anyRun, fc.double({ min: -30, max: 30, noNaN: true }), (r, offsetK) => {
        const run = resolved(r);
        const full = solveResolvedRun(run);
        // A start a little off the root, as the thickness before gives.
        const lean = solveLean(run, full.surfaceTemperatureC + offsetK);
        // Each solve stops within 1e-7 K of the root (run-solver.ts), so two differ by at most twice that.
        expect(Math.abs(lean.surfaceTemperatureC - full.surfaceTemperatureC)).toBeLessThanOrEqual(2e-7);
        // The heat flow differs by the surface's own change of heat with temperature over that gap:
        // at most π·D·(h_c·5/4 + h_r) per kelvin (natural convection grows as ΔT^¼), plus latent heat's share; 2e-7 K × twice that bounds it.
        const perKelvin = Math.PI * full.surfaceDiameterM * 2 * (1.25 * full.convectionCoefficientWPerM2K + full.radiationCoefficientWPerM2K);
        expect(Math.abs(lean.heatLossWPerM - full.heatLossWPerM)).toBeLessThanOrEqual(2e-7 * perKelvin + 1e-9 * Math.abs(full.heatLossWPerM));
      }),
      { numRuns: 400, seed: 10 },
    );
  });

  it('a line at the air’s own temperature under warmer surroundings is solved, not refused (both ends of the bracket round to one side of zero)', () => {
    const run = resolved({ od: 0.01, wallFraction: 0, fluid: 0, ambient: 0, surroundingsOffset: 0.5, wind: 0, emittance: 0.05, vertical: false, heightM: 0.5, humidity: undefined, fixed: 'combined', layers: [{ t: 0.005, m: 'glass-fibre', k: undefined }] });
    const full = solveResolvedRun(run);
    // With the coefficient fixed, the surroundings do not count: nothing flows.
    expect(Math.abs(full.surfaceTemperatureC)).toBeLessThanOrEqual(1e-7);
    expect(Math.abs(full.heatLossWPerM)).toBeLessThan(1e-6);
  });
});
