import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { validSubmission } from '../support/fixtures';
import { appFetch } from '../support/stack';

function postEstimate(body: unknown, contentType = 'application/json'): Promise<Response> {
  return appFetch('/api/estimate', {
    method: 'POST',
    headers: { 'content-type': contentType },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
}

describe('POST /api/estimate', () => {
  it('answers the engine’s estimate for a valid plant', async () => {
    const response = await postEstimate(validSubmission().estimate);
    expect(response.status).toBe(200);
    const body = (await response.json()) as { engineVersion: string; result: { runs: { id: string; current: { heatLossWPerM: number } }[] } };
    expect(body.result.runs.map((r) => r.id)).toEqual(['steam-1', 'hw-1']);
    for (const run of body.result.runs) expect(run.current.heatLossWPerM).toBeGreaterThan(0);
  });

  it.each([
    ['not JSON', '{', '(body)'],
    ['no runs', { energy: { price: 1 }, runs: [] }, 'runs'],
    ['no fuel price', { energy: { fuel: 'natural-gas' }, runs: validSubmission().estimate.runs }, 'energy.price'],
    ['an unknown pipe size', { ...validSubmission().estimate, runs: [{ ...validSubmission().estimate.runs[0]!, pipe: { standard: 'ASME-B36.10M', size: '7-3/8' } }] }, 'runs.0.pipe.size'],
    ['3 m of insulation', { ...validSubmission().estimate, runs: [{ ...validSubmission().estimate.runs[0]!, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 3 } }] }, 'runs.0.current.thicknessM'],
  ])('refuses %s with 400 and the field', async (_name, body, path) => {
    const response = await postEstimate(body);
    expect(response.status).toBe(400);
    const answer = (await response.json()) as { error: { issues: { path: string; message: string }[] } };
    expect(answer.error.issues.map((i) => i.path)).toContain(path);
    for (const issue of answer.error.issues) expect(issue.message).toMatch(/[A-Za-z].* .*/);
  });

  it('refuses a proposed material too cold-rated for its line on the material, with the rating and the line in its params', async () => {
    const plant = validSubmission().estimate;
    const glycol = { ...plant.runs[0]!, id: 'glycol-1', service: 'glycol' as const, steamGaugePressureKPa: undefined, fluidTemperatureC: -45, proposed: { material: 'flexible-elastomeric' as const } };
    const response = await postEstimate({ ...plant, runs: [glycol] });
    expect(response.status).toBe(400);
    const answer = (await response.json()) as { error: { issues: { path: string; params?: Record<string, unknown> }[] } };
    const issue = answer.error.issues.find((i) => i.path === 'runs.0.proposed.material');
    expect(issue?.params).toEqual({ quantity: 'temperature', limit: 'min', limitSI: -40, givenSI: -45, exclusive: false, unitSI: '°C', subject: 'flexible-elastomeric' });
  });

  it('refuses a body that is not declared as JSON with 415', async () => {
    const response = await postEstimate(JSON.stringify(validSubmission().estimate), 'text/plain');
    expect(response.status).toBe(415);
  });

  it('never answers 500, whatever JSON arrives', async () => {
    const base = validSubmission().estimate;
    const mutated = fc.record({
      path: fc.constantFrom(
        'energy.price',
        'operatingHoursPerYear',
        'runs.0.lengthM',
        'runs.0.steamGaugePressureKPa',
        'runs.1.fluidTemperatureC',
        'runs.0.pipe.size',
        'runs.0.service',
        'conditions.indoorAirTemperatureC',
        'runs',
        'market',
        'areas',
        'runs.0.areaId',
        'runs.0.finish',
        'runs.0.fittings',
        'runs.0.measurements',
        'runs.0.measurements.surfaceTemperatureC',
        'runs.1.proposed.option',
        'runs.1.proposed.price',
      ),
      value: fc.oneof(fc.double(), fc.integer(), fc.string(), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }), fc.object({ maxDepth: 1 })),
    });
    await fc.assert(
      fc.asyncProperty(mutated, async ({ path, value }) => {
        const body = structuredClone(base) as Record<string, unknown>;
        const keys = path.split('.');
        let target = body as Record<string, unknown>;
        for (const key of keys.slice(0, -1)) target = (target[key] ??= {}) as Record<string, unknown>;
        target[keys.at(-1)!] = value;
        const response = await postEstimate(body);
        await response.arrayBuffer();
        return response.status < 500;
      }),
      { numRuns: 90, seed: 20261201 },
    );
  });
});

describe('GET /api/openapi.json', () => {
  it('describes the endpoints with the request schemas the server parses with', async () => {
    const response = await appFetch('/api/openapi.json');
    expect(response.status).toBe(200);
    const doc = (await response.json()) as { openapi: string; paths: Record<string, unknown>; components: { schemas: Record<string, { properties?: Record<string, unknown> }> } };
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/api/estimate', '/api/assessments', '/api/health']));
    expect(Object.keys(doc.components.schemas.PlantInput!.properties!)).toEqual(expect.arrayContaining(['energy', 'runs', 'operatingHoursPerYear', 'areas', 'market']));
    const runProperties = Object.keys((doc.components.schemas.PlantInput!.properties!.runs as { items: { properties: Record<string, unknown> } }).items.properties);
    expect(runProperties).toEqual(expect.arrayContaining(['areaId', 'finish', 'fittings', 'measurements', 'proposed']));
    expect(JSON.stringify(doc.paths['/api/estimate'])).toContain('"detail"');
    expect(Object.keys(doc.components.schemas.CreateAssessment!.properties!)).toEqual(expect.arrayContaining(['contact', 'consent', 'plant', 'estimate']));
  });
});
