import { describe, expect, it } from 'vitest';
import { estimatePlant, type PlantInput, type PlantResult, type RunEstimate } from '../../engine';
import { NBSP } from './format';
import { presentResult } from './present';

const nb = (text: string) => text.replace(/~/g, NBSP);

/** An invented plant: Sorrel Ford Smokehouse, a steam header, a hot-water loop and a glycol line. */
const plant: PlantInput = {
  label: 'Sorrel Ford Smokehouse',
  unitSystem: 'US',
  operatingHoursPerYear: 5000,
  operatingHoursConfidence: 'estimated',
  conditions: { indoorAirTemperatureC: 21, indoorRelativeHumidityPercent: 70 },
  energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', currency: 'USD', boilerEfficiency: 0.8, electricityPricePerKWh: 0.15 },
  runs: [
    {
      id: 'header',
      label: 'Smoke-oven header',
      service: 'steam',
      steamGaugePressureKPa: 689.476,
      pipe: { standard: 'ASME-B36.10M', size: '2', schedule: '40' },
      lengthM: 12,
      lengthConfidence: 'guessed',
      current: { state: 'bare' },
      valves: 2,
    },
    {
      id: 'loop',
      label: 'Washdown hot water',
      service: 'hot-water',
      fluidTemperatureC: 70,
      pipe: { standard: 'ASME-B36.10M', size: '1', schedule: '40' },
      lengthM: 20,
      current: { state: 'damaged', bareFraction: 0.3, material: 'glass-fibre', thicknessM: 0.0254 },
    },
    {
      id: 'glycol',
      label: 'Glycol to the cold room',
      service: 'glycol',
      fluidTemperatureC: -5,
      pipe: { standard: 'ASME-B36.10M', size: '1-1/2', schedule: '40' },
      lengthM: 15,
      current: { state: 'bare' },
    },
  ],
};

const result = estimatePlant(plant);

/** The result with one run's figures replaced, to pin wording on known values. */
function withRun(index: number, change: (run: RunEstimate) => RunEstimate): PlantResult {
  return { ...result, runs: result.runs.map((run, i) => (i === index ? change(run) : run)) };
}

describe('presentResult: names and rows', () => {
  const shown = presentResult(result, { system: 'US' });

  it('names each run’s service, state and proposal in our words', () => {
    expect(shown.runs.map((r) => r.service)).toEqual(['Steam', 'Hot water', 'Glycol (30 % propylene)']);
    expect(shown.runs.map((r) => r.state)).toEqual(['Bare', 'Partly bare', 'Bare']);
    expect(shown.runs[2]?.today.heatLabel).toBe('Heat gained');
    expect(shown.runs[0]?.today.heatLabel).toBe('Heat lost');
    expect(shown.runs[0]?.proposed.summary).toMatch(new RegExp(`^\\d[\\d½¼¾⅛⅜⅝⅞.]*${NBSP}in of [a-z ]+ with `));
  });

  it('gives the steam line its gauge pressure in the reader’s units, and none to the others', () => {
    expect(shown.runs[0]?.line.pressure).toBe(nb('100~psig'));
    expect(presentResult(result, { system: 'SI' }).runs[0]?.line.pressure).toBe(nb('6.89~bar (gauge)').replace(' ', NBSP));
    expect(shown.runs[1]?.line.pressure).toBeNull();
  });

  it('shows every length, loss and surface in the reader’s units', () => {
    const si = presentResult(result, { system: 'SI' });
    expect(shown.runs[0]?.length).toBe(nb('39.4~ft'));
    expect(si.runs[0]?.length).toBe(nb('12~m'));
    expect(shown.runs[0]?.today.heatPerLength).toMatch(new RegExp(`${NBSP}Btu/h${NBSP}per${NBSP}ft$`));
    expect(si.runs[0]?.today.heatPerLength).toMatch(new RegExp(`${NBSP}W/m$`));
    expect(shown.runs[0]?.today.surface).toMatch(new RegExp(`${NBSP}°F$`));
    expect(si.headline.lossEnergy.unit).toBe('GJ');
    expect(shown.headline.lossEnergy.unit).toBe('MMBtu');
  });

  it('counts the runs with hazards and lists their hazards in run order', () => {
    expect(shown.runsWithHazards).toBe(result.runs.filter((r) => r.hazards.length > 0).length);
    expect(shown.hazards.map((h) => h.runId)).toEqual(result.runs.flatMap((r) => r.hazards.map(() => r.id)));
  });
});

describe('presentResult: money and ranges by one rule', () => {
  const pinned: PlantResult = {
    ...result,
    range: {
      ...result.range,
      currentAnnualCost: { low: 2912.4, likely: 4234.2, high: 6187.9 },
      annualCostSaving: { low: 2100.2, likely: 3641.7, high: 5020 },
      simplePaybackYears: { low: 1.0, likely: 1.21, high: 1.35 },
    },
    totals: { ...result.totals, simplePaybackYears: 1.21 },
  };

  it.each(['US', 'SI'] as const)('in %s: the loss reads $4,230 a year, likely $2,900–$6,200', (system) => {
    const { lossCost, saving, payback } = presentResult(pinned, { system }).headline;
    expect(lossCost.value).toBe('$4,230');
    expect(lossCost.per).toBe('a year');
    expect(lossCost.range).toEqual({ low: '$2,900', high: '$6,200', text: '$2,900–$6,200' });
    expect(saving.value).toBe('$3,640');
    expect(saving.range?.text).toBe('$2,100–$5,000');
    expect(payback.value).toBe(nb('1.2~years'));
    expect(payback.range?.text).toBe(nb('1.0–1.4~years'));
  });

  it('money is the same whatever the display units; energy is not', () => {
    const us = presentResult(result, { system: 'US' });
    const si = presentResult(result, { system: 'SI' });
    const money = (p: typeof us) => [
      p.headline.lossCost.text,
      p.headline.lossCost.range?.text,
      p.headline.saving.text,
      p.headline.installedCost.text,
      p.headline.lifeCycleNet.text,
      ...p.runs.flatMap((r) => [r.today.cost, r.saving, r.installedCost]),
    ];
    expect(money(si)).toEqual(money(us));
    expect(si.headline.lossEnergy.text).not.toBe(us.headline.lossEnergy.text);
  });
});

describe('presentResult: hazards in the reader’s units', () => {
  const hot = withRun(0, (run) => ({
    ...run,
    current: { ...run.current, surfaceTemperatureC: 169.4 },
    personnelProtection: { ...run.personnelProtection, touchLimitC: 60 },
    hazards: [{ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: 'engine wording, never shown' }],
  }));

  it.each([
    { system: 'US', sentence: 'The surface runs at about 337~°F, above the 140~°F touch limit: it can burn on contact.' },
    { system: 'SI', sentence: 'The surface runs at about 169~°C, above the 60~°C touch limit: it can burn on contact.' },
  ] as const)('a touch burn in $system', ({ system, sentence }) => {
    const hazard = presentResult(hot, { system }).runs[0]?.hazards[0];
    expect(hazard).toMatchObject({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', flag: 'Burns on touch', tone: 'heat', runLabel: 'Smoke-oven header' });
    expect(hazard?.sentence).toBe(nb(sentence));
  });

  const sweating = (surfaceC: number, dewC: number) =>
    withRun(2, (run) => ({
      ...run,
      current: { ...run.current, surfaceTemperatureC: surfaceC },
      air: { ...run.air, dewPointC: dewC },
      hazards: [{ code: 'SURFACE_BELOW_DEW_POINT', message: 'engine wording, never shown' }],
    }));

  it.each([
    { system: 'SI', surface: -4.7, dew: 12.3, expected: 'about −5~°C, below the air’s dew point of 12~°C' },
    { system: 'US', surface: -4.7, dew: 12.3, expected: 'about 24~°F, below the air’s dew point of 54~°F' },
    { system: 'SI', surface: 11.6, dew: 12.0, expected: 'about 11.6~°C, below the air’s dew point of 12.0~°C' },
  ] as const)('sweating in $system, surface $surface °C under a $dew °C dew point', ({ system, surface, dew, expected }) => {
    const hazard = presentResult(sweating(surface, dew), { system }).runs[2]?.hazards[0];
    expect(hazard).toMatchObject({ flag: 'Sweats: below the dew point', tone: 'cold' });
    expect(hazard?.sentence).toContain(nb(expected));
  });

  it('never passes on an engine sentence in °C to a US reader', () => {
    const shown = presentResult(hot, { system: 'US' });
    for (const hazard of shown.hazards) expect(hazard.sentence).not.toMatch(/°C/);
  });
});

describe('presentResult: notes and basis', () => {
  it('words each plant note our own way', () => {
    const shown = presentResult(result, { system: 'US' });
    expect(shown.notes).toHaveLength(result.warnings.length);
    expect(shown.notes.join(' ')).not.toMatch(/undefined/);
    expect(shown.basis.ranges).toContain(`of ${result.range.samples} samples`);
  });
});
