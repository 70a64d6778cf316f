/** PostgreSQL's own error under Drizzle's wrapper, which adds the query and its parameters. */
export interface PgError {
  code?: string;
  constraint?: string;
  message: string;
}

export function pgErrorOf(error: unknown): PgError | undefined {
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current && typeof current === 'object'; depth += 1) {
    const candidate = current as { code?: unknown; message?: unknown; cause?: unknown };
    if (typeof candidate.code === 'string') return candidate as PgError;
    current = candidate.cause;
  }
  return undefined;
}

export function isUniqueViolation(error: unknown, constraintPart: string): boolean {
  const pg = pgErrorOf(error);
  return pg?.code === '23505' && (pg.constraint ?? '').includes(constraintPart);
}

/**
 * PostgreSQL and socket codes that mean "the database is not there just now": connection
 * failures (08…), shutdown and start-up (57P…), too many connections, and the socket errors
 * of a server that went away.
 */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH', 'ENETUNREACH',
  '08000', '08001', '08003', '08004', '08006', '57P01', '57P02', '57P03', '53300', '53400',
]);

/** node-postgres reports these without a code. */
const UNAVAILABLE_MESSAGES = [
  /Connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /not queryable/i,
  /Client was closed and is not queryable/i,
  /Cannot use a pool after calling end/i,
  /the database system is (shutting down|starting up|in recovery mode)/i,
  /terminating connection due to administrator command/i,
];

/** True when the error (or one it wraps) says the database cannot be reached right now. */
export function isDatabaseUnavailable(error: unknown): boolean {
  let current: unknown = error;
  for (let depth = 0; depth < 6 && current && typeof current === 'object'; depth += 1) {
    const candidate = current as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
    if (typeof candidate.code === 'string' && UNAVAILABLE_CODES.has(candidate.code)) return true;
    if (typeof candidate.message === 'string' && UNAVAILABLE_MESSAGES.some((pattern) => pattern.test(candidate.message as string))) {
      return true;
    }
    // Node's happy-eyeballs connect wraps each refused address in an AggregateError.
    if (Array.isArray(candidate.errors) && candidate.errors.some((inner) => isDatabaseUnavailable(inner))) return true;
    current = candidate.cause;
  }
  return false;
}

/**
 * One line for the log: Drizzle's message carries every parameter of the query (owners'
 * e-mail addresses, phone numbers), so logs get PostgreSQL's message and code instead.
 */
export function describeForLog(error: unknown): string {
  const pg = pgErrorOf(error);
  if (pg) return `database error ${pg.code}: ${pg.message}${pg.constraint ? ` (${pg.constraint})` : ''}`;
  if (error instanceof Error) return `${error.name}: ${error.message.split('\n')[0]}\n${error.stack?.split('\n').slice(1, 6).join('\n') ?? ''}`;
  return String(error);
}
