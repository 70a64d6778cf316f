/**
 * Errors the domain raises on purpose, each with a code. Endpoints map codes to HTTP
 * statuses in one place (./http); domain code never speaks HTTP.
 */
export type DomainErrorCode =
  | 'NOT_FOUND'
  | 'ALREADY_CLAIMED'
  | 'CLAIM_LIMIT'
  | 'INVALID_TRANSITION'
  | 'CONFLICT'
  /** Input that parsed but names something that does not fit (a prefix of another country, an unknown id in a list). */
  | 'INVALID_INPUT'
  /** A link that worked once and no longer does (used, expired or withdrawn). */
  | 'GONE'
  | 'UNPROCESSABLE'
  | 'RATE_LIMITED'
  | 'FORBIDDEN'
  | 'UPLOAD_REFUSED'
  | 'PAYLOAD_TOO_LARGE'
  | 'SERVICE_UNAVAILABLE';

export class DomainError extends Error {
  /** For RATE_LIMITED and SERVICE_UNAVAILABLE: when to try again (sent as Retry-After). */
  retryAfterSeconds?: number;

  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly field?: string,
    /** Plain data the caller can act on (e.g. who claimed a lead first, and when). */
    readonly details?: Record<string, unknown>,
    /** Every field at fault, when there is more than one (`field` is the first). */
    readonly issues?: readonly { path: string; message: string }[],
  ) {
    super(message);
    this.name = 'DomainError';
  }

  /** The same error, carrying when to try again. */
  withRetryAfter(seconds: number): this {
    this.retryAfterSeconds = Math.max(1, Math.ceil(seconds));
    return this;
  }
}
