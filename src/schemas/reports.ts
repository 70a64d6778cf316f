/**
 * The follow-up report's contracts: what the composer saves (a report's composition), what the
 * report endpoints accept and answer, and a consultant's price table. The endpoints parse with
 * these, the desk's and the owner's islands parse the answers with them, and /api/openapi.json
 * is generated from them.
 */
import { z } from 'zod';
import { INSULATION_MATERIAL_IDS, JACKET_IDS, OPTION_KINDS, priceTableSchema, runPriceSchema } from '../engine';
import { reportText } from './report-text';

/** Kinds of thing a site walk turns up that the report names, each with its caution. */
export const findingKinds = ['burn-point', 'sweating', 'asbestos', 'corrosion'] as const;
export type FindingKind = (typeof findingKinds)[number];

const optionalText = (label: string, max: number) => reportText(label, max).optional();

/**
 * The consultant's choice for one run. Anything left out is the engine's suggestion (the option
 * with the least life-cycle cost that meets the touch and sweat needs). A choice that differs
 * from the suggestion needs a reason before the report can be sent.
 */
export const runChoiceSchema = z.object({
  runId: reportText('Run id', 64).min(1, { error: 'Say which run this choice is for.' }),
  option: z.enum(OPTION_KINDS, { error: `Option must be one of ${OPTION_KINDS.join(', ')}.` }).optional(),
  material: z.enum(INSULATION_MATERIAL_IDS, { error: `Material must be one of ${INSULATION_MATERIAL_IDS.join(', ')}.` }).optional(),
  thicknessM: z
    .number({ error: 'Thickness must be a number in meters.' })
    .gt(0, { error: 'Thickness must be more than 0.' })
    .lt(0.5, { error: 'Thickness must be under 0.5 m (about 20 in).' })
    .optional(),
  jacket: z.enum(JACKET_IDS, { error: `Jacket must be one of ${JACKET_IDS.join(', ')}.` }).optional(),
  coverFittings: z.boolean({ error: 'Cover fittings must be true or false.' }).optional(),
  /** The consultant's installed price for this run, in place of their price table. */
  price: runPriceSchema.optional(),
  /** Why the engine's suggestion was changed; needed to send when anything differs from it. */
  reason: optionalText('Reason', 500),
});
export type RunChoice = z.infer<typeof runChoiceSchema>;

/** Something found on the site walk. */
export const findingSchema = z.object({
  kind: z.enum(findingKinds, { error: `Finding kind must be one of ${findingKinds.join(', ')}.` }),
  /** The run it was found on, when it belongs to one. */
  runId: optionalText('Run id', 64),
  /** Where: "flange pair above the filler, east wall". */
  place: reportText('Where it was found', 200).min(1, { error: 'Say where it was found.' }),
  /** A burn point's measured surface temperature, °C. */
  surfaceTemperatureC: z
    .number({ error: 'Measured temperature must be a number in °C.' })
    .min(-60, { error: 'Measured temperature must be at least −60 °C.' })
    .max(650, { error: 'Measured temperature must be at most 650 °C.' })
    .optional(),
  note: optionalText('Note', 1000),
});
export type Finding = z.infer<typeof findingSchema>;

/** A rebate, grant or incentive the owner can claim against the work. */
export const incentiveSchema = z.object({
  text: reportText('Incentive', 200).min(1, { error: 'Name the incentive or rebate.' }),
  amount: z
    .number({ error: 'Incentive amount must be a number in the plant’s currency.' })
    .min(0, { error: 'Incentive amount cannot be negative.' })
    .max(1e8, { error: 'Incentive amount must be under 100,000,000.' }),
});
export type Incentive = z.infer<typeof incentiveSchema>;

/** Everything the consultant composes; each part may be empty in a draft. */
export const reportCompositionSchema = z.object({
  /** A few lines to the owner at the top of the report. */
  introduction: reportText('Introduction', 2000).default(''),
  runs: z.array(runChoiceSchema, { error: 'Runs must be a list.' }).max(500, { error: 'At most 500 runs.' }).default([]),
  incentives: z.array(incentiveSchema, { error: 'Incentives must be a list.' }).max(5, { error: 'At most 5 incentive lines.' }).default([]),
  exclusions: z
    .array(reportText('Exclusion', 300).min(1, { error: 'An exclusion cannot be empty.' }), { error: 'Exclusions must be a list.' })
    .max(20, { error: 'At most 20 exclusions.' })
    .default([]),
  notes: reportText('Notes', 4000).default(''),
  findings: z.array(findingSchema, { error: 'Findings must be a list.' }).max(40, { error: 'At most 40 findings.' }).default([]),
  /** Photos of the lead shown in the report, in this order. */
  photoIds: z
    .array(z.uuid({ error: 'A photo id must be the id of one of the lead’s photos.' }), { error: 'Photos must be a list.' })
    .max(12, { error: 'At most 12 photos.' })
    .default([]),
});
export type ReportComposition = z.infer<typeof reportCompositionSchema>;

/** PATCH /api/reports/{id}: the parts given replace the draft's (a list is replaced whole). */
export const reportPatchSchema = z.strictObject(
  {
    introduction: reportCompositionSchema.shape.introduction.unwrap().optional(),
    runs: reportCompositionSchema.shape.runs.unwrap().optional(),
    incentives: reportCompositionSchema.shape.incentives.unwrap().optional(),
    exclusions: reportCompositionSchema.shape.exclusions.unwrap().optional(),
    notes: reportCompositionSchema.shape.notes.unwrap().optional(),
    findings: reportCompositionSchema.shape.findings.unwrap().optional(),
    photoIds: reportCompositionSchema.shape.photoIds.unwrap().optional(),
    /** Start again from another inventory state (0 the owner's answers, n the n-th site walk). */
    baseRevisionNumber: z
      .number({ error: 'Base revision must be a whole number.' })
      .int({ error: 'Base revision must be a whole number.' })
      .min(0)
      .optional(),
  },
  { error: 'Only introduction, runs, incentives, exclusions, notes, findings, photoIds and baseRevisionNumber can be changed.' },
);
export type ReportPatch = z.infer<typeof reportPatchSchema>;

/** POST /api/leads/{id}/reports: a new draft, empty or copied from a sent version. */
export const createReportSchema = z
  .strictObject(
    {
      /** Copy the composition of this sent version (a correction); left out: the latest one, if any. */
      fromVersion: z.number({ error: 'fromVersion must be a whole number.' }).int().min(1).optional(),
      /** Start from nothing, even when versions exist. */
      blank: z.boolean().optional(),
    },
    { error: 'Only fromVersion and blank can be given.' },
  )
  .default({});

/** POST /api/reports/{id}/answer: the owner accepts (asks to be contacted to go ahead) or declines. */
export const reportAnswerSchema = z.strictObject(
  {
    accept: z.boolean({ error: 'accept must be true (go ahead) or false (decline).' }),
    reason: reportText('Reason', 1000).optional(),
  },
  { error: 'Only accept and reason can be given.' },
);
export type ReportAnswerRequest = z.infer<typeof reportAnswerSchema>;

/** PUT /api/consultants/me/prices. */
export const priceTableRequestSchema = z.strictObject(
  {
    currency: z
      .string({ error: 'Currency must be a three-letter code such as USD, CAD or AUD.' })
      .trim()
      .toUpperCase()
      .regex(/^[A-Z]{3}$/, { error: 'Currency must be a three-letter code such as USD, CAD or AUD.' }),
    priceTable: priceTableSchema,
  },
  { error: 'Only currency and priceTable can be given.' },
);
export type PriceTableRequest = z.infer<typeof priceTableRequestSchema>;

const isoTime = z.string().describe('ISO 8601 time');
const photoSchema = z.object({ id: z.uuid(), url: z.string(), runId: z.string().nullable(), caption: z.string(), expiresAt: isoTime });
const personSchema = z.object({
  name: z.string(),
  firm: z.string().nullable(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
});

/** GET|PUT /api/consultants/me/prices: the consultant's table (null before they save one) and the demo table to start from. */
export const priceTableResponseSchema = z.object({
  prices: z.object({ currency: z.string(), priceTable: priceTableSchema, updatedAt: isoTime }).nullable(),
  demo: z.object({ priceTable: priceTableSchema, note: z.string() }),
});
export type PriceTableResponse = z.infer<typeof priceTableResponseSchema>;

/** The engine's suggestion for a run before the consultant's changes. */
export const runSuggestionSchema = z.object({
  runId: z.string(),
  option: z.enum(OPTION_KINDS),
  material: z.string(),
  thicknessM: z.number(),
  jacket: z.string(),
  coverFittings: z.boolean(),
  installedCost: z.number(),
  annualSaving: z.number(),
  simplePaybackYears: z.number().nullable(),
  choiceCode: z.string(),
});
export type RunSuggestion = z.infer<typeof runSuggestionSchema>;

/** One report as the list shows it. */
export const reportSummarySchema = z.object({
  id: z.uuid(),
  status: z.enum(['draft', 'sent']),
  version: z.number().int().nullable(),
  baseRevisionNumber: z.number().int(),
  createdAt: isoTime,
  updatedAt: isoTime,
  sentAt: isoTime.nullable(),
  /** The version that replaced this one, when a later one was sent. */
  replacedBy: z.object({ version: z.number().int(), sentAt: isoTime }).nullable(),
  pdfReady: z.boolean(),
  answer: z.object({ accept: z.boolean(), reason: z.string().nullable(), at: isoTime }).nullable(),
});
export type ReportSummary = z.infer<typeof reportSummarySchema>;

/** GET /api/leads/{id}/reports: a lead's draft and versions, newest first (the owner sees versions only). */
export const reportListResponseSchema = z.object({
  lead: z.object({ id: z.uuid(), reference: z.string(), latestRevisionNumber: z.number().int() }),
  reports: z.array(reportSummarySchema),
  allowed: z.object({ compose: z.boolean() }),
});
export type ReportListResponse = z.infer<typeof reportListResponseSchema>;

/** GET /api/reports/{id} (and the answer of POST, PATCH, send and answer): one report whole. */
export const reportResponseSchema = z.object({
  report: reportSummarySchema.extend({
    lead: z.object({ id: z.uuid(), reference: z.string(), status: z.string(), latestRevisionNumber: z.number().int() }),
    plant: z.object({
      name: z.string(),
      countryCode: z.string(),
      unitSystem: z.enum(['SI', 'US']),
      pageSize: z.enum(['A4', 'LETTER']),
    }),
    composition: reportCompositionSchema,
    consultant: personSchema,
    /** The PlantInput the result was worked out from: the inventory with the consultant's choices and prices. */
    plantInput: z.record(z.string(), z.unknown()),
    /** The engine's PlantResult of the report (for a draft: as composed now). */
    result: z.record(z.string(), z.unknown()),
    /** Drafts: the engine's own choice per run before the consultant's changes. */
    suggestions: z.array(runSuggestionSchema).nullable(),
    /** Where the installed prices come from: the consultant's own table, or the demo table and why. */
    priceBasis: z.object({ kind: z.enum(['own-table', 'demo-table']), note: z.string() }),
    /** Photos the report shows, with short-lived links. */
    photos: z.array(photoSchema),
    /** Photos of the lead the composer can choose from (drafts only). */
    photoChoices: z.array(photoSchema).nullable(),
    pdfUrl: z.string().nullable(),
    /** The PDF was made and later deleted with the owner's details (the retention period); the figures stay. */
    pdfRemoved: z.boolean(),
    allowed: z.object({ edit: z.boolean(), send: z.boolean(), answer: z.boolean() }),
  }),
});
export type ReportResponse = z.infer<typeof reportResponseSchema>;
export type ReportView = ReportResponse['report'];
