/**
 * The form's checks: the very schema the server parses with, each refusal worded with the
 * field's own label and in the unit the person typed in (src/lib/field-messages.ts).
 */
import { toNestErrors, validateFieldsNatively } from '@hookform/resolvers';
import { get, type FieldError, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import type { RangeIssueParams } from '../../engine';
import type { FieldContext } from '../../lib/form-fields';
import { fieldMessage } from '../../lib/field-messages';
import { createAssessmentSchema } from '../../schemas/assessment';
import { fuelById, type DraftValues } from './draft';
import { PRICE_UNIT_NAMES } from './price-units';

/** The unit system, currency and price unit the form's values are typed in. */
export function fieldContextOf(values: unknown): FieldContext {
  const estimate = (values as Partial<DraftValues> | undefined)?.estimate;
  return fieldContextFrom(estimate?.unitSystem, estimate?.energy?.currency, estimate?.energy?.priceUnit, estimate?.energy?.fuel);
}

/** The same from the four values it depends on (what a field watches). */
export function fieldContextFrom(system: unknown, currency: unknown, priceUnit: unknown, fuelId: unknown): FieldContext {
  const fuel = fuelById(typeof fuelId === 'string' ? fuelId : undefined);
  const unit = (typeof priceUnit === 'string' && priceUnit in PRICE_UNIT_NAMES ? priceUnit : undefined) ?? fuel?.defaultPriceUnit ?? 'kWh';
  return {
    system: system === 'US' ? 'US' : 'SI',
    currency: typeof currency === 'string' && currency ? currency : 'USD',
    priceUnitName: PRICE_UNIT_NAMES[unit as keyof typeof PRICE_UNIT_NAMES],
  };
}

type Issue = z.core.$ZodIssue;

/** A union's refusal is told by the branch that came closest (fewest issues), as its own issues. */
function flatten(issues: readonly Issue[], prefix: readonly PropertyKey[] = []): { path: PropertyKey[]; issue: Issue }[] {
  return issues.flatMap((issue) => {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'invalid_union' && issue.errors.length > 0) {
      const closest = issue.errors.reduce((best, branch) => (branch.length < best.length ? branch : best));
      if (closest.length > 0) return flatten(closest, path);
    }
    return [{ path, issue }];
  });
}

/** One refusal in the field's words: range facts from its params, "required" and "not a number" from what was typed. */
export function wordedIssue(issue: Issue, path: string, values: unknown, context: FieldContext): string {
  const typed: unknown = get(values, path);
  const params = issue.code === 'custom' ? (issue.params as RangeIssueParams | undefined) : undefined;
  return fieldMessage(
    {
      path,
      message: issue.message,
      params: params && typeof params.limitSI === 'number' ? params : undefined,
      typed,
      notANumber: issue.code === 'invalid_type' && typed !== undefined && typeof typed !== 'number',
    },
    context,
  );
}

/** The errors of the values as the form shows them: first refusal per field, in its own words. */
export function fieldErrorsOf(values: unknown): Record<string, FieldError> {
  const parsed = createAssessmentSchema.safeParse(values);
  if (parsed.success) return {};
  const context = fieldContextOf(values);
  const errors: Record<string, FieldError> = {};
  for (const { path, issue } of flatten(parsed.error.issues)) {
    const key = path.map(String).join('.');
    if (errors[key]) continue;
    errors[key] = { type: issue.code, message: wordedIssue(issue, key, values, context) };
  }
  return errors;
}

/** react-hook-form's resolver over the assessment schema, messages in the field's words. */
export const wordedResolver: Resolver<DraftValues> = async (values, _context, options) => {
  const errors = fieldErrorsOf(values);
  if (Object.keys(errors).length === 0) {
    if (options.shouldUseNativeValidation) validateFieldsNatively({}, options);
    // The values as typed: the draft keeps what the person gave, the server fills the defaults.
    return { values, errors: {} };
  }
  return { values: {}, errors: toNestErrors(errors, options) };
};
