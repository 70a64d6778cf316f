/**
 * The admin area's contracts: what its endpoints accept and answer. The endpoints parse with
 * these, the admin islands' client checks answers with them, and /api/openapi.json is made from
 * them.
 */
import { z } from 'zod';
import { assessmentStatuses } from '../db/statuses';
import { checkRegionPrefix, countryCodes, isCountryCode } from '../lib/routing/postal-code';
import { heldStages } from '../lib/leads/pipeline';

const isoDate = z.string().describe('ISO 8601 date and time');
const id = z.uuid();

/** Text a person types: trimmed, with a length limit and a sentence naming the field. */
function typedText(label: string, { min = 1, max }: { min?: number; max: number }) {
  return z
    .string({ error: `Enter the ${label}.` })
    .trim()
    .min(min, { error: `Enter the ${label}.` })
    .max(max, { error: `Keep the ${label} under ${max} characters.` })
    .refine((text) => !/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F\u202A-\u202E\u2066-\u2069]/.test(text), {
      error: `The ${label} holds an invisible control character; retype it rather than pasting it.`,
    });
}

const email = z
  .string({ error: 'Enter the e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter an e-mail address like name@firm.com.' }))
  .pipe(z.string().max(254, { error: 'An e-mail address is at most 254 characters.' }));

const phone = z
  .string({ error: 'Enter the phone number as text.' })
  .trim()
  .max(40, { error: 'Keep the phone number under 40 characters.' })
  .regex(/^[+()\d\s.\-]*$/, { error: 'A phone number may hold digits, spaces, + ( ) . and - only.' })
  .transform((value) => value || null);

const openClaimCap = z
  .number({ error: 'Give the number of open leads as a whole number.' })
  .int({ error: 'Give the number of open leads as a whole number.' })
  .min(1, { error: 'A consultant may hold at least 1 open lead.' })
  .max(100, { error: 'Keep the cap at 100 open leads or fewer.' });

/** A new password: better-auth's own limits (10 to 128 characters), said in words. */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(10, { error: 'Choose a password of at least 10 characters.' })
  .max(128, { error: 'Keep the password to 128 characters or fewer.' });

// ——— Consultants ———

export const consultantStatuses = ['invited', 'active', 'deactivated'] as const;

export const consultantSchema = z.object({
  id,
  name: z.string(),
  email: z.string(),
  firm: z.string().nullable(),
  phone: z.string().nullable(),
  status: z.enum(consultantStatuses).describe('invited: has not chosen a password yet; deactivated: cannot sign in.'),
  openClaimCap: z.int(),
  openClaims: z.int().describe('Leads held at claimed, in touch or site walk booked: the ones the cap counts.'),
  heldLeads: z.int().describe('Every lead held and not finished (up to report sent).'),
  overCap: z.boolean(),
  regions: z.array(z.object({ id, name: z.string() })),
  invitation: z
    .object({ expiresAt: isoDate, lastSentAt: isoDate, sentCount: z.int(), expired: z.boolean() })
    .nullable()
    .describe('The waiting invitation, for consultants who have not chosen a password yet.'),
  deactivation: z.object({ reason: z.string().nullable() }).nullable(),
  lastSignInAt: isoDate.nullable(),
});
export type ConsultantView = z.infer<typeof consultantSchema>;

export const consultantListResponseSchema = z.object({ consultants: z.array(consultantSchema) });
export const consultantResponseSchema = z.object({ consultant: consultantSchema });

/** POST /api/admin/consultants: invite a consultant by e-mail. */
export const inviteConsultantRequestSchema = z
  .object({
    email,
    name: typedText('name', { max: 120 }),
    firm: typedText('firm', { max: 160 }),
    phone: phone.optional(),
    regionIds: z.array(z.uuid({ error: 'Each region must be the id of a region.' })).max(50).optional(),
    openClaimCap: openClaimCap.optional(),
  })
  .strict();
export type InviteConsultantRequest = z.output<typeof inviteConsultantRequestSchema>;

/** PATCH /api/admin/consultants/{id}: name, firm, phone or cap of open claims. */
export const updateConsultantRequestSchema = z
  .object({
    name: typedText('name', { max: 120 }).optional(),
    firm: typedText('firm', { max: 160 }).optional(),
    phone: phone.optional(),
    openClaimCap: openClaimCap.optional(),
  })
  .strict()
  .refine((body) => Object.values(body).some((v) => v !== undefined), { error: 'Send at least one of name, firm, phone, openClaimCap.' });
export type UpdateConsultantRequest = z.output<typeof updateConsultantRequestSchema>;

/** POST /api/admin/consultants/{id}/deactivate */
export const deactivateConsultantRequestSchema = z
  .object({
    leads: z.enum(['reopen', 'colleague'], {
      error: 'Say where their open leads go: "reopen" (open again for the region) or "colleague" (to the consultant named in colleagueId).',
    }),
    colleagueId: z.uuid({ error: 'colleagueId must be the id of a consultant.' }).optional(),
    reason: typedText('reason', { min: 0, max: 500 }).optional(),
  })
  .strict()
  .superRefine((body, ctx) => {
    if (body.leads === 'colleague' && !body.colleagueId) {
      ctx.addIssue({ code: 'custom', path: ['colleagueId'], message: 'Name the colleague who takes over the open leads.' });
    }
    if (body.leads === 'reopen' && body.colleagueId) {
      ctx.addIssue({ code: 'custom', path: ['colleagueId'], message: 'A colleague is named only when the leads go to one.' });
    }
  });
export type DeactivateConsultantRequest = z.output<typeof deactivateConsultantRequestSchema>;

export const deactivateConsultantResponseSchema = z.object({
  consultant: consultantSchema,
  leads: z.object({
    reopened: z.int().describe('Open again for their region (its other consultants alerted).'),
    unrouted: z.int().describe('Had no region: back among the leads that need a person.'),
    handedOver: z.int().describe('Now held by the colleague.'),
  }),
});

// ——— Invitations and passwords (public, reached from e-mail) ———

const token = z
  .string({ error: 'The link is incomplete; open it again from the e-mail.' })
  .min(20, { error: 'The link is incomplete; open it again from the e-mail.' })
  .max(200, { error: 'The link is not one of ours; open it again from the e-mail.' })
  .regex(/^[A-Za-z0-9_-]+$/, { error: 'The link is not one of ours; open it again from the e-mail.' });

/** POST /api/invitations/accept (JSON or the join page's form). */
export const acceptInvitationRequestSchema = z.object({ token, password: newPasswordSchema }).strict();
export const acceptInvitationResponseSchema = z.object({ home: z.string() });

/** POST /api/password/forgot (JSON or the page's form). */
export const forgotPasswordRequestSchema = z.object({ email }).strict();
export const forgotPasswordResponseSchema = z.object({ sent: z.literal(true) });

/** POST /api/password/reset (JSON or the page's form). */
export const resetPasswordRequestSchema = z.object({ token, password: newPasswordSchema }).strict();
export const resetPasswordResponseSchema = z.object({ reset: z.literal(true) });

// ——— Regions ———

const countryCode = z
  .string({ error: `countryCode must be one of ${countryCodes.join(', ')}.` })
  .trim()
  .toUpperCase()
  .refine(isCountryCode, { error: `countryCode must be one of ${countryCodes.join(', ')}.` });

const prefixList = z
  .array(z.string({ error: 'Each prefix is text, like 972 or HG1.' }), { error: 'prefixes is a list, like ["970", "971"].' })
  .max(200, { error: 'A region holds at most 200 prefixes; split it into several regions.' });

const consultantIds = z
  .array(z.uuid({ error: 'Each consultant must be the id of a consultant.' }), { error: 'consultantIds is a list of consultant ids.' })
  .max(100);

/** Checks every prefix against the country's format, naming each wrong one at its place in the list. */
function checkPrefixes(country: string | undefined, prefixes: readonly string[] | undefined, ctx: z.RefinementCtx): void {
  if (!prefixes || !country || !isCountryCode(country)) return;
  const seen = new Map<string, number>();
  prefixes.forEach((typed, index) => {
    const checked = checkRegionPrefix(country, typed);
    if (!checked.ok) {
      ctx.addIssue({ code: 'custom', path: ['prefixes', index], message: checked.message });
      return;
    }
    const earlier = seen.get(checked.prefix);
    if (earlier !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['prefixes', index], message: `"${typed.trim()}" is already in the list (at place ${earlier + 1}).` });
    }
    seen.set(checked.prefix, index);
  });
}

/** POST /api/admin/regions */
export const createRegionRequestSchema = z
  .object({
    name: typedText('region name', { max: 80 }),
    countryCode,
    prefixes: prefixList.default([]),
    consultantIds: consultantIds.optional(),
  })
  .strict()
  .superRefine((body, ctx) => checkPrefixes(body.countryCode, body.prefixes, ctx));
export type CreateRegionRequest = z.output<typeof createRegionRequestSchema>;

/**
 * PATCH /api/admin/regions/{id}: the fields given replace the region's. Prefixes are checked
 * against the country sent or, when none is sent, the region's own (by the domain).
 */
export const updateRegionRequestSchema = z
  .object({
    name: typedText('region name', { max: 80 }).optional(),
    countryCode: countryCode.optional(),
    prefixes: prefixList.optional(),
    consultantIds: consultantIds.optional(),
  })
  .strict()
  .superRefine((body, ctx) => checkPrefixes(body.countryCode, body.prefixes, ctx))
  .refine((body) => Object.values(body).some((v) => v !== undefined), {
    error: 'Send at least one of name, countryCode, prefixes, consultantIds.',
  });
export type UpdateRegionRequest = z.output<typeof updateRegionRequestSchema>;

/** `?dryRun=1` on POST and PATCH: answer what saving would do, store nothing. */
export const dryRunQuerySchema = z.object({
  dryRun: z
    .enum(['0', '1', 'true', 'false'], { error: 'dryRun is 1 (only show what would change) or 0.' })
    .optional()
    .transform((v) => v === '1' || v === 'true'),
});

export const regionSchema = z.object({
  id,
  slug: z.string(),
  name: z.string(),
  countryCode: z.string(),
  countryName: z.string(),
  prefixes: z.array(z.string()),
  consultants: z.array(z.object({ id, name: z.string(), firm: z.string().nullable(), active: z.boolean() })),
  retiredAt: isoDate.nullable(),
  openLeads: z.int(),
  staleLeads: z.int(),
  heldLeads: z.int(),
});
export type RegionView = z.infer<typeof regionSchema>;

export const regionListResponseSchema = z.object({ regions: z.array(regionSchema) });

/** Where a prefix meets another region's: the longer prefix wins the codes both would match. */
export const prefixOverlapSchema = z.object({
  prefix: z.string(),
  otherRegion: z.object({ id, name: z.string() }),
  otherPrefix: z.string(),
  winner: z.enum(['this', 'other']),
  explanation: z.string(),
});

export const routingChangeSchema = z.object({
  /** Assessments that matched no region and now go to this one (its consultants alerted). */
  routedFromUnrouted: z.int(),
  /** Open leads that move between regions because a longer prefix now wins. */
  moved: z.array(z.object({ from: z.string().nullable(), to: z.string().nullable(), count: z.int() })),
  /** Open leads no region covers any more. */
  nowUnrouted: z.int(),
  leads: z.array(z.object({ id, reference: z.string(), from: z.string().nullable(), to: z.string().nullable() })).max(50),
});
export type RoutingChange = z.infer<typeof routingChangeSchema>;

export const regionChangeResponseSchema = z.object({
  dryRun: z.boolean(),
  region: regionSchema,
  overlaps: z.array(prefixOverlapSchema),
  routing: routingChangeSchema,
});
export type RegionChangeResponse = z.infer<typeof regionChangeResponseSchema>;

// ——— Leads that need a person ———

/** POST /api/admin/leads/{id}/assign */
export const assignLeadRequestSchema = z
  .object({
    consultantId: z.uuid({ error: 'consultantId must be the id of a consultant.' }),
    reason: typedText('reason', { max: 500 }),
  })
  .strict();
export type AssignLeadRequest = z.output<typeof assignLeadRequestSchema>;

/** POST /api/admin/leads/{id}/junk and /restore */
export const junkLeadRequestSchema = z.object({ reason: typedText('reason', { max: 500 }) }).strict();
export type JunkLeadRequest = z.output<typeof junkLeadRequestSchema>;

export const adminLeadResponseSchema = z.object({
  lead: z.object({
    id,
    reference: z.string(),
    status: z.enum(assessmentStatuses),
    holder: z.object({ id, name: z.string(), firm: z.string().nullable() }).nullable(),
    region: z.object({ id, name: z.string() }).nullable(),
  }),
  /** The consultant now holds more open leads than their cap (the admin may hand over past it). */
  overCap: z.boolean(),
});

export const attentionReasons = ['unrouted', 'stale', 'over-cap', 'holder-deactivated'] as const;
export type AttentionReason = (typeof attentionReasons)[number];

export const attentionLeadSchema = z.object({
  id,
  reference: z.string(),
  status: z.enum(assessmentStatuses),
  reason: z.enum(attentionReasons),
  plantType: z.string(),
  place: z.string().describe('Postal code and country: the admin routes by it.'),
  region: z.object({ id, name: z.string() }).nullable(),
  holder: z.object({ id, name: z.string(), firm: z.string().nullable() }).nullable(),
  postedAt: isoDate,
  waitingHours: z.int(),
  currency: z.string(),
  annualLoss: z.number(),
});
export type AttentionLead = z.infer<typeof attentionLeadSchema>;

export const attentionResponseSchema = z.object({
  staleAfterHours: z.int(),
  leads: z.array(attentionLeadSchema),
  overCap: z.array(z.object({ id, name: z.string(), firm: z.string().nullable(), openClaims: z.int(), cap: z.int() })),
  consultants: z.array(z.object({ id, name: z.string(), firm: z.string().nullable(), openClaims: z.int(), cap: z.int(), regionIds: z.array(id) })),
});
export type AttentionResponse = z.infer<typeof attentionResponseSchema>;

// ——— The funnel ———

export const funnelSteps = ['submitted', 'claimed', 'in_touch', 'site_walk', 'report_sent', 'signed'] as const;
export type FunnelStep = (typeof funnelSteps)[number];

export const funnelQuerySchema = z.object({
  months: z
    .preprocess((v) => (v === undefined || v === '' ? undefined : Number(v)), z.int({ error: 'months is a whole number from 1 to 24.' }).min(1).max(24).optional())
    .transform((v) => v ?? 6),
  region: z.preprocess((v) => (v === '' ? undefined : v), z.uuid({ error: 'region must be the id of a region.' }).optional()),
});

export const funnelRowSchema = z.object({
  month: z.string().describe('YYYY-MM, the month the assessments were submitted (UTC).'),
  region: z.object({ id, name: z.string() }).nullable(),
  counts: z.object({
    submitted: z.int(),
    claimed: z.int(),
    in_touch: z.int(),
    site_walk: z.int(),
    report_sent: z.int(),
    signed: z.int(),
  }),
});
export const funnelResponseSchema = z.object({
  months: z.array(z.string()),
  rows: z.array(funnelRowSchema),
  totals: funnelRowSchema.shape.counts,
});
export type FunnelResponse = z.infer<typeof funnelResponseSchema>;

// ——— The activity log ———

export const activityQuerySchema = z
  .object({
    lead: z.preprocess(
      (v) => (v === '' ? undefined : v),
      z
        .string()
        .trim()
        .max(40)
        .regex(/^([0-9a-fA-F-]{36}|LW-[A-Za-z0-9-]{2,20})$/, { error: 'lead is a lead’s id or its reference, like LW-4K7Q-2M.' })
        .optional(),
    ),
    person: z.preprocess((v) => (v === '' ? undefined : v), z.uuid({ error: 'person must be the id of a person.' }).optional()),
    action: z.preprocess(
      (v) => (v === '' ? undefined : v),
      z
        .string()
        .max(60)
        .regex(/^[a-z-]+(\.[a-z-]+)?$/, { error: 'action is an action name like lead.claimed, or a family like lead.' })
        .optional(),
    ),
    from: z.preprocess((v) => (v === '' ? undefined : v), z.iso.date({ error: 'from is a date like 2026-03-01.' }).optional()),
    to: z.preprocess((v) => (v === '' ? undefined : v), z.iso.date({ error: 'to is a date like 2026-03-31.' }).optional()),
    page: z
      .preprocess((v) => (v === undefined || v === '' ? undefined : Number(v)), z.int({ error: 'page is a whole number from 1.' }).min(1).max(100_000).optional())
      .transform((v) => v ?? 1),
    pageSize: z
      .preprocess((v) => (v === undefined || v === '' ? undefined : Number(v)), z.union([z.literal(25), z.literal(50), z.literal(100)], { error: 'pageSize is 25, 50 or 100.' }).optional())
      .transform((v) => v ?? 50),
  })
  .superRefine((q, ctx) => {
    if (q.from && q.to && q.from > q.to) ctx.addIssue({ code: 'custom', path: ['to'], message: '“to” must not be before “from”.' });
  });
export type ActivityQuery = z.output<typeof activityQuerySchema>;

export const activityLogEntrySchema = z.object({
  id: z.number(),
  at: isoDate,
  action: z.string(),
  what: z.string().describe('The entry in words.'),
  note: z.string().nullable(),
  actor: z.object({ id, name: z.string(), firm: z.string().nullable() }).nullable(),
  subject: z.object({ id, name: z.string() }).nullable(),
  lead: z.object({ id, reference: z.string() }).nullable(),
});
export type ActivityLogEntry = z.infer<typeof activityLogEntrySchema>;

export const activityResponseSchema = z.object({
  entries: z.array(activityLogEntrySchema),
  page: z.int(),
  pageSize: z.int(),
  total: z.int(),
  pageCount: z.int(),
});
export type ActivityResponse = z.infer<typeof activityResponseSchema>;

// ——— Settings ———

/** Each setting's shape; src/lib/admin/settings.ts gives the defaults and reads stored values through these. */
export const settingShapes = {
  staleAfterHours: z
    .number({ error: 'Give the hours as a number.' })
    .int({ error: 'Give whole hours.' })
    .min(1, { error: 'A lead goes stale after at least 1 hour.' })
    .max(24 * 60, { error: 'Keep it to 60 days (1,440 hours) or less.' }),
} as const;

export const settingsSchema = z.object({ staleAfterHours: settingShapes.staleAfterHours });
export const updateSettingsRequestSchema = settingsSchema
  .partial()
  .strict()
  .refine((body) => Object.values(body).some((v) => v !== undefined), { error: 'Send at least one setting.' });
export const settingsResponseSchema = z.object({ settings: settingsSchema });

/** Stages a held lead can be handed over at (not finished work). */
export const handOverStages = heldStages.filter((s) => s !== 'signed' && s !== 'closed');
