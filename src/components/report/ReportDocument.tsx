/**
 * The report as a web page, from the presented report (src/lib/reports/present): rendered on the
 * server for the owner's and the desk's pages (no client JavaScript), and by the composer's
 * island as its preview — so the preview is exactly what the owner reads. Every figure carries
 * `data-figure` with its key, so a test can set the page beside the PDF.
 */
import type { PresentedReport, ReportChart } from '../../lib/reports/present';

const barTone = { loss: '#a8461c', gain: '#2e6a4d', plain: '#4b5058' } as const;
const lineTone = { axis: '#4b5058', grid: '#d6cdbd', mark: '#2c6a90' } as const;

function Chart({ chart }: { chart: ReportChart }) {
  return (
    <figure className="report-chart">
      <figcaption className="font-semibold">{chart.title}</figcaption>
      <svg viewBox={`0 0 ${chart.width} ${chart.height}`} role="img" aria-label={`${chart.title}. ${chart.caption}`} className="h-auto w-full">
        {chart.bars.map((bar, i) => (
          <rect key={`b${i}`} x={bar.x} y={bar.y} width={bar.w} height={bar.h} fill={barTone[bar.tone]} />
        ))}
        {chart.lines.map((line, i) => (
          <line key={`l${i}`} x1={line.x1} y1={line.y1} x2={line.x2} y2={line.y2} stroke={lineTone[line.tone]} strokeWidth={line.tone === 'mark' ? 1.6 : 1} />
        ))}
        {chart.labels.map((label, i) => (
          <text key={`t${i}`} x={label.x} y={label.y} textAnchor={label.anchor} fontSize="11" fill="#4b5058">
            {label.text}
          </text>
        ))}
      </svg>
      <p className="text-sm text-graphite-soft">{chart.caption}</p>
    </figure>
  );
}

export interface ReportDocumentProps {
  report: PresentedReport;
  /** Photos chosen for the report, with short-lived links. */
  photos: readonly { id: string; url: string; caption: string }[];
  /** The PDF's download link; null for a draft or while it is being rendered. */
  pdfUrl: string | null;
  /** Said where the PDF link would be while there is none. */
  pdfNote?: string;
  /** Heading level of the report's title (1 on its own page, 2 inside the composer). */
  level?: 1 | 2;
}

export default function ReportDocument({ report, photos, pdfUrl, pdfNote, level = 1 }: ReportDocumentProps) {
  const Title = level === 1 ? 'h1' : 'h2';
  const Section = level === 1 ? 'h2' : 'h3';
  return (
    <article className="report space-y-8" data-report-reference={report.reference}>
      <header className="space-y-2">
        <p className="eyebrow">
          {report.title} · {report.reference}
        </p>
        <Title className="text-display">{report.plantName}</Title>
        <p className="text-graphite-soft" data-figure="version">
          {report.versionLine}
        </p>
        <p>
          Prepared by <strong>{report.consultantLine}</strong>
          {report.consultantContact && <span className="text-graphite-soft"> · {report.consultantContact}</span>}
        </p>
        <p className="text-sm text-graphite-soft">{report.basedOn}</p>
        {report.replacedLine && (
          <p role="note" className="notice notice-warn" data-replaced="true">
            {report.replacedLine}
          </p>
        )}
        {pdfUrl ? (
          <p>
            <a className="btn btn-quiet" href={pdfUrl} download>
              Download the PDF
            </a>
          </p>
        ) : (
          pdfNote && <p className="text-sm text-graphite-soft">{pdfNote}</p>
        )}
      </header>

      {report.introduction && <p className="max-w-text whitespace-pre-line text-lg">{report.introduction}</p>}

      <section aria-label="The figures">
        <dl className="report-figures grid gap-px overflow-hidden rounded-plate border border-line bg-line sm:grid-cols-2 lg:grid-cols-3">
          {report.headline.map((figure) => (
            <div key={figure.key} className="bg-surface p-4">
              <dt className="text-sm font-semibold uppercase tracking-wide text-graphite-soft">{figure.label}</dt>
              <dd className="mt-1">
                <span className="block text-3xl font-extrabold tabular-nums" data-figure={figure.key}>
                  {figure.value}
                </span>
                {figure.range && (
                  <span className="block text-sm text-graphite-soft">
                    likely <span data-figure={`${figure.key}-range`}>{figure.range}</span>
                  </span>
                )}
                {figure.note && <span className="block text-sm text-graphite-soft">{figure.note}</span>}
              </dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="report-actions" className="space-y-3">
        <Section id="report-actions" className="text-2xl font-extrabold">
          What to do first
        </Section>
        {report.actions.length === 0 ? (
          <p>No work is recommended on these figures.</p>
        ) : (
          <ol className="space-y-2">
            {report.actions.map((action) => (
              <li key={action.rank} className="rounded-plate border border-line bg-surface p-4" data-action-rank={action.rank}>
                <p className="flex flex-wrap items-baseline gap-x-3">
                  <span className="font-extrabold">
                    {action.rank}. {action.runLabel}
                  </span>
                  {action.tag && <span className={action.tag === 'For safety' ? 'font-semibold text-ember' : 'font-semibold text-mineral'}>{action.tag}</span>}
                </p>
                <p className="text-graphite-soft">{action.what}</p>
                <p className="mt-1 flex flex-wrap gap-x-5 tabular-nums">
                  <span>
                    Cost <strong data-figure={`action-${action.rank}-cost`}>{action.cost}</strong>
                  </span>
                  <span>
                    Saves <strong data-figure={`action-${action.rank}-saving`}>{action.saving}</strong>
                  </span>
                  <span>
                    Pays back <strong data-figure={`action-${action.rank}-payback`}>{action.payback}</strong>
                  </span>
                </p>
              </li>
            ))}
          </ol>
        )}
        <p className="text-sm text-graphite-soft">{report.actionsNote}</p>
      </section>

      <section aria-label="Charts" className="grid gap-6 lg:grid-cols-2">
        {report.charts.map((chart) => (
          <Chart key={chart.title} chart={chart} />
        ))}
      </section>

      <section aria-labelledby="report-runs" className="space-y-3">
        <Section id="report-runs" className="text-2xl font-extrabold">
          Run by run
        </Section>
        <ul className="space-y-2">
          {report.runs.map((run) => (
            <li key={run.id} className="rounded-plate border border-line bg-surface p-4">
              <p className="font-extrabold">{run.label}</p>
              <p className="text-sm text-graphite-soft">{run.line}</p>
              <p>
                Today: {run.today}, {run.todayCost}.
              </p>
              <p>
                Recommended: <strong>{run.recommendation}</strong>.
              </p>
              <p className="tabular-nums">
                Installed {run.installedCost} ({run.priceSource}) · saves {run.saving} · pays back {run.payback}
              </p>
              {run.reason && <p className="text-graphite-soft">Why this choice: {run.reason}</p>}
              {run.hazards.map((hazard) => (
                <p key={hazard} className="text-ember">
                  {hazard}
                </p>
              ))}
            </li>
          ))}
        </ul>
      </section>

      {report.findings.length > 0 && (
        <section aria-labelledby="report-findings" className="space-y-3">
          <Section id="report-findings" className="text-2xl font-extrabold">
            Found on the site walk
          </Section>
          <ul className="space-y-2">
            {report.findings.map((finding, i) => (
              <li key={i} className="border-l-4 border-ember pl-3">
                <p className="font-semibold">
                  {finding.kind}: {finding.where}
                </p>
                {finding.reading && <p>{finding.reading}</p>}
                {finding.note && <p className="text-graphite-soft">{finding.note}</p>}
              </li>
            ))}
          </ul>
        </section>
      )}

      {photos.length > 0 && (
        <section aria-labelledby="report-photos" className="space-y-3">
          <Section id="report-photos" className="text-2xl font-extrabold">
            Photos
          </Section>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {photos.map((photo, i) => (
              <li key={photo.id}>
                <figure>
                  <img src={photo.url} alt={`Photo ${i + 1}: ${photo.caption}`} loading="lazy" className="aspect-[4/3] w-full rounded-plate border border-line object-cover" />
                  <figcaption className="mt-1 text-sm text-graphite-soft">{photo.caption}</figcaption>
                </figure>
              </li>
            ))}
          </ul>
        </section>
      )}

      {(report.incentives.length > 0 || report.exclusions.length > 0 || report.notes) && (
        <section aria-labelledby="report-terms" className="space-y-3">
          <Section id="report-terms" className="text-2xl font-extrabold">
            Terms of this proposal
          </Section>
          {report.incentives.length > 0 && (
            <div>
              <p className="font-semibold">Incentives and rebates</p>
              <ul>
                {report.incentives.map((line, i) => (
                  <li key={i}>
                    {line.text}: <span className="tabular-nums">{line.amount}</span>
                  </li>
                ))}
              </ul>
              {report.incentivesTotal && <p className="font-semibold">In all: {report.incentivesTotal}</p>}
            </div>
          )}
          {report.exclusions.length > 0 && (
            <div>
              <p className="font-semibold">Not included</p>
              <ul className="list-disc pl-5">
                {report.exclusions.map((line, i) => (
                  <li key={i}>{line}</li>
                ))}
              </ul>
            </div>
          )}
          {report.notes && (
            <div>
              <p className="font-semibold">Notes</p>
              <p className="whitespace-pre-line">{report.notes}</p>
            </div>
          )}
        </section>
      )}

      <section aria-labelledby="report-method" className="space-y-3">
        <Section id="report-method" className="text-2xl font-extrabold">
          Assumptions and method
        </Section>
        {report.assumptions.map((part) => (
          <div key={part.title}>
            <p className="font-semibold">{part.title}</p>
            {part.lines.map((line) => (
              <p key={line} className="text-graphite-soft">
                {line}
              </p>
            ))}
          </div>
        ))}
      </section>

      <section aria-labelledby="report-cautions" className="space-y-3 rounded-plate border border-line border-t-4 border-t-ember bg-surface p-5">
        <Section id="report-cautions" className="text-2xl font-extrabold">
          Before any work
        </Section>
        <ul className="space-y-2">
          {report.cautions.map((caution) => (
            <li key={caution.title}>
              <p className={caution.tone === 'heat' ? 'font-semibold text-ember' : caution.tone === 'cold' ? 'font-semibold text-frost' : 'font-semibold'}>{caution.title}</p>
              <p>{caution.text}</p>
            </li>
          ))}
        </ul>
      </section>
      <p className="text-sm text-graphite-soft">{report.footer}</p>
    </article>
  );
}
