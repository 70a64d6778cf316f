/**
 * Typical values count as guessed: what the form filled in and the person never touched is
 * sent as a guess, what they typed as near enough, what they said themselves as they said
 * it — and the range widens with the guesses.
 */
import { describe, expect, it } from 'vitest';
import { AREA_PRESETS, estimatePlant } from '../../engine';
import { NOTHING_TYPED, withConfidences } from './confidence';
import { freshValues, newArea, type DraftValues } from './draft';
import { toPlantInput } from './posting';

const EVERYTHING_TYPED = () => true;

/** An invented plant: Tarnbrook Dairy's steam header and a glycol line through its washdown room. */
function dairy(): DraftValues {
  const values = freshValues('US');
  values.plant = { plantName: 'Tarnbrook Dairy', plantType: 'creamery', countryCode: 'US', postalCode: '05401' };
  values.estimate.energy.price = 1.35;
  const washdown = newArea('washdown-room', []);
  values.estimate.areas = [washdown];
  const steam = values.estimate.runs[0]!;
  steam.lengthM = 36.6;
  values.estimate.runs.push({
    ...structuredClone(steam),
    id: 'run-glycol',
    label: 'Glycol to the vat room',
    service: 'glycol',
    steamGaugePressureKPa: undefined,
    fluidTemperatureC: -5,
    areaId: washdown.id,
    lengthM: 24,
  });
  return values;
}

/** The same dairy with the area's air typed in, figure for figure as its kind's usual values. */
function typedAreas(values: DraftValues): DraftValues {
  const copy = structuredClone(values);
  const preset = AREA_PRESETS.find((p) => p.id === 'washdown-room')!;
  copy.estimate.areas = copy.estimate.areas!.map((area) => ({
    ...area,
    average: { ...preset.average },
    design: { ...preset.design },
  }));
  return copy;
}

const width = (range: { low: number; high: number }) => range.high - range.low;

describe('typical values count as guessed', () => {
  it('untouched pre-fills are sent as guesses; typed ones as near enough; the price as near enough', () => {
    const untouched = toPlantInput(dairy().estimate, 'US', NOTHING_TYPED);
    expect(untouched.operatingHoursConfidence).toBe('guessed');
    expect(untouched.conditions?.confidence).toBe('guessed');
    expect(untouched.areas?.[0]?.confidence).toBe('guessed');
    expect(untouched.energy.priceConfidence).toBe('estimated');
    expect(untouched.energy.boilerEfficiencyConfidence).toBe('guessed');

    const typed = toPlantInput(typedAreas(dairy()).estimate, 'US', EVERYTHING_TYPED);
    expect(typed.operatingHoursConfidence).toBe('estimated');
    expect(typed.conditions?.confidence).toBe('estimated');
    expect(typed.areas?.[0]?.confidence).toBe('estimated');
  });

  it('hours changed from the usual figure count as near enough even when the typing is not on record', () => {
    const values = dairy();
    values.estimate.operatingHoursPerYear = 4000;
    expect(withConfidences(values.estimate, NOTHING_TYPED).operatingHoursConfidence).toBe('estimated');
  });

  it('what the person said stays as they said it', () => {
    const values = dairy();
    values.estimate.operatingHoursConfidence = 'measured';
    values.estimate.energy.priceConfidence = 'guessed';
    const sent = toPlantInput(values.estimate, 'US', NOTHING_TYPED);
    expect(sent.operatingHoursConfidence).toBe('measured');
    expect(sent.energy.priceConfidence).toBe('guessed');
  });

  it('the same plant sent with untouched pre-fills gives a wider range than with the values typed', () => {
    const guessed = estimatePlant(toPlantInput(dairy().estimate, 'US', NOTHING_TYPED));
    const typed = estimatePlant(toPlantInput(typedAreas(dairy()).estimate, 'US', EVERYTHING_TYPED));
    // The same figures either way: only how sure they are differs.
    expect(typed.range.currentAnnualCost.likely).toBe(guessed.range.currentAnnualCost.likely);
    expect(typed.totals.current.annualCost).toBe(guessed.totals.current.annualCost);
    expect(width(guessed.range.currentAnnualCost)).toBeGreaterThan(width(typed.range.currentAnnualCost));
    expect(width(guessed.range.annualCostSaving)).toBeGreaterThan(width(typed.range.annualCostSaving));
  });
});
