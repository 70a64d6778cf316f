/**
 * One way to show an estimate. {@link presentResult} turns the engine's PlantResult (live
 * from /api/estimate, or stored with an assessment) into what a person reads — names,
 * headline figures with their ranges, one row per run with the choice made for it, hazards
 * and notices in the reader's units, notes — every figure rounded by the one rule of
 * ./format. Screens, e-mails and reports lay these strings out; none of them rounds,
 * converts or names anything itself, and no engine sentence (written in SI) reaches a reader.
 */
import type { InputNotice, OptionKind, PlantResult, PlantWarning, RunEstimate } from '../../engine';
import { displayFormat, type DisplayFormat, type DisplayOptions } from './format';
import { NBSP } from './rounding';
import { presentHeadline, type PresentedHeadline } from './headline';
import { HAZARD_FLAGS, materialWords, OPTION_WORDS, PLANT_NOTE_WORDS, serviceWords, STATE_WORDS, surfaceWords } from './words';

/** A hazard of one run, worded in the reader's units. */
export interface PresentedHazard {
  readonly runId: string;
  readonly runLabel: string;
  readonly code: RunEstimate['hazards'][number]['code'];
  /** A few words, shown as a flag beside the run. */
  readonly flag: string;
  readonly tone: 'heat' | 'cold' | 'plain';
  /** The full sentence: "On the hottest still day the surface reaches about 337 °F, above the 140 °F touch limit: …". */
  readonly sentence: string;
}

/** Something about a run's answers worth a second look, said at its field in the reader's units. */
export interface PresentedNotice {
  readonly runId: string;
  readonly code: InputNotice['code'];
  /** The form field concerned (dotted path, as the engine gives it). */
  readonly path: string;
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
  /** The choice made for the run and why, in our words. */
  readonly choice: {
    readonly option: OptionKind;
    /** "Insulate", "Leave as it is". */
    readonly label: string;
    /** Why: "Insulating it costs least over 20 years of the choices that are safe." */
    readonly reason: string;
  };
  readonly proposed: {
    /** "Insulate: 1½ in of mineral wool with a PVC cover"; "Leave as it is". */
    readonly summary: string;
    /** What goes on; null when the run is left as it is. */
    readonly work: { readonly thickness: string; readonly material: string; readonly cover: string } | null;
    readonly surface: string;
    readonly coversFittings: boolean;
    readonly heatPerYear: string;
    /** What the run would still cost a year after the work. */
    readonly cost: string;
  };
  readonly economicThickness: string | null;
  readonly saving: string;
  readonly installedCost: string;
  readonly payback: string;
  readonly hazards: readonly PresentedHazard[];
  readonly notices: readonly PresentedNotice[];
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
  /** How many runs have work recommended ("3 of 5 runs"). */
  readonly runsWithWork: string;
  /** Plant-wide notes on the figures, in our words and the reader's units. */
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

/** Two temperatures that round alike would contradict their sentence: then both get a decimal. */
function temperaturePair(f: DisplayFormat, a: number, b: number): [string, string] {
  const whole: [string, string] = [f.temperature(a), f.temperature(b)];
  return whole[0] === whole[1] ? [f.temperature(a, 1), f.temperature(b, 1)] : whole;
}

function fittingsWord(count: number): string {
  return `${count} bare fitting${count === 1 ? '' : 's'}`;
}

function hazardsOf(run: RunEstimate, f: DisplayFormat): PresentedHazard[] {
  const touchLimitC = run.personnelProtection.touchLimitC;
  const dewC = run.condensationControl.dewPointC;
  return run.hazards.map((hazard) => {
    const { flag, tone } = HAZARD_FLAGS[hazard.code];
    const sentence = ((): string => {
      switch (hazard.code) {
        case 'SURFACE_ABOVE_TOUCH_LIMIT': {
          const [surface, limit] = temperaturePair(f, run.current.designSurfaceTemperatureC, touchLimitC);
          return `On the hottest still day the surface reaches about ${surface}, above the ${limit} touch limit: it can burn on contact.`;
        }
        case 'SURFACE_BELOW_DEW_POINT': {
          const [surface, dew] = temperaturePair(f, run.current.designSurfaceTemperatureC, dewC);
          return `In the dampest hour the surface sits at about ${surface}, below the air’s dew point of ${dew}: it will sweat, or frost, unless insulated with a sealed vapor retarder.`;
        }
        case 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT':
          return `${fittingsWord(run.fittings.uncoveredCount)} on this line ${run.fittings.uncoveredCount === 1 ? 'runs' : 'run'} above the ${f.temperature(touchLimitC)} touch limit on the hottest still day: removable covers would stop burns.`;
        case 'BARE_FITTINGS_BELOW_DEW_POINT':
          return `${fittingsWord(run.fittings.uncoveredCount)} on this line ${run.fittings.uncoveredCount === 1 ? 'sits' : 'sit'} below the ${f.temperature(dewC)} dew point in the dampest hour: ${run.fittings.uncoveredCount === 1 ? 'it' : 'they'} will drip onto whatever is below; removable covers with a vapor retarder stop it.`;
        case 'MATERIAL_ABOVE_SERVICE_LIMIT':
          return 'The insulation next to the pipe runs hotter than it is rated for; a material rated for the line’s temperature belongs next to the pipe.';
        case 'MATERIAL_BELOW_SERVICE_LIMIT':
          return 'The insulation runs colder than it is rated for; a material rated for the line’s temperature belongs next to the pipe.';
        case 'INSULATION_BELOW_CRITICAL_RADIUS':
          return 'On a pipe this small a thin layer adds surface faster than it adds resistance, so it lets out a little more heat, not less; a thicker layer cuts the loss.';
        case 'RAYLEIGH_BEYOND_CORRELATION':
          return 'This line is larger than the still-air formula the estimate uses was fitted for; treat its figures as approximate.';
      }
    })();
    return { runId: run.id, runLabel: run.label, code: hazard.code, flag, tone, sentence };
  });
}

function noticeSentence(run: RunEstimate, notice: InputNotice, f: DisplayFormat): string {
  const given = notice.params?.givenSI;
  const limit = notice.params?.limitSI;
  const name = `“${run.label}”`;
  const temperature = (c: number | undefined) => (c === undefined ? null : f.temperature(c));
  switch (notice.code) {
    case 'RUN_LONGER_THAN_1_KM':
      return `${name} is ${given === undefined ? 'very' : f.quantity(given, 'length')} long; a small plant’s runs are usually far shorter. Check the length and its unit.`;
    case 'MANY_VALVES':
      return `${name} lists ${given ?? 'many'} valves; more than ${limit ?? 'a few dozen'} on one run is unusual. Check the count.`;
    case 'HOT_WATER_ABOVE_BOILING':
      return `${name} carries water at ${temperature(given) ?? 'a temperature'} above its boiling point${limit === undefined ? '' : ` of about ${f.temperature(limit)}`}: it would flash to steam. Check the temperature or give the line’s pressure.`;
    case 'GLYCOL_ABOVE_60C':
      return `${name} carries glycol at ${temperature(given) ?? 'a high temperature'}; glycol loops in food plants run cold, rarely above ${temperature(limit) ?? 'warm'}. Check the service or the temperature.`;
    case 'STEAM_BELOW_ATMOSPHERIC':
      return `${name} gives steam below atmospheric pressure${given === undefined ? '' : ` (${f.quantity(given, 'gaugePressure')})`}; process steam runs above it. Check the sign and the unit.`;
    case 'MEASURED_BELOW_SATURATION':
      return `The bare steam line ${name} reads about ${temperature(given) ?? 'less'}, well under saturated steam at the stated pressure: the line may run only part of the time, hold condensate or have a wrong gauge, or a shiny surface may have misled an infrared reading.`;
    case 'MEASURED_CLOSE_TO_AIR':
      return `${name}: the insulated surface reads too close to the air to judge the insulation’s condition from; the catalog figure is kept.`;
  }
}

function choiceReason(run: RunEstimate, horizonYears: number): string {
  const doing = OPTION_WORDS[run.proposed.option].doing;
  const over = `over ${horizonYears} years`;
  switch (run.choice.code) {
    case 'FORCED':
      return `${doing} was chosen for this run by hand; the other choices are shown beside it.`;
    case 'NO_OPTION_MEETS_SAFETY':
      return `Nothing in stock keeps this run ${run.cold ? 'above the dew point' : 'under the touch limit'}; ${doing.toLowerCase()} comes closest.`;
    case 'NOTHING_PAYS':
      return run.options.length > 1 ? `Left as it is: no work on this run pays for itself ${over}, and it is safe as it stands.` : 'Left as it is.';
    case 'SAFETY_ONLY':
      return `${doing} is for safety: as it stands the run ${run.cold ? 'sweats' : 'can burn on contact'}, but the work does not pay for itself in energy ${over}.`;
    case 'LEAST_LIFE_CYCLE_COST':
      return `${doing} costs least ${over} of the choices that are safe.`;
  }
}

function presentRun(run: RunEstimate, result: PlantResult, f: DisplayFormat): PresentedRun {
  const option = run.proposed.option;
  const work =
    option === 'leave'
      ? null
      : { thickness: f.thickness(run.proposed.thicknessM), material: materialWords(run.proposed.material), cover: surfaceWords(run.proposed.jacket) };
  const coversFittings = option !== 'leave' && run.proposed.coverFittings && run.fittings.uncoveredCount > 0;
  const gaugeKPa = run.steamAbsolutePressureKPa === null ? null : run.steamAbsolutePressureKPa - result.assumptions.atmosphericPressureKPa;
  const label = OPTION_WORDS[option].label;
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
    choice: { option, label, reason: choiceReason(run, result.assumptions.horizonYears) },
    proposed: {
      summary: work
        ? `${label}: ${work.thickness} of ${work.material.toLowerCase()} with ${work.cover}${coversFittings ? ', and removable covers on the fittings' : ''}`
        : label,
      work,
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
    notices: run.notices.map((notice) => ({ runId: run.id, code: notice.code, path: notice.path, sentence: noticeSentence(run, notice, f) })),
  };
}

function noteOf(warning: PlantWarning, result: PlantResult, runs: readonly PresentedRun[], f: DisplayFormat): string {
  if (warning.code !== 'NO_STOCK_MEETS_NEED' && warning.code !== 'INPUT_NOTICE') return PLANT_NOTE_WORDS[warning.code];
  const index = result.runs.findIndex((run) => run.id === warning.runId);
  const run = result.runs[index];
  const shown = runs[index];
  if (!run || !shown) return 'An answer is worth a second look; see the runs.';
  if (warning.code === 'INPUT_NOTICE') {
    return shown.notices.find((notice) => notice.path === warning.path)?.sentence ?? `An answer for “${run.label}” is worth a second look.`;
  }
  return run.cold
    ? `“${run.label}”: no stock thickness keeps the surface above the ${f.temperature(run.condensationControl.dewPointC)} dew point in the dampest hour. Dry the room’s air or choose a better material.`
    : `“${run.label}”: no stock thickness keeps the surface under the ${f.temperature(run.personnelProtection.touchLimitC)} touch limit on the hottest day. Guard the line or choose another material.`;
}

/**
 * A PlantResult as a person reads it, in their unit system (the one they filled the form
 * in) and the plant's currency. Pure: the same result and options always give the same
 * strings, wherever they are shown.
 */
export function presentResult(result: PlantResult, options: DisplayOptions): PresentedResult {
  const f = displayFormat({ ...options, currency: result.currency });
  const { totals, range, assumptions } = result;
  const net = totals.lifeCycle.netSaving;
  const illustrative = assumptions.priceTableIllustrative;
  const runs = result.runs.map((run) => presentRun(run, result, f));
  const hazards = runs.flatMap((run) => run.hazards);

  return {
    system: options.system,
    currency: result.currency,
    engineVersion: result.engineVersion,
    hasColdLines: result.runs.some((run) => run.cold),
    headline: presentHeadline(result, f),
    runs,
    hazards,
    runsWithHazards: runs.filter((run) => run.hazards.length > 0).length,
    runsWithWork: `${totals.runsWithWork} of ${result.runs.length} run${result.runs.length === 1 ? '' : 's'}`,
    notes: result.warnings.map((warning) => noteOf(warning, result, runs, f)),
    basis: {
      ranges: `Ranges run from the 10th to the 90th percentile of ${f.number(range.samples, 6)} samples over the answers marked as estimates or guesses.`,
      lifeCycle: `Over ${assumptions.horizonYears} years, counting fuel rising ${f.number(assumptions.fuelEscalationPercent)}${NBSP}% a year and money discounted at ${f.number(assumptions.discountRatePercent)}${NBSP}%, the recommended work comes out ${f.money(Math.abs(net))} ${net >= 0 ? 'ahead' : 'behind'}.`,
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
