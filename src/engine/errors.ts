import type { z } from 'zod';
import type { RangeIssueParams } from './schema-helpers';

/**
 * Codes for failures the input schema cannot catch. The HTTP layer maps a code to
 * a status (e.g. INVALID_INPUT → 400, UNKNOWN_PIPE_SIZE → 422); it never matches
 * on the message, which is a sentence for people.
 */
export type EngineErrorCode =
  | 'INVALID_INPUT'
  | 'UNKNOWN_PIPE_SIZE'
  | 'UNKNOWN_SCHEDULE'
  | 'UNKNOWN_MATERIAL'
  | 'PRESSURE_OUT_OF_RANGE'
  | 'TEMPERATURE_OUT_OF_RANGE'
  | 'MATERIAL_OUT_OF_SERVICE_RANGE'
  | 'NO_CONVERGENCE'
  | 'NON_FINITE_RESULT';

/** One field-level problem, as reported by the input schema. */
export interface EngineIssue {
  readonly path: readonly (string | number)[];
  readonly message: string;
  /** For a range issue: the quantity, the limit crossed and both values in SI, so a client can re-word it. */
  readonly params?: RangeIssueParams;
}

/** The issues of a failed parse, each with its path, sentence and (for ranges) params. */
export function engineIssuesOf(error: z.ZodError): EngineIssue[] {
  return error.issues.map((issue) => {
    const params = issue.code === 'custom' ? (issue.params as RangeIssueParams | undefined) : undefined;
    return {
      path: issue.path.filter((p): p is string | number => typeof p !== 'symbol'),
      message: issue.message,
      ...(params && typeof params.limitSI === 'number' ? { params } : {}),
    };
  });
}

/** The INVALID_INPUT error for a failed parse. */
export function invalidInput(error: z.ZodError): EngineError {
  const issues = engineIssuesOf(error);
  return new EngineError('INVALID_INPUT', issues.map((i) => i.message).join(' '), issues);
}

/** Typed error thrown by the engine; `code` is stable, `message` is readable. */
export class EngineError extends Error {
  override readonly name = 'EngineError';
  readonly code: EngineErrorCode;
  readonly issues: readonly EngineIssue[];

  constructor(code: EngineErrorCode, message: string, issues: readonly EngineIssue[] = []) {
    super(message);
    this.code = code;
    this.issues = issues;
  }
}

/** True when `value` is an {@link EngineError} (works across module copies). */
export function isEngineError(value: unknown): value is EngineError {
  return value instanceof EngineError || (value instanceof Error && value.name === 'EngineError' && 'code' in value);
}
