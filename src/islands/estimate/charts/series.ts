/**
 * The four result charts as plain series: what each chart draws and what its table
 * alternative lists. Every figure comes from the engine's PlantResult.
 */
import type { PlantResult, RunEstimate } from '../../../engine';
import type { DisplayFormat } from '../../../lib/presentation';
import { displayUnit } from '../../../lib/units-display';

/** Colors are our tokens, named here and resolved from the stylesheet where the chart is drawn. */
export type Tone = 'ember' | 'frost' | 'mineral' | 'graphite' | 'graphite-soft';

export interface ChartSeries {
  readonly label: string;
  readonly values: readonly (number | null)[];
  readonly tone: Tone;
  /** One tone per bar (hot runs ember, cold runs frost). */
  readonly tones?: readonly Tone[];
  readonly dashed?: boolean;
  /** Drawn as marked points only, no line (the economic thickness). */
  readonly pointsOnly?: boolean;
}

export interface ChartSpec {
  readonly kind: 'bar' | 'line';
  /** The chart's accessible name; the table below it carries the same numbers. */
  readonly name: string;
  readonly labels: readonly string[];
  readonly series: readonly ChartSeries[];
  readonly xTitle: string;
  readonly yTitle: string;
  readonly format: (value: number) => string;
}

/** Heat lost (or gained, cold lines) a year by run, now and with the proposal. */
export function lossByRun(result: PlantResult, f: DisplayFormat): ChartSpec {
  const unit = displayUnit('energyPerYear', f.system);
  return {
    kind: 'bar',
    name: `Bar chart: heat lost or gained a year by run, now and with the proposed insulation, in ${unit.symbol}.`,
    labels: result.runs.map((run) => run.label),
    series: [
      {
        label: 'Now',
        values: result.runs.map((run) => unit.fromBase(run.current.annualHeatGJ)),
        tone: 'ember',
        tones: result.runs.map((run) => (run.cold ? 'frost' : 'ember')),
      },
      {
        label: 'With the proposed insulation',
        values: result.runs.map((run) => unit.fromBase(run.proposed.annualHeatGJ)),
        tone: 'mineral',
      },
    ],
    xTitle: 'Run',
    yTitle: `Heat a year (${unit.symbol})`,
    format: (value) => f.quantity(unit.toBase(value), 'energyPerYear'),
  };
}

/**
 * Temperatures from the fluid out to the air for one run, face by face as heat crosses them
 * (the engine's face profile), now and with the proposal. Where today's run has fewer layers
 * than the proposal, its surface temperature carries across the missing layer: nothing is
 * there to take a drop.
 */
export function temperatureProfile(run: RunEstimate, f: DisplayFormat, touchLimitC: number): ChartSpec {
  const unit = displayUnit('temperature', f.system);
  const air = run.air.temperatureC;
  // The island asks for the full answer (POST /api/estimate?detail=full), which carries the profiles.
  const proposedFaces = run.proposed.profile?.faceTemperaturesC ?? [];
  const layerFaces = proposedFaces.length - 2;
  const labels = [
    'In the pipe',
    'Pipe wall, inside',
    'Pipe wall, outside',
    ...Array.from({ length: layerFaces }, (_, i) => (layerFaces === 1 ? 'Insulation, outer face' : `Layer ${i + 1}, outer face`)),
    'Surrounding air',
  ];
  const nowFaces = [...(run.current.profile?.faceTemperaturesC ?? [])];
  while (nowFaces.length < proposedFaces.length) nowFaces.push(nowFaces[nowFaces.length - 1] ?? run.fluidTemperatureC);
  const limit = run.cold
    ? { label: `Dew point of the air (${f.temperature(run.air.dewPointC)})`, valueC: run.air.dewPointC, tone: 'frost' as const }
    : { label: `Touch limit (${f.temperature(touchLimitC)})`, valueC: touchLimitC, tone: 'ember' as const };
  return {
    kind: 'line',
    name: `Line chart: temperature from the ${run.cold ? 'cold line' : 'fluid'} out to the air, face by face, for ${run.label}, now and with the proposed insulation, in ${unit.symbol}.`,
    labels,
    series: [
      {
        label: 'Now',
        values: [run.fluidTemperatureC, ...nowFaces.slice(0, proposedFaces.length), air].map(unit.fromBase),
        tone: run.cold ? 'frost' : 'ember',
      },
      {
        label: 'With the proposed insulation',
        values: [run.fluidTemperatureC, ...proposedFaces, air].map(unit.fromBase),
        tone: 'mineral',
      },
      { label: limit.label, values: labels.map(() => unit.fromBase(limit.valueC)), tone: limit.tone, dashed: true },
    ],
    xTitle: 'From the inside out',
    yTitle: `Temperature (${unit.symbol})`,
    format: (value) => f.temperature(unit.toBase(value)),
  };
}


export function cashFlow(result: PlantResult, f: DisplayFormat): ChartSpec {
  const years = result.totals.cashFlow;
  const { horizonYears, discountRatePercent, fuelEscalationPercent } = result.assumptions;
  return {
    kind: 'line',
    name: `Line chart: cumulative cash flow of insulating over ${horizonYears} years, starting from the installed cost.`,
    labels: years.map((y) => `Year ${y.year}`),
    series: [
      {
        label: `Cash, fuel price rising ${f.number(fuelEscalationPercent)} % a year`,
        values: years.map((y) => y.cumulative),
        tone: 'mineral',
      },
      {
        label: `Present value at ${f.number(discountRatePercent)} % a year`,
        values: years.map((y) => y.cumulativePresentValue),
        tone: 'graphite',
        dashed: true,
      },
    ],
    xTitle: 'Year',
    yTitle: `Cumulative (${result.currency})`,
    format: (value) => f.money(value),
  };
}
