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

/**
 * What kind of quantity a number field holds, so a client can re-word a range message in
 * its own units (°F, psig, ft, %) with the field's own label.
 */
export type QuantityKind =
  | 'temperature'
  | 'temperatureDifference'
  | 'pressure'
  | 'length'
  | 'speed'
  | 'fraction'
  | 'percent'
  | 'hours'
  | 'years'
  | 'count'
  | 'money'
  | 'conductivity'
  | 'coefficient'
  | 'number';

/**
 * Machine-readable facts of a range issue, beside its sentence: which limit was crossed,
 * the limit and the given value in SI (the unit named by `unitSI`), and whether the limit
 * itself is allowed.
 */
export interface RangeIssueParams {
  readonly quantity: QuantityKind;
  readonly limit: 'min' | 'max';
  readonly limitSI: number;
  readonly givenSI: number;
  /** The limit itself is refused (e.g. a thickness must be more than 0). */
  readonly exclusive: boolean;
  readonly unitSI: string;
  /**
   * The id of what holds the limit, when it is a rating rather than the field's own range
   * (an insulation material's service temperatures): the field is a choice, the quantity
   * the line it is weighed against.
   */
  readonly subject?: string;
}

/** The facts of a material refused for a line's temperature: its rating crossed, in °C. */
export function ratingIssueParams(material: { id: string; serviceMinC: number; serviceMaxC: number }, lineC: number): RangeIssueParams {
  const high = lineC > material.serviceMaxC;
  return {
    quantity: 'temperature',
    limit: high ? 'max' : 'min',
    limitSI: high ? material.serviceMaxC : material.serviceMinC,
    givenSI: lineC,
    exclusive: false,
    unitSI: '°C',
    subject: material.id,
  };
}

const KIND_BY_UNIT: Readonly<Record<string, QuantityKind>> = {
  '°C': 'temperature',
  K: 'temperatureDifference',
  kPa: 'pressure',
  m: 'length',
  'm/s': 'speed',
  '%': 'percent',
  'h/yr': 'hours',
  years: 'years',
  'W/(m·K)': 'conductivity',
  'W/(m²·K)': 'coefficient',
};

export interface QuantityOptions {
  readonly min?: number;
  readonly max?: number;
  /** The lower bound itself is refused (e.g. a thickness must be more than 0). */
  readonly minExclusive?: boolean;
  /** The upper bound itself is refused (e.g. under 0.5 m). */
  readonly maxExclusive?: boolean;
  /** Extra advice appended to a range message. */
  readonly hint?: string;
  /** The kind of quantity; by default read from the unit ('°C' → temperature, '' → number). */
  readonly kind?: QuantityKind;
}

/**
 * A finite number with range messages a plant owner can act on, e.g.
 * "Insulation thickness must be under 0.5 m; 3 m was given.", each range issue carrying
 * {@link RangeIssueParams} in its `params`.
 */
export function quantity(label: string, unit: string, options: QuantityOptions = {}) {
  const hint = options.hint ? ` ${options.hint}` : '';
  const kind = options.kind ?? KIND_BY_UNIT[unit] ?? 'number';
  const { min, max } = options;
  return z
    .number({
      error: (issue) =>
        issue.input === undefined
          ? `${label} is required.`
          : `${label} must be a number${unit ? ` in ${unit}` : ''}; ${describeInput(issue.input)} was given.`,
    })
    .superRefine((value, ctx) => {
      if (!Number.isFinite(value)) return;
      // Words only for a refusal: every valid number of every request passes through here.
      const given = () => withUnit(describeInput(value), unit);
      if (min !== undefined && (options.minExclusive ? value <= min : value < min)) {
        const bound = withUnit(formatNumber(min), unit);
        ctx.addIssue({
          code: 'custom',
          message: `${label} must be ${options.minExclusive ? 'more than' : 'at least'} ${bound}; ${given()} was given.${hint}`,
          params: { quantity: kind, limit: 'min', limitSI: min, givenSI: value, exclusive: Boolean(options.minExclusive), unitSI: unit } satisfies RangeIssueParams,
        });
      } else if (max !== undefined && (options.maxExclusive ? value >= max : value > max)) {
        const bound = withUnit(formatNumber(max), unit);
        ctx.addIssue({
          code: 'custom',
          message: `${label} must be ${options.maxExclusive ? 'under' : 'at most'} ${bound}; ${given()} was given.${hint}`,
          params: { quantity: kind, limit: 'max', limitSI: max, givenSI: value, exclusive: Boolean(options.maxExclusive), unitSI: unit } satisfies RangeIssueParams,
        });
      }
    });
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
