/**
 * Sending a report: the draft is worked out once more from its inventory and frozen as the next
 * numbered version — the engine input, its full result, the consultant as named in it — the lead
 * moves to `report_sent`, an activity entry is written and the PDF's rendering is queued, all in
 * one transaction. The worker renders the PDF from the frozen version and queues the owner's
 * e-mail with it attached. Sending a version again answers with that version: nothing changes.
 */
import { getDb } from '../../db/client';
import { recordActivity } from '../../db/queries/assessments';
import { freezeDraft, latestVersionNumber, markLeadReportSent } from '../../db/queries/reports';
import { findReport } from '../../db/queries/reports';
import { ENGINE_VERSION } from '../../engine';
import type { ReportView } from '../../schemas/reports';
import { inTransaction } from '../../db/transaction';
import { DomainError } from '../errors';
import { enqueue, jobNames } from '../jobs/queue';
import { stageText } from '../leads/pipeline';
import type { SessionUser } from '../session';
import { composableStages, mayCompose, reachReport } from './access';
import { loadInventory } from './base';
import { composeInput, compositionIssues, estimateComposed, sendIssues, suggestionsFor } from './compose';
import { compositionOf } from './composition';
import { consultantNamed, leadPhotoIds, ownPricesOf, reportView } from './read';

/** POST /api/reports/{id}/send: the draft becomes the next version; a version sent again is answered as it is. */
export async function sendReport(user: SessionUser, reportId: string | undefined): Promise<{ sentNow: boolean; report: ReportView }> {
  const reached = await reachReport(user, reportId);
  const { found, role, report } = reached;
  if (report.status === 'sent') return { sentNow: false, report: await reportView(found, role, report, user) };
  if (!mayCompose(role, found.lead)) {
    throw new DomainError('INVALID_TRANSITION', `This lead is “${stageText[found.lead.status].label}”; a report can no longer be sent on it.`);
  }
  const db = getDb();
  const composition = compositionOf(report);
  const inventory = await loadInventory(db, found.lead, report.baseRevisionNumber);
  if (!inventory) throw new DomainError('CONFLICT', 'The inventory this draft starts from is no longer there; start it again from the latest one.');
  const prices = await ownPricesOf(user.id);
  const issues = [
    ...compositionIssues(inventory.plant, composition, await leadPhotoIds(found.lead.id)),
    ...sendIssues(inventory.plant, composition, suggestionsFor(inventory.plant, prices)),
  ];
  if (issues.length) throw new DomainError('INVALID_INPUT', `${issues[0]!.path}: ${issues[0]!.message}`, issues[0]!.path, undefined, issues);
  const composed = composeInput(inventory.plant, composition, prices);
  const result = estimateComposed(composed, inventory.plant, composition);
  const consultant = await consultantNamed(user.id);
  const holder = role === 'admin' ? null : user.id;

  const frozen = await inTransaction(async (tx, sqlRunner) => {
    const version = (await latestVersionNumber(tx, found.lead.id)) + 1;
    const sent = await freezeDraft(tx, report.id, {
      version,
      composition,
      plantInput: composed.input,
      resultSnapshot: result,
      engineVersion: ENGINE_VERSION,
      consultant,
      authorUserId: user.id,
    });
    // Sent by a simultaneous request: that one made the version.
    if (!sent) return null;
    const lead = await markLeadReportSent(tx, found.lead.id, composableStages, holder);
    if (!lead) throw new DomainError('CONFLICT', 'The lead changed while the report was being sent; reload the page to see where it stands.');
    await recordActivity(tx, {
      assessmentId: found.lead.id,
      actorUserId: user.id,
      action: 'report.sent',
      detail: {
        reportId: sent.id,
        version,
        from: found.lead.status,
        runsWithWork: result.totals.runsWithWork,
        annualSaving: result.totals.savings.annualCost,
        installedCost: result.totals.installedCost,
        currency: result.currency,
      },
    });
    await enqueue(jobNames.renderReportPdf, { reportId: sent.id }, { sqlRunner });
    return sent;
  });
  const current = frozen ?? (await findReport(db, report.id));
  if (!current) throw new Error('a sent report is never deleted');
  const { found: now } = await reachReport(user, current.id);
  return { sentNow: frozen !== null, report: await reportView(now, role, current, user) };
}
