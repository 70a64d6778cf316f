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

const UNAVAILABLE = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', '57P01', '57P03', '53300']);

export function isDatabaseUnavailable(error: unknown): boolean {
  const pg = pgErrorOf(error);
  return pg?.code !== undefined && UNAVAILABLE.has(pg.code);
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
