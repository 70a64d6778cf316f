/**
 * Site-walk revisions in /api/openapi.json: GET and POST /api/leads/{id}/revisions, their body
 * and answers, generated from the zod schemas in src/schemas/revisions.ts that the endpoint
 * parses and answers with. Merged into the document by ./openapi.
 */
import { z } from 'zod';
import { revisionListResponseSchema, revisionRequestSchema, revisionSavedResponseSchema, staleRevisionDetailsSchema } from '../schemas/revisions';

const toSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as Record<string, unknown>;

const error = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });
const answer = (description: string, ref: string) => ({ description, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });

const idParameter = { name: 'id', in: 'path', required: true, description: 'The assessment id.', schema: { type: 'string', format: 'uuid' } };
const notFound = error('No lead with this id among the leads you can reach (an out-of-region id answers the same; so does a malformed one).');

export function revisionPaths() {
  return {
    '/api/leads/{id}/revisions': {
      get: {
        summary: 'A lead’s inventory as the owner sent it and after each site walk, with what changed',
        description:
          'Everyone who reaches the lead reads its states and the diff of the original against the latest revision; the reason of each revision only the consultant holding the lead and admins.',
        parameters: [idParameter],
        responses: {
          '200': answer('The original (number 0), the revisions oldest first, and the diff.', 'RevisionList'),
          '401': error('Not signed in (or the account is deactivated).'),
          '403': error('The account’s role may not read leads.'),
          '404': notFound,
        },
      },
      post: {
        summary: 'Save a site-walk revision of the inventory',
        description:
          'Only the consultant holding the lead (and admins), until the work is agreed or the lead closed. Send every run as the engine takes it and the areas they sit in; plant-wide answers are kept from the base revision. The revision, the lead’s headline figures and an activity entry are stored together. Send the same clientKey again after a dropped connection and the revision already made is returned (200) rather than a second one.',
        parameters: [idParameter],
        requestBody: { required: true, content: { 'application/json': { schema: { $ref: '#/components/schemas/RevisionRequest' } } } },
        responses: {
          '201': answer('Saved: the revision and what it changed from its base.', 'RevisionSaved'),
          '200': answer('Already saved under this clientKey.', 'RevisionSaved'),
          '400': error('Invalid body or an impossible input; each issue names its field (runs.2.measurements.surfaceTemperatureC).'),
          '401': error('Not signed in (or the account is deactivated).'),
          '403': error('The account’s role may not revise leads, or another consultant holds the lead (or nobody has claimed it yet).'),
          '404': notFound,
          '409': {
            description:
              'CONFLICT: a newer revision was saved since baseNumber (details: StaleRevision — who saved it and when); nothing was overwritten. INVALID_TRANSITION: the lead is closed or the work agreed.',
            content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
          },
          '415': error('The body is not JSON.'),
          '422': error('The inputs are well formed but outside the method’s range.'),
        },
      },
    },
  };
}

export function revisionSchemas() {
  return {
    RevisionRequest: toSchema(revisionRequestSchema, 'input'),
    RevisionList: toSchema(revisionListResponseSchema, 'output'),
    RevisionSaved: toSchema(revisionSavedResponseSchema, 'output'),
    StaleRevision: toSchema(staleRevisionDetailsSchema, 'output'),
  };
}
