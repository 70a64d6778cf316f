import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EngineError, estimatePlant, plantInputSchema, runInputSchema, solveRun, type PlantInput } from '../index';

const pipe = { standard: 'ASME-B36.10M', size: '2' };

/** Each refused input with the path and (part of) the sentence the owner sees. */
const refusals: { name: string; input: unknown; path: string; message: RegExp }[] = [
  { name: 'fluid below absolute zero', input: { pipe, fluidTemperatureC: -300 }, path: 'fluidTemperatureC', message: /cannot be at or below absolute zero/ },
  { name: 'fluid too hot', input: { pipe, fluidTemperatureC: 900 }, path: 'fluidTemperatureC', message: /between -100 °C and 650 °C/ },
  { name: '3 m of insulation on a 1/2" pipe', input: { pipe: { ...pipe, size: '1/2' }, fluidTemperatureC: 80, insulation: [{ thicknessM: 3, material: 'mineral-wool' }] }, path: 'insulation.0.thicknessM', message: /^Insulation thickness must be under 0\.5 m; 3 m was given\.$/ },
  { name: 'zero thickness', input: { pipe, fluidTemperatureC: 80, insulation: [{ thicknessM: 0, material: 'mineral-wool' }] }, path: 'insulation.0.thicknessM', message: /more than 0 m/ },
  { name: 'too much in total', input: { pipe, fluidTemperatureC: 80, insulation: [{ thicknessM: 0.3, material: 'mineral-wool' }, { thicknessM: 0.3, material: 'glass-fibre' }] }, path: 'insulation', message: /Total insulation thickness must be under 0\.5 m/ },
  { name: 'steam above the IF97 range', input: { pipe, steam: { gaugePressureKPa: 19000 } }, path: 'steam.gaugePressureKPa', message: /IAPWS-IF97 saturation range/ },
  { name: 'steam in a vacuum below the triple point', input: { pipe, steam: { gaugePressureKPa: -101 } }, path: 'steam.gaugePressureKPa', message: /absolute pressure between/ },
  { name: 'unknown size', input: { pipe: { ...pipe, size: '7' }, fluidTemperatureC: 80 }, path: 'pipe.size', message: /has no size "7"/ },
  { name: 'unknown schedule', input: { pipe: { ...pipe, schedule: '99' }, fluidTemperatureC: 80 }, path: 'pipe.schedule', message: /offers 10, 40, 80, 160, STD, XS/ },
  { name: 'unknown standard', input: { pipe: { standard: 'DIN-2448', size: '2' }, fluidTemperatureC: 80 }, path: 'pipe.standard', message: /must be one of ASME-B36\.10M/ },
  { name: 'material above its limit', input: { pipe, steam: { gaugePressureKPa: 700 }, insulation: [{ thicknessM: 0.03, material: 'flexible-elastomeric' }] }, path: 'insulation.0.material', message: /rated for -40 °C to 104 °C; this line runs at 170\.482 °C/ },
  { name: 'unknown material', input: { pipe, fluidTemperatureC: 80, insulation: [{ thicknessM: 0.03, material: 'asbestos' }] }, path: 'insulation.0.material', message: /must be one of glass-fibre/ },
  { name: 'layer with both material and k', input: { pipe, fluidTemperatureC: 80, insulation: [{ thicknessM: 0.03, material: 'mineral-wool', conductivityWPerMK: 0.04 }] }, path: 'insulation.0', message: /not both/ },
  { name: 'both temperature and steam', input: { pipe, fluidTemperatureC: 80, steam: { gaugePressureKPa: 100 } }, path: 'fluidTemperatureC', message: /not both/ },
  { name: 'neither temperature nor steam', input: { pipe }, path: 'fluidTemperatureC', message: /fluid temperature or its steam pressure/ },
  { name: 'wall thicker than the radius', input: { pipe: { outerDiameterM: 0.05, wallThicknessM: 0.03, conductivityWPerMK: 50 }, fluidTemperatureC: 80 }, path: 'pipe.wallThicknessM', message: /less than half the outside diameter/ },
  { name: 'negative wind', input: { pipe, fluidTemperatureC: 80, windSpeedMPerS: -2 }, path: 'windSpeedMPerS', message: /Wind speed must be at least 0 m\/s; -2 m\/s was given/ },
  { name: 'humidity over 100 %', input: { pipe, fluidTemperatureC: 5, relativeHumidityPercent: 120 }, path: 'relativeHumidityPercent', message: /at most 100 %/ },
  { name: 'text for a number', input: { pipe, fluidTemperatureC: 'hot' }, path: 'fluidTemperatureC', message: /must be a number/ },
  { name: 'infinite temperature', input: { pipe, fluidTemperatureC: Number.POSITIVE_INFINITY }, path: 'fluidTemperatureC', message: /must be a number/ },
  { name: 'emittance above 1', input: { pipe, fluidTemperatureC: 80, surfaceEmittance: 1.5 }, path: 'surfaceEmittance', message: /at most 1;/ },
  { name: 'no pipe', input: { fluidTemperatureC: 80 }, path: 'pipe', message: /Describe the pipe/ },
];

describe('bad run inputs are refused with a reason and a path', () => {
  it.each(refusals)('$name', ({ input, path, message }) => {
    const parsed = runInputSchema.safeParse(input);
    expect(parsed.success).toBe(false);
    const issue = parsed.error?.issues.find((i) => i.path.join('.') === path);
    expect(issue?.message, JSON.stringify(parsed.error?.issues)).toMatch(message);
    expect(() => solveRun(input as never)).toThrow(EngineError);
  });
});

const plant = (over: Partial<PlantInput> = {}): PlantInput => ({
  energy: { fuel: 'natural-gas', price: 1 },
  runs: [{ id: 'r1', label: 'Header', service: 'steam', pipe, lengthM: 10 }],
  ...over,
});

describe('bad plant inputs are refused with a reason and a path', () => {
  const cases: { name: string; input: unknown; path: string; message: RegExp }[] = [
    { name: 'no runs', input: plant({ runs: [] }), path: 'runs', message: /at least one pipe run/ },
    { name: 'no price', input: { runs: plant().runs, energy: { fuel: 'natural-gas' } }, path: 'energy.price', message: /Fuel price is required/ },
    { name: 'duplicate ids', input: plant({ runs: [plant().runs[0] as never, plant().runs[0] as never] }), path: 'runs.1.id', message: /used twice/ },
    { name: 'temperature for a steam run', input: plant({ runs: [{ id: 'a', label: 'A', service: 'steam', pipe, lengthM: 5, fluidTemperatureC: 150 }] }), path: 'runs.0.fluidTemperatureC', message: /gauge pressure, not a fluid temperature/ },
    { name: 'bad ambient', input: plant({ runs: [{ id: 'a', label: 'A', service: 'hot-water', pipe, lengthM: 5, ambient: { kind: 'cellar' } as never }] }), path: 'runs.0.ambient.kind', message: /indoor-still, indoor-draughty or outdoor/ },
    { name: 'negative length', input: plant({ runs: [{ id: 'a', label: 'A', service: 'hot-water', pipe, lengthM: -5 }] }), path: 'runs.0.lengthM', message: /Run length must be more than 0 m/ },
    { name: 'fraction over 1', input: plant({ runs: [{ id: 'a', label: 'A', service: 'hot-water', pipe, lengthM: 5, current: { state: 'damaged', bareFraction: 1.4 } }] }), path: 'runs.0.current.bareFraction', message: /at most 1/ },
  ];
  it.each(cases)('$name', ({ input, path, message }) => {
    const parsed = plantInputSchema.safeParse(input);
    expect(parsed.success).toBe(false);
    const issue = parsed.error?.issues.find((i) => i.path.join('.') === path);
    expect(issue?.message, JSON.stringify(parsed.error?.issues)).toMatch(message);
  });

  it('fills the trade’s usual values as defaults', () => {
    const parsed = plantInputSchema.parse(plant());
    expect(parsed.operatingHoursPerYear).toBe(6000);
    expect(parsed.conditions.indoorAirTemperatureC).toBe(20);
    expect(parsed.economics).toMatchObject({ horizonYears: 10, discountRatePercent: 5, touchLimitC: 60 });
    expect(parsed.runs[0]?.current).toEqual({ state: 'bare' });
    expect(parsed.runs[0]?.proposed.coverFittings).toBe(true);
  });
});

/** Any value at all in any field: the engine either refuses through the schema or returns finite numbers. */
const wild = fc.oneof(
  fc.double(),
  fc.integer({ min: -1e6, max: 1e6 }),
  fc.constantFrom(0, -0, 1e-300, 1e300, -273.15, 0.5, 22064, Number.NaN, Number.POSITIVE_INFINITY),
  fc.string({ maxLength: 6 }),
  fc.constant(null),
  fc.constant(undefined),
);
const maybe = <T>(a: fc.Arbitrary<T>) => fc.oneof({ weight: 12, arbitrary: a }, { weight: 1, arbitrary: wild });
/** Mostly left out, sometimes given (possibly wildly). */
const sometimes = <T>(a: fc.Arbitrary<T>) => fc.oneof({ weight: 3, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: maybe(a) });

const wildRun = fc.record({
    pipe: fc.oneof(
      fc.record({ outerDiameterM: maybe(fc.double({ min: 0.001, max: 3 })), wallThicknessM: maybe(fc.double({ min: 0, max: 0.3 })), conductivityWPerMK: maybe(fc.double({ min: 0.05, max: 2000 })) }),
      fc.record({ standard: fc.constantFrom('ASME-B36.10M', 'ASTM-B88-L', 'EN-10220', 'X'), size: fc.constantFrom('1/2', '2', 'DN50', '12', '99'), schedule: fc.option(fc.constantFrom('40', '80', 'L', '2.9', 'zz'), { nil: undefined }) }),
    ),
    fluidTemperatureC: maybe(fc.double({ min: -300, max: 800 })),
    steam: fc.option(fc.record({ gaugePressureKPa: maybe(fc.double({ min: -200, max: 30000 })) }), { nil: undefined, freq: 8 }),
    ambientTemperatureC: maybe(fc.double({ min: -80, max: 80 })),
    surroundingsTemperatureC: sometimes(fc.double({ min: -100, max: 200 })),
    windSpeedMPerS: sometimes(fc.double({ min: 0, max: 50 })),
    orientation: fc.constantFrom('horizontal', 'vertical', 'horizontal', 'vertical', 'diagonal'),
    runHeightM: sometimes(fc.double({ min: 0, max: 300 })),
    relativeHumidityPercent: sometimes(fc.double({ min: 0, max: 120 })),
    surfaceEmittance: sometimes(fc.double({ min: 0, max: 1.2 })),
    insideFilmWPerM2K: sometimes(fc.double({ min: 0, max: 1e8 })),
    surfaceCoefficientWPerM2K: sometimes(fc.double({ min: 0, max: 2000 })),
    insulation: fc.array(
      fc.oneof(
        { weight: 4, arbitrary: fc.record({ thicknessM: maybe(fc.double({ min: 0.001, max: 0.6 })), material: fc.constantFrom('mineral-wool', 'glass-fibre', 'calcium-silicate', 'cellular-glass', 'flexible-elastomeric', 'polyisocyanurate', 'felt') }) },
        { weight: 4, arbitrary: fc.record({ thicknessM: maybe(fc.double({ min: 0.001, max: 0.6 })), conductivityWPerMK: maybe(fc.double({ min: 0.001, max: 6 })) }) },
        { weight: 1, arbitrary: fc.record({ thicknessM: wild, material: wild, conductivityWPerMK: wild }) },
      ),
      { maxLength: 4 },
    ),
});

describe('no input makes the engine loop, throw an untyped error or return NaN/Infinity', () => {
  it('solveRun: schema refusal (EngineError) or a finite result', () => {
    let solved = 0;
    fc.assert(
      fc.property(wildRun, (input) => {
        try {
          const result = solveRun(input as never);
          solved++;
          for (const value of [result.heatLossWPerM, result.surfaceTemperatureC, result.uInnerWPerM2K, result.uOuterWPerM2K, ...result.interfaceTemperaturesC]) {
            expect(Number.isFinite(value)).toBe(true);
          }
          expect(result.iterations).toBeLessThanOrEqual(200);
        } catch (error) {
          expect(error).toBeInstanceOf(EngineError);
          expect((error as EngineError).message.length).toBeGreaterThan(10);
        }
      }),
      { numRuns: 4000, seed: 12 },
    );
    // Not vacuous: a share of the wild inputs is valid and gets solved.
    expect(solved).toBeGreaterThan(10);
  });

  it('solveRun on valid but extreme corners stays finite', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 650, noNaN: true }),
        fc.double({ min: -50, max: 60, noNaN: true }),
        fc.double({ min: -80, max: 150, noNaN: true }),
        fc.double({ min: 0.003, max: 2.5, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 0.02, max: 1, noNaN: true }),
        fc.array(fc.double({ min: 1e-6, max: 0.099, noNaN: true }), { maxLength: 5 }),
        (fluid, air, surroundings, od, wind, emittance, layers) => {
          const result = solveRun({
            pipe: { outerDiameterM: od, wallThicknessM: 0, conductivityWPerMK: 0.1 },
            fluidTemperatureC: fluid,
            ambientTemperatureC: air,
            surroundingsTemperatureC: surroundings,
            windSpeedMPerS: wind,
            surfaceEmittance: emittance,
            insideFilmWPerM2K: 1,
            insulation: layers.map((t, i) => ({ thicknessM: t, conductivityWPerMK: i % 2 ? 0.005 : 5 })),
          });
          expect(Number.isFinite(result.heatLossWPerM)).toBe(true);
          expect(result.surfaceTemperatureC).toBeGreaterThanOrEqual(Math.min(fluid, air, surroundings) - 1e-6);
          expect(result.surfaceTemperatureC).toBeLessThanOrEqual(Math.max(fluid, air, surroundings) + 1e-6);
        },
      ),
      { numRuns: 1000, seed: 13 },
    );
  });

  it('estimatePlant: refusal or finite figures for wild plants', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            service: fc.constantFrom('steam', 'hot-water', 'glycol', 'chilled-water', 'cip-return', 'boiling'),
            size: fc.constantFrom('1/2', '2', '6', '13'),
            lengthM: maybe(fc.double({ min: 0, max: 20000 })),
            state: fc.constantFrom({ state: 'bare' }, { state: 'damaged', bareFraction: 0.5 }, { state: 'insulated', material: 'mineral-wool', thicknessM: 0.05 }),
            ambient: fc.constantFrom({ kind: 'indoor-still' }, { kind: 'outdoor', windSpeedMPerS: 12 }, { kind: 'indoor-draughty' }),
            steam: fc.option(fc.double({ min: -150, max: 20000 }), { nil: undefined }),
          }),
          { minLength: 1, maxLength: 4 },
        ),
        maybe(fc.double({ min: 0, max: 100 })),
        (runs, price) => {
          try {
            const result = estimatePlant({
              energy: { fuel: 'natural-gas', price: price as number, electricityPricePerKWh: 0.1 },
              runs: runs.map((r, i) => ({
                id: `r${i}`,
                label: `Run ${i}`,
                service: r.service as never,
                pipe: { standard: 'ASME-B36.10M', size: r.size },
                lengthM: r.lengthM as number,
                current: r.state as never,
                ambient: r.ambient as never,
                ...(r.service === 'steam' && r.steam !== undefined ? { steamGaugePressureKPa: r.steam } : {}),
              })),
            });
            for (const value of [result.totals.current.annualCost, result.totals.savings.annualCo2Kg, result.range.currentAnnualCost.low, result.range.currentAnnualCost.high]) {
              expect(Number.isFinite(value)).toBe(true);
            }
          } catch (error) {
            expect(error).toBeInstanceOf(EngineError);
          }
        },
      ),
      { numRuns: 200, seed: 14 },
    );
  });
});
