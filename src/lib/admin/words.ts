/** The admin area's own words for its steps, reasons and states, shared by pages and islands. */
import type { AttentionReason, FunnelStep } from '../../schemas/admin';

export const funnelStepLabels: Record<FunnelStep, string> = {
  submitted: 'Sent by the owner',
  claimed: 'Taken on',
  in_touch: 'Talking',
  site_walk: 'Walk booked',
  report_sent: 'Report out',
  signed: 'Work agreed',
};

export const attentionReasonText: Record<AttentionReason, { label: string; hint: string }> = {
  unrouted: { label: 'No region', hint: 'No region covers its postal code; hand it to a consultant or add the code to a region.' },
  stale: { label: 'Waiting too long', hint: 'Open in its region, and nobody has taken it on.' },
  'over-cap': { label: 'Over the cap', hint: 'Its consultant holds more open leads than their cap.' },
  'holder-deactivated': { label: 'Consultant gone', hint: 'Its consultant was deactivated; hand it to someone else.' },
};

export const consultantStatusText = {
  invited: 'Invited, not joined yet',
  active: 'Active',
  deactivated: 'Deactivated',
} as const;

/** "3 h", "2 days", "5 weeks". */
export function waitedText(hours: number): string {
  if (hours < 48) return `${hours} h`;
  const days = Math.floor(hours / 24);
  return days < 21 ? `${days} days` : `${Math.floor(days / 7)} weeks`;
}

const monthFormat = new Intl.DateTimeFormat('en-GB', { month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "2026-03" → "Mar 2026". */
export function monthText(month: string): string {
  return monthFormat.format(new Date(`${month}-01T00:00:00Z`));
}

const stamp = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

/** A moment as the admin area prints it (UTC, said so). */
export function whenText(iso: string): string {
  return `${stamp.format(new Date(iso))} UTC`;
}
