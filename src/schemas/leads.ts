/**
 * The desk's contracts: what the lead endpoints accept (query strings and bodies) and what they
 * answer. The endpoints parse with these, the desk islands' client parses the answers with
 * them, and /api/openapi.json is generated from them.
 */
import { z } from 'zod';
import { assessmentStatuses } from '../db/statuses';
import { SERVICE_IDS } from '../engine';
import { closeReasons, heldStages, movableStages, releaseReasons } from '../lib/leads/pipeline';
import { plantTypes, type PlantTypeId } from './assessment';

const plantTypeIds = plantTypes.map((t) => t.id) as [PlantTypeId, ...PlantTypeId[]];
const serviceIds = [...SERVICE_IDS] as [string, ...string[]];
const closeReasonIds = closeReasons.map((r) => r.id) as [string, ...string[]];
const releaseReasonIds = releaseReasons.map((r) => r.id) as [string, ...string[]];

/** Ways the open list can be ordered. */
export const leadSortKeys = ['posted', 'loss', 'saving', 'spread', 'runs', 'photos'] as const;
export type LeadSortKey = (typeof leadSortKeys)[number];
export const leadPageSizes = [10, 25, 50] as const;

/** A number typed into a query string: empty means "not given". */
const optionalNumber = (what: string, { min, max, integer = false }: { min: number; max: number; integer?: boolean }) =>
  z.preprocess(
    (value) => (value === '' || value === undefined ? undefined : value),
    z.coerce
      .number({ error: `${what} must be a number.` })
      .refine((n) => Number.isFinite(n), { error: `${what} must be a number.` })
      .refine((n) => !integer || Number.isInteger(n), { error: `${what} must be a whole number.` })
      .refine((n) => n >= min && n <= max, { error: `${what} must be between ${min} and ${max}.` })
      .optional(),
  );

const optionalChoice = <const T extends readonly [string, ...string[]]>(values: T, message: string) =>
  z.preprocess((value) => (value === '' ? undefined : value), z.enum(values, { error: message }).optional());

/** GET /api/leads: the list to show (`open` in my regions, or `mine`), its page, order and filters. */
export const leadListQuerySchema = z
  .object({
    view: z.enum(['open', 'mine'], { error: 'view must be "open" (leads waiting in your regions) or "mine" (leads you hold).' }).default('open'),
    page: optionalNumber('page', { min: 1, max: 100_000, integer: true }).transform((n) => n ?? 1),
    pageSize: z
      .preprocess(
        (value) => (value === '' || value === undefined ? undefined : Number(value)),
        z
          .union(leadPageSizes.map((n) => z.literal(n)) as unknown as [z.ZodLiteral<10>, z.ZodLiteral<25>, z.ZodLiteral<50>], {
            error: `pageSize must be one of ${leadPageSizes.join(', ')}.`,
          })
          .optional(),
      )
      .transform((n) => n ?? 25),
    sort: optionalChoice(leadSortKeys, `sort must be one of ${leadSortKeys.join(', ')}.`).transform((s) => s ?? 'posted'),
    dir: optionalChoice(['asc', 'desc'], 'dir must be "asc" or "desc".').transform((d) => d ?? 'desc'),
    region: z.preprocess(
      (value) => (value === '' ? undefined : value),
      z.uuid({ error: 'region must be the id of one of your regions.' }).optional(),
    ),
    plantType: optionalChoice(plantTypeIds, `plantType must be one of ${plantTypeIds.join(', ')}.`),
    service: z
      .preprocess(
        (value) => (value === undefined || value === '' ? [] : Array.isArray(value) ? value.filter((v) => v !== '') : [value]),
        z.array(z.enum(serviceIds, { error: `service must be one of ${serviceIds.join(', ')}.` })).max(serviceIds.length),
      )
      .describe('Services the plant must have among its runs (repeat the parameter for several).'),
    lossMin: optionalNumber('The lowest yearly loss', { min: 0, max: 1e9 }),
    lossMax: optionalNumber('The highest yearly loss', { min: 0, max: 1e9 }),
    spreadMax: optionalNumber('The widest range', { min: 0, max: 1000 }).describe(
      'Widest range of the yearly loss accepted, as ± percent of the likely figure: (high − low) / 2 / likely × 100.',
    ),
    runsMin: optionalNumber('The fewest runs', { min: 0, max: 10_000, integer: true }),
    runsMax: optionalNumber('The most runs', { min: 0, max: 10_000, integer: true }),
    photos: optionalChoice(['yes', 'no'], 'photos must be "yes" or "no".'),
    maxAgeDays: optionalNumber('Posted within', { min: 1, max: 3650, integer: true }).describe('Only leads posted within this many days.'),
    minAgeDays: optionalNumber('Posted at least', { min: 0, max: 3650, integer: true }).describe('Only leads posted at least this many days ago.'),
    stage: optionalChoice(heldStages, `stage must be one of ${heldStages.join(', ')}.`).describe('For view=mine: only leads at this stage.'),
  })
  .superRefine((q, ctx) => {
    if (q.lossMin !== undefined && q.lossMax !== undefined && q.lossMin > q.lossMax) {
      ctx.addIssue({ code: 'custom', path: ['lossMax'], message: 'The highest yearly loss must not be below the lowest.' });
    }
    if (q.runsMin !== undefined && q.runsMax !== undefined && q.runsMin > q.runsMax) {
      ctx.addIssue({ code: 'custom', path: ['runsMax'], message: 'The most runs must not be fewer than the fewest.' });
    }
    if (q.maxAgeDays !== undefined && q.minAgeDays !== undefined && q.minAgeDays > q.maxAgeDays) {
      ctx.addIssue({ code: 'custom', path: ['minAgeDays'], message: '“Posted at least … days ago” must not exceed “posted within … days”.' });
    }
  });
export type LeadListQuery = z.output<typeof leadListQuerySchema>;
export type LeadListQueryInput = z.input<typeof leadListQuerySchema>;

/** Query-string parameters that may repeat. */
export const leadListArrayParams = ['service'] as const;

/** A URL's search parameters as the object `leadListQuerySchema` reads. */
export function leadQueryObject(params: URLSearchParams): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(params.keys())) {
    out[key] = (leadListArrayParams as readonly string[]).includes(key) ? params.getAll(key) : (params.get(key) ?? '');
  }
  return out;
}

const isoDate = z.string().describe('ISO 8601 date and time');
const named = z.object({ id: z.string(), name: z.string() });
const moneyRange = z.object({ likely: z.number(), low: z.number(), high: z.number() });

/** One row of the open list: the plant and its figures, never who the owner is. */
export const openLeadSchema = z
  .object({
    id: z.uuid(),
    reference: z.string(),
    status: z.enum(assessmentStatuses),
    region: named.nullable(),
    plantType: named,
    area: z.string().describe('First three characters of the postal code.'),
    countryCode: z.string(),
    currency: z.string(),
    annualLoss: moneyRange.describe('Yearly cost of the heat lost today, with its 10–90 % range.'),
    annualSaving: z.number(),
    runCount: z.int(),
    photoCount: z.int(),
    hazardRunCount: z.int(),
    services: z.array(named),
    postedAt: isoDate,
  })
  .strict();
export type OpenLead = z.infer<typeof openLeadSchema>;

/** One row of my leads: the open row's figures plus who the owner is and where it stands. */
export const myLeadSchema = openLeadSchema
  .extend({
    company: z.string(),
    contactName: z.string(),
    claimedAt: isoDate.nullable(),
    updatedAt: isoDate,
  })
  .strict();
export type MyLead = z.infer<typeof myLeadSchema>;

export const leadListResponseSchema = z.object({
  view: z.enum(['open', 'mine']),
  items: z.array(z.union([myLeadSchema, openLeadSchema])),
  page: z.int(),
  pageSize: z.int(),
  total: z.int(),
  pageCount: z.int(),
});
export type LeadListResponse = z.infer<typeof leadListResponseSchema>;

export const activityEntrySchema = z.object({
  id: z.number(),
  at: isoDate,
  action: z.string().describe('lead.claimed, lead.moved, lead.noted, lead.released, assessment.submitted, …'),
  actor: z.object({ name: z.string(), firm: z.string().nullable() }).nullable(),
  detail: z.record(z.string(), z.unknown()),
});
export type ActivityEntryView = z.infer<typeof activityEntrySchema>;

export const leadDetailSchema = openLeadSchema
  .extend({
    claimedAt: isoDate.nullable(),
    claimedBy: z.object({ name: z.string(), firm: z.string().nullable() }).nullable(),
    contact: z
      .object({ name: z.string(), company: z.string(), email: z.string(), phone: z.string().nullable(), plantName: z.string().nullable(), postalCode: z.string() })
      .nullable()
      .describe('Only for the consultant holding the lead, and admins; null for everyone else.'),
    answers: z.record(z.string(), z.unknown()).describe('Plant-wide and energy answers (SI), without the runs.'),
    runs: z.array(
      z.object({ id: z.uuid(), position: z.int(), label: z.string(), service: z.string(), lengthM: z.number(), spec: z.record(z.string(), z.unknown()) }),
    ),
    photos: z
      .array(z.object({ id: z.uuid(), runId: z.uuid().nullable(), contentType: z.string(), url: z.string(), expiresAt: isoDate }))
      .nullable()
      .describe('Short-lived signed links; null for those who may not see them.'),
    engineVersion: z.string(),
    result: z.record(z.string(), z.unknown()).describe('The engine’s PlantResult as stored.'),
    timeline: z.array(activityEntrySchema).nullable(),
    allowed: z.object({
      claim: z.boolean(),
      moves: z.array(z.enum(movableStages)),
      release: z.boolean(),
      note: z.boolean(),
    }),
  })
  .strict();
export type LeadDetail = z.infer<typeof leadDetailSchema>;

export const leadDetailResponseSchema = z.object({ lead: leadDetailSchema });

/** The claim's answer: the lead, now held. */
export const claimResponseSchema = z.object({
  lead: z.object({ id: z.uuid(), reference: z.string(), status: z.literal('claimed'), claimedAt: isoDate }),
});

/** POST /api/leads/{id}/moves */
export const moveRequestSchema = z
  .object({
    to: z.enum(movableStages, {
      error: `to must be one of ${movableStages.join(', ')} (“report_sent” is set by sending a report).`,
    }),
    note: z.string().trim().max(4000, { error: 'Keep the note under 4,000 characters.' }).optional(),
    reason: z.enum(closeReasonIds, { error: `Choose why the lead is closed: ${closeReasonIds.join(', ')}.` }).optional(),
  })
  .strict()
  .superRefine((move, ctx) => {
    if (move.to === 'closed' && !move.reason) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: `Choose why the lead is closed: ${closeReasonIds.join(', ')}.` });
    }
    if (move.to !== 'closed' && move.reason) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'A reason is given only when closing a lead.' });
    }
    if (move.reason === 'other' && !move.note) {
      ctx.addIssue({ code: 'custom', path: ['note'], message: 'Say in the note why the lead is closed.' });
    }
  });
export type MoveRequest = z.output<typeof moveRequestSchema>;

export const moveResponseSchema = z.object({ lead: z.object({ id: z.uuid(), status: z.enum(heldStages) }) });

/** POST /api/leads/{id}/release */
export const releaseRequestSchema = z
  .object({
    reason: z.enum(releaseReasonIds, { error: `Choose why you hand the lead back: ${releaseReasonIds.join(', ')}.` }),
    note: z.string().trim().max(4000, { error: 'Keep the note under 4,000 characters.' }).optional(),
  })
  .strict()
  .superRefine((release, ctx) => {
    if (release.reason === 'other' && !release.note) {
      ctx.addIssue({ code: 'custom', path: ['note'], message: 'Say in the note why you hand the lead back.' });
    }
  });
export type ReleaseRequest = z.output<typeof releaseRequestSchema>;

export const releaseResponseSchema = z.object({ lead: z.object({ id: z.uuid(), status: z.literal('fresh') }) });

/** POST /api/leads/{id}/notes */
export const noteRequestSchema = z
  .object({
    text: z
      .string({ error: 'Write the note in text.' })
      .trim()
      .min(1, { error: 'Write something in the note.' })
      .max(4000, { error: 'Keep the note under 4,000 characters.' }),
  })
  .strict();
export type NoteRequest = z.output<typeof noteRequestSchema>;

export const noteResponseSchema = z.object({ entry: activityEntrySchema });

/** The extra a 409 on a claim carries: who was first, and when. */
export const claimConflictDetailsSchema = z.object({ firm: z.string(), claimedAt: isoDate });
