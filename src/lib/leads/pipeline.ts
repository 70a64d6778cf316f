/**
 * The consultant's pipeline: which stage a lead may move to from which, as one table, checked
 * on the server for every move and release. The words people see for each stage are here too.
 *
 * `report_sent` is reached only by sending a report (the report composer sets it), never by a
 * hand move: the owner's page promises a readable report at that stage, so a lead must not
 * claim one that does not exist.
 */
import type { AssessmentStatus } from '../../db/statuses';

/** The stages of a lead a consultant holds. */
export const heldStages = ['claimed', 'in_touch', 'site_walk_booked', 'report_sent', 'signed', 'closed'] as const;
export type HeldStage = (typeof heldStages)[number];

/** Stages that count against a consultant's cap of open claims: work they still owe the owner. */
export const openClaimStages = ['claimed', 'in_touch', 'site_walk_booked'] as const satisfies readonly HeldStage[];

/**
 * Stages at which the holder may revise the inventory after a site walk: until the work is
 * agreed or the lead closed. A revision after the report is out feeds a corrected report.
 */
export const revisableStages = ['claimed', 'in_touch', 'site_walk_booked', 'report_sent'] as const satisfies readonly HeldStage[];

export function isRevisableStage(status: AssessmentStatus): boolean {
  return (revisableStages as readonly string[]).includes(status);
}

/** Stages a consultant may choose in a move (`report_sent` comes from sending a report). */
export const movableStages = ['in_touch', 'site_walk_booked', 'signed', 'closed'] as const satisfies readonly HeldStage[];
export type MoveTarget = (typeof movableStages)[number];

interface StageRules {
  /** Where a hand move may take the lead from here. */
  readonly moves: readonly MoveTarget[];
  /** Whether the holder may hand it back to the region (status `fresh`). */
  readonly release: boolean;
}

/** The one table of allowed moves. */
export const pipeline: Readonly<Record<HeldStage, StageRules>> = {
  claimed: { moves: ['in_touch', 'closed'], release: true },
  in_touch: { moves: ['site_walk_booked', 'closed'], release: true },
  // A canceled walk goes back to talking; the owner's answer can also end it here.
  site_walk_booked: { moves: ['in_touch', 'closed'], release: true },
  report_sent: { moves: ['signed', 'closed'], release: false },
  signed: { moves: [], release: false },
  closed: { moves: [], release: false },
};

export function isHeldStage(status: AssessmentStatus): status is HeldStage {
  return (heldStages as readonly string[]).includes(status);
}

/** How each stage reads on the desk (our own words; the owner's page has its own). */
export const stageText: Readonly<Record<AssessmentStatus, { label: string; hint: string }>> = {
  fresh: { label: 'Open', hint: 'Waiting for a consultant of the region to take it on.' },
  claimed: { label: 'Taken on', hint: 'You hold it; the owner has been told you will call.' },
  in_touch: { label: 'Talking', hint: 'You and the owner are in touch.' },
  site_walk_booked: { label: 'Walk booked', hint: 'A date is set to walk the lines on site.' },
  report_sent: { label: 'Report out', hint: 'The report is with the owner.' },
  signed: { label: 'Work agreed', hint: 'The owner has agreed to the work.' },
  closed: { label: 'Closed', hint: 'Ended without work, for the reason given.' },
  unrouted: { label: 'No region', hint: 'No region covers its postal code; the admin routes it.' },
  junk: { label: 'Set aside', hint: 'Marked as not a real inquiry.' },
};

/** The verb on the button that makes a move, e.g. "Mark as talking". */
export const moveText: Readonly<Record<MoveTarget, string>> = {
  in_touch: 'We are talking',
  site_walk_booked: 'Site walk booked',
  signed: 'Work agreed',
  closed: 'Close the lead',
};

/** Why a lead is closed: a short list, so the funnel can count them. */
export const closeReasons = [
  { id: 'no-answer', label: 'The owner stopped answering' },
  { id: 'too-small', label: 'Savings too small to act on' },
  { id: 'went-elsewhere', label: 'The owner chose another firm' },
  { id: 'postponed', label: 'The owner put the work off' },
  { id: 'report-declined', label: 'The owner declined the report' },
  { id: 'not-our-work', label: 'Not work we do' },
  { id: 'other', label: 'Something else (say what in the note)' },
] as const;
export type CloseReason = (typeof closeReasons)[number]['id'];

/** Why a consultant hands a lead back to the region. */
export const releaseReasons = [
  { id: 'no-capacity', label: 'We cannot take it on now' },
  { id: 'too-far', label: 'Too far from us' },
  { id: 'not-our-work', label: 'Not work we do' },
  { id: 'conflict', label: 'We have a conflict of interest' },
  { id: 'other', label: 'Something else (say what in the note)' },
] as const;
export type ReleaseReason = (typeof releaseReasons)[number]['id'];

export type MoveCheck = { ok: true } | { ok: false; reason: string };

/** Whether the table allows a move from `from` to `to`, and if not, a sentence saying why. */
export function checkMove(from: AssessmentStatus, to: MoveTarget): MoveCheck {
  if (from === 'fresh') return { ok: false, reason: 'Claim the lead before moving it along.' };
  if (!isHeldStage(from)) return { ok: false, reason: `This lead is “${stageText[from].label}” and is not in anyone’s pipeline.` };
  if (from === to) return { ok: false, reason: `The lead is already at “${stageText[to].label}”.` };
  if (pipeline[from].moves.includes(to)) return { ok: true };
  if (to === 'signed') {
    return { ok: false, reason: 'Work is agreed after the owner has the report; send the report first.' };
  }
  if (from === 'signed' || from === 'closed') {
    return { ok: false, reason: `The lead is “${stageText[from].label}”; it does not move any more.` };
  }
  const allowed = pipeline[from].moves.map((m) => `“${stageText[m].label}”`).join(' or ');
  return { ok: false, reason: `From “${stageText[from].label}” a lead moves to ${allowed}, not to “${stageText[to].label}”.` };
}

/** Whether the holder may hand the lead back, and if not, why. */
export function checkRelease(from: AssessmentStatus): MoveCheck {
  if (from === 'fresh') return { ok: false, reason: 'The lead is open already; nobody holds it.' };
  if (!isHeldStage(from)) return { ok: false, reason: `This lead is “${stageText[from].label}” and is not in anyone’s pipeline.` };
  if (pipeline[from].release) return { ok: true };
  if (from === 'report_sent') return { ok: false, reason: 'The owner has your report; close the lead instead of handing it back.' };
  return { ok: false, reason: `The lead is “${stageText[from].label}”; it can no longer be handed back.` };
}
