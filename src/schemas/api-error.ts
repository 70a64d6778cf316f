/**
 * The shape of every error the API answers with (4xx and 5xx), declared once: the endpoint
 * wrapper (src/lib/http.ts) builds it, the islands' client parses it, the OpenAPI document
 * is generated from it. `zod/mini`, since the browser parses with it.
 */
import * as z from 'zod/mini';
import type { QuantityKind, RangeIssueParams } from '../engine';
import { mirrorOf } from './mirror';

const QUANTITY_KINDS = [
  'temperature',
  'temperatureDifference',
  'pressure',
  'length',
  'speed',
  'fraction',
  'percent',
  'hours',
  'years',
  'count',
  'money',
  'conductivity',
  'coefficient',
  'number',
] as const satisfies readonly QuantityKind[];

/**
 * What a range issue says besides its sentence: the kind of quantity, the limit crossed and
 * both values in SI, so a client can say it again in its own units with the field's label.
 */
export const rangeIssueParamsSchema = mirrorOf<RangeIssueParams>()(
  z.object({
    quantity: z.enum(QUANTITY_KINDS),
    limit: z.enum(['min', 'max']),
    limitSI: z.number(),
    givenSI: z.number(),
    exclusive: z.boolean().check(z.describe('The limit itself is refused (a thickness must be more than 0).')),
    unitSI: z.string().check(z.describe('The SI unit of limitSI and givenSI, e.g. °C, kPa, m, h/yr.')),
    subject: z
      .optional(z.string())
      .check(z.describe('Id of what holds the limit when it is a rating, not the field’s own range: an insulation material refused for the line’s temperature.')),
  }),
);

/** One field-level problem: `{ path: 'runs.2.lengthM', message }`. */
export const apiIssueSchema = z.object({
  path: z.string().check(z.describe('Dotted path of the field, e.g. runs.2.lengthM; "(body)" for the body as a whole.')),
  message: z.string().check(z.describe('A sentence a person can act on, in the words of the field.')),
  params: z.optional(rangeIssueParamsSchema),
});

export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string().check(z.describe('A stable code for programs, e.g. VALIDATION_FAILED, RATE_LIMITED.')),
    message: z.string().check(z.describe('A sentence a person can act on.')),
    issues: z.optional(z.array(apiIssueSchema)),
    details: z.optional(
      z.record(z.string(), z.unknown()).check(z.describe('What a program needs besides the sentence, e.g. who claimed a lead first and when.')),
    ),
  }),
});

export type ApiIssue = z.output<typeof apiIssueSchema>;
export type ApiErrorBody = z.output<typeof apiErrorSchema>;
