/**
 * Draws a chart spec with chart.js. Loaded lazily: chart.js is the largest thing on the
 * results step and nobody needs it before the first result. Lines carry no point marks, and
 * their legend shows each as the line it is, solid or dashed (lineSwatch); bars colored by hot
 * and cold lines get a legend entry per color.
 */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  Tooltip,
  type ChartData,
  type ChartOptions,
  type LegendItem,
} from 'chart.js';
import { Bar, Line } from 'react-chartjs-2';
import type { ChartSeries, ChartSpec, Tone } from './series';

Chart.register(BarController, BarElement, CategoryScale, LinearScale, LineController, LineElement, PointElement, Tooltip, Legend);

/** The stylesheet's token for a tone, so charts wear the same colors as the page. */
function color(tone: Tone): string {
  const styles = getComputedStyle(document.documentElement);
  return styles.getPropertyValue(`--color-${tone}`).trim() || styles.color;
}

const DASH = [6, 5];
/** A line swatch's size in the legend, px. */
const SWATCH_WIDTH = 32;
const SWATCH_HEIGHT = 8;
const TONE_WORDS: Partial<Record<Tone, string>> = { ember: 'hot lines', frost: 'cold lines' };

/** A legend swatch drawn as its line is: the tone, solid or dashed (chart.js's own line swatch is always solid). */
function lineSwatch(tone: Tone, dashed: boolean | undefined): HTMLCanvasElement {
  const swatch = document.createElement('canvas');
  swatch.width = SWATCH_WIDTH;
  swatch.height = SWATCH_HEIGHT;
  const ctx = swatch.getContext('2d');
  if (ctx) {
    ctx.strokeStyle = color(tone);
    ctx.lineWidth = 2.5;
    ctx.setLineDash(dashed ? DASH : []);
    ctx.beginPath();
    ctx.moveTo(0, SWATCH_HEIGHT / 2);
    ctx.lineTo(SWATCH_WIDTH, SWATCH_HEIGHT / 2);
    ctx.stroke();
  }
  return swatch;
}

function lineLegend(spec: ChartSpec, chart: Chart): LegendItem[] {
  return spec.series.map((s, datasetIndex) => ({
    text: s.label,
    pointStyle: lineSwatch(s.tone, s.dashed),
    fillStyle: color(s.tone),
    strokeStyle: color(s.tone),
    lineWidth: 0,
    hidden: !chart.isDatasetVisible(datasetIndex),
    datasetIndex,
  }));
}

/** A bar series colored per bar gets one legend entry per color it uses. */
function barLegend(spec: ChartSpec, chart: Chart): LegendItem[] {
  return spec.series.flatMap((s: ChartSeries, datasetIndex) => {
    const hidden = !chart.isDatasetVisible(datasetIndex);
    const tones = s.tones ? [...new Set(s.tones)] : [s.tone];
    return tones.map((tone) => ({
      text: tones.length > 1 ? `${s.label}, ${TONE_WORDS[tone] ?? tone}` : s.label,
      fillStyle: color(tone),
      strokeStyle: color(tone),
      lineWidth: 0,
      hidden,
      datasetIndex,
    }));
  });
}

function options(spec: ChartSpec): ChartOptions<'bar' | 'line'> {
  const text = color('graphite');
  const grid = getComputedStyle(document.documentElement).getPropertyValue('--color-line').trim();
  const font = { family: getComputedStyle(document.body).fontFamily, size: 13 };
  const lines = spec.kind !== 'bar';
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: spec.kind === 'profile' ? { mode: 'nearest', intersect: false, axis: 'x' } : { mode: 'index', intersect: false },
    plugins: {
      legend: {
        position: 'bottom',
        labels: lines
          ? { color: text, font, usePointStyle: true, pointStyleWidth: SWATCH_WIDTH, generateLabels: (chart) => lineLegend(spec, chart) }
          : { color: text, font, boxWidth: 14, generateLabels: (chart) => barLegend(spec, chart) },
      },
      tooltip: {
        callbacks: {
          title: (items) => (spec.kind === 'profile' && spec.xFormat && items[0] ? `${spec.xFormat(items[0].parsed.x ?? 0)} ${spec.xTitle.replace(/^.*\((.*)\)$/, '$1')} from the center` : (items[0]?.label ?? '')),
          label: (item) => (item.parsed.y === null ? '' : `${item.dataset.label ?? ''}: ${spec.format(item.parsed.y)}`),
        },
      },
    },
    scales: {
      x:
        spec.kind === 'profile'
          ? {
              type: 'linear',
              min: 0,
              title: { display: true, text: spec.xTitle, color: text, font },
              ticks: { color: text, font, callback: (value) => (spec.xFormat ? spec.xFormat(Number(value)) : String(value)) },
              grid: { color: grid },
            }
          : { title: { display: true, text: spec.xTitle, color: text, font }, ticks: { color: text, font }, grid: { color: grid } },
      y: {
        title: { display: true, text: spec.yTitle, color: text, font },
        ticks: { color: text, font, callback: (value) => spec.format(Number(value)) },
        grid: { color: grid },
      },
    },
  };
}

export default function ChartCanvas({ spec }: { spec: ChartSpec }) {
  if (spec.kind === 'bar') {
    const data: ChartData<'bar', (number | null)[], string> = {
      labels: [...spec.labels],
      datasets: spec.series.map((s) => ({
        label: s.label,
        data: [...s.values],
        backgroundColor: s.tones ? s.tones.map(color) : color(s.tone),
        borderWidth: 0,
      })),
    };
    return <Bar data={data} options={options(spec) as ChartOptions<'bar'>} aria-label={spec.name} />;
  }
  const line = (s: ChartSeries) => ({
    label: s.label,
    borderColor: color(s.tone),
    backgroundColor: color(s.tone),
    borderDash: s.dashed ? DASH : [],
    borderWidth: 2.5,
    pointStyle: 'line' as const,
    pointRadius: 0,
    pointHoverRadius: 4,
    spanGaps: false,
  });
  if (spec.kind === 'profile') {
    const data: ChartData<'line', { x: number; y: number }[]> = {
      datasets: spec.series.map((s) => ({ ...line(s), data: (s.points ?? []).map((p) => ({ x: p.x, y: p.y })) })),
    };
    return <Line data={data} options={options(spec) as ChartOptions<'line'>} aria-label={spec.name} />;
  }
  const data: ChartData<'line', (number | null)[], string> = {
    labels: [...spec.labels],
    datasets: spec.series.map((s) => ({ ...line(s), data: [...s.values] })),
  };
  return <Line data={data} options={options(spec) as ChartOptions<'line'>} aria-label={spec.name} />;
}
