import { describe, expect, it } from 'vitest';
import { estimatePlant, type PlantInput, type PlantResult, type RunEstimate } from '../../engine';
import { NBSP } from './rounding';
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
    expect(shown.runs.some((run) => run.proposed.work !== null)).toBe(true);
    for (const run of shown.runs) {
      const expected = run.proposed.work ? new RegExp(`^${run.choice.label}: \\d[\\d½¼¾⅛⅜⅝⅞.]*${NBSP}in of [a-z ]+ with `) : /^Leave as it is$/;
      expect(run.proposed.summary).toMatch(expected);
    }
  });

  it.each([
    ['leave', 'Leave as it is'],
    ['repair', 'Repair the bare parts'],
    ['insulate', 'Insulate'],
    ['add-layer', 'Add a layer'],
    ['replace', 'Replace the insulation'],
  ] as const)('names the choice %s “%s”, and says why in our words, the horizon in years', (option, label) => {
    const forced = withRun(0, (run) => ({ ...run, proposed: { ...run.proposed, option }, choice: { code: 'LEAST_LIFE_CYCLE_COST', message: 'engine wording' } }));
    const run = presentResult(forced, { system: 'US' }).runs[0];
    expect(run?.choice.label).toBe(label);
    expect(run?.choice.reason).toMatch(new RegExp(` costs least over ${result.assumptions.horizonYears} years of the choices that are safe\\.$`));
    expect(run?.proposed.work === null).toBe(option === 'leave');
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

  it.each(['US', 'SI'] as const)('in %s: the loss reads “4,230 dollars a year, likely 2,900–6,200”', (system) => {
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
    current: { ...run.current, designSurfaceTemperatureC: 169.4 },
    personnelProtection: { ...run.personnelProtection, touchLimitC: 60 },
    hazards: [{ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: 'engine wording, never shown' }],
  }));

  it.each([
    { system: 'US', sentence: 'On the hottest still day the surface reaches about 337~°F, above the 140~°F touch limit: it can burn on contact.' },
    { system: 'SI', sentence: 'On the hottest still day the surface reaches about 169~°C, above the 60~°C touch limit: it can burn on contact.' },
  ] as const)('a touch burn in $system', ({ system, sentence }) => {
    const hazard = presentResult(hot, { system }).runs[0]?.hazards[0];
    expect(hazard).toMatchObject({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', flag: 'Burns on touch', tone: 'heat', runLabel: 'Smoke-oven header' });
    expect(hazard?.sentence).toBe(nb(sentence));
  });

  const sweating = (surfaceC: number, dewC: number) =>
    withRun(2, (run) => ({
      ...run,
      current: { ...run.current, designSurfaceTemperatureC: surfaceC },
      condensationControl: { ...run.condensationControl, dewPointC: dewC },
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

  it.each([
    { code: 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT', run: 0, count: 2, expected: '2 bare fittings on this line run above the 140~°F touch limit on the hottest still day' },
    { code: 'BARE_FITTINGS_BELOW_DEW_POINT', run: 2, count: 1, expected: '1 bare fitting on this line sits below the' },
  ] as const)('bare fittings ($code) are counted and worded in the reader’s units', ({ code, run: index, count, expected }) => {
    const changed = withRun(index, (run) => ({
      ...run,
      fittings: { ...run.fittings, uncoveredCount: count },
      personnelProtection: { ...run.personnelProtection, touchLimitC: 60 },
      hazards: [{ code, message: 'engine wording in °C, never shown' }],
    }));
    const hazard = presentResult(changed, { system: 'US' }).runs[index]?.hazards[0];
    expect(hazard?.sentence).toContain(nb(expected));
    expect(hazard?.sentence).not.toMatch(/°C/);
  });

  it('never passes on an engine sentence in °C to a US reader', () => {
    const every = withRun(0, (run) => ({
      ...run,
      hazards: (['MATERIAL_ABOVE_SERVICE_LIMIT', 'MATERIAL_BELOW_SERVICE_LIMIT', 'INSULATION_BELOW_CRITICAL_RADIUS', 'RAYLEIGH_BEYOND_CORRELATION'] as const).map((code) => ({
        code,
        message: 'engine wording at 200 °C',
      })),
    }));
    const hazards = presentResult(every, { system: 'US' }).runs[0]?.hazards ?? [];
    expect(hazards).toHaveLength(4);
    for (const hazard of hazards) expect(hazard.sentence).not.toMatch(/°C|engine wording/);
  });
});

describe('presentResult: notices and notes in the reader’s units', () => {
  const noticed = {
    ...withRun(1, (run) => ({
      ...run,
      notices: [
        {
          code: 'HOT_WATER_ABOVE_BOILING' as const,
          path: 'runs.1.fluidTemperatureC',
          message: 'engine wording at 110 °C',
          params: { quantity: 'temperature' as const, limit: 'max' as const, limitSI: 100, givenSI: 110 },
        },
      ],
    })),
    warnings: [
      ...result.warnings,
      { code: 'INPUT_NOTICE' as const, message: 'engine wording at 110 °C', runId: 'loop', path: 'runs.1.fluidTemperatureC' },
      { code: 'NO_STOCK_MEETS_NEED' as const, message: 'engine wording at 60 °C', runId: 'header' },
    ],
  };

  it.each([
    { system: 'US', temperatures: ['230~°F', '212~°F'], limit: '140~°F' },
    { system: 'SI', temperatures: ['110~°C', '100~°C'], limit: '60~°C' },
  ] as const)('in $system: a notice at its field, and the plant notes about it', ({ system, temperatures, limit }) => {
    const shown = presentResult(noticed, { system });
    const notice = shown.runs[1]?.notices[0];
    expect(notice).toMatchObject({ path: 'runs.1.fluidTemperatureC', code: 'HOT_WATER_ABOVE_BOILING' });
    expect(notice?.sentence).toBe(nb(`“Washdown hot water” carries water at ${temperatures[0]} above its boiling point of about ${temperatures[1]}: it would flash to steam. Check the temperature or give the line’s pressure.`));
    expect(shown.notes).toContain(notice?.sentence);
    expect(shown.notes.some((note) => note.startsWith('“Smoke-oven header”: no stock thickness') && note.includes(nb(limit)))).toBe(true);
    expect(shown.notes.join(' ')).not.toMatch(/engine wording|undefined/);
  });

  it('says how the figures were reached', () => {
    const shown = presentResult(result, { system: 'US' });
    expect(shown.basis.ranges).toContain(`of ${result.range.samples} samples`);
    expect(shown.runsWithWork).toBe(`${result.totals.runsWithWork} of 3 runs`);
  });
});
