/**
 * One way to show a report: {@link presentReport} turns a version (or a draft as composed now)
 * into every string a reader sees — headline figures with their ranges, the ranked actions, run
 * by run recommendations, findings, incentives, exclusions, the assumptions and method, the
 * cautions. The web page, the composer's preview, the e-mail and the PDF lay these strings out;
 * none of them rounds, converts or words a figure itself.
 */
import {
  INSULATION_MATERIALS,
  PIPE_MATERIALS,
  SURFACES,
  serviceDefaults,
  SERVICE_IDS,
  type OptionKind,
  type PlantResult,
  type RunEstimate,
  type ServiceId,
} from '../../engine';
import type { FindingKind, ReportComposition, RunChoice } from '../../schemas/reports';
import type { UnitSystem } from '../units-display';
import { cautions, type Caution } from '../cautions';
import { reportFigures, QUICK_WIN_YEARS, type ReportFigures } from './figures';
import { displayFormat, surfaceLabel, type DisplayFormat } from '../presentation';

/** What a report is presented from. */
export interface ReportSource {
  readonly result: PlantResult;
  readonly composition: ReportComposition;
  /** The PlantInput the result was worked out from (hours, areas and finishes are read from it). */
  readonly plantInput: Record<string, unknown>;
  readonly consultant: { readonly name: string; readonly firm: string | null; readonly email: string | null; readonly phone: string | null };
  readonly plant: { readonly name: string; readonly reference: string; readonly unitSystem: UnitSystem };
  readonly version: number | null;
  readonly sentAt: string | null;
  readonly replacedBy: { readonly version: number; readonly sentAt: string } | null;
  readonly baseRevisionNumber: number;
}

/** One headline figure. `key` names it the same on every medium (tests match them). */
export interface ReportFigure {
  readonly key: string;
  readonly label: string;
  readonly value: string;
  readonly range: string | null;
  readonly note: string | null;
}

export interface PresentedAction {
  readonly rank: number;
  readonly runLabel: string;
  readonly what: string;
  readonly cost: string;
  readonly saving: string;
  readonly payback: string;
  /** "Quick win", "For safety", or empty. */
  readonly tag: string;
}

export interface PresentedReportRun {
  readonly id: string;
  readonly label: string;
  /** "Steam · 2 in · 30 m · 337 °F". */
  readonly line: string;
  readonly today: string;
  readonly todayCost: string;
  readonly recommendation: string;
  readonly priceSource: string;
  readonly installedCost: string;
  readonly saving: string;
  readonly payback: string;
  readonly reason: string | null;
  readonly hazards: readonly string[];
}

export interface PresentedFinding {
  readonly kind: string;
  readonly where: string;
  readonly reading: string | null;
  readonly note: string | null;
}

/** A chart drawn the same way on the page and in the PDF: geometry in a 600 × 220 box, labels in our words. */
export interface ReportChart {
  readonly title: string;
  readonly caption: string;
  readonly width: number;
  readonly height: number;
  readonly bars: readonly { readonly x: number; readonly y: number; readonly w: number; readonly h: number; readonly tone: 'loss' | 'gain' | 'plain' }[];
  readonly lines: readonly { readonly x1: number; readonly y1: number; readonly x2: number; readonly y2: number; readonly tone: 'axis' | 'grid' | 'mark' }[];
  readonly labels: readonly { readonly x: number; readonly y: number; readonly text: string; readonly anchor: 'start' | 'middle' | 'end' }[];
}

export interface PresentedReport {
  readonly title: string;
  readonly plantName: string;
  readonly reference: string;
  /** "Version 2, sent 4 March 2026", or "Draft (not sent)". */
  readonly versionLine: string;
  readonly replacedLine: string | null;
  readonly basedOn: string;
  readonly consultantLine: string;
  readonly consultantContact: string;
  readonly introduction: string;
  readonly headline: readonly ReportFigure[];
  readonly actions: readonly PresentedAction[];
  readonly actionsNote: string;
  readonly runs: readonly PresentedReportRun[];
  readonly findings: readonly PresentedFinding[];
  readonly incentives: readonly { readonly text: string; readonly amount: string }[];
  readonly incentivesTotal: string | null;
  readonly exclusions: readonly string[];
  readonly notes: string;
  readonly charts: readonly ReportChart[];
  readonly assumptions: readonly { readonly title: string; readonly lines: readonly string[] }[];
  readonly cautions: readonly Caution[];
  readonly footer: string;
  readonly figures: ReportFigures;
}

const OPTION_LABELS: Readonly<Record<OptionKind, string>> = {
  leave: 'Leave as it is',
  repair: 'Repair the bare parts',
  insulate: 'Insulate',
  'add-layer': 'Add a layer',
  replace: 'Replace the insulation',
};

const FINDING_LABELS: Readonly<Record<FindingKind, string>> = {
  'burn-point': 'Burn point',
  sweating: 'Sweating over product',
  asbestos: 'Suspected asbestos',
  corrosion: 'Corrosion under insulation',
};

const CONFIDENCE_WORDS: Readonly<Record<string, string>> = {
  measured: 'measured on site',
  estimated: 'the owner’s estimate',
  guessed: 'a typical figure, not yet checked',
};

const longDate = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' });

function materialName(id: string): string {
  return INSULATION_MATERIALS.find((m) => m.id === id)?.name ?? id;
}

/** A surface or cover by the pick-lists' own name (the one the forms show). */
function surfaceName(id: string): string {
  return surfaceLabel(id);
}

function serviceName(id: string): string {
  return (SERVICE_IDS as readonly string[]).includes(id) ? serviceDefaults(id as ServiceId).name : id;
}

function recommendationOf(run: RunEstimate, f: DisplayFormat): string {
  const option = run.proposed.option;
  if (option === 'leave') return OPTION_LABELS.leave;
  const covers = run.proposed.coverFittings && run.fittings.uncoveredCount > 0 ? `, removable covers on ${run.fittings.uncoveredCount} fitting${run.fittings.uncoveredCount === 1 ? '' : 's'}` : '';
  if (option === 'repair') return `${OPTION_LABELS.repair}: ${f.thickness(run.proposed.thicknessM)} ${materialName(run.proposed.material).toLowerCase()}, ${surfaceName(run.proposed.jacket).toLowerCase()}${covers}`;
  return `${OPTION_LABELS[option]}: ${f.thickness(run.proposed.thicknessM)} ${materialName(run.proposed.material).toLowerCase()}, ${surfaceName(run.proposed.jacket).toLowerCase()}${covers}`;
}

function hazardSentences(run: RunEstimate, f: DisplayFormat): string[] {
  return run.hazards.map((hazard) => {
    switch (hazard.code) {
      case 'SURFACE_ABOVE_TOUCH_LIMIT':
        return `Today the surface reaches about ${f.temperature(run.current.designSurfaceTemperatureC)} on the hottest still day, above the ${f.temperature(run.personnelProtection.touchLimitC)} touch limit.`;
      case 'SURFACE_BELOW_DEW_POINT':
        return `Today the surface sits at about ${f.temperature(run.current.designSurfaceTemperatureC)} in the wettest hour, below the ${f.temperature(run.condensationControl.dewPointC)} dew point: it sweats.`;
      case 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT':
        return `${run.fittings.uncoveredCount} bare fitting${run.fittings.uncoveredCount === 1 ? '' : 's'} above the touch limit.`;
      case 'BARE_FITTINGS_BELOW_DEW_POINT':
        return `${run.fittings.uncoveredCount} bare fitting${run.fittings.uncoveredCount === 1 ? '' : 's'} below the dew point: they drip.`;
      default:
        return hazard.message;
    }
  });
}

function paybackText(f: DisplayFormat, years: number | null): string {
  return years === null ? 'for safety' : f.years(years);
}

function runsOfInput(plant: Record<string, unknown>): Record<string, unknown>[] {
  return Array.isArray(plant.runs) ? (plant.runs as Record<string, unknown>[]) : [];
}

function presentRun(run: RunEstimate, choice: RunChoice | undefined, f: DisplayFormat, atmosphereKPa: number): PresentedReportRun {
  const pressure = run.steamAbsolutePressureKPa === null ? null : f.quantity(run.steamAbsolutePressureKPa - atmosphereKPa, 'gaugePressure');
  const line = [serviceName(run.service), f.quantity(run.lengthM, 'length'), f.temperature(run.fluidTemperatureC), pressure].filter(Boolean).join(' · ');
  const heat = `${run.cold ? 'gains' : 'loses'} ${f.quantity(Math.abs(run.current.heatLossWPerM), 'heatPerLength')}`;
  const state = run.current.state === 'bare' ? 'Bare' : run.current.state === 'damaged' ? 'Partly bare' : 'Insulated';
  return {
    id: run.id,
    label: run.label,
    line,
    today: `${state}; ${heat}`,
    todayCost: `${f.money(run.current.annualCost)} a year`,
    recommendation: recommendationOf(run, f),
    priceSource: choice?.price ? 'your price for this run' : 'price table',
    installedCost: f.money(run.installedCost),
    saving: `${f.money(run.savings.annualCost)} a year`,
    payback: run.proposed.option === 'leave' ? '—' : paybackText(f, run.simplePaybackYears),
    reason: choice?.reason ? choice.reason : null,
    hazards: hazardSentences(run, f),
  };
}

/** Cumulative position year by year after paying for the work (incentives counted), as bars. */
function cashFlowChart(figures: ReportFigures, f: DisplayFormat): ReportChart {
  const width = 600;
  const height = 220;
  const left = 70;
  const right = 10;
  const top = 14;
  const bottom = 30;
  const values = figures.cashFlow.map((y) => y.cumulative);
  const max = Math.max(0, ...values);
  const min = Math.min(0, ...values);
  const span = max - min || 1;
  const y = (v: number) => top + ((max - v) / span) * (height - top - bottom);
  const slot = (width - left - right) / Math.max(1, values.length);
  const bars = figures.cashFlow.map((point, i) => {
    const y0 = y(0);
    const y1 = y(point.cumulative);
    return { x: left + i * slot + slot * 0.15, y: Math.min(y0, y1), w: slot * 0.7, h: Math.max(0.5, Math.abs(y1 - y0)), tone: point.cumulative >= 0 ? ('gain' as const) : ('loss' as const) };
  });
  const labels: ReportChart['labels'][number][] = [
    { x: left - 6, y: y(max) + 4, text: f.money(max), anchor: 'end' as const },
    { x: left - 6, y: y(0) + 4, text: f.money(0), anchor: 'end' as const },
    ...(min < 0 ? [{ x: left - 6, y: y(min) + 4, text: f.money(min), anchor: 'end' as const }] : []),
    ...figures.cashFlow
      .filter((point) => point.year === 0 || point.year === figures.horizonYears || point.year % 5 === 0)
      .map((point) => ({ x: left + figures.cashFlow.indexOf(point) * slot + slot / 2, y: height - 10, text: point.year === 0 ? 'now' : `year ${point.year}`, anchor: 'middle' as const })),
  ];
  const lines: ReportChart['lines'][number][] = [
    { x1: left, y1: y(0), x2: width - right, y2: y(0), tone: 'axis' as const },
    { x1: left, y1: top, x2: left, y2: height - bottom, tone: 'axis' as const },
  ];
  const payback = figures.paybackYears;
  if (payback !== null && payback <= figures.horizonYears) {
    const x = left + payback * slot + slot / 2;
    lines.push({ x1: x, y1: top, x2: x, y2: height - bottom, tone: 'mark' as const });
    labels.push({ x: x + 4, y: top + 10, text: `paid back after ${f.years(payback)}`, anchor: 'start' as const });
  }
  return {
    title: `Money ahead after the work, year by year (${figures.horizonYears} years)`,
    caption: 'Savings so far less what the work costs you, with fuel prices rising as assumed; below the line you have not yet earned it back.',
    width,
    height,
    bars,
    lines,
    labels,
  };
}

/** Yearly cost of each recommended run today against after the work, the largest first (at most 8). */
function runCostChart(result: PlantResult, f: DisplayFormat): ReportChart {
  const width = 600;
  const rows = result.runs.filter((r) => r.proposed.option !== 'leave').sort((a, b) => b.current.annualCost - a.current.annualCost).slice(0, 8);
  const rowHeight = 24;
  const top = 8;
  const left = 170;
  const right = 70;
  const height = top + rows.length * rowHeight + 22;
  const max = Math.max(1, ...rows.map((r) => r.current.annualCost));
  const scale = (v: number) => (Math.max(0, v) / max) * (width - left - right);
  const bars: ReportChart['bars'][number][] = [];
  const labels: ReportChart['labels'][number][] = [];
  rows.forEach((run, i) => {
    const y0 = top + i * rowHeight;
    bars.push({ x: left, y: y0 + 3, w: Math.max(0.5, scale(run.current.annualCost)), h: 8, tone: 'loss' });
    bars.push({ x: left, y: y0 + 12, w: Math.max(0.5, scale(run.proposed.annualCost)), h: 8, tone: 'gain' });
    labels.push({ x: left - 6, y: y0 + 15, text: run.label.length > 28 ? `${run.label.slice(0, 27)}…` : run.label, anchor: 'end' });
    labels.push({ x: left + scale(run.current.annualCost) + 4, y: y0 + 11, text: f.money(run.current.annualCost), anchor: 'start' });
  });
  labels.push({ x: left, y: height - 6, text: 'upper bar: a year today · lower bar: a year after the work', anchor: 'start' });
  return {
    title: 'What each run costs a year, today and after the work',
    caption: 'Heat cost of the runs where work is recommended, largest first.',
    width,
    height,
    bars,
    lines: [{ x1: left, y1: top, x2: left, y2: top + rows.length * rowHeight, tone: 'axis' }],
    labels,
  };
}

function assumptionsOf(source: ReportSource, f: DisplayFormat): PresentedReport['assumptions'] {
  const { result, plantInput } = source;
  const a = result.assumptions;
  const inputRuns = runsOfInput(plantInput);
  const areas = Array.isArray(plantInput.areas) ? (plantInput.areas as { id?: string; label?: string }[]) : [];
  const areaName = (id: string) => areas.find((area) => area.id === id)?.label ?? id.replace(/-/g, ' ');
  const byArea = new Map<string, RunEstimate>();
  for (const run of result.runs) if (!byArea.has(run.areaId)) byArea.set(run.areaId, run);
  const conditions = [...byArea.entries()].map(
    ([id, run]) =>
      `${areaName(id)}: ${f.temperature(run.air.temperatureC)} on average, air moving ${f.quantity(run.air.speedMPerS, 'speed')}; design: ${f.temperature(run.designAir.hotTemperatureC)} on the hottest still day, ${f.percent(run.designAir.wetRelativeHumidityPercent / 100)} humidity at ${f.temperature(run.designAir.wetTemperatureC)} in the wettest hour.`,
  );
  const hours = Number(plantInput.operatingHoursPerYear ?? 6000);
  const hoursConfidence = String(plantInput.operatingHoursConfidence ?? 'guessed');
  const ownHours = result.runs.filter((run) => run.operatingHoursPerYear !== hours);
  const jackets = [...new Set(result.runs.filter((r) => r.proposed.option !== 'leave').map((r) => r.proposed.jacket))];
  const finishes = [...new Set(inputRuns.map((r) => (typeof r.finish === 'string' ? r.finish : null)).filter((x): x is string => x !== null))];
  const typed = source.composition.runs.filter((c) => c.price).map((c) => result.runs.find((r) => r.id === c.runId)?.label ?? c.runId);
  return [
    {
      title: 'Air around the runs: average and design',
      lines: [
        'Energy, money and CO₂ use each area’s air over the year on average; burn and sweat checks use design air — the hottest still day and the wettest hour — so a line safe on an average day is not passed as safe.',
        ...conditions,
      ],
    },
    {
      title: 'Operating hours',
      lines: [
        `${f.number(hours)} hours a year (${CONFIDENCE_WORDS[hoursConfidence] ?? hoursConfidence}).`,
        ...ownHours.map((run) => `“${run.label}” runs ${f.number(run.operatingHoursPerYear)} hours a year.`),
      ],
    },
    {
      title: 'Surface emittances',
      lines: [
        ...jackets.map((id) => `${surfaceName(id)} over new insulation: emittance ${SURFACES.find((s) => s.id === id)?.emittance ?? '—'}.`),
        ...finishes.map((id) => `Bare pipe, ${surfaceName(id).toLowerCase()}: emittance ${SURFACES.find((s) => s.id === id)?.emittance ?? '—'}.`),
        `Other bare pipe by its material: ${PIPE_MATERIALS.map((m) => `${m.name.toLowerCase()} ${SURFACES.find((s) => s.id === m.bareSurface)?.emittance ?? '—'}`).join(', ')}.`,
      ],
    },
    {
      title: 'Prices',
      lines: [
        a.priceTableIllustrative ? 'Installed costs: Lagwise’s illustrative demo prices, not a quotation.' : `Installed costs: ${a.priceTable}.`,
        ...(typed.length ? [`Priced by hand for this plant: ${typed.map((label) => `“${label}”`).join(', ')}.`] : []),
        `Fuel at ${f.money(a.fuelCostPerGJ)} per GJ of fuel energy, boiler efficiency ${f.percent(a.boilerEfficiency)}${a.electricityPricePerKWh !== null ? `; chillers at a coefficient of performance of ${f.number(a.chillerCoefficientOfPerformance)}` : ''}.`,
        `Life-cycle figures over ${a.horizonYears} years, money discounted at ${f.number(a.discountRatePercent)} % a year, fuel rising ${f.number(a.fuelEscalationPercent)} % a year.`,
        `CO₂ by ${a.emissionFactor.label} (${f.number(a.emissionFactor.kgCo2PerGJ)} kg CO₂ per GJ of fuel).`,
        `Ranges run from the 10th to the 90th percentile of ${f.number(result.range.samples)} samples of the inputs that are estimated or guessed.`,
      ],
    },
    {
      title: 'Method',
      lines: [
        'Heat flow per meter through the pipe wall and each insulation layer by the method for insulated cylinders of ASTM C680, each layer’s conductivity averaged over its own temperature span.',
        'Outer surface: natural convection by Churchill & Chu (1975), wind and drafts by Churchill & Bernstein (1977), radiation by the Stefan–Boltzmann law with the emittances above.',
        'Steam temperature from its pressure by IAPWS-IF97; dew point by the Magnus form (Alduchov & Eskridge, 1996); insulation thicknesses as made (ASTM C585).',
        'Touch limit from the burn thresholds of ASTM C1055; life-cycle cost as present worth with uniform escalation (NIST Handbook 135).',
        `Lagwise engine ${result.engineVersion}.`,
      ],
    },
  ];
}

const FINDING_CAUTIONS: Readonly<Record<FindingKind, string>> = {
  'burn-point': 'burn',
  sweating: 'drop',
  asbestos: 'fibre',
  corrosion: 'code',
};

/** A report as a person reads it; pure, so every medium shows the same strings. */
export function presentReport(source: ReportSource): PresentedReport {
  const { result, composition, consultant, plant } = source;
  const f = displayFormat({ system: plant.unitSystem, currency: result.currency });
  const figures = reportFigures(result, composition);
  const choices = new Map(composition.runs.map((c) => [c.runId, c]));
  const labelOf = new Map(result.runs.map((r) => [r.id, r.label]));
  const a = result.assumptions;
  const headline: ReportFigure[] = [
    { key: 'saving', label: 'Saving a year', value: f.money(figures.annualSaving.likely), range: f.moneyRange(figures.annualSaving.low, figures.annualSaving.high).text, note: null },
    { key: 'installed', label: 'Installed cost', value: f.money(figures.installedCost.likely), range: f.moneyRange(figures.installedCost.low, figures.installedCost.high).text, note: null },
    ...(figures.incentivesTotal > 0
      ? [{ key: 'net-cost', label: 'After incentives', value: f.money(figures.netCost), range: null, note: `${f.money(figures.incentivesTotal)} of incentives` }]
      : []),
    {
      key: 'payback',
      label: 'Payback',
      value: paybackText(f, figures.paybackYears),
      range: figures.paybackRange ? f.yearsRange(figures.paybackRange.low, figures.paybackRange.high).text : null,
      note: null,
    },
    {
      key: 'life-cycle',
      label: `${figures.lifeCycleNetSaving >= 0 ? 'Ahead' : 'Behind'} after ${figures.horizonYears} years`,
      value: f.money(Math.abs(figures.lifeCycleNetSaving)),
      range: null,
      note: `${f.money(figures.lifeCycleProposedCost)} with the work, against ${f.money(figures.lifeCycleCurrentCost)} as it is`,
    },
    {
      key: 'co2',
      label: 'CO₂ avoided a year',
      value: f.co2(figures.annualCo2SavingKg.likely),
      range: f.co2Range(figures.annualCo2SavingKg.low, figures.annualCo2SavingKg.high).text,
      note: `${f.number(a.emissionFactor.kgCo2PerGJ)} kg CO₂ per GJ of fuel, ${a.emissionFactor.label}`,
    },
    { key: 'heat', label: 'Heat saved a year', value: f.quantity(figures.annualHeatSavingGJ.likely, 'energyPerYear'), range: f.quantityRange(figures.annualHeatSavingGJ.low, figures.annualHeatSavingGJ.high, 'energyPerYear').text, note: null },
    ...(figures.steamSavedKgPerHour > 0
      ? [{ key: 'steam', label: 'Steam saved', value: f.quantity(figures.steamSavedKgPerHour, 'steamRate'), range: null, note: `${f.quantity(figures.steamSavedKgPerYear, 'steamMass')} a year` }]
      : []),
  ];
  const actions: PresentedAction[] = figures.actions.map((action) => {
    const run = result.runs.find((r) => r.id === action.runId) as RunEstimate;
    return {
      rank: action.rank,
      runLabel: action.runLabel,
      what: recommendationOf(run, f),
      cost: f.money(action.installedCost),
      saving: `${f.money(action.annualSaving)} a year`,
      payback: paybackText(f, action.paybackYears),
      tag: action.quickWin ? 'Quick win' : action.forSafety ? 'For safety' : '',
    };
  });
  const sent = source.sentAt ? longDate.format(new Date(source.sentAt)) : null;
  const firm = consultant.firm ? `, ${consultant.firm}` : '';
  const kinds = new Set(composition.findings.map((finding) => FINDING_CAUTIONS[finding.kind]));
  return {
    title: 'Follow-up report',
    plantName: plant.name,
    reference: plant.reference,
    versionLine: source.version === null ? 'Draft, not sent' : `Version ${source.version}${sent ? `, sent ${sent}` : ''}`,
    replacedLine: source.replacedBy ? `Replaced by version ${source.replacedBy.version} on ${longDate.format(new Date(source.replacedBy.sentAt))}: read that one for the current figures.` : null,
    basedOn: source.baseRevisionNumber === 0 ? 'Based on the inventory as the owner entered it.' : `Based on site walk ${source.baseRevisionNumber}: lengths, conditions and readings as found on site.`,
    consultantLine: `${consultant.name}${firm}`,
    consultantContact: [consultant.phone, consultant.email].filter(Boolean).join(' · '),
    introduction: composition.introduction,
    headline,
    actions,
    actionsNote: `Quick wins pay back within ${QUICK_WIN_YEARS === 1 ? 'a year' : `${QUICK_WIN_YEARS} years`}; work marked for safety stops burns or sweating and is not there for the fuel it saves. Work is recommended on ${figures.runsWithWork} of ${figures.runCount} run${figures.runCount === 1 ? '' : 's'}.`,
    runs: result.runs.map((run) => presentRun(run, choices.get(run.id), f, a.atmosphericPressureKPa)),
    findings: composition.findings.map((finding) => ({
      kind: FINDING_LABELS[finding.kind],
      where: [finding.runId ? `“${labelOf.get(finding.runId) ?? finding.runId}”` : null, finding.place].filter(Boolean).join(', '),
      reading: finding.surfaceTemperatureC !== undefined ? `surface measured at ${f.temperature(finding.surfaceTemperatureC)}` : null,
      note: finding.note ?? null,
    })),
    incentives: composition.incentives.map((line) => ({ text: line.text, amount: f.money(line.amount) })),
    incentivesTotal: figures.incentivesTotal > 0 ? f.money(figures.incentivesTotal) : null,
    exclusions: composition.exclusions,
    notes: composition.notes,
    charts: [cashFlowChart(figures, f), runCostChart(result, f)],
    assumptions: assumptionsOf(source, f),
    // Every caution, those the findings touch first.
    cautions: [...cautions.filter((c) => kinds.has(c.glyph)), ...cautions.filter((c) => !kinds.has(c.glyph))],
    footer: `Prepared by ${consultant.name}${firm} with Lagwise · ${plant.reference}${source.version !== null ? ` · version ${source.version}` : ''}`,
    figures,
  };
}
