/**
 * One chart with its heading, a short reading of it, the chart itself (loaded lazily) and
 * the same numbers as a table for anyone who cannot see the drawing.
 */
import { Component, lazy, Suspense, type ReactNode } from 'react';
import type { ChartSpec } from './series';

const ChartCanvas = lazy(() => import('./ChartCanvas'));

/** If the chart code cannot be fetched (offline), the table still says everything. */
class ChartBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  override state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  override render() {
    if (this.state.failed) return <p className="chart-note">The chart could not be drawn; the table below has its numbers.</p>;
    return this.props.children;
  }
}

interface Props {
  id: string;
  title: string;
  reading: ReactNode;
  spec: ChartSpec;
  controls?: ReactNode;
}

export function ChartPanel({ id, title, reading, spec, controls }: Props) {
  return (
    <section className="chart-panel" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="chart-title">
        {title}
      </h3>
      {controls}
      <p className="chart-reading">{reading}</p>
      <div className="chart-box">
        <ChartBoundary>
          <Suspense fallback={<p className="chart-note">Drawing the chart…</p>}>
            <ChartCanvas spec={spec} />
          </Suspense>
        </ChartBoundary>
      </div>
      <details className="chart-table">
        <summary>Show the numbers as a table</summary>
        <div className="table-scroll" tabIndex={0} role="region" aria-label={`${title}: numbers`}>
          <table>
            <caption className="sr-only">{spec.name}</caption>
            <thead>
              <tr>
                <th scope="col">{spec.rowTitle ?? spec.xTitle}</th>
                {spec.series.map((s) => (
                  <th key={s.label} scope="col">
                    {s.label}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {spec.labels.map((label, row) => (
                <tr key={`${label}-${row}`}>
                  <th scope="row">{label}</th>
                  {spec.series.map((s) => {
                    const value = s.values[row];
                    return <td key={s.label}>{value === null || value === undefined ? '—' : spec.format(value)}</td>;
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </section>
  );
}
