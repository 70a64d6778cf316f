import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  fahrenheitToCelsius,
  inchesToMetres,
  lookupPipe,
  mphToMetresPerSecond,
  psiToKPa,
  solveRun,
  STEFAN_BOLTZMANN_W_PER_M2K4,
  type RunInput,
} from '../index';

const MATERIALS = ['glass-fibre', 'mineral-wool', 'calcium-silicate', 'cellular-glass'] as const;

/** Hot insulated or bare runs across the range the form offers. */
const hotRun = fc.record({
  od: fc.double({ min: 0.015, max: 0.6, noNaN: true }),
  wallFraction: fc.double({ min: 0, max: 0.2, noNaN: true }),
  fluid: fc.double({ min: 40, max: 400, noNaN: true }),
  ambient: fc.double({ min: -20, max: 35, noNaN: true }),
  wind: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 15, noNaN: true })),
  emittance: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
  vertical: fc.boolean(),
  layers: fc.array(
    fc.record({ t: fc.double({ min: 0.005, max: 0.12, noNaN: true }), m: fc.constantFrom(...MATERIALS) }),
    { maxLength: 3 },
  ),
});

type HotRun = typeof hotRun extends fc.Arbitrary<infer T> ? T : never;
const toInput = (r: HotRun): RunInput => ({
  pipe: { outerDiameterM: r.od, wallThicknessM: r.od * r.wallFraction * 0.5, conductivityWPerMK: 50 },
  fluidTemperatureC: r.fluid,
  ambientTemperatureC: r.ambient,
  windSpeedMPerS: r.wind,
  surfaceEmittance: r.emittance,
  orientation: r.vertical ? 'vertical' : 'horizontal',
  insulation: r.layers.map((l) => ({ thicknessM: l.t, material: l.m })),
});

describe('identities and properties', () => {
  it('U_i·A_i = U_o·A_o, and q′ = U_i·πD_i·(T_fluid − T_air) when surroundings are at air temperature', () => {
    fc.assert(
      fc.property(hotRun, (r) => {
        const result = solveRun(toInput(r));
        const ui = result.uInnerWPerM2K * Math.PI * result.innerDiameterM;
        const uo = result.uOuterWPerM2K * Math.PI * result.surfaceDiameterM;
        expect(Math.abs(ui / uo - 1)).toBeLessThan(1e-12);
        const q = ui * (r.fluid - r.ambient);
        expect(Math.abs(q - result.heatLossWPerM)).toBeLessThanOrEqual(1e-6 * Math.abs(result.heatLossWPerM) + 1e-6);
      }),
      { numRuns: 300, seed: 1 },
    );
  });

  it('the same q′ flows through the film, the wall, every layer and off the surface', () => {
    fc.assert(
      fc.property(hotRun, (r) => {
        const res = solveRun(toInput(r));
        const q = res.heatLossWPerM;
        const t = res.interfaceTemperaturesC;
        const d = res.interfaceDiametersM;
        const tol = 1e-9 * Math.abs(q) + 1e-9;
        // The film closes on the real fluid temperature only to the root finder's
        // tolerance (1e-7 K on the surface, amplified inward): check it in kelvin.
        const filmDrop = q / (res.insideFilmWPerM2K * Math.PI * res.innerDiameterM);
        expect(Math.abs((t[0] as number) - (t[1] as number) - filmDrop)).toBeLessThan(1e-5);
        const wallDrop = (q * Math.log((d[1] as number) / (d[0] as number))) / (2 * Math.PI * 50);
        expect(Math.abs((t[1] as number) - (t[2] as number) - wallDrop)).toBeLessThan(1e-9);
        res.layerMeanConductivitiesWPerMK.forEach((k, j) => {
          const through = (2 * Math.PI * k * ((t[j + 2] as number) - (t[j + 3] as number))) / Math.log((d[j + 2] as number) / (d[j + 1] as number));
          expect(Math.abs(through - q)).toBeLessThan(tol);
        });
        const ts = res.surfaceTemperatureC;
        const off =
          Math.PI *
          res.surfaceDiameterM *
          (res.convectionCoefficientWPerM2K * (ts - r.ambient) +
            r.emittance * STEFAN_BOLTZMANN_W_PER_M2K4 * ((ts + 273.15) ** 4 - (r.ambient + 273.15) ** 4));
        expect(Math.abs(off - q)).toBeLessThan(1e-5 * Math.abs(q) + 1e-5);
      }),
      { numRuns: 300, seed: 2 },
    );
  });

  it('hot surfaces lie between air and fluid temperature, and the loss is positive', () => {
    fc.assert(
      fc.property(hotRun, (r) => {
        const res = solveRun(toInput(r));
        expect(res.surfaceTemperatureC).toBeGreaterThanOrEqual(r.ambient);
        expect(res.surfaceTemperatureC).toBeLessThanOrEqual(r.fluid);
        expect(res.heatLossWPerM).toBeGreaterThan(0);
        for (let i = 1; i < res.interfaceTemperaturesC.length; i++) {
          expect(res.interfaceTemperaturesC[i] as number).toBeLessThanOrEqual((res.interfaceTemperaturesC[i - 1] as number) + 1e-9);
        }
      }),
      { numRuns: 300, seed: 3 },
    );
  });

  it('more insulation never raises the loss on a pipe above the critical radius', () => {
    fc.assert(
      fc.property(hotRun, fc.double({ min: 0.005, max: 0.1, noNaN: true }), (r, extra) => {
        const input = toInput({ ...r, od: Math.max(r.od, 0.05), layers: r.layers.length ? r.layers : [{ t: 0.02, m: 'mineral-wool' }] });
        const thin = solveRun(input);
        const layers = input.insulation ?? [];
        const last = layers[layers.length - 1] as { thicknessM: number; material: string };
        const thick = solveRun({ ...input, insulation: [...layers.slice(0, -1), { ...last, thicknessM: last.thicknessM + extra }] });
        expect(thick.heatLossWPerM).toBeLessThanOrEqual(thin.heatLossWPerM * (1 + 1e-9));
      }),
      { numRuns: 200, seed: 4 },
    );
  });

  it('a cold line gains heat: the sign flips and the surface lies between fluid and air', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 10, noNaN: true }),
        fc.double({ min: 15, max: 35, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        (fluid, ambient, t) => {
          const input: RunInput = {
            pipe: { standard: 'ASTM-B88-L', size: '1' },
            fluidTemperatureC: fluid,
            fluid: { kind: 'propylene-glycol-30', velocityMPerS: 1 },
            ambientTemperatureC: ambient,
            insulation: t > 0.005 ? [{ thicknessM: t, material: 'flexible-elastomeric' }] : [],
          };
          const res = solveRun(input);
          expect(res.heatLossWPerM).toBeLessThan(0);
          expect(res.surfaceTemperatureC).toBeGreaterThanOrEqual(fluid);
          expect(res.surfaceTemperatureC).toBeLessThanOrEqual(ambient);
        },
      ),
      { numRuns: 200, seed: 5 },
    );
  });

  it('results are continuous: a tiny change of any input moves the loss a tiny amount', () => {
    fc.assert(
      fc.property(hotRun, fc.constantFrom('od', 'fluid', 'ambient', 'emittance', 'wind', 'thickness'), (r, which) => {
        const base = solveRun(toInput(r)).heatLossWPerM;
        const h = 1e-7;
        const nudged = { ...r, layers: r.layers.map((l) => ({ ...l })) };
        if (which === 'thickness' && nudged.layers[0]) nudged.layers[0].t *= 1 + h;
        else if (which === 'wind') nudged.wind = r.wind + h;
        else if (which !== 'thickness') nudged[which] = r[which] * (1 + h) + h;
        const moved = solveRun(toInput(nudged)).heatLossWPerM;
        expect(Math.abs(moved - base)).toBeLessThanOrEqual(1e-4 * Math.abs(base) + 1e-4);
      }),
      { numRuns: 300, seed: 6 },
    );
  });

  it('US customary and SI inputs give the same answer', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 250, noNaN: true }),
        fc.double({ min: 20, max: 95, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.constantFrom(0.5, 1, 2, 3),
        (psig, airF, mph, inches) => {
          const dims = lookupPipe('ASME-B36.10M', '2', '40');
          const us = solveRun({
            pipe: { outerDiameterM: inchesToMetres(2.375), wallThicknessM: inchesToMetres(0.154), conductivityWPerMK: 52 },
            steam: { gaugePressureKPa: psiToKPa(psig) },
            ambientTemperatureC: fahrenheitToCelsius(airF),
            windSpeedMPerS: mphToMetresPerSecond(mph),
            insulation: [{ thicknessM: inchesToMetres(inches), material: 'mineral-wool' }],
          });
          const si = solveRun({
            pipe: { standard: 'ASME-B36.10M', size: 'DN50', schedule: '40', material: 'carbon-steel' },
            steam: { gaugePressureKPa: psig * 6.894757293168361 },
            ambientTemperatureC: ((airF - 32) * 5) / 9,
            windSpeedMPerS: mph * 0.44704,
            insulation: [{ thicknessM: inches * 0.0254, material: 'mineral-wool' }],
          });
          expect(dims.outerDiameterM).toBeCloseTo(inchesToMetres(2.375), 12);
          expect(Math.abs(us.heatLossWPerM - si.heatLossWPerM)).toBeLessThanOrEqual(1e-7 * si.heatLossWPerM);
        },
      ),
      { numRuns: 100, seed: 8 },
    );
  });
});
