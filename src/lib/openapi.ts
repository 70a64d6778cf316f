/**
 * The API's OpenAPI 3.1 description, generated from the same zod schemas the endpoints
 * parse with, so the document cannot drift from what the server accepts.
 */
import { z } from 'zod';
import { createAssessmentSchema } from '../schemas/assessment';
import { ENGINE_VERSION, plantInputSchema } from '../engine';
import { adminPaths, adminSchemas } from './openapi-admin';
import { leadPaths, leadSchemas } from './openapi-leads';
import { APP_VERSION } from './site';

const inputSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string', examples: ['VALIDATION_FAILED'] },
        message: { type: 'string', description: 'A sentence a person can act on.' },
        details: { type: 'object', description: 'Plain data to act on, e.g. who claimed a lead first and when ({ firm, claimedAt }).' },
        issues: {
          type: 'array',
          items: {
            type: 'object',
            required: ['path', 'message'],
            properties: {
              path: { type: 'string', description: 'Dotted path of the field, e.g. runs.2.lengthM', examples: ['runs.0.lengthM'] },
              message: { type: 'string' },
              params: {
                type: 'object',
                description:
                  'Present on range issues, so a client can say it again in its own units with its own label: the kind of quantity, which limit was crossed, the limit and the given value in SI (unitSI), and whether the limit itself is refused.',
                required: ['quantity', 'limit', 'limitSI', 'givenSI', 'exclusive', 'unitSI'],
                properties: {
                  quantity: { type: 'string', enum: ['temperature', 'temperatureDifference', 'pressure', 'length', 'speed', 'fraction', 'percent', 'hours', 'years', 'count', 'money', 'conductivity', 'coefficient', 'number'] },
                  limit: { type: 'string', enum: ['min', 'max'] },
                  limitSI: { type: 'number' },
                  givenSI: { type: 'number' },
                  exclusive: { type: 'boolean' },
                  unitSI: { type: 'string', examples: ['°C', 'kPa', 'm', 'h/yr'] },
                },
              },
            },
          },
        },
      },
    },
  },
} as const;

const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
});

const assessmentCreated = {
  type: 'object',
  required: ['assessment'],
  properties: {
    assessment: {
      type: 'object',
      required: ['id', 'reference', 'status', 'regionName'],
      properties: {
        id: { type: 'string', format: 'uuid' },
        reference: { type: 'string', examples: ['LW-7KQ4-MX'] },
        status: { type: 'string', enum: ['fresh', 'unrouted', 'junk'] },
        regionName: { type: ['string', 'null'] },
      },
    },
  },
} as const;

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
            '200': { description: 'Up; the database answers.' },
            '503': { description: 'The database does not answer; the body says why.' },
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
              description: `The engine's PlantResult (engine ${ENGINE_VERSION}).`,
              content: {
                'application/json': {
                  schema: {
                    type: 'object',
                    required: ['engineVersion', 'result'],
                    properties: {
                      engineVersion: { type: 'string' },
                      result: {
                        type: 'object',
                        description:
                          'PlantResult: per run the options weighed (leave, repair, insulate, add-layer, replace) with the chosen one and why, hazards at design air, notices; totals over the recommended actions; ranges; assumptions; warnings.',
                      },
                    },
                  },
                },
              },
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
            '201': { description: 'Stored.', content: { 'application/json': { schema: assessmentCreated } } },
            '200': { description: 'Already stored under this Idempotency-Key.', content: { 'application/json': { schema: assessmentCreated } } },
            '400': errorResponse('Invalid input or a refused photo; each issue names its field.'),
            '413': errorResponse('The upload is too large.'),
            '422': errorResponse('The estimate is physically impossible.'),
            '429': errorResponse('Too many submissions from this address or e-mail in the last hour.'),
          },
        },
      },
      ...leadPaths(),
      ...adminPaths(),
    },
    components: {
      schemas: {
        PlantInput: inputSchema(plantInputSchema),
        CreateAssessment: inputSchema(createAssessmentSchema),
        ...adminSchemas(),
        Error: errorSchema,
        ...leadSchemas(),
      },
    },
  };
}
