/**
 * Errors the domain raises on purpose, each with a code. Endpoints map codes to HTTP
 * statuses in one place (./http); domain code never speaks HTTP.
 */
export type DomainErrorCode =
  | 'NOT_FOUND'
  | 'ALREADY_CLAIMED'
  | 'INVALID_TRANSITION'
  | 'CONFLICT'
  | 'UNPROCESSABLE'
  | 'RATE_LIMITED'
  | 'FORBIDDEN'
  | 'UPLOAD_REFUSED'
  | 'PAYLOAD_TOO_LARGE'
  | 'SERVICE_UNAVAILABLE';

export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'DomainError';
  }
}
