/**
 * Lagging found wet or crushed on a site walk (data/lagging-condition.ts, common practice):
 * crushed lagging is worked out at half its thickness, wet lagging at three times its dry
 * conductivity, and a measured surface temperature overrides both.
 */
import { describe, expect, it } from 'vitest';
import { estimatePlant, plantInputSchema, type PlantInput, type PlantRunInput } from '../index';

const energy = { fuel: 'natural-gas' as const, price: 1, priceUnit: 'therm' as const, currency: 'USD' };

function plantWith(current: PlantRunInput['current'], measurements?: PlantRunInput['measurements']): PlantInput {
  return {
    energy,
    runs: [
      {
        id: 'r',
        label: 'Steam header',
        service: 'steam',
        steamGaugePressureKPa: 500,
        pipe: { standard: 'ASME-B36.10M', size: '3' },
        lengthM: 40,
        current,
        ...(measurements ? { measurements } : {}),
      },
    ],
  };
}

const lagged = (thicknessM: number, condition?: 'sound' | 'wet' | 'crushed') =>
  ({ state: 'insulated', material: 'mineral-wool', thicknessM, jacket: 'all-service-jacket', ...(condition ? { condition } : {}) }) as const;

describe('condition of the lagging in place', () => {
  it('is sound unless said otherwise', () => {
    const parsed = plantInputSchema.parse(plantWith(lagged(0.05)));
    expect(parsed.runs[0]?.current).toMatchObject({ state: 'insulated', condition: 'sound' });
  });

  it('refuses a condition it does not know, naming the choices', () => {
    const parsed = plantInputSchema.safeParse(plantWith({ ...lagged(0.05), condition: 'soggy' } as never));
    expect(parsed.success).toBe(false);
    const issue = parsed.error?.issues.find((i) => i.path.join('.') === 'runs.0.current.condition');
    expect(issue?.message).toBe('Condition of the existing insulation must be one of sound, wet, crushed; "soggy" was given.');
  });

  it('crushed lagging is worked out as sound lagging of half the thickness (common practice)', () => {
    const crushed = estimatePlant(plantWith(lagged(0.1, 'crushed'))).runs[0]!;
    const half = estimatePlant(plantWith(lagged(0.05))).runs[0]!;
    expect(crushed.current.heatLossWPerM).toBeCloseTo(half.current.heatLossWPerM, 9);
    expect(crushed.current.surfaceTemperatureC).toBeCloseTo(half.current.surfaceTemperatureC, 9);
  });

  it('wet lagging loses more than sound and less than bare pipe, and runs hotter at the surface', () => {
    const wet = estimatePlant(plantWith(lagged(0.05, 'wet'))).runs[0]!;
    const sound = estimatePlant(plantWith(lagged(0.05))).runs[0]!;
    expect(wet.current.heatLossWPerM).toBeGreaterThan(2 * sound.current.heatLossWPerM);
    expect(wet.current.heatLossWPerM).toBeLessThan(sound.bare.heatLossWPerM);
    expect(wet.current.surfaceTemperatureC).toBeGreaterThan(sound.current.surfaceTemperatureC);
  });

  it('a measured surface temperature decides the loss whatever the condition was said to be', () => {
    const reading = { surfaceTemperatureC: 70, airTemperatureC: 20 };
    const wet = estimatePlant(plantWith(lagged(0.05, 'wet'), reading)).runs[0]!;
    const sound = estimatePlant(plantWith(lagged(0.05), reading)).runs[0]!;
    expect(wet.measurements?.measuredHeatLossWPerM).toBeCloseTo(sound.measurements?.measuredHeatLossWPerM as number, 9);
    expect(wet.current.heatLossWPerM).toBeCloseTo(sound.current.heatLossWPerM, 6);
  });
});
