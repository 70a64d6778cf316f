/**
 * Renders a report's PDF: the presented report laid out by ./ReportPdf with Manrope embedded and
 * the chosen photos as JPEG. Pure of the database: the caller hands in what the version froze.
 */
import { renderToBuffer } from '@react-pdf/renderer';
import { createElement } from 'react';
import type { PaperSize } from '../paper';
import { presentReport, type ReportSource } from '../present';
import { registerReportFonts } from './fonts';
import { ReportPdf } from './ReportPdf';

export interface PdfPhoto {
  /** JPEG bytes. */
  readonly data: Buffer;
  readonly caption: string;
}

/** The PDF of a report, from the same source its web page is presented from. */
export async function renderReportPdf(source: ReportSource, options: { pageSize: PaperSize; createdAt: Date; photos?: readonly PdfPhoto[] }): Promise<Buffer> {
  registerReportFonts();
  const report = presentReport(source);
  const element = createElement(ReportPdf, { report, pageSize: options.pageSize, createdAt: options.createdAt, photos: options.photos ?? [] });
  return renderToBuffer(element as Parameters<typeof renderToBuffer>[0]);
}
