/**
 * The report's two e-mails, with their figures from the one presentation of the version: to the
 * owner when a version is sent (the link and the PDF attached, read from object storage), and to
 * the consultant holding the lead when the owner answers.
 */
import { createElement, type ReactElement } from 'react';
import { getDb } from '../../db/client';
import { findConsultantProfile, findLead } from '../../db/queries/leads';
import { findReport } from '../../db/queries/reports';
import type { OutgoingEmail } from '../email/messages';
import { ReportAnswered, reportAnsweredSubject, ReportSent, reportSentSubject } from '../email/templates/ReportMail';
import { appBaseUrl } from '../site';
import { getObject } from '../storage/objects';
import { reportPdfFileName } from './pdf-file';
import { presentReport } from './present';
import { frozenSource } from './source';

export interface ReportMail {
  subject: string;
  element: ReactElement;
  attachments?: { filename: string; content: string; contentType: string }[];
}

/** Thrown while the PDF a mail must carry is not readable yet: the queue retries. */
export class PdfNotReady extends Error {}

/** The mail for `email`, or null when its report or lead no longer exists. */
export async function reportMailFor(email: Extract<OutgoingEmail, { template: 'report-sent' | 'report-answered' }>): Promise<ReportMail | null> {
  const report = await findReport(getDb(), email.props.reportId);
  if (!report || report.status !== 'sent' || report.version === null) return null;
  const found = await findLead(getDb(), report.assessmentId, undefined);
  if (!found) return null;
  const lead = found.lead;
  const plantLabel = lead.plantName || lead.companyName;
  if (email.template === 'report-answered') {
    const holder = lead.claimedByUserId ? await findConsultantProfile(getDb(), lead.claimedByUserId) : null;
    const props = {
      consultantName: holder?.name ?? 'there',
      reference: lead.reference,
      plantLabel,
      version: report.version,
      accepted: report.answer === 'accepted',
      reason: report.answerReason,
      contactName: lead.contactName,
      leadUrl: `${appBaseUrl()}/desk/leads/${lead.id}`,
    };
    return { subject: reportAnsweredSubject(props), element: createElement(ReportAnswered, props) };
  }
  if (!report.pdfObjectKey) throw new PdfNotReady(`the PDF of report ${report.id} is not stored yet`);
  const pdf = await getObject(report.pdfObjectKey);
  if (!pdf) throw new PdfNotReady(`the PDF of report ${report.id} is not readable from storage`);
  const presented = presentReport(frozenSource(report, lead, null));
  const figure = (key: string) => presented.headline.find((f) => f.key === key);
  const fileName = reportPdfFileName(lead.reference, report.version);
  const props = {
    contactName: lead.contactName,
    reference: lead.reference,
    plantLabel,
    version: report.version,
    corrects: report.version > 1,
    consultantLine: presented.consultantLine,
    saving: figure('saving')?.value ?? '',
    savingRange: figure('saving')?.range ?? null,
    installedCost: figure('net-cost')?.value ?? figure('installed')?.value ?? '',
    payback: figure('payback')?.value ?? '',
    reportUrl: `${appBaseUrl()}/my/reports/${report.id}`,
    fileName,
  };
  return {
    subject: reportSentSubject(props),
    element: createElement(ReportSent, props),
    attachments: [{ filename: fileName, content: pdf.bytes.toString('base64'), contentType: 'application/pdf' }],
  };
}
