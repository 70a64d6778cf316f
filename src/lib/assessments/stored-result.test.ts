import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema, type PlantInput } from '../../engine';
import { readingNote, readStoredResult, storedPlantInput, type StoredResultReading } from './stored-result';

/** The reading, checked to have the status, narrowed to it. */
function expectStatus<S extends StoredResultReading['status']>(reading: StoredResultReading, status: S): Extract<StoredResultReading, { status: S }> {
  expect(reading.status).toBe(status);
  return reading as Extract<StoredResultReading, { status: S }>;
}

/** An invented plant: Hatherley Mill Bakery's steam to the ovens and its proofer's hot water. */
const plant: PlantInput = {
  label: 'Hatherley Mill Bakery',
  unitSystem: 'SI',
  energy: { fuel: 'natural-gas', price: 0.9, priceUnit: 'therm', currency: 'GBP' },
  runs: [
    { id: 'ovens', label: 'Steam to the deck ovens', service: 'steam', steamGaugePressureKPa: 500, pipe: { standard: 'ASME-B36.10M', size: '1' }, lengthM: 18 },
    { id: 'proofer', label: 'Proofer hot water', service: 'hot-water', fluidTemperatureC: 65, pipe: { standard: 'ASME-B36.10M', size: '3/4' }, lengthM: 9 },
  ],
};

/** What submission stores: the parsed input split into the questionnaire and the runs' specs, the result as JSON. */
function stored(engineVersion = ENGINE_VERSION) {
  const parsed = plantInputSchema.parse(plant);
  const { runs, ...estimateWithoutRuns } = parsed;
  const snapshot: unknown = JSON.parse(JSON.stringify(estimateParsedPlant(parsed)));
  const questionnaire = { plant: { plantType: 'bakery' }, estimate: estimateWithoutRuns };
  return { resultSnapshot: snapshot, engineVersion, input: storedPlantInput(questionnaire, runs), questionnaire, runs };
}

describe('readStoredResult', () => {
  it('reads a snapshot of this engine as stored, after a round trip through JSON', () => {
    const s = stored();
    const reading = expectStatus(readStoredResult(s), 'as-stored');
    expect(reading.result).toEqual(s.resultSnapshot);
    expect(reading.computedBy).toBe(ENGINE_VERSION);
    expect(readingNote(reading)).toBeNull();
  });

  it('works a snapshot of another engine version out again from the stored inputs, and says so', () => {
    const s = stored('0.9.0');
    const reading = expectStatus(readStoredResult({ ...s, resultSnapshot: { engineVersion: '0.9.0', runs: 'an older shape' } }), 'recomputed');
    expect(reading).toMatchObject({ computedBy: ENGINE_VERSION, storedVersion: '0.9.0' });
    expect(reading.result).toEqual(estimateParsedPlant(plantInputSchema.parse(plant)));
    expect(readingNote(reading)).toContain('engine 0.9.0');
  });

  it('recomputes a snapshot of this version whose shape today’s schema refuses (the result changed without a version bump)', () => {
    const s = stored();
    const { range: _dropped, ...withoutRange } = s.resultSnapshot as Record<string, unknown>;
    expect(readStoredResult({ ...s, resultSnapshot: withoutRange }).status).toBe('recomputed');
  });

  it('shows an older snapshot as it was, named, when today’s engine refuses its inputs', () => {
    const s = stored('0.9.0');
    const refused = storedPlantInput(s.questionnaire, s.runs.map((run) => ({ ...run, service: 'molten-chocolate' })));
    const reading = readStoredResult({ ...s, input: refused });
    expect(reading).toMatchObject({ status: 'other-version', computedBy: '0.9.0' });
    expect(readingNote(reading)).toContain('earlier version of the method (engine 0.9.0)');
  });

  it('says it cannot read a snapshot that neither parses nor can be worked out again', () => {
    const reading = expectStatus(readStoredResult({ resultSnapshot: { runs: [] }, engineVersion: '0.9.0', input: storedPlantInput(null, []) }), 'unreadable');
    expect(reading.reason).toMatch(/engine 0\.9\.0 does not match today's result at \S+/);
    expect(readingNote(reading)).toMatch(/can no longer be shown/);
  });
});

describe('storedPlantInput', () => {
  it('puts the runs back into the stored estimate answers, in order, so the engine takes them again', () => {
    const s = stored();
    const input = storedPlantInput(s.questionnaire, s.runs);
    expect(plantInputSchema.parse(input)).toEqual(plantInputSchema.parse(plant));
  });

  it('gives nothing to recompute from when the questionnaire has no estimate', () => {
    expect(storedPlantInput({ plant: {} }, [])).toBeUndefined();
  });
});
