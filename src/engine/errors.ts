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
