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
  /** For a `profile` chart: the drawn line as points against distance (x in display units). */
  readonly points?: readonly { readonly x: number; readonly y: number }[];
}

export interface ChartSpec {
  /** `profile`: lines drawn through each series' `points` over a distance axis; the table lists `labels` × `values`. */
  readonly kind: 'bar' | 'line' | 'profile';
  /** The chart's accessible name; the table below it carries the same numbers. */
  readonly name: string;
  readonly labels: readonly string[];
  readonly series: readonly ChartSeries[];
  readonly xTitle: string;
  readonly yTitle: string;
  readonly format: (value: number) => string;
  /** For a `profile` chart: how a distance on the x axis reads. */
  readonly xFormat?: (value: number) => string;
  /** The table's first column, where its rows are not the x axis' values (default: `xTitle`). */
  readonly rowTitle?: string;
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

/** Points along a cylindrical layer: steady conduction makes the temperature fall with ln(r). */
const POINTS_PER_LAYER = 12;
/** How far past the surface the air is drawn, as a share of the surface radius (at least 10 mm). */
const AIR_SHOWN_SHARE = 0.35;
const AIR_SHOWN_MIN_M = 0.01;

interface Face {
  readonly radiusM: number;
  readonly temperatureC: number;
}

/**
 * One series' line from the pipe's center out into the air, as heat crosses it: level in the
 * fluid, a step at the inside film, through the wall, a ln(r) curve through each layer, then
 * the step from the surface to the air (the outside film, a fraction of a millimeter thick,
 * drawn as the step it is) and level air beyond. Radii in meters.
 */
function profilePoints(fluidC: number, faces: readonly Face[], airC: number, airToM: number): { radiusM: number; temperatureC: number }[] {
  const first = faces[0];
  if (!first) return [];
  const points = [
    { radiusM: 0, temperatureC: fluidC },
    { radiusM: first.radiusM, temperatureC: fluidC },
    { radiusM: first.radiusM, temperatureC: first.temperatureC },
  ];
  for (let i = 1; i < faces.length; i += 1) {
    const inner = faces[i - 1] as Face;
    const outer = faces[i] as Face;
    // The pipe wall is thin and metal: a straight line. Layers follow ln(r).
    const steps = i === 1 ? 1 : POINTS_PER_LAYER;
    for (let k = 1; k <= steps; k += 1) {
      const radiusM = inner.radiusM + ((outer.radiusM - inner.radiusM) * k) / steps;
      const share = Math.log(radiusM / inner.radiusM) / Math.log(outer.radiusM / inner.radiusM);
      points.push({ radiusM, temperatureC: inner.temperatureC + (outer.temperatureC - inner.temperatureC) * share });
    }
  }
  const surface = faces[faces.length - 1] as Face;
  points.push({ radiusM: surface.radiusM, temperatureC: airC }, { radiusM: airToM, temperatureC: airC });
  return points;
}

function facesOf(profile: { readonly faceDiametersM: readonly number[]; readonly faceTemperaturesC: readonly number[] } | undefined): Face[] {
  if (!profile) return [];
  return profile.faceDiametersM.map((d, i) => ({ radiusM: d / 2, temperatureC: profile.faceTemperaturesC[i] ?? NaN }));
}

/**
 * Temperatures from the fluid out to the air for one run, against the distance from the pipe's
 * center, now and with the proposal (the engine's face profiles). Each line has only the faces
 * its pipe has: a bare pipe's line steps from its wall to the air. The table lists the same
 * temperatures face by face ("—" where a face does not exist).
 */
export function temperatureProfile(run: RunEstimate, f: DisplayFormat, touchLimitC: number): ChartSpec {
  const unit = displayUnit('temperature', f.system);
  const distance = displayUnit('thickness', f.system);
  const air = run.air.temperatureC;
  // The island asks for the full answer (POST /api/estimate?detail=full), which carries the profiles.
  const nowFaces = facesOf(run.current.profile);
  const proposedFaces = facesOf(run.proposed.profile);
  const layerCount = Math.max(nowFaces.length, proposedFaces.length) - 2;
  const labels = [
    'In the pipe',
    'Pipe wall, inside',
    'Pipe wall, outside',
    ...Array.from({ length: Math.max(0, layerCount) }, (_, i) => (layerCount === 1 ? 'Insulation, outer face' : `Layer ${i + 1}, outer face`)),
    'Surrounding air',
  ];
  const outermostM = Math.max(...[...nowFaces, ...proposedFaces].map((face) => face.radiusM), 0);
  const airToM = outermostM + Math.max(outermostM * AIR_SHOWN_SHARE, AIR_SHOWN_MIN_M);
  const column = (faces: readonly Face[]) => [
    unit.fromBase(run.fluidTemperatureC),
    ...Array.from({ length: labels.length - 2 }, (_, i) => (faces[i] ? unit.fromBase(faces[i].temperatureC) : null)),
    unit.fromBase(air),
  ];
  const drawn = (faces: readonly Face[]) =>
    profilePoints(run.fluidTemperatureC, faces, air, airToM).map((p) => ({ x: distance.fromBase(p.radiusM), y: unit.fromBase(p.temperatureC) }));
  const limit = run.cold
    ? { label: `Dew point of the air (${f.temperature(run.air.dewPointC)})`, valueC: run.air.dewPointC, tone: 'frost' as const }
    : { label: `Touch limit (${f.temperature(touchLimitC)})`, valueC: touchLimitC, tone: 'ember' as const };
  const limitY = unit.fromBase(limit.valueC);
  return {
    kind: 'profile',
    name: `Line chart: temperature against distance from the pipe's center, from the ${run.cold ? 'cold line' : 'fluid'} out to the air, for ${run.label}, now and with the proposed insulation, in ${unit.symbol}.`,
    labels,
    series: [
      { label: 'Now', values: column(nowFaces), points: drawn(nowFaces), tone: run.cold ? 'frost' : 'ember' },
      { label: 'With the proposed insulation', values: column(proposedFaces), points: drawn(proposedFaces), tone: 'mineral' },
      {
        label: limit.label,
        values: labels.map(() => limitY),
        points: [
          { x: 0, y: limitY },
          { x: distance.fromBase(airToM), y: limitY },
        ],
        tone: limit.tone,
        dashed: true,
      },
    ],
    xTitle: `Distance from the pipe's center (${distance.symbol})`,
    rowTitle: 'From the inside out',
    yTitle: `Temperature (${unit.symbol})`,
    format: (value) => f.temperature(unit.toBase(value)),
    xFormat: (value) => `${Number(value.toFixed(distance.symbol === 'in' ? 1 : 0))}`,
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
