/**
 * Validation messages in the words and units of the field a person typed in. The engine's
 * schema refuses in SI with its own names ("Run length must be more than 0 m"); a range
 * refusal carries its facts in `params` (limit and given value in SI), and this module says it
 * again with the form's label, in the unit the box shows, rounded the way the box is.
 * The browser's checks and the server's 400s both pass through {@link fieldMessage}.
 */
import type { RangeIssueParams } from '../engine';
import { formFieldAt, type FieldContext, type FormField } from './form-fields';
import { displayUnit } from './units-display';
import { DEFAULT_LOCALE, numberFormat, typeset, withUnit } from './presentation/rounding';
import { materialWords } from './presentation/material-words';

/** What is known of one refusal: its path, the engine's sentence, and what kind it is. */
export interface FieldIssue {
  readonly path: string;
  readonly message: string;
  /** Range facts, when the refusal is a limit crossed. */
  readonly params?: RangeIssueParams | undefined;
  /** What the person left in the box, for "is required" and "not a number". */
  readonly typed?: unknown;
  /** The parse found no number where one was wanted. */
  readonly notANumber?: boolean;
}

interface Shown {
  readonly symbol: string;
  readonly decimals: number;
  readonly fromSI: (value: number) => number;
}

function shownUnit(field: FormField, context: FieldContext): Shown {
  if (field.quantity) {
    const unit = displayUnit(field.quantity, context.system);
    return { symbol: unit.symbol, decimals: unit.inputDecimals, fromSI: unit.fromBase };
  }
  return { symbol: field.unitText?.(context) ?? '', decimals: field.decimals ?? 2, fromSI: (value) => value };
}

/**
 * A value written as the box would take it: at most the unit's input decimals, grouped,
 * with a true minus. A limit is rounded toward the allowed side, so typing the figure the
 * message names is always accepted.
 */
function written(value: number, decimals: number, toward?: 'up' | 'down'): string {
  const scale = 10 ** decimals;
  const scaled = Number((value * scale).toPrecision(12));
  const whole = toward === 'up' ? Math.ceil(scaled) : toward === 'down' ? Math.floor(scaled) : Math.round(scaled);
  const rounded = whole / scale;
  const text = numberFormat(DEFAULT_LOCALE, { maximumFractionDigits: decimals, useGrouping: true }).format(Object.is(rounded, -0) ? 0 : rounded);
  return typeset(text);
}

/** Decimals that keep a limit to four significant figures, never more than the box takes. */
function limitDecimals(value: number, boxDecimals: number): number {
  if (value === 0) return 0;
  const integerDigits = Math.floor(Math.log10(Math.abs(value))) + 1;
  return Math.max(0, Math.min(boxDecimals, 4 - integerDigits));
}

function describeTyped(typed: unknown): string {
  if (typeof typed === 'string') return `“${typed.length > 30 ? `${typed.slice(0, 30)}…` : typed}”`;
  return 'something else';
}

function rangeMessage(field: FormField, params: RangeIssueParams, context: FieldContext): string {
  const unit = shownUnit(field, context);
  const limitShown = unit.fromSI(params.limitSI);
  const givenShown = unit.fromSI(params.givenSI);
  // Toward the allowed side, and no more than four figures: "at most 2,320 psig", not 2,320.6.
  const toward = params.limit === 'min' ? 'up' : 'down';
  // What was typed, to the box's decimals at least (a horizon of 0.8 years reads 0.8, not 1).
  const givenText = written(givenShown, Math.max(unit.decimals, 2));
  const boundText = written(limitShown, limitDecimals(limitShown, unit.decimals), toward);
  const bound = withUnit(boundText, boundText === '1' && field.singular ? field.singular : unit.symbol);
  const given = withUnit(givenText, givenText === '1' && field.singular ? field.singular : unit.symbol);
  const verb = params.limit === 'min' ? (params.exclusive ? 'more than' : 'at least') : params.exclusive ? 'under' : 'at most';
  const advice = params.limit === 'min' ? field.advice?.min : field.advice?.max;
  return `${field.label} must be ${verb} ${bound}; ${given} was given.${advice ? ` ${advice}` : ''}`;
}

/**
 * A material refused for its line: its rating and the line's temperature in the units the
 * form shows ("Flexible foam tube is rated up to 219 °F; this line runs at 230 °F.").
 */
function ratingMessage(subject: string, params: RangeIssueParams, context: FieldContext): string {
  // A material's rating is a temperature, whatever the line is described by (a steam gauge reads pressure).
  const unit = displayUnit('temperature', context.system);
  const high = params.limit === 'max';
  const bound = withUnit(written(unit.fromBase(params.limitSI), 0, high ? 'down' : 'up'), unit.symbol);
  const line = withUnit(written(unit.fromBase(params.givenSI), 0), unit.symbol);
  return `${materialWords(subject)} is rated ${high ? 'up to' : 'down to'} ${bound}; this line runs at ${line}. Choose a material rated for the line’s temperature.`;
}

/**
 * The sentence to show beside a field: the form's label, the box's unit, the limit rounded
 * toward what is allowed. Anything that is not one of the form's number fields keeps the
 * engine's own sentence.
 */
export function fieldMessage(issue: FieldIssue, context: FieldContext): string {
  if (issue.params?.subject !== undefined) return ratingMessage(issue.params.subject, issue.params, context);
  const field = formFieldAt(issue.path);
  if (!field) return issue.message;
  if (issue.params) return rangeMessage(field, issue.params, context);
  const unit = shownUnit(field, context);
  if (issue.typed === undefined || issue.typed === '' || issue.typed === null) {
    return `${field.label} is required${unit.symbol ? ` (in ${unit.symbol})` : ''}.`;
  }
  if (issue.notANumber) {
    return `${field.label} must be a number${unit.symbol ? ` in ${unit.symbol}` : ''}; ${describeTyped(issue.typed)} was given.`;
  }
  return issue.message;
}
