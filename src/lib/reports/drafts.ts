/**
 * The composer's drafts: one per lead, made empty or from a sent version (a correction), saved
 * on the server as the consultant edits. Only the consultant holding the lead (or an admin)
 * composes, and only while the lead is at a stage a report can still be sent from.
 */
import { getDb } from '../../db/client';
import { findDraft, findVersion, insertDraft, latestVersionNumber, updateDraft } from '../../db/queries/reports';
import type { Report } from '../../db/schema';
import type { ReportPatch, ReportView } from '../../schemas/reports';
import { reportCompositionSchema } from '../../schemas/reports';
import { DomainError } from '../errors';
import { stageText } from '../leads/pipeline';
import type { SessionUser } from '../session';
import { mayCompose, reachLeadReports, reachReport, type ReachedLead } from './access';
import { loadInventory } from './base';
import { composeInput, compositionIssues, estimateComposed } from './compose';
import { compositionOf } from './composition';
import { leadPhotoIds, ownPricesOf, reportView } from './read';

function cannotCompose(reached: ReachedLead): DomainError {
  if (reached.role === 'owner') return new DomainError('FORBIDDEN', 'Reports are written by the consultant who holds the lead.');
  return new DomainError(
    'INVALID_TRANSITION',
    `This lead is “${stageText[reached.found.lead.status].label}”; a report can be composed while you hold it, up to the owner’s answer.`,
  );
}

/**
 * POST /api/leads/{id}/reports: the lead's draft — the one already open, or a new one starting
 * from the latest inventory, copying the latest (or the named) version's composition when one
 * was sent. `created` says which.
 */
export async function openDraft(user: SessionUser, leadId: string | undefined, request: { fromVersion?: number; blank?: boolean }): Promise<{ created: boolean; report: ReportView }> {
  const reached = await reachLeadReports(user, leadId);
  if (!mayCompose(reached.role, reached.found.lead)) throw cannotCompose(reached);
  const db = getDb();
  const lead = reached.found.lead;
  const existing = await findDraft(db, lead.id);
  if (existing) return { created: false, report: await reportView(reached.found, reached.role, existing, user) };
  let composition: unknown = reportCompositionSchema.parse({});
  if (!request.blank) {
    const from = request.fromVersion ?? (await latestVersionNumber(db, lead.id));
    if (request.fromVersion !== undefined || from > 0) {
      const version = await findVersion(db, lead.id, from);
      if (!version) throw new DomainError('INVALID_INPUT', `This lead has no version ${from} to start from.`, 'fromVersion');
      composition = compositionOf(version);
    }
  }
  const inventory = await loadInventory(db, lead);
  if (!inventory) throw new Error('a lead always has its latest inventory');
  const made = await insertDraft(db, { assessmentId: lead.id, authorUserId: user.id, baseRevisionNumber: inventory.number, composition });
  // Made at the same moment by another request: that one is the draft.
  const draft: Report | null = made ?? (await findDraft(db, lead.id));
  if (!draft) throw new DomainError('CONFLICT', 'The draft changed while it was being made; reload the composer.');
  return { created: made !== null, report: await reportView(reached.found, reached.role, draft, user) };
}

/** PATCH /api/reports/{id}: saves part of a draft and answers with the figures as composed now. */
export async function saveDraft(user: SessionUser, reportId: string | undefined, patch: ReportPatch): Promise<ReportView> {
  const reached = await reachReport(user, reportId);
  const { report, found } = reached;
  if (report.status !== 'draft') {
    throw new DomainError('CONFLICT', `Version ${report.version} was sent and cannot change; start a new draft to correct it.`, undefined, { version: report.version });
  }
  if (!mayCompose(reached.role, found.lead)) throw cannotCompose(reached);
  const db = getDb();
  const { baseRevisionNumber, ...parts } = patch;
  const composition = reportCompositionSchema.parse({ ...compositionOf(report), ...Object.fromEntries(Object.entries(parts).filter(([, v]) => v !== undefined)) });
  const baseNumber = baseRevisionNumber ?? report.baseRevisionNumber;
  const inventory = await loadInventory(db, found.lead, baseNumber);
  if (!inventory) throw new DomainError('INVALID_INPUT', `This lead has no inventory state ${baseNumber}.`, 'baseRevisionNumber');
  const issues = compositionIssues(inventory.plant, composition, await leadPhotoIds(found.lead.id));
  if (issues.length) throw new DomainError('INVALID_INPUT', `${issues[0]!.path}: ${issues[0]!.message}`, issues[0]!.path, undefined, issues);
  // Refused by the engine (a material not rated for the line): nothing is saved, the field is named.
  estimateComposed(composeInput(inventory.plant, composition, await ownPricesOf(user.id)), inventory.plant, composition);
  const saved = await updateDraft(db, report.id, { composition, baseRevisionNumber: baseNumber, authorUserId: user.id });
  if (!saved) throw new DomainError('CONFLICT', 'This draft was sent meanwhile and cannot change; start a new draft to correct it.');
  return reportView(found, reached.role, saved, user);
}
