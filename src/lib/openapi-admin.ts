/**
 * The admin area's part of /api/openapi.json (and the public invitation and password links it
 * sends), generated from the zod schemas in src/schemas/admin.ts that the endpoints parse and
 * answer with. Merged into the document by ./openapi.
 */
import { z } from 'zod';
import {
  acceptInvitationRequestSchema,
  acceptInvitationResponseSchema,
  activityQuerySchema,
  activityResponseSchema,
  adminLeadResponseSchema,
  assignLeadRequestSchema,
  attentionResponseSchema,
  consultantListResponseSchema,
  consultantResponseSchema,
  createRegionRequestSchema,
  deactivateConsultantRequestSchema,
  deactivateConsultantResponseSchema,
  forgotPasswordRequestSchema,
  forgotPasswordResponseSchema,
  funnelQuerySchema,
  funnelResponseSchema,
  inviteConsultantRequestSchema,
  junkLeadRequestSchema,
  regionChangeResponseSchema,
  regionListResponseSchema,
  resetPasswordRequestSchema,
  resetPasswordResponseSchema,
  settingsResponseSchema,
  updateConsultantRequestSchema,
  updateRegionRequestSchema,
  updateSettingsRequestSchema,
} from '../schemas/admin';

const toSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as Record<string, unknown>;

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const error = (description: string) => ({ description, content: { 'application/json': { schema: ref('Error') } } });
const answer = (description: string, name: string) => ({ description, content: { 'application/json': { schema: ref(name) } } });
const body = (name: string, form = false) => ({
  required: true,
  content: {
    'application/json': { schema: ref(name) },
    ...(form ? { 'application/x-www-form-urlencoded': { schema: ref(name) } } : {}),
  },
});

const adminOnly = {
  '401': error('Not signed in (or the account is deactivated).'),
  '403': error('Only admins may do this.'),
};
const badInput = error('The input is invalid; each issue names its field (e.g. prefixes.2 with the prefix and the country’s format).');

const idParameter = (what: string) => ({ name: 'id', in: 'path', required: true, description: `The ${what} id.`, schema: { type: 'string', format: 'uuid' } });
const dryRunParameter = {
  name: 'dryRun',
  in: 'query',
  required: false,
  description: '1: answer what saving would do (overlaps, leads routed or moved) and store nothing.',
  schema: { type: 'string', enum: ['0', '1', 'true', 'false'] },
};

function queryParameters(schema: z.ZodType) {
  const json = toSchema(schema, 'input') as { properties?: Record<string, Record<string, unknown>> };
  return Object.entries(json.properties ?? {}).map(([name, property]) => ({ name, in: 'query', required: false, schema: property }));
}

export function adminPaths() {
  return {
    '/api/admin/consultants': {
      get: { summary: 'Every consultant with status, regions, cap and open work', responses: { '200': answer('The consultants.', 'ConsultantList'), ...adminOnly } },
      post: {
        summary: 'Invite a consultant by e-mail',
        description: 'Makes the account (no password yet), its profile and regions, and mails a single-use link that lasts 7 days; the link lets them choose a password.',
        requestBody: body('InviteConsultant'),
        responses: { '201': answer('Invited.', 'ConsultantResponse'), '400': badInput, '409': error('The address already has an account.'), ...adminOnly },
      },
    },
    '/api/admin/consultants/{id}': {
      get: { summary: 'One consultant', parameters: [idParameter('consultant')], responses: { '200': answer('The consultant.', 'ConsultantResponse'), '404': error('No consultant with this id.'), ...adminOnly } },
      patch: {
        summary: 'Change a consultant’s name, firm, phone or cap of open claims',
        parameters: [idParameter('consultant')],
        requestBody: body('UpdateConsultant'),
        responses: { '200': answer('Changed.', 'ConsultantResponse'), '400': badInput, '404': error('No consultant with this id.'), ...adminOnly },
      },
    },
    '/api/admin/consultants/{id}/deactivate': {
      post: {
        summary: 'Deactivate a consultant',
        description: 'Their sessions end at once. Their open leads (claimed, in touch, walk booked) reopen for their region — whose other consultants are alerted — or go to the named colleague, who must cover each lead’s region.',
        parameters: [idParameter('consultant')],
        requestBody: body('DeactivateConsultant'),
        responses: {
          '200': answer('Deactivated, with where the leads went.', 'DeactivateConsultantResponse'),
          '400': badInput,
          '404': error('No consultant with this id.'),
          '409': error('Already deactivated, or has not joined yet.'),
          ...adminOnly,
        },
      },
    },
    '/api/admin/consultants/{id}/reactivate': {
      post: {
        summary: 'Let a deactivated consultant sign in again',
        parameters: [idParameter('consultant')],
        responses: { '200': answer('Reactivated.', 'ConsultantResponse'), '404': error('No consultant with this id.'), '409': error('Not deactivated.'), ...adminOnly },
      },
    },
    '/api/admin/consultants/{id}/invitation': {
      post: {
        summary: 'Send a waiting invitation again with a new link (the old link stops working)',
        parameters: [idParameter('consultant')],
        responses: { '200': answer('Sent.', 'ConsultantResponse'), '404': error('No consultant with this id.'), '409': error('They have joined already.'), ...adminOnly },
      },
      delete: {
        summary: 'Withdraw a waiting invitation; the unused account is removed',
        parameters: [idParameter('consultant')],
        responses: { '204': { description: 'Withdrawn.' }, '404': error('No consultant with this id.'), '409': error('They have joined already.'), ...adminOnly },
      },
    },
    '/api/admin/regions': {
      get: { summary: 'Regions (live first, then retired) with prefixes, consultants and lead counts', responses: { '200': answer('The regions.', 'RegionList'), ...adminOnly } },
      post: {
        summary: 'Make a region',
        description: 'Prefixes are checked against the country’s postal format. Unrouted assessments it now covers, and open ones a longer prefix now wins, are routed to it in the same transaction and its consultants alerted.',
        parameters: [dryRunParameter],
        requestBody: body('CreateRegion'),
        responses: {
          '201': answer('Made.', 'RegionChange'),
          '200': answer('Dry run: what saving would do; nothing stored.', 'RegionChange'),
          '400': badInput,
          '409': error('A prefix already belongs to another region (the issue names it).'),
          ...adminOnly,
        },
      },
    },
    '/api/admin/regions/{id}': {
      patch: {
        summary: 'Change a region: { name?, countryCode?, prefixes?, consultantIds? }',
        parameters: [idParameter('region'), dryRunParameter],
        requestBody: body('UpdateRegion'),
        responses: {
          '200': answer('Changed (or, on a dry run, what would change).', 'RegionChange'),
          '400': badInput,
          '404': error('No region with this id.'),
          '409': error('The region is retired, or a prefix belongs to another region.'),
          ...adminOnly,
        },
      },
      delete: {
        summary: 'Retire a region',
        description: 'Its prefixes and consultants are let go; its open leads go to whichever region now wins their postal code, or become unrouted. Held leads stay with their consultants.',
        parameters: [idParameter('region')],
        responses: { '200': answer('Retired, with the leads that moved.', 'RegionChange'), '404': error('No region with this id.'), '409': error('Retired already.'), ...adminOnly },
      },
    },
    '/api/admin/leads/{id}/assign': {
      post: {
        summary: 'Hand a lead to a consultant by hand, with the reason',
        description: 'From unrouted, open or a held stage before the report is out. The owner is told who will contact them; the consultant is mailed. The admin may hand over past the consultant’s cap (overCap says so).',
        parameters: [idParameter('assessment')],
        requestBody: body('AssignLead'),
        responses: {
          '200': answer('Handed over.', 'AdminLeadResponse'),
          '400': badInput,
          '404': error('No lead with this id.'),
          '409': error('Junk, finished, already held by them, or changed meanwhile.'),
          ...adminOnly,
        },
      },
    },
    '/api/admin/leads/{id}/junk': {
      post: {
        summary: 'Set a lead aside as junk; it leaves every consultant’s view',
        parameters: [idParameter('assessment')],
        requestBody: body('JunkLead'),
        responses: { '200': answer('Set aside.', 'AdminLeadResponse'), '400': badInput, '404': error('No lead with this id.'), '409': error('Junk already.'), ...adminOnly },
      },
    },
    '/api/admin/leads/{id}/restore': {
      post: {
        summary: 'Take a lead back from junk (to its holder’s stage, or routed afresh)',
        parameters: [idParameter('assessment')],
        requestBody: body('JunkLead'),
        responses: { '200': answer('Taken back.', 'AdminLeadResponse'), '400': badInput, '404': error('No lead with this id.'), '409': error('Not junk.'), ...adminOnly },
      },
    },
    '/api/admin/attention': {
      get: {
        summary: 'Leads that need a person',
        description: 'Unrouted, open longer than the staleAfterHours setting, or held by a deactivated consultant; and consultants over their cap.',
        responses: { '200': answer('The list.', 'Attention'), ...adminOnly },
      },
    },
    '/api/admin/funnel': {
      get: {
        summary: 'Submitted → claimed → in touch → site walk → report sent → signed, by region and month',
        parameters: queryParameters(funnelQuerySchema),
        responses: { '200': answer('The funnel.', 'Funnel'), '400': badInput, ...adminOnly },
      },
    },
    '/api/admin/activity': {
      get: {
        summary: 'The activity log, newest first, paged on the server',
        parameters: queryParameters(activityQuerySchema),
        responses: { '200': answer('One page of entries.', 'ActivityPage'), '400': badInput, ...adminOnly },
      },
    },
    '/api/admin/settings': {
      get: { summary: 'The admin’s settings', responses: { '200': answer('The settings.', 'SettingsResponse'), ...adminOnly } },
      patch: { summary: 'Change settings', requestBody: body('UpdateSettings'), responses: { '200': answer('Changed.', 'SettingsResponse'), '400': badInput, ...adminOnly } },
    },
    '/api/invitations/accept': {
      post: {
        summary: 'Choose a password from an invitation link',
        description: 'Spends the link and signs the consultant in (session cookie). A form post gets a 303 to the desk, or back to /join with an error.',
        requestBody: body('AcceptInvitation', true),
        responses: {
          '200': answer('Joined; the session cookie is set.', 'AcceptInvitationResponse'),
          '303': { description: 'Form posts: to the desk, or back to the join page.' },
          '400': badInput,
          '404': error('Not a link we know.'),
          '410': error('Used, expired or withdrawn.'),
        },
      },
    },
    '/api/password/forgot': {
      post: {
        summary: 'Mail a consultant or admin a link to choose a new password',
        description: 'The same answer whether or not the address has an account.',
        requestBody: body('ForgotPassword', true),
        responses: { '200': answer('Sent if the address belongs to a consultant or admin.', 'ForgotPasswordResponse'), '303': { description: 'Form posts: back to the page.' }, '400': badInput, '429': error('Too many requests in the last hour.') },
      },
    },
    '/api/password/reset': {
      post: {
        summary: 'Set a new password from a reset link (every session ends)',
        requestBody: body('ResetPassword', true),
        responses: { '200': answer('Set.', 'ResetPasswordResponse'), '303': { description: 'Form posts: to sign-in, or back to the page.' }, '400': badInput, '410': error('Used or expired.') },
      },
    },
  };
}

export function adminSchemas() {
  return {
    ConsultantList: toSchema(consultantListResponseSchema, 'output'),
    ConsultantResponse: toSchema(consultantResponseSchema, 'output'),
    InviteConsultant: toSchema(inviteConsultantRequestSchema, 'input'),
    UpdateConsultant: toSchema(updateConsultantRequestSchema, 'input'),
    DeactivateConsultant: toSchema(deactivateConsultantRequestSchema, 'input'),
    DeactivateConsultantResponse: toSchema(deactivateConsultantResponseSchema, 'output'),
    RegionList: toSchema(regionListResponseSchema, 'output'),
    CreateRegion: toSchema(createRegionRequestSchema, 'input'),
    UpdateRegion: toSchema(updateRegionRequestSchema, 'input'),
    RegionChange: toSchema(regionChangeResponseSchema, 'output'),
    AssignLead: toSchema(assignLeadRequestSchema, 'input'),
    JunkLead: toSchema(junkLeadRequestSchema, 'input'),
    AdminLeadResponse: toSchema(adminLeadResponseSchema, 'output'),
    Attention: toSchema(attentionResponseSchema, 'output'),
    Funnel: toSchema(funnelResponseSchema, 'output'),
    ActivityPage: toSchema(activityResponseSchema, 'output'),
    SettingsResponse: toSchema(settingsResponseSchema, 'output'),
    UpdateSettings: toSchema(updateSettingsRequestSchema, 'input'),
    AcceptInvitation: toSchema(acceptInvitationRequestSchema, 'input'),
    AcceptInvitationResponse: toSchema(acceptInvitationResponseSchema, 'output'),
    ForgotPassword: toSchema(forgotPasswordRequestSchema, 'input'),
    ForgotPasswordResponse: toSchema(forgotPasswordResponseSchema, 'output'),
    ResetPassword: toSchema(resetPasswordRequestSchema, 'input'),
    ResetPasswordResponse: toSchema(resetPasswordResponseSchema, 'output'),
  };
}
