/**
 * Each activity entry in words for the admin's log: who did what, with the note or reason that
 * came with it. Lead entries read as on the desk's timeline (../leads/timeline).
 */
import type { AssessmentStatus } from '../../db/statuses';
import { stageText } from '../leads/pipeline';
import { timelineLine, type TimelineLine } from '../leads/timeline';

export interface LoggedEntry {
  action: string;
  detail: Record<string, unknown>;
  actorName: string | null;
  actorFirm: string | null;
  subjectName: string | null;
  at: string;
  id: number;
}

const text = (value: unknown) => (typeof value === 'string' && value ? value : null);
const list = (value: unknown) => (Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : []);
const stage = (value: unknown) =>
  typeof value === 'string' && value in stageText ? `“${stageText[value as AssessmentStatus].label}”` : 'another stage';

/** The families of actions, for the log's filter. */
export const actionFamilies = [
  { id: 'lead', label: 'Leads: claims, moves, notes, hand-overs' },
  { id: 'assessment', label: 'Assessments sent by owners' },
  { id: 'region', label: 'Regions' },
  { id: 'consultant', label: 'Consultants and invitations' },
  { id: 'sign-in', label: 'Refused sign-ins' },
  { id: 'settings', label: 'Settings' },
] as const;

export function activityLine(entry: LoggedEntry): TimelineLine {
  const who = entry.actorName ? (entry.actorFirm ? `${entry.actorName} (${entry.actorFirm})` : entry.actorName) : 'Lagwise';
  const whom = entry.subjectName ?? text(entry.detail.name) ?? text(entry.detail.email) ?? 'a consultant';
  const d = entry.detail;
  const reason = text(d.reason);
  switch (entry.action) {
    case 'consultant.invited':
      return { what: `${who} invited ${whom} (${text(d.firm) ?? 'no firm given'})`, note: null };
    case 'consultant.invitation-resent':
      return { what: `${who} sent ${whom} a new invitation link`, note: null };
    case 'consultant.invitation-withdrawn':
      return { what: `${who} withdrew the invitation of ${text(d.name) ?? text(d.email) ?? 'a consultant'}`, note: null };
    case 'consultant.joined':
      return { what: `${who} chose a password and joined`, note: null };
    case 'consultant.updated': {
      const changed = Object.keys((d.changed as Record<string, unknown>) ?? {}).map((k) => (k === 'openClaimCap' ? 'cap of open leads' : k));
      return { what: `${who} changed ${whom}’s ${changed.join(', ') || 'details'}`, note: null };
    }
    case 'consultant.deactivated': {
      const where = d.leads === 'colleague' ? `${d.handedOver ?? 0} open lead(s) handed to a colleague` : `${d.reopened ?? 0} open lead(s) opened again`;
      return { what: `${who} deactivated ${whom}; ${where}`, note: reason };
    }
    case 'consultant.reactivated':
      return { what: `${who} reactivated ${whom}`, note: null };
    case 'account.password-reset':
      return { what: `${who} chose a new password from a reset link`, note: null };
    case 'sign-in.refused':
      return {
        what: `Sign-in refused for ${text(d.email) ?? 'an account'}: ${d.reason === 'deactivated' ? 'the account is deactivated' : 'too many tries'}`,
        note: null,
      };
    case 'region.created':
      return { what: `${who} made the region ${text(d.name) ?? ''} (${list(d.prefixes).join(', ') || 'no prefixes yet'})`, note: null };
    case 'region.updated': {
      const parts = [
        text(d.renamedFrom) ? `renamed from ${text(d.renamedFrom)}` : null,
        list(d.prefixesAdded).length ? `added ${list(d.prefixesAdded).join(', ')}` : null,
        list(d.prefixesRemoved).length ? `removed ${list(d.prefixesRemoved).join(', ')}` : null,
        list(d.consultantsAdded).length || list(d.consultantsRemoved).length ? 'changed its consultants' : null,
      ].filter(Boolean);
      return { what: `${who} changed the region ${text(d.name) ?? ''}${parts.length ? `: ${parts.join('; ')}` : ''}`, note: null };
    }
    case 'region.retired':
      return { what: `${who} retired the region ${text(d.name) ?? ''}`, note: null };
    case 'settings.changed':
      return { what: `${who} set ${d.key === 'staleAfterHours' ? 'the hours before an open lead needs a person' : String(d.key)} from ${String(d.from)} to ${String(d.to)}`, note: null };
    case 'lead.assigned':
      return { what: `${who} handed the lead to ${whom}${d.to && d.from !== d.to ? ` (now ${stage(d.to)})` : ''}`, note: reason };
    case 'lead.reopened':
      return { what: `${who} opened the lead again for its region (${whom} held it)`, note: reason };
    case 'lead.junked':
      return { what: `${who} set the lead aside as junk`, note: reason };
    case 'lead.restored':
      return { what: `${who} took the lead back from junk (now ${stage(d.to)})`, note: reason };
    case 'lead.routed':
      return { what: d.from === 'unrouted' ? 'A region change routed the lead to a region' : 'A region change moved the open lead to another region', note: null };
    case 'lead.unrouted':
      return { what: 'A region change left the lead without a region', note: null };
    default:
      return timelineLine({
        id: entry.id,
        at: entry.at,
        action: entry.action,
        actor: entry.actorName ? { name: entry.actorName, firm: entry.actorFirm } : null,
        detail: d,
      });
  }
}
