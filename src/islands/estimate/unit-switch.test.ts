/**
 * Switching between US and SI units only converts what is shown: the plant's country decides
 * the catalogs (pipe standard, stock thickness series, billing unit) and so every money
 * figure. Checked on a three-run plant of the invented Harrow Vale Creamery.
 */
import { describe, expect, it } from 'vitest';
import { estimatePlant, toSI } from '../../engine';
import { presentResult } from '../../lib/presentation';
import { formatConverted, type UnitSystem } from '../../lib/units-display';
import {
  defaultPriceUnit,
  draftMarket,
  existingInsulationDefaults,
  freshValues,
  newRun,
  settleMarket,
  type DraftValues,
} from './draft';
import { validPlantInput } from './validation';

/** The same plant as the form holds it, read in either unit system. */
function creamery(system: UnitSystem, countryCode = 'US'): DraftValues {
  const values = freshValues(system);
  values.plant = { plantName: 'Harrow Vale Creamery', plantType: 'creamery', countryCode, postalCode: '05401' };
  values.estimate.energy.price = 1.35;
  values.estimate.energy.priceUnit = 'therm';
  const market = draftMarket(countryCode, system);
  const steam = { ...newRun(market, 1), label: 'Boiler header', lengthM: toSI('length', 131, 'ft'), steamGaugePressureKPa: 690 };
  const water = {
    ...newRun(market, 2, 'hot-water'),
    label: 'CIP return',
    lengthM: 25,
    fluidTemperatureC: 75,
    current: { state: 'damaged' as const, bareFraction: 0.3, ...existingInsulationDefaults('hot-water', market) },
  };
  const glycol = { ...newRun(market, 3, 'glycol'), label: 'Glycol to the cold room', lengthM: 18, fluidTemperatureC: -4 };
  values.estimate.runs = [steam, water, glycol];
  return values;
}

function estimateIn(system: UnitSystem) {
  const values = creamery(system);
  const input = validPlantInput(values.estimate, values.plant.countryCode);
  if (!input) throw new Error(`the ${system} draft should be a complete estimate`);
  return estimatePlant(input);
}

describe('switching units never changes a money figure or a catalog', () => {
  it('the same plant in US and in SI units gives the same money, to the cent, run by run', () => {
    const us = estimateIn('US');
    const si = estimateIn('SI');
    expect(us.totals.current.annualCost).toBeGreaterThan(0);
    expect(us.totals.installedCost).toBeGreaterThan(0);
    expect(si.totals.current.annualCost).toBe(us.totals.current.annualCost);
    expect(si.totals.savings.annualCost).toBe(us.totals.savings.annualCost);
    expect(si.totals.installedCost).toBe(us.totals.installedCost);
    expect(si.market).toBe('US');
    expect(si.range.installedCost).toEqual(us.range.installedCost);
    expect(si.range.annualCostSaving).toEqual(us.range.annualCostSaving);
    const perRun = (result: typeof us) => result.runs.map((run) => [run.proposed.option, run.current.annualCost, run.savings.annualCost, run.installedCost]);
    expect(perRun(us)).toHaveLength(3);
    expect(perRun(si)).toEqual(perRun(us));
  });

  it('and reads the same money strings in either unit system', () => {
    const result = estimateIn('US');
    const money = (system: UnitSystem) => {
      const shown = presentResult(result, { system });
      return [
        shown.headline.lossCost.text,
        shown.headline.lossCost.range?.text,
        shown.headline.saving.text,
        shown.headline.installedCost.text,
        shown.headline.installedCost.range?.text,
        ...shown.runs.flatMap((run) => [run.today.cost, run.saving, run.installedCost]),
      ];
    };
    expect(money('SI')).toEqual(money('US'));
  });

  it('a new run starts on the market’s catalog whatever the units: NPS 2 schedule 40 steel in the US, DN50 in Germany', () => {
    for (const system of ['US', 'SI'] as const) {
      expect(newRun(draftMarket('US', system), 1).pipe).toEqual({ standard: 'ASME-B36.10M', size: '2', schedule: '40', material: 'carbon-steel' });
      expect(newRun(draftMarket('DE', system), 1).pipe).toMatchObject({ standard: 'EN-10220' });
      expect(existingInsulationDefaults('steam', draftMarket('US', system)).thicknessM).toBe(0.0254);
      expect(existingInsulationDefaults('steam', draftMarket('DE', system)).thicknessM).toBe(0.025);
      expect(defaultPriceUnit('natural-gas', draftMarket('US', system))).toBe('therm');
      expect(defaultPriceUnit('natural-gas', draftMarket('DE', system))).toBe('kWh');
    }
  });

  it('choosing the country settles the starting catalog and billing unit, and keeps what the person chose', () => {
    const values = freshValues('SI');
    const copper = { standard: 'ASTM-B88-L', size: '3/4', schedule: 'L', material: 'copper' };
    values.estimate.runs.push({ ...newRun('EU', 2), pipe: copper });
    const settled = settleMarket(values, draftMarket('US', 'SI'));
    expect(settled.priceUnit).toBe('therm');
    expect(settled.runPipes).toEqual([{ index: 0, pipe: { standard: 'ASME-B36.10M', size: '2', schedule: '40', material: 'carbon-steel' } }]);
  });

  it('131 ft reads 131 ft in US and 39.9 m in SI, and back', () => {
    const stored = toSI('length', 131, 'ft');
    expect(formatConverted(stored, 'length', 'SI')).toBe('39.9');
    expect(formatConverted(stored, 'length', 'US')).toBe('131');
    expect(formatConverted(0.025, 'thickness', 'US')).toBe('0.984');
    expect(formatConverted(600, 'gaugePressure', 'US')).toBe('87');
  });
});
