/**
 * The checks that read the assessment schema — the very one the server parses with. The
 * schema and its validation library are the largest part of the form's code, and nothing
 * needs them before the first check, so this module is loaded then (`loadValidation`).
 */
import { get, type FieldError } from 'react-hook-form';
import type { z } from 'zod';
import { plantInputSchema, type PlantInput, type RangeIssueParams } from '../../engine';
import type { FieldContext } from '../../lib/form-fields';
import { fieldMessage } from '../../lib/field-messages';
import { createAssessmentSchema } from '../../schemas/assessment';
import { stepOfPath, type StepId } from './draft';
import { toPlantInput } from './posting';
import { NOTHING_TYPED, type WasTyped } from './confidence';
import { fieldContextOf } from './resolver';

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


/** Steps with at least one problem, read from the same schema the server parses with. */
export function stepsWithProblems(values: unknown): Set<StepId> {
  const parsed = createAssessmentSchema.safeParse(values);
  const steps = new Set<StepId>();
  if (parsed.success) return steps;
  for (const issue of parsed.error.issues) steps.add(stepOfPath(issue.path.map(String).join('.')));
  return steps;
}

/** The estimate input when the draft's estimate part is complete and valid, else null. */
export function validPlantInput(estimate: unknown, countryCode?: string, wasTyped: WasTyped = NOTHING_TYPED): PlantInput | null {
  if (typeof estimate !== 'object' || estimate === null || !Array.isArray((estimate as PlantInput).runs)) return null;
  const input = toPlantInput(estimate as PlantInput, countryCode, wasTyped);
  return plantInputSchema.safeParse(input).success ? input : null;
}
