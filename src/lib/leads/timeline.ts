/**
 * How each entry of a lead's history reads on the desk: one line saying what happened, and the
 * note or reason that came with it.
 */
import type { ActivityEntryView } from '../../schemas/leads';
import { closeReasons, releaseReasons, stageText } from './pipeline';
import type { AssessmentStatus } from '../../db/statuses';

export interface TimelineLine {
  what: string;
  note: string | null;
}

function who(entry: ActivityEntryView): string {
  if (!entry.actor) return 'Someone';
  return entry.actor.firm ? `${entry.actor.name} (${entry.actor.firm})` : entry.actor.name;
}

function stage(value: unknown): string {
  return typeof value === 'string' && value in stageText ? `“${stageText[value as AssessmentStatus].label}”` : 'another stage';
}

function labelOf(list: readonly { id: string; label: string }[], id: unknown): string | null {
  return list.find((r) => r.id === id)?.label ?? null;
}

const text = (value: unknown) => (typeof value === 'string' && value ? value : null);

export function timelineLine(entry: ActivityEntryView): TimelineLine {
  const d = entry.detail;
  switch (entry.action) {
    case 'assessment.submitted':
      return { what: 'The owner sent the assessment', note: null };
    case 'lead.claimed':
      return { what: `${who(entry)} took it on`, note: null };
    case 'lead.moved': {
      const reason = labelOf(closeReasons, d.reason);
      return { what: `${who(entry)} moved it from ${stage(d.from)} to ${stage(d.to)}${reason ? `: ${reason.toLowerCase()}` : ''}`, note: text(d.note) };
    }
    case 'lead.released': {
      const reason = labelOf(releaseReasons, d.reason);
      return { what: `${who(entry)} handed it back to the region${reason ? `: ${reason.toLowerCase()}` : ''}`, note: text(d.note) };
    }
    case 'lead.revised': {
      const parts = [
        typeof d.changed === 'number' && d.changed > 0 ? `${d.changed} run${d.changed === 1 ? '' : 's'} corrected` : null,
        typeof d.added === 'number' && d.added > 0 ? `${d.added} added` : null,
        typeof d.removed === 'number' && d.removed > 0 ? `${d.removed} removed` : null,
      ].filter(Boolean);
      return {
        what: `${who(entry)} saved site-walk revision ${typeof d.number === 'number' ? d.number : ''}${parts.length ? `: ${parts.join(', ')}` : ': figures worked out again'}`,
        note: text(d.reason),
      };
    }
    case 'report.sent':
      return { what: `${who(entry)} sent version ${typeof d.version === 'number' ? d.version : '?'} of the report`, note: null };
    case 'report.answered':
      return {
        what: d.accept === true ? `The owner accepted version ${String(d.version)} of the report and asks to go ahead` : `The owner declined version ${String(d.version)} of the report`,
        note: text(d.reason),
      };
    case 'lead.noted':
      return { what: `${who(entry)} wrote a note`, note: text(d.text) };
    default:
      return { what: `${who(entry)}: ${entry.action}`, note: null };
  }
}
