/**
 * The report as a PDF, laid out with react-pdf from the presented report (../present), so it
 * carries the very strings of the web page. Charts are drawn with react-pdf's vector primitives
 * from the same geometry the page draws; nothing here rounds or words a figure.
 */
import { Document, Image, Line, Page, Rect, StyleSheet, Svg, Text, View } from '@react-pdf/renderer';
import type { PresentedReport, ReportChart } from '../present';
import { PDF_FONT_FAMILY } from './fonts';

export const pdfColours = {
  paper: '#fcfaf5',
  graphite: '#22262b',
  soft: '#4b5058',
  line: '#d6cdbd',
  sunken: '#ece6da',
  ember: '#a8461c',
  emberTint: '#f5dfd2',
  mineral: '#2e6a4d',
  mineralTint: '#dceadf',
  frost: '#2c6a90',
} as const;

const styles = StyleSheet.create({
  page: { fontFamily: PDF_FONT_FAMILY, fontSize: 9.5, color: pdfColours.graphite, paddingTop: 40, paddingBottom: 50, paddingHorizontal: 42, lineHeight: 1.4 },
  mark: { fontSize: 11, fontWeight: 800, color: pdfColours.ember, letterSpacing: 0.6 },
  h1: { fontSize: 22, fontWeight: 800, marginTop: 6, lineHeight: 1.15 },
  h2: { fontSize: 13, fontWeight: 800, marginTop: 16, marginBottom: 6 },
  h3: { fontSize: 10.5, fontWeight: 700, marginTop: 8, marginBottom: 3 },
  soft: { color: pdfColours.soft },
  small: { fontSize: 8.5, color: pdfColours.soft },
  replaced: { marginTop: 8, padding: 6, backgroundColor: pdfColours.emberTint, color: pdfColours.ember, fontWeight: 700 },
  figures: { flexDirection: 'row', flexWrap: 'wrap', marginTop: 12, borderTopWidth: 1, borderTopColor: pdfColours.line },
  figure: { width: '33.33%', paddingVertical: 7, paddingRight: 8, borderBottomWidth: 1, borderBottomColor: pdfColours.line },
  figureLabel: { fontSize: 8, color: pdfColours.soft, textTransform: 'uppercase', letterSpacing: 0.4 },
  figureValue: { fontSize: 16, fontWeight: 800, marginTop: 2, lineHeight: 1.2 },
  row: { flexDirection: 'row', borderBottomWidth: 0.6, borderBottomColor: pdfColours.line, paddingVertical: 4 },
  head: { flexDirection: 'row', backgroundColor: pdfColours.sunken, paddingVertical: 4, fontWeight: 700 },
  cell: { paddingRight: 6 },
  tag: { fontSize: 7.5, fontWeight: 700, color: pdfColours.mineral },
  tagSafety: { fontSize: 7.5, fontWeight: 700, color: pdfColours.ember },
  block: { marginBottom: 6 },
  footer: { position: 'absolute', left: 42, right: 120, fontSize: 7.5, color: pdfColours.soft },
  pageNumber: { position: 'absolute', right: 42, width: 70, textAlign: 'right', fontSize: 7.5, color: pdfColours.soft },
  photo: { width: '48%', marginBottom: 8 },
});

const tone = { loss: pdfColours.ember, gain: pdfColours.mineral, plain: pdfColours.soft } as const;
const stroke = { axis: pdfColours.soft, grid: pdfColours.line, mark: pdfColours.frost } as const;

function Chart({ chart, width }: { chart: ReportChart; width: number }) {
  const scale = width / chart.width;
  return (
    <View wrap={false} style={{ marginTop: 6, marginBottom: 8 }}>
      <Text style={styles.h3}>{chart.title}</Text>
      <Svg width={width} height={chart.height * scale} viewBox={`0 0 ${chart.width} ${chart.height}`}>
        {chart.bars.map((bar, i) => (
          <Rect key={`b${i}`} x={bar.x} y={bar.y} width={bar.w} height={bar.h} fill={tone[bar.tone]} />
        ))}
        {chart.lines.map((line, i) => (
          <Line key={`l${i}`} x1={line.x1} y1={line.y1} x2={line.x2} y2={line.y2} stroke={stroke[line.tone]} strokeWidth={line.tone === 'mark' ? 1.4 : 0.8} />
        ))}
        {chart.labels.map((label, i) => (
          <Text key={`t${i}`} x={label.x} y={label.y} textAnchor={label.anchor} style={{ fontSize: 9, fontFamily: PDF_FONT_FAMILY[0] }} fill={pdfColours.soft}>
            {label.text}
          </Text>
        ))}
      </Svg>
      <Text style={styles.small}>{chart.caption}</Text>
    </View>
  );
}

export interface ReportPdfProps {
  report: PresentedReport;
  pageSize: 'A4' | 'LETTER';
  /** The version's sending time: the PDF's own dates, so one version always yields the same file. */
  createdAt: Date;
  /** JPEG bytes of the photos chosen, in order, with a caption each. */
  photos: readonly { data: Buffer; caption: string }[];
}

/** The whole report as a react-pdf document. */
export function ReportPdf({ report, pageSize, createdAt, photos }: ReportPdfProps) {
  const contentWidth = (pageSize === 'A4' ? 595.28 : 612) - 84;
  // Placed from the top: react-pdf 4.9 placed a fixed page-number text set from the bottom ever further off the page as a long report went on, until pdfkit refused the number (a 40-run report failed to render).
  const footerTop = (pageSize === 'A4' ? 841.89 : 792) - 34;
  return (
    <Document
      title={`${report.title}: ${report.plantName} (${report.reference})`}
      author={report.consultantLine}
      subject={report.versionLine}
      creator="Lagwise"
      producer="Lagwise"
      creationDate={createdAt}
      modificationDate={createdAt}
    >
      <Page size={pageSize} style={styles.page}>
        <Text style={styles.mark}>LAGWISE</Text>
        <Text style={styles.h1}>
          {report.title}: {report.plantName}
        </Text>
        <Text style={styles.soft}>
          {report.reference} · {report.versionLine}
        </Text>
        <Text style={styles.soft}>
          Prepared by {report.consultantLine}
          {report.consultantContact ? ` · ${report.consultantContact}` : ''}
        </Text>
        <Text style={styles.small}>{report.basedOn}</Text>
        {report.replacedLine && <Text style={styles.replaced}>{report.replacedLine}</Text>}
        {report.introduction ? <Text style={{ marginTop: 10 }}>{report.introduction}</Text> : null}

        <View style={styles.figures}>
          {report.headline.map((figure) => (
            <View key={figure.key} style={styles.figure}>
              <Text style={styles.figureLabel}>{figure.label}</Text>
              <Text style={styles.figureValue}>{figure.value}</Text>
              {figure.range && <Text style={styles.small}>likely {figure.range}</Text>}
              {figure.note && <Text style={styles.small}>{figure.note}</Text>}
            </View>
          ))}
        </View>

        <Text style={styles.h2}>What to do first</Text>
        <View style={styles.head}>
          <Text style={[styles.cell, { width: '5%' }]}>#</Text>
          <Text style={[styles.cell, { width: '45%' }]}>Run and work</Text>
          <Text style={[styles.cell, { width: '16%', textAlign: 'right' }]}>Cost</Text>
          <Text style={[styles.cell, { width: '18%', textAlign: 'right' }]}>Saves</Text>
          <Text style={[styles.cell, { width: '16%', textAlign: 'right' }]}>Pays back</Text>
        </View>
        {report.actions.map((action) => (
          <View key={action.rank} style={styles.row} wrap={false}>
            <Text style={[styles.cell, { width: '5%' }]}>{action.rank}</Text>
            <View style={[styles.cell, { width: '45%' }]}>
              <Text style={{ fontWeight: 700 }}>{action.runLabel}</Text>
              <Text style={styles.small}>{action.what}</Text>
              {action.tag ? <Text style={action.tag === 'For safety' ? styles.tagSafety : styles.tag}>{action.tag}</Text> : null}
            </View>
            <Text style={[styles.cell, { width: '16%', textAlign: 'right' }]}>{action.cost}</Text>
            <Text style={[styles.cell, { width: '18%', textAlign: 'right' }]}>{action.saving}</Text>
            <Text style={[styles.cell, { width: '16%', textAlign: 'right' }]}>{action.payback}</Text>
          </View>
        ))}
        <Text style={[styles.small, { marginTop: 4 }]}>{report.actionsNote}</Text>

        {report.charts.map((chart) => (
          <Chart key={chart.title} chart={chart} width={contentWidth} />
        ))}

        <Text style={styles.h2} break>
          Run by run
        </Text>
        {report.runs.map((run) => (
          // One paragraph of spans per run: a layout box per line made the run-by-run pages most of a long report's render time.
          <View key={run.id} style={[styles.block, { borderBottomWidth: 0.6, borderBottomColor: pdfColours.line, paddingBottom: 5 }]} wrap={false}>
            <Text>
              <Text style={{ fontWeight: 700 }}>{run.label}</Text>
              {'\n'}
              <Text style={styles.small}>{run.line}</Text>
              {`\nToday: ${run.today}, ${run.todayCost}.\nRecommended: ${run.recommendation}.\nInstalled ${run.installedCost} (${run.priceSource}) · saves ${run.saving} · pays back ${run.payback}`}
              {run.reason ? <Text style={styles.soft}>{`\nWhy this choice: ${run.reason}`}</Text> : null}
              {run.hazards.map((hazard) => (
                <Text key={hazard} style={{ color: pdfColours.ember }}>
                  {`\n${hazard}`}
                </Text>
              ))}
            </Text>
          </View>
        ))}

        {report.findings.length > 0 && (
          <View>
            <Text style={styles.h2}>Found on the site walk</Text>
            {report.findings.map((finding, i) => (
              <View key={i} style={styles.block} wrap={false}>
                <Text style={{ fontWeight: 700 }}>
                  {finding.kind}: {finding.where}
                </Text>
                {finding.reading && <Text>{finding.reading}</Text>}
                {finding.note && <Text style={styles.soft}>{finding.note}</Text>}
              </View>
            ))}
          </View>
        )}

        {photos.length > 0 && (
          <View>
            <Text style={styles.h2}>Photos</Text>
            <View style={{ flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between' }}>
              {photos.map((photo, i) => (
                <View key={i} style={styles.photo} wrap={false}>
                  <Image src={{ data: photo.data, format: 'jpg' }} />
                  <Text style={styles.small}>{photo.caption}</Text>
                </View>
              ))}
            </View>
          </View>
        )}

        {(report.incentives.length > 0 || report.exclusions.length > 0 || report.notes) && (
          <View>
            <Text style={styles.h2}>Terms of this proposal</Text>
            {report.incentives.length > 0 && <Text style={styles.h3}>Incentives and rebates</Text>}
            {report.incentives.map((line, i) => (
              <Text key={i}>
                {line.text}: {line.amount}
              </Text>
            ))}
            {report.incentivesTotal && <Text style={{ fontWeight: 700 }}>In all: {report.incentivesTotal}</Text>}
            {report.exclusions.length > 0 && <Text style={styles.h3}>Not included</Text>}
            {report.exclusions.map((line, i) => (
              <Text key={i}>· {line}</Text>
            ))}
            {report.notes ? <Text style={styles.h3}>Notes</Text> : null}
            {report.notes ? <Text>{report.notes}</Text> : null}
          </View>
        )}

        <Text style={styles.h2} break>
          Assumptions and method
        </Text>
        {report.assumptions.map((section) => (
          <View key={section.title} style={styles.block}>
            <Text style={styles.h3}>{section.title}</Text>
            {section.lines.map((line) => (
              <Text key={line}>{line}</Text>
            ))}
          </View>
        ))}

        <Text style={styles.h2}>Before any work</Text>
        {report.cautions.map((caution) => (
          <View key={caution.title} style={styles.block} wrap={false}>
            <Text style={{ fontWeight: 700, color: caution.tone === 'heat' ? pdfColours.ember : caution.tone === 'cold' ? pdfColours.frost : pdfColours.graphite }}>
              {caution.title}
            </Text>
            <Text>{caution.text}</Text>
          </View>
        ))}

        <Text style={[styles.footer, { top: footerTop }]} fixed>
          {report.footer}
        </Text>
        <Text style={[styles.pageNumber, { top: footerTop }]} fixed render={({ pageNumber, totalPages }) => `page ${pageNumber} of ${totalPages}`} />
      </Page>
    </Document>
  );
}
