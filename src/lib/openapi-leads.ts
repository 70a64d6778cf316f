/**
 * The desk's part of /api/openapi.json: the lead endpoints, their query, bodies and answers,
 * generated from the zod schemas in src/schemas/leads.ts that the endpoints parse and answer
 * with. Merged into the document by ./openapi.
 */
import { z } from 'zod';
import {
  claimResponseSchema,
  leadDetailResponseSchema,
  leadListQuerySchema,
  leadListResponseSchema,
  moveRequestSchema,
  moveResponseSchema,
  noteRequestSchema,
  noteResponseSchema,
  releaseRequestSchema,
  releaseResponseSchema,
} from '../schemas/leads';

const toSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as Record<string, unknown>;

const error = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });
const answer = (description: string, ref: string) => ({ description, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });
const body = (ref: string) => ({ required: true, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });

const guarded = {
  '401': error('Not signed in (or the account is deactivated).'),
  '403': error('The account’s role may not do this, or another consultant holds the lead.'),
  '404': error('No lead with this id among the leads you can reach (an out-of-region id answers the same; so does a malformed one).'),
};

const idParameter = { name: 'id', in: 'path', required: true, description: 'The assessment id.', schema: { type: 'string', format: 'uuid' } };

/** The list's query parameters, one per field of the query schema. */
function listParameters() {
  const json = toSchema(leadListQuerySchema, 'input') as { properties?: Record<string, Record<string, unknown>> };
  return Object.entries(json.properties ?? {}).map(([name, schema]) => ({
    name,
    in: 'query',
    required: false,
    ...(name === 'service' ? { explode: true, style: 'form' } : {}),
    ...(typeof schema.description === 'string' ? { description: schema.description } : {}),
    schema,
  }));
}

export function leadPaths() {
  return {
    '/api/leads': {
      get: {
        summary: 'One page of leads: open in my regions (view=open) or held by me (view=mine)',
        description: 'Paged, sorted and filtered on the server. Open leads carry no owner name, company, e-mail or phone.',
        parameters: listParameters(),
        responses: { '200': answer('The page, with the total.', 'LeadList'), '400': error('A query parameter is invalid; each issue names it.'), '401': guarded['401'], '403': guarded['403'] },
      },
    },
    '/api/leads/{id}': {
      get: {
        summary: 'One lead, with only the parts the viewer may see',
        parameters: [idParameter],
        responses: { '200': answer('The lead. Contact, photos and timeline are null unless the viewer holds the lead or is an admin.', 'LeadDetailResponse'), ...guarded },
      },
    },
    '/api/leads/{id}/claim': {
      post: {
        summary: 'Claim a fresh lead (first claim wins)',
        parameters: [idParameter],
        responses: {
          '200': answer('Claimed; the owner is e-mailed who will contact them.', 'ClaimResponse'),
          '409': error('ALREADY_CLAIMED with details {firm, claimedAt} of who was first; CLAIM_LIMIT with details {openClaims, cap}; or the lead is no longer open.'),
          ...guarded,
        },
      },
    },
    '/api/leads/{id}/moves': {
      post: {
        summary: 'Move a held lead along the pipeline',
        description: 'claimed → in_touch → site_walk_booked → (report_sent, set by sending a report) → signed | closed. Closing needs a reason.',
        parameters: [idParameter],
        requestBody: body('MoveRequest'),
        responses: { '200': answer('Moved.', 'MoveResponse'), '400': error('Invalid body; each issue names its field.'), '409': error('The pipeline does not allow this move; the message says why.'), ...guarded },
      },
    },
    '/api/leads/{id}/release': {
      post: {
        summary: 'Hand a held lead back to its region',
        description: 'The lead becomes fresh again and the region’s other consultants are alerted.',
        parameters: [idParameter],
        requestBody: body('ReleaseRequest'),
        responses: { '200': answer('Handed back.', 'ReleaseResponse'), '400': error('Invalid body.'), '409': error('The lead can no longer be handed back (a report was sent, or it is closed).'), ...guarded },
      },
    },
    '/api/leads/{id}/notes': {
      post: {
        summary: 'Add a note to a held lead’s timeline',
        parameters: [idParameter],
        requestBody: body('NoteRequest'),
        responses: { '201': answer('The timeline entry.', 'NoteResponse'), '400': error('Empty or too long.'), ...guarded },
      },
    },
  };
}

export function leadSchemas() {
  return {
    LeadList: toSchema(leadListResponseSchema, 'output'),
    LeadDetailResponse: toSchema(leadDetailResponseSchema, 'output'),
    ClaimResponse: toSchema(claimResponseSchema, 'output'),
    MoveRequest: toSchema(moveRequestSchema, 'input'),
    MoveResponse: toSchema(moveResponseSchema, 'output'),
    ReleaseRequest: toSchema(releaseRequestSchema, 'input'),
    ReleaseResponse: toSchema(releaseResponseSchema, 'output'),
    NoteRequest: toSchema(noteRequestSchema, 'input'),
    NoteResponse: toSchema(noteResponseSchema, 'output'),
  };
}
