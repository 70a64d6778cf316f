/**
 * The OpenAPI document describes what the server says, not only what it accepts: every JSON
 * answer is a named schema generated from src/schemas, and live answers validate against the
 * document (with a JSON Schema validator, not with the zod schemas that made it).
 */
import Ajv2020 from 'ajv/dist/2020';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { apiErrorSchema } from '../../src/schemas/api-error';
import { submitAssessmentAnswerSchema } from '../../src/schemas/assessment-answer';
import { estimateAnswerSchema } from '../../src/schemas/estimate';
import { ensureTestRegion, validSubmission } from '../support/fixtures';
import { appFetch } from '../support/stack';

interface Operation {
  responses: Record<string, { content?: Record<string, { schema?: { $ref?: string } }> }>;
}
interface Document {
  paths: Record<string, Record<string, Operation>>;
  components: { schemas: Record<string, { properties?: Record<string, unknown>; required?: string[] }> };
}

let doc: Document;
let ajv: Ajv2020;

/** Validates a live answer against the document's schema for that path, method and status. */
function expectDescribed(path: string, method: string, status: number, body: unknown): void {
  const ref = doc.paths[path]?.[method]?.responses[String(status)]?.content?.['application/json']?.schema?.$ref;
  expect(ref, `${method.toUpperCase()} ${path} ${status} has a JSON schema in the document`).toMatch(/^#\/components\/schemas\//);
  const validate = ajv.getSchema(`lagwise-openapi${ref}`);
  expect(validate, `${ref} resolves`).toBeDefined();
  const valid = validate!(body);
  expect(validate!.errors ?? [], `${method.toUpperCase()} ${path} ${status} matches ${ref}`).toEqual([]);
  expect(valid).toBe(true);
}

function postJson(path: string, body: unknown): Promise<Response> {
  return appFetch(path, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

beforeAll(async () => {
  await ensureTestRegion();
  const response = await appFetch('/api/openapi.json');
  expect(response.status).toBe(200);
  doc = (await response.json()) as Document;
  // The components as one resource, so their references to each other resolve.
  ajv = new Ajv2020({ strict: false, allErrors: true, validateFormats: false });
  ajv.addSchema({ $id: 'lagwise-openapi', components: doc.components });
});

afterAll(async () => {
  await closeDb();
});

describe('the OpenAPI document’s answers', () => {
  it('names a schema for every JSON answer of every operation, and each one exists', () => {
    const answers = Object.entries(doc.paths).flatMap(([path, methods]) =>
      Object.entries(methods).flatMap(([method, operation]) =>
        Object.entries(operation.responses).flatMap(([status, answer]) =>
          answer.content?.['application/json'] ? [{ where: `${method} ${path} ${status}`, ref: answer.content['application/json'].schema?.$ref }] : [],
        ),
      ),
    );
    expect(answers.length).toBeGreaterThan(10);
    for (const { where, ref } of answers) expect(ref, where).toMatch(/^#\/components\/schemas\/\w+$/);
    const refs = answers.map((a) => a.ref as string);
    for (const ref of refs) expect(doc.components.schemas[ref.split('/').at(-1)!], ref).toBeDefined();
    for (const id of ['Health', 'EstimateAnswer', 'Error', 'AssessmentSubmitted']) expect(refs).toContain(`#/components/schemas/${id}`);
  });

  it('describes the estimate’s result field for field: PlantResult lists every key a real result has', async () => {
    const response = await postJson('/api/estimate', validSubmission().estimate);
    const body = (await response.json()) as { result: Record<string, unknown> };
    expect(Object.keys(body.result).sort()).toEqual([...(doc.components.schemas.PlantResult!.required ?? [])].sort());
  });

  it.each(['', '?detail=full'])('POST /api/estimate%s: the answer validates against the document and parses with the client’s schema', async (query) => {
    const response = await postJson(`/api/estimate${query}`, validSubmission().estimate);
    expect(response.status).toBe(200);
    const body: unknown = await response.json();
    expectDescribed('/api/estimate', 'post', 200, body);
    expect(estimateAnswerSchema.safeParse(body).success).toBe(true);
  });

  it('POST /api/estimate with a bad length: the 400 validates as Error, issues and their range params included', async () => {
    const estimate = validSubmission().estimate;
    const response = await postJson('/api/estimate', { ...estimate, runs: [{ ...estimate.runs[0]!, lengthM: -5 }] });
    expect(response.status).toBe(400);
    const body: unknown = await response.json();
    expectDescribed('/api/estimate', 'post', 400, body);
    const issue = apiErrorSchema.parse(body).error.issues?.find((i) => i.path === 'runs.0.lengthM');
    expect(issue?.params).toMatchObject({ quantity: 'length', limit: 'min', givenSI: -5 });
  });

  it('POST /api/assessments: the 201 validates as AssessmentSubmitted and parses with the client’s schema', async () => {
    const response = await postJson('/api/assessments', validSubmission());
    expect(response.status).toBe(201);
    const body: unknown = await response.json();
    expectDescribed('/api/assessments', 'post', 201, body);
    expect(submitAssessmentAnswerSchema.parse(body).assessment.status).toBe('fresh');
  });

  it('GET /api/health: the 200 validates as Health', async () => {
    const response = await appFetch('/api/health');
    expect(response.status).toBe(200);
    expectDescribed('/api/health', 'get', 200, await response.json());
  });
});
