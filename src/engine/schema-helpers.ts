import { z } from 'zod';

/** Formats a number for a message: at most six significant digits, no exponent for everyday sizes. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const rounded = Number(value.toPrecision(6));
  return String(rounded);
}

/** Describes whatever was sent in place of a number. */
function describeInput(input: unknown): string {
  if (typeof input === 'number') return formatNumber(input);
  if (typeof input === 'string') return `"${input.length > 40 ? `${input.slice(0, 40)}…` : input}"`;
  if (input === null) return 'nothing';
  if (Array.isArray(input)) return 'a list';
  return typeof input === 'object' ? 'an object' : String(input);
}

function withUnit(value: string, unit: string): string {
  return unit === '' ? value : `${value} ${unit}`;
}

export interface QuantityOptions {
  readonly min?: number;
  readonly max?: number;
  /** The lower bound itself is refused (e.g. a thickness must be more than 0). */
  readonly minExclusive?: boolean;
  /** The upper bound itself is refused (e.g. under 0.5 m). */
  readonly maxExclusive?: boolean;
  /** Extra advice appended to a range message. */
  readonly hint?: string;
}

/**
 * A finite number with range messages a plant owner can act on, e.g.
 * "Insulation thickness must be under 0.5 m; 3 m was given."
 */
export function quantity(label: string, unit: string, options: QuantityOptions = {}) {
  const hint = options.hint ? ` ${options.hint}` : '';
  let schema = z.number({
    error: (issue) =>
      issue.input === undefined
        ? `${label} is required.`
        : `${label} must be a number${unit ? ` in ${unit}` : ''}; ${describeInput(issue.input)} was given.`,
  });
  const { min, max } = options;
  if (min !== undefined) {
    const bound = withUnit(formatNumber(min), unit);
    schema = options.minExclusive
      ? schema.gt(min, {
          error: (issue) => `${label} must be more than ${bound}; ${withUnit(describeInput(issue.input), unit)} was given.${hint}`,
        })
      : schema.gte(min, {
          error: (issue) => `${label} must be at least ${bound}; ${withUnit(describeInput(issue.input), unit)} was given.${hint}`,
        });
  }
  if (max !== undefined) {
    const bound = withUnit(formatNumber(max), unit);
    schema = options.maxExclusive
      ? schema.lt(max, {
          error: (issue) => `${label} must be under ${bound}; ${withUnit(describeInput(issue.input), unit)} was given.${hint}`,
        })
      : schema.lte(max, {
          error: (issue) => `${label} must be at most ${bound}; ${withUnit(describeInput(issue.input), unit)} was given.${hint}`,
        });
  }
  return schema;
}

/** A string naming one of `ids`, with a message that lists them. */
export function oneOf<const T extends readonly [string, ...string[]]>(label: string, ids: T) {
  return z.enum(ids, {
    error: (issue) =>
      issue.input === undefined
        ? `${label} is required.`
        : `${label} must be one of ${ids.join(', ')}; ${describeInput(issue.input)} was given.`,
  });
}

/** A non-empty string with a readable message. */
export function text(label: string, maxLength = 200) {
  return z
    .string({ error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be text.`) })
    .trim()
    .min(1, { error: `${label} must not be empty.` })
    .max(maxLength, { error: `${label} must be at most ${maxLength} characters.` });
}
