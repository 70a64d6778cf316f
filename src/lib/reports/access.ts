/**
 * Who reaches a report: the plant's owner (sent versions only), the consultant holding the lead
 * and admins (drafts too). Anyone else — another owner, a consultant of the region who does not
 * hold it, the consultant who held it before handing it back — is answered exactly as for a
 * report that does not exist, so ids cannot be probed.
 */
import { getDb } from '../../db/client';
import { findLead, type LeadRecord } from '../../db/queries/leads';
import { findReport } from '../../db/queries/reports';
import type { AssessmentStatus, Report } from '../../db/schema';
import { DomainError } from '../errors';
import { can } from '../guards';
import { isLeadId } from '../leads/access';
import { isHeldStage } from '../leads/pipeline';
import type { SessionUser } from '../session';

/** How the viewer stands to a lead's reports. */
export type ReportRole = 'owner' | 'holder' | 'admin';

/** Lead stages at which a report may be composed and sent (a correction too, once one is out). */
export const composableStages = ['claimed', 'in_touch', 'site_walk_booked', 'report_sent'] as const satisfies readonly AssessmentStatus[];

export function isComposableStage(status: AssessmentStatus): boolean {
  return (composableStages as readonly string[]).includes(status);
}

/** The one answer for a report (or a lead's reports) the viewer cannot reach. */
export function reportNotFound(): DomainError {
  return new DomainError('NOT_FOUND', 'There is no report at this address among the reports you can read.');
}

/** The viewer's standing to a lead, or null when they have none. */
export function reportRoleFor(user: SessionUser, lead: { ownerUserId: string | null; claimedByUserId: string | null; status: AssessmentStatus }): ReportRole | null {
  if (!can(user, 'report', 'read')) return null;
  if (can(user, 'lead', 'reassign')) return 'admin';
  if (lead.claimedByUserId === user.id && isHeldStage(lead.status) && can(user, 'lead', 'send-report')) return 'holder';
  if (lead.ownerUserId === user.id && user.role === 'owner') return 'owner';
  return null;
}

/** Whether the role may see a report in this state (owners never see drafts). */
export function mayRead(role: ReportRole, report: Pick<Report, 'status'>): boolean {
  return role !== 'owner' || report.status === 'sent';
}

/** Whether the role may compose and send on this lead now. */
export function mayCompose(role: ReportRole, lead: { status: AssessmentStatus }): boolean {
  return (role === 'holder' || role === 'admin') && isComposableStage(lead.status);
}

export interface ReachedLead {
  readonly found: LeadRecord;
  readonly role: ReportRole;
}

/** The lead as the viewer reaches it for its reports; NOT_FOUND otherwise. */
export async function reachLeadReports(user: SessionUser, leadId: string | undefined): Promise<ReachedLead> {
  if (!isLeadId(leadId)) throw reportNotFound();
  const found = await findLead(getDb(), leadId, undefined);
  if (!found) throw reportNotFound();
  const role = reportRoleFor(user, found.lead);
  if (!role) throw reportNotFound();
  return { found, role };
}

export interface ReachedReport extends ReachedLead {
  readonly report: Report;
}

/** A report as the viewer reaches it; NOT_FOUND for one they may not read (a draft, to an owner). */
export async function reachReport(user: SessionUser, reportId: string | undefined): Promise<ReachedReport> {
  if (!isLeadId(reportId)) throw reportNotFound();
  const report = await findReport(getDb(), reportId);
  if (!report) throw reportNotFound();
  const reached = await reachLeadReports(user, report.assessmentId);
  if (!mayRead(reached.role, report)) throw reportNotFound();
  return { ...reached, report };
}
