/**
 * The contracts of site-walk revisions: what POST /api/leads/{id}/revisions accepts, what
 * GET and POST answer, and the diff between two states of a lead's inventory. The endpoint
 * parses with these, the site-walk island's client parses the answers with them, and
 * /api/openapi.json is generated from them.
 */
import { z } from 'zod';
import { plantInputSchema } from '../engine';

const isoDate = z.string().describe('ISO 8601 date and time');
const person = z.object({ name: z.string(), firm: z.string().nullable() });

/** The longest reason a revision may carry. */
export const MAX_REVISION_REASON = 500;

/** What a device calls one save of an edit: sent again unchanged after a dropped connection. */
export const clientKeySchema = z
  .string({ error: 'clientKey must be text.' })
  .regex(/^[A-Za-z0-9_-]{8,64}$/, { error: 'clientKey must be 8 to 64 letters, digits, dashes or underscores.' });

/**
 * POST /api/leads/{id}/revisions: the consultant's corrected inventory — every run as the
 * engine takes it (the engine's own run schema) and the plant's areas the runs sit in — with
 * the revision it was made from and why. Plant-wide answers (energy, hours, economics) are kept
 * from that revision.
 */
export const revisionRequestSchema = z.strictObject(
  {
    baseNumber: z
      .number({ error: 'baseNumber must be the number of the revision you started from (0 for the owner’s answers).' })
      .int({ error: 'baseNumber must be a whole number.' })
      .min(0, { error: 'baseNumber cannot be negative; 0 is the owner’s answers.' }),
    reason: z
      .string({ error: 'Say in a few words what the site walk changed.' })
      .trim()
      .min(1, { error: 'Say in a few words what the site walk changed.' })
      .max(MAX_REVISION_REASON, { error: `Keep the reason under ${MAX_REVISION_REASON} characters.` }),
    clientKey: clientKeySchema.optional(),
    areas: plantInputSchema.shape.areas,
    runs: plantInputSchema.shape.runs,
  },
  {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `A revision carries baseNumber, reason, clientKey, areas and runs only; leave out ${issue.keys.map((k) => `"${k}"`).join(', ')}.`
        : issue.code === 'invalid_type'
          ? 'Send the revision as a JSON object with baseNumber, reason and runs.'
          : undefined,
  },
);
export type RevisionRequest = z.output<typeof revisionRequestSchema>;
export type RevisionRequestInput = z.input<typeof revisionRequestSchema>;

// The diff ---------------------------------------------------------------------------------

/** How a run's length stands: the length used and whether it was measured on site. */
const lengthValue = z.object({ lengthM: z.number(), measured: z.boolean() });
const pipeValue = z.object({
  standard: z.string().nullable(),
  size: z.string().nullable(),
  schedule: z.string().nullable(),
  material: z.string().nullable(),
  outerDiameterM: z.number().nullable().describe('Only for a pipe given by its dimensions.'),
});
const lineValue = z.object({
  steamGaugePressureKPa: z.number().nullable(),
  fluidTemperatureC: z
    .number()
    .nullable()
    .describe('Given for liquid lines; null with a steam pressure, or when the service’s typical value is used.'),
});
const laggingValue = z.object({
  state: z.enum(['bare', 'damaged', 'insulated']),
  material: z.string().nullable(),
  thicknessM: z.number().nullable(),
});
const fittingsValue = z.object({
  valves: z.int(),
  flangePairs: z.int(),
  covered: z.boolean().describe('Valves and flange pairs already under covers.'),
  others: z.array(z.object({ type: z.string(), count: z.int(), covered: z.boolean() })),
});
const roomValue = z.object({
  areaId: z.string(),
  airTemperatureC: z.number(),
  relativeHumidityPercent: z.number(),
  airSpeedMPerS: z.number(),
});
const surfaceReadingValue = z.object({
  surfaceTemperatureC: z.number().describe('As read on the thermometer.'),
  method: z.enum(['contact', 'infrared']),
  infraredEmittanceSetting: z.number().nullable(),
  airTemperatureC: z.number().nullable(),
});

const change = <F extends string, V extends z.ZodType>(field: F, value: V) =>
  z.object({ field: z.literal(field), before: value.nullable(), after: value.nullable() });

/** One input of a run that differs, with its value before and after (null: not given). */
export const inputChangeSchema = z.discriminatedUnion('field', [
  change('label', z.string()),
  change('service', z.string()),
  change('length', lengthValue),
  change('pipe', pipeValue),
  change('line', lineValue),
  change('lagging', laggingValue),
  change('bareFraction', z.number()),
  change('laggingCondition', z.enum(['sound', 'wet', 'crushed'])),
  change('jacket', z.string()),
  change('fittings', fittingsValue),
  change('room', roomValue),
  change('surfaceReading', surfaceReadingValue),
]);
export type InputChange = z.infer<typeof inputChangeSchema>;
export type InputField = InputChange['field'];

/** Figures compared run by run and for the plant. */
export const runFigureIds = [
  'heatLossWPerM',
  'annualHeatGJ',
  'annualCost',
  'annualSaving',
  'installedCost',
  'paybackYears',
  'surfaceTemperatureC',
] as const;
export const totalFigureIds = [
  'annualCost',
  'annualHeatGJ',
  'annualCo2Kg',
  'annualSaving',
  'installedCost',
  'paybackYears',
  'runsWithHazards',
] as const;

const figureChange = <const T extends readonly [string, ...string[]]>(ids: T) =>
  z.object({
    figure: z.enum(ids),
    before: z.number().nullable().describe('null: the run did not exist, or (payback) never pays back.'),
    after: z.number().nullable(),
  });
export const runFigureChangeSchema = figureChange(runFigureIds);
export const totalFigureChangeSchema = figureChange(totalFigureIds);
export type RunFigureChange = z.infer<typeof runFigureChangeSchema>;
export type TotalFigureChange = z.infer<typeof totalFigureChangeSchema>;

const rangeSchema = z.object({ low: z.number(), likely: z.number(), high: z.number() });

/** What became of one run between two states of the inventory. */
export const runDiffSchema = z.object({
  runId: z.string(),
  /** The run's name in the later state (the earlier one for a removed run). */
  label: z.string(),
  status: z.enum(['changed', 'unchanged', 'added', 'removed']),
  inputs: z.array(inputChangeSchema).describe('Inputs that differ; for an added or removed run, every input with the other side null.'),
  figures: z.array(runFigureChangeSchema),
  /** The unchanged run's figures moved all the same (the method was updated between the two). */
  figuresMoved: z.boolean(),
  hazards: z.object({ before: z.array(z.string()), after: z.array(z.string()) }).describe('Hazard codes of the run today, before and after.'),
  /** Revisions (by number) whose save changed this run, when the diff spans several. */
  changedIn: z.array(z.int()),
});
export type RunDiff = z.infer<typeof runDiffSchema>;

/** Everything that differs between two states of a lead's inventory. */
export const revisionDiffSchema = z.object({
  fromNumber: z.int(),
  toNumber: z.int(),
  runs: z.array(runDiffSchema).describe('The later state’s runs in their order, then the runs it no longer has.'),
  totals: z.array(totalFigureChangeSchema),
  lossRange: z.object({ before: rangeSchema, after: rangeSchema }).describe('The yearly cost of the loss, 10th–90th percentile.'),
  counts: z.object({ changed: z.int(), unchanged: z.int(), added: z.int(), removed: z.int() }),
});
export type RevisionDiff = z.infer<typeof revisionDiffSchema>;

// Answers ----------------------------------------------------------------------------------

/** One state of a lead's inventory: the owner's original (number 0) or a site-walk revision. */
export const revisionViewSchema = z.object({
  number: z.int().describe('0 for the owner’s answers; 1, 2, … for site-walk revisions.'),
  baseNumber: z.int().nullable().describe('The revision this one was made from; null for the owner’s answers.'),
  savedAt: isoDate,
  author: person.nullable().describe('Who saved it; null for the owner’s answers.'),
  reason: z.string().nullable().describe('Why it was saved; only for the consultant holding the lead and admins.'),
  engineVersion: z.string(),
  plant: z.record(z.string(), z.unknown()).describe('The PlantInput as the engine takes it (defaults filled in).'),
  result: z.record(z.string(), z.unknown()).describe('The engine’s PlantResult for it.'),
});
export type RevisionView = z.infer<typeof revisionViewSchema>;

/** GET /api/leads/{id}/revisions */
export const revisionListResponseSchema = z.object({
  lead: z.object({ id: z.uuid(), reference: z.string(), latestNumber: z.int() }),
  original: revisionViewSchema,
  revisions: z.array(revisionViewSchema).describe('Oldest first.'),
  diff: revisionDiffSchema.nullable().describe('The owner’s original against the latest revision; null while there is none.'),
  allowed: z.object({ revise: z.boolean() }),
});
export type RevisionListResponse = z.infer<typeof revisionListResponseSchema>;

/** POST /api/leads/{id}/revisions: the stored revision, and what it changed from its base. */
export const revisionSavedResponseSchema = z.object({
  revision: revisionViewSchema,
  diff: revisionDiffSchema,
  /** True when this save had been stored already (the same clientKey sent again). */
  replayed: z.boolean(),
});
export type RevisionSavedResponse = z.infer<typeof revisionSavedResponseSchema>;

/** The extra a 409 on a stale base carries: the latest revision, who saved it and when. */
export const staleRevisionDetailsSchema = z.object({
  latestNumber: z.int(),
  savedAt: isoDate.nullable(),
  author: person.nullable(),
});
