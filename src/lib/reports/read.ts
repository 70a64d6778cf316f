/**
 * Reports as the API and the pages show them: a lead's list (drafts only to the composer), and
 * one report whole — for a sent version the frozen figures, for a draft the figures as composed
 * now with the engine's own suggestion per run beside them.
 */
import { getDb } from '../../db/client';
import { findConsultantProfile, listLeadAttachments, listLeadRuns, type LeadRecord } from '../../db/queries/leads';
import { findPriceTable, listLeadReports } from '../../db/queries/reports';
import type { Report } from '../../db/schema';
import type { PlantResult } from '../../engine';
import {
  type ReportListResponse,
  type ReportSummary,
  type ReportView,
  type RunSuggestion,
} from '../../schemas/reports';
import { unitSystemOf } from '../assessments/questionnaire';
import type { SessionUser } from '../session';
import { signedReadUrl } from '../storage/objects';
import { mayCompose, mayRead, reachLeadReports, reachReport, type ReportRole } from './access';
import { latestInventoryNumber, loadInventory } from './base';
import { composeInput, estimateComposed, suggestionsFor, type OwnPrices, type PriceBasis } from './compose';
import { compositionOf, type ReportPerson } from './composition';
import { paperSizeFor } from './paper';

function iso(date: Date | null): string | null {
  return date ? date.toISOString() : null;
}

/** Summaries of a lead's reports, each saying whether a later version replaced it. */
export function summarize(rows: readonly Report[]): ReportSummary[] {
  const versions = rows.filter((r) => r.status === 'sent' && r.version !== null);
  return rows.map((row) => {
    const next = row.version === null ? undefined : versions.filter((v) => (v.version as number) > (row.version as number)).sort((a, b) => (a.version as number) - (b.version as number))[0];
    return {
      id: row.id,
      status: row.status,
      version: row.version,
      baseRevisionNumber: row.baseRevisionNumber,
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
      sentAt: iso(row.sentAt),
      replacedBy: next && next.sentAt ? { version: next.version as number, sentAt: next.sentAt.toISOString() } : null,
      pdfReady: row.pdfObjectKey !== null,
      answer: row.answer && row.answeredAt ? { accept: row.answer === 'accepted', reason: row.answerReason, at: row.answeredAt.toISOString() } : null,
    };
  });
}

/** GET /api/leads/{id}/reports. */
export async function listReportsFor(user: SessionUser, leadId: string | undefined): Promise<ReportListResponse> {
  const { found, role } = await reachLeadReports(user, leadId);
  const rows = (await listLeadReports(getDb(), found.lead.id)).filter((row) => mayRead(role, row));
  return {
    lead: { id: found.lead.id, reference: found.lead.reference, latestRevisionNumber: latestInventoryNumber(found.lead) },
    reports: summarize(rows),
    allowed: { compose: mayCompose(role, found.lead) },
  };
}

/** A consultant's price table as the composer hands it to the engine. */
export async function ownPricesOf(userId: string): Promise<OwnPrices | null> {
  const row = await findPriceTable(getDb(), userId);
  return row ? { currency: row.currency, priceTable: row.priceTable as Record<string, unknown> } : null;
}

/** The consultant as a report names them: their name, firm, e-mail and phone now. */
export async function consultantNamed(userId: string | null): Promise<ReportPerson> {
  const profile = userId ? await findConsultantProfile(getDb(), userId) : null;
  return { name: profile?.name ?? 'Your consultant', firm: profile?.firm ?? null, email: profile?.email ?? null, phone: profile?.phone ?? null };
}

/** A draft's figures as composed now: the engine's result and suggestions on the author's prices. */
export async function draftFigures(found: LeadRecord, report: Report, composerUserId: string) {
  const composition = compositionOf(report);
  const inventory = await loadInventory(getDb(), found.lead, report.baseRevisionNumber);
  if (!inventory) return null;
  const prices = await ownPricesOf(composerUserId);
  const composed = composeInput(inventory.plant, composition, prices);
  const result = estimateComposed(composed, inventory.plant, composition);
  return { composition, inventory, composed, result, suggestions: suggestionsFor(inventory.plant, prices) };
}

function priceBasisOfResult(result: PlantResult): PriceBasis {
  return result.assumptions.priceTableIllustrative
    ? { kind: 'demo-table', note: 'Installed costs from Lagwise’s illustrative demo prices, except where typed per run.' }
    : { kind: 'own-table', note: `Installed costs from ${result.assumptions.priceTable}, except where typed per run.` };
}

async function photoLinks(leadId: string, ids: readonly string[] | null) {
  const [all, runs] = await Promise.all([listLeadAttachments(getDb(), leadId), listLeadRuns(getDb(), leadId)]);
  const files = all.filter((f) => f.contentType.startsWith('image/'));
  const labels = new Map(runs.map((run) => [run.id, run.label]));
  const chosen = ids === null ? files : ids.map((id) => files.find((f) => f.id === id)).filter((f): f is (typeof files)[number] => f !== undefined);
  return Promise.all(
    chosen.map(async (file) => {
      const signed = await signedReadUrl(file.objectKey);
      const caption = file.pipeRunId ? (labels.get(file.pipeRunId) ?? 'A run') : 'The plant';
      return { id: file.id, url: signed.url, runId: file.pipeRunId, caption, expiresAt: signed.expiresAt.toISOString() };
    }),
  );
}

/** The ids of the lead's photos a report may show (images only). */
export async function leadPhotoIds(leadId: string): Promise<Set<string>> {
  const files = await listLeadAttachments(getDb(), leadId);
  return new Set(files.filter((f) => f.contentType.startsWith('image/')).map((f) => f.id));
}

/** One report whole, as `role` may see it. */
export async function reportView(found: LeadRecord, role: ReportRole, report: Report, viewer: SessionUser): Promise<ReportView> {
  const rows = await listLeadReports(getDb(), found.lead.id);
  const summary = summarize(rows).find((s) => s.id === report.id);
  if (!summary) throw new Error('a report is always among its lead’s reports');
  const lead = found.lead;
  const base = {
    ...summary,
    lead: { id: lead.id, reference: lead.reference, status: lead.status, latestRevisionNumber: latestInventoryNumber(lead) },
    plant: { name: lead.plantName || lead.companyName, countryCode: lead.countryCode, unitSystem: unitSystemOf(lead.questionnaire), pageSize: paperSizeFor(lead.countryCode) },
  };
  if (report.status === 'sent') {
    const result = report.resultSnapshot as PlantResult;
    const latest = rows.filter((r) => r.status === 'sent').reduce((max, r) => Math.max(max, r.version ?? 0), 0);
    return {
      ...base,
      composition: compositionOf(report),
      consultant: report.consultant as ReportPerson,
      plantInput: report.plantInput as Record<string, unknown>,
      result: result as unknown as Record<string, unknown>,
      suggestions: null,
      priceBasis: priceBasisOfResult(result),
      photos: await photoLinks(lead.id, compositionOf(report).photoIds),
      photoChoices: null,
      pdfUrl: report.pdfObjectKey ? `/api/reports/${report.id}/pdf` : null,
      pdfRemoved: !report.pdfObjectKey && report.pdfRenderedAt !== null,
      allowed: { edit: false, send: false, answer: role === 'owner' && report.version === latest && report.answer === null && lead.status === 'report_sent' },
    };
  }
  const composer = report.authorUserId ?? viewer.id;
  const figures = await draftFigures(found, report, composer);
  const composition = compositionOf(report);
  return {
    ...base,
    composition,
    consultant: await consultantNamed(composer),
    plantInput: figures?.composed.input ?? {},
    result: (figures?.result ?? {}) as unknown as Record<string, unknown>,
    suggestions: figures?.suggestions ?? ([] as RunSuggestion[]),
    priceBasis: figures?.composed.priceBasis ?? { kind: 'demo-table', note: 'The inventory this draft starts from is no longer there.' },
    photos: await photoLinks(lead.id, composition.photoIds),
    photoChoices: await photoLinks(lead.id, null),
    pdfUrl: null,
    pdfRemoved: false,
    allowed: { edit: mayCompose(role, lead), send: mayCompose(role, lead), answer: false },
  };
}

/** GET /api/reports/{id}. */
export async function getReportFor(user: SessionUser, reportId: string | undefined): Promise<ReportView> {
  const { found, role, report } = await reachReport(user, reportId);
  return reportView(found, role, report, user);
}
