/**
 * Draws a chart spec with chart.js. Loaded lazily: chart.js is the largest thing on the
 * results step and nobody needs it before the first result.
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
} from 'chart.js';
import { Bar, Line } from 'react-chartjs-2';
import type { ChartSpec, Tone } from './series';

Chart.register(BarController, BarElement, CategoryScale, LinearScale, LineController, LineElement, PointElement, Tooltip, Legend);

/** The stylesheet's token for a tone, so charts wear the same colors as the page. */
function color(tone: Tone): string {
  const styles = getComputedStyle(document.documentElement);
  return styles.getPropertyValue(`--color-${tone}`).trim() || styles.color;
}

function options(spec: ChartSpec): ChartOptions<'bar' | 'line'> {
  const text = color('graphite');
  const grid = getComputedStyle(document.documentElement).getPropertyValue('--color-line').trim();
  const font = { family: getComputedStyle(document.body).fontFamily, size: 13 };
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: { mode: 'index', intersect: false },
    plugins: {
      legend: {
        position: 'bottom',
        labels: spec.kind === 'line' ? { color: text, font, boxWidth: 28, boxHeight: 3 } : { color: text, font, boxWidth: 14 },
      },
      tooltip: {
        callbacks: {
          label: (item) => (item.parsed.y === null ? '' : `${item.dataset.label ?? ''}: ${spec.format(item.parsed.y)}`),
        },
      },
    },
    scales: {
      x: { title: { display: true, text: spec.xTitle, color: text, font }, ticks: { color: text, font }, grid: { color: grid } },
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
  const data: ChartData<'line', (number | null)[], string> = {
    labels: [...spec.labels],
    datasets: spec.series.map((s) => ({
      label: s.label,
      data: [...s.values],
      borderColor: color(s.tone),
      backgroundColor: color(s.tone),
      borderDash: s.dashed ? [6, 5] : [],
      borderWidth: s.pointsOnly ? 0 : 2.5,
      showLine: !s.pointsOnly,
      pointRadius: s.pointsOnly ? 9 : 3,
      // The economic thickness sits on the cost line; drawn last, it stays visible.
      order: s.pointsOnly ? -1 : 0,
      pointStyle: s.pointsOnly ? 'rectRot' : 'circle',
      spanGaps: false,
    })),
  };
  return <Line data={data} options={options(spec) as ChartOptions<'line'>} aria-label={spec.name} />;
}
