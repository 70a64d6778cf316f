/**
 * The API's OpenAPI 3.1 description, generated from the same zod schemas the endpoints
 * parse requests with (io 'input') and declare their answers with (io 'output', the ones the
 * islands' client parses), so the document cannot drift from what the server accepts or says.
 */
import { z } from 'zod';
import { createAssessmentSchema } from '../schemas/assessment';
import { submitAssessmentAnswerSchema } from '../schemas/assessment-answer';
import { apiErrorSchema } from '../schemas/api-error';
import { estimateAnswerSchema, plantResultSchema } from '../schemas/estimate';
import { coverageAnswerSchema } from '../schemas/coverage';
import { healthAnswerSchema } from '../schemas/health';
import { ENGINE_VERSION, plantInputSchema } from '../engine';
import { adminPaths, adminSchemas } from './openapi-admin';
import { leadPaths, leadSchemas } from './openapi-leads';
import { revisionPaths, revisionSchemas } from './openapi-revisions';
import { reportPaths, reportSchemas } from './openapi-reports';
import { APP_VERSION } from './site';

const inputSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });

/**
 * Every answer's schema, by its component name; the answers reference each other by these
 * names (EstimateAnswer → PlantResult) instead of repeating themselves.
 */
function answerSchemas(): Record<string, unknown> {
  const answers = z.registry<{ id: string }>();
  answers.add(apiErrorSchema, { id: 'Error' });
  answers.add(estimateAnswerSchema, { id: 'EstimateAnswer' });
  answers.add(plantResultSchema, { id: 'PlantResult' });
  answers.add(submitAssessmentAnswerSchema, { id: 'AssessmentSubmitted' });
  answers.add(healthAnswerSchema, { id: 'Health' });
  answers.add(coverageAnswerSchema, { id: 'Coverage' });
  const { schemas } = z.toJSONSchema(answers, { io: 'output', target: 'draft-2020-12', uri: (id) => `#/components/schemas/${id}` });
  // Each component sits inside the document: its own $schema and fragment $id would only confuse readers.
  return Object.fromEntries(Object.entries(schemas).map(([id, { $schema: _schema, $id: _id, ...schema }]) => [id, schema]));
}

const ref = (id: string) => ({ $ref: `#/components/schemas/${id}` });

const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: ref('Error') } },
});

const assessmentSubmitted = { 'application/json': { schema: ref('AssessmentSubmitted') } };

export function openApiDocument() {
  return {
    openapi: '3.1.0',
    info: {
      title: 'Lagwise API',
      version: APP_VERSION,
      description:
        'Estimates of heat loss, fuel cost, CO2, hazards and insulation savings of pipe runs, and submission of an assessment to the consultants of a region. All quantities are SI; field names carry their units.',
    },
    servers: [{ url: '/' }],
    paths: {
      '/api/health': {
        get: {
          summary: 'Version and database status',
          responses: {
            '200': { description: 'Up; the database answers.', content: { 'application/json': { schema: ref('Health') } } },
            '503': { description: 'The database does not answer; the body says why.', content: { 'application/json': { schema: ref('Health') } } },
          },
        },
      },
      '/api/coverage': {
        get: {
          summary: 'Whether a consultant covers a postal code',
          description: 'Asked before an assessment is sent. Nothing is stored; the number of asks per address is limited.',
          parameters: [
            { name: 'country', in: 'query', required: true, description: 'The plant’s country, a two-letter code (US, CA, GB …).', schema: { type: 'string', minLength: 2, maxLength: 2 } },
            { name: 'postalCode', in: 'query', required: true, description: 'The plant’s postal code as typed.', schema: { type: 'string', minLength: 1, maxLength: 16 } },
          ],
          responses: {
            '200': { description: 'Covered or not, and by which region.', content: { 'application/json': { schema: ref('Coverage') } } },
            '400': errorResponse('The country is not one we serve, or the code is not a postal code of that country.'),
            '429': errorResponse('Too many codes asked about from this address in the last minute.'),
          },
        },
      },
      '/api/estimate': {
        post: {
          summary: 'Estimate a plant (nothing is stored)',
          parameters: [
            {
              name: 'detail',
              in: 'query',
              required: false,
              description:
                '`summary` (default): the figures the result screens show. `full`: also each run’s thickness series, face profiles and every figure of its options. Numbers in the answer carry six significant digits.',
              schema: { type: 'string', enum: ['summary', 'full'], default: 'summary' },
            },
          ],
          requestBody: { required: true, content: { 'application/json': { schema: { $ref: '#/components/schemas/PlantInput' } } } },
          responses: {
            '200': {
              description: `The engine's PlantResult (engine ${ENGINE_VERSION}): per run the options weighed (leave, repair, insulate, add a layer, replace) with the chosen one and why, hazards at design air and notices; totals over the recommended work; ranges; assumptions; warnings.`,
              content: { 'application/json': { schema: ref('EstimateAnswer') } },
            },
            '400': errorResponse('The input is invalid; each issue names its field.'),
            '415': errorResponse('The body is not JSON.'),
            '422': errorResponse('The input is well formed but physically impossible or outside the method’s range.'),
          },
        },
      },
      '/api/assessments': {
        post: {
          summary: 'Submit an assessment to be routed to a consultant',
          parameters: [
            {
              name: 'Idempotency-Key',
              in: 'header',
              required: false,
              description: 'Send the same key again (a double click) and the first assessment is returned, not a second stored.',
              schema: { type: 'string', minLength: 8, maxLength: 128 },
            },
          ],
          requestBody: {
            required: true,
            content: {
              'application/json': { schema: { $ref: '#/components/schemas/CreateAssessment' } },
              'multipart/form-data': {
                schema: {
                  type: 'object',
                  required: ['assessment'],
                  properties: {
                    assessment: { type: 'string', contentMediaType: 'application/json', description: 'CreateAssessment as JSON.' },
                    photos: { type: 'array', items: { type: 'string', contentMediaType: 'application/octet-stream' }, description: 'Photos of the whole plant. A run’s photos go in parts named photos.<runId>. JPEG, PNG, WebP, HEIC or PDF, 10 MB each, 12 in all.' },
                  },
                },
              },
            },
          },
          responses: {
            '201': { description: 'Stored.', content: assessmentSubmitted },
            '200': { description: 'Already stored under this Idempotency-Key.', content: assessmentSubmitted },
            '400': errorResponse('Invalid input or a refused photo; each issue names its field.'),
            '413': errorResponse('The upload is too large.'),
            '422': errorResponse('The estimate is physically impossible.'),
            '429': errorResponse('Too many submissions from this address or e-mail in the last hour.'),
          },
        },
      },
      ...leadPaths(),
      ...adminPaths(),
      ...revisionPaths(),
      ...reportPaths(),
    },
    components: {
      schemas: {
        PlantInput: inputSchema(plantInputSchema),
        CreateAssessment: inputSchema(createAssessmentSchema),
        ...adminSchemas(),
        ...answerSchemas(),
        ...leadSchemas(),
        ...revisionSchemas(),
        ...reportSchemas(),
      },
    },
  };
}
