/**
 * One way to show an estimate. {@link presentResult} turns the engine's PlantResult (live
 * from /api/estimate, or stored with an assessment) into what a person reads — names,
 * headline figures with their ranges, one row per run, hazards in the reader's units, notes —
 * every figure rounded by the one rule of ./format. Screens, e-mails and reports lay these
 * strings out; none of them rounds, converts or names anything itself.
 */
import type { PlantResult, RunEstimate } from '../../engine';
import { displayFormat, NBSP, type DisplayFormat, type DisplayOptions } from './format';
import { presentHeadline, type PresentedHeadline } from './headline';
import { HAZARD_FLAGS, materialWords, PLANT_NOTE_WORDS, serviceWords, STATE_WORDS, surfaceWords } from './words';

/** A hazard of one run, worded in the reader's units. */
export interface PresentedHazard {
  readonly runId: string;
  readonly runLabel: string;
  readonly code: RunEstimate['hazards'][number]['code'];
  /** A few words, shown as a flag beside the run. */
  readonly flag: string;
  readonly tone: 'heat' | 'cold' | 'plain';
  /** The full sentence: "The surface runs at about 337 °F, above the 140 °F touch limit: …". */
  readonly sentence: string;
}

/** One run as a row or a card. */
export interface PresentedRun {
  readonly id: string;
  readonly label: string;
  readonly service: string;
  readonly cold: boolean;
  /** The line's own temperature ("338 °F") and, for steam, its gauge pressure ("100 psig"). */
  readonly line: { readonly temperature: string; readonly pressure: string | null };
  readonly length: string;
  /** "Bare", "Partly bare", "Insulated". */
  readonly state: string;
  readonly today: {
    /** "Heat lost" or, on a cold line, "Heat gained". */
    readonly heatLabel: string;
    readonly heatPerLength: string;
    readonly heatPerYear: string;
    readonly cost: string;
    readonly surface: string;
  };
  readonly proposed: {
    /** "1½ in of mineral wool with a PVC cover". */
    readonly summary: string;
    readonly thickness: string;
    readonly material: string;
    readonly cover: string;
    readonly surface: string;
    readonly coversFittings: boolean;
    readonly heatPerYear: string;
    /** What the run would still cost a year, insulated as proposed. */
    readonly cost: string;
  };
  readonly economicThickness: string | null;
  readonly saving: string;
  readonly installedCost: string;
  readonly payback: string;
  readonly hazards: readonly PresentedHazard[];
}

/** A whole estimate as a person reads it. */
export interface PresentedResult {
  readonly system: DisplayOptions['system'];
  readonly currency: string;
  readonly engineVersion: string;
  /** True when some run is a cold line (its heat is gained, not lost). */
  readonly hasColdLines: boolean;
  readonly headline: PresentedHeadline;
  readonly runs: readonly PresentedRun[];
  /** Every run's hazards, in run order. */
  readonly hazards: readonly PresentedHazard[];
  /** How many runs carry at least one hazard. */
  readonly runsWithHazards: number;
  /** Plant-wide notes on the figures, in our words. */
  readonly notes: readonly string[];
  /** How the figures were reached, sentence by sentence. */
  readonly basis: {
    readonly ranges: string;
    readonly lifeCycle: string;
    readonly prices: string;
    readonly co2: string;
    readonly boilerEfficiency: string;
    readonly pricesIllustrative: boolean;
  };
  /** The formatters these strings were made with, for anything a layout adds (chart axes). */
  readonly format: DisplayFormat;
}

function hazardsOf(run: RunEstimate, f: DisplayFormat): PresentedHazard[] {
  const pair = (a: number, b: number): [string, string] => {
    const whole = [f.temperature(a), f.temperature(b)] as [string, string];
    // Two different temperatures that round alike would contradict the sentence: show a decimal.
    return whole[0] === whole[1] ? [f.temperature(a, 1), f.temperature(b, 1)] : whole;
  };
  return run.hazards.map((hazard) => {
    const { flag, tone } = HAZARD_FLAGS[hazard.code];
    let sentence: string;
    switch (hazard.code) {
      case 'SURFACE_ABOVE_TOUCH_LIMIT': {
        const [surface, limit] = pair(run.current.surfaceTemperatureC, run.personnelProtection.touchLimitC);
        sentence = `The surface runs at about ${surface}, above the ${limit} touch limit: it can burn on contact.`;
        break;
      }
      case 'SURFACE_BELOW_DEW_POINT': {
        const [surface, dew] = pair(run.current.surfaceTemperatureC, run.air.dewPointC);
        sentence = `The surface runs at about ${surface}, below the air’s dew point of ${dew}: it will sweat, or frost, unless insulated with a sealed vapor retarder.`;
        break;
      }
      case 'MATERIAL_ABOVE_SERVICE_LIMIT':
        sentence = 'The insulation next to the pipe runs hotter than it is rated for; a material rated for the line’s temperature belongs next to the pipe.';
        break;
      case 'MATERIAL_BELOW_SERVICE_LIMIT':
        sentence = 'The insulation runs colder than it is rated for; a material rated for the line’s temperature belongs next to the pipe.';
        break;
      case 'INSULATION_BELOW_CRITICAL_RADIUS':
        sentence = 'On a pipe this small a thin layer adds surface faster than it adds resistance, so it lets out a little more heat, not less; a thicker layer cuts the loss.';
        break;
      case 'RAYLEIGH_BEYOND_CORRELATION':
        sentence = 'This line is larger than the still-air formula the estimate uses was fitted for; treat its figures as approximate.';
        break;
    }
    return { runId: run.id, runLabel: run.label, code: hazard.code, flag, tone, sentence };
  });
}

function presentRun(run: RunEstimate, result: PlantResult, f: DisplayFormat): PresentedRun {
  const coversFittings = run.proposed.coverFittings && run.fittings.valves + run.fittings.flangePairs > 0;
  const thickness = f.thickness(run.proposed.thicknessM);
  const material = materialWords(run.proposed.material);
  const cover = surfaceWords(run.proposed.jacket);
  const gaugeKPa = run.steamAbsolutePressureKPa === null ? null : run.steamAbsolutePressureKPa - result.assumptions.atmosphericPressureKPa;
  return {
    id: run.id,
    label: run.label,
    service: serviceWords(run.service),
    cold: run.cold,
    line: {
      temperature: f.temperature(run.fluidTemperatureC),
      pressure: gaugeKPa === null ? null : f.quantity(gaugeKPa, 'gaugePressure'),
    },
    length: f.quantity(run.lengthM, 'length'),
    state: STATE_WORDS[run.current.state],
    today: {
      heatLabel: run.cold ? 'Heat gained' : 'Heat lost',
      heatPerLength: f.quantity(Math.abs(run.current.heatLossWPerM), 'heatPerLength'),
      heatPerYear: f.quantity(run.current.annualHeatGJ, 'energyPerYear'),
      cost: f.money(run.current.annualCost),
      surface: f.temperature(run.current.surfaceTemperatureC),
    },
    proposed: {
      summary: `${thickness} of ${material.toLowerCase()} with ${cover}${coversFittings ? ', and removable covers on the fittings' : ''}`,
      thickness,
      material,
      cover,
      surface: f.temperature(run.proposed.surfaceTemperatureC),
      coversFittings,
      heatPerYear: f.quantity(run.proposed.annualHeatGJ, 'energyPerYear'),
      cost: f.money(run.proposed.annualCost),
    },
    economicThickness: run.economicThickness ? f.thickness(run.economicThickness.thicknessM) : null,
    saving: f.money(run.savings.annualCost),
    installedCost: f.money(run.installedCost),
    payback: f.years(run.simplePaybackYears),
    hazards: hazardsOf(run, f),
  };
}

/**
 * A PlantResult as a person reads it, in their unit system (the one they filled the form
 * in) and the plant's currency. Pure: the same result and options always give the same
 * strings, wherever they are shown.
 */
export function presentResult(result: PlantResult, options: DisplayOptions): PresentedResult {
  const f = displayFormat({ ...options, currency: result.currency });
  const { totals, range, assumptions } = result;
  const hasColdLines = result.runs.some((run) => run.cold);
  const net = totals.lifeCycle.netSaving;
  const illustrative = assumptions.priceTableIllustrative;
  const runs = result.runs.map((run) => presentRun(run, result, f));
  const hazards = runs.flatMap((run) => run.hazards);

  return {
    system: options.system,
    currency: result.currency,
    engineVersion: result.engineVersion,
    hasColdLines,
    headline: presentHeadline(result, f),
    runs,
    hazards,
    runsWithHazards: runs.filter((run) => run.hazards.length > 0).length,
    notes: result.warnings.map((warning) => PLANT_NOTE_WORDS[warning.code]),
    basis: {
      ranges: `Ranges run from the 10th to the 90th percentile of ${f.number(range.samples, 6)} samples over the answers marked as estimates or guesses.`,
      lifeCycle: `Over ${assumptions.horizonYears} years, counting fuel rising ${f.number(assumptions.fuelEscalationPercent)}${NBSP}% a year and money discounted at ${f.number(assumptions.discountRatePercent)}${NBSP}%, insulating comes out ${f.money(Math.abs(net))} ${net >= 0 ? 'ahead' : 'behind'}.`,
      prices: illustrative
        ? 'Installed costs are Lagwise’s illustrative prices, not a quotation; a consultant prices the real work.'
        : `Installed costs: ${assumptions.priceTable}.`,
      co2: `CO₂ by ${assumptions.emissionFactor.label}.`,
      boilerEfficiency: f.percent(assumptions.boilerEfficiency),
      pricesIllustrative: illustrative,
    },
    format: f,
  };
}
