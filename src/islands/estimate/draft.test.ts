/**
 * Drafts kept in a browser by an older form still load: their valve and flange counts move
 * into the run's list of fittings, a draft without areas gets an empty list, and the result
 * is a draft the estimate accepts.
 */
import { describe, expect, it } from 'vitest';
import { plantInputSchema } from '../../engine';
import { freshValues, migrateDraft, newArea, type DraftValues } from './draft';
import { toPlantInput } from './posting';

/** A draft as the form kept it before areas and fittings by kind: counts on the run, one "lagged too" tick. */
function olderDraft(): Partial<DraftValues> {
  const values = freshValues('US');
  const run = values.estimate.runs[0] as Record<string, unknown>;
  delete run.fittings;
  Object.assign(run, {
    lengthM: 36.6,
    valves: 3,
    flangePairs: 2,
    fittingsInsulated: true,
    current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.0254, jacket: 'pvc-jacket' },
  });
  const estimate = values.estimate as Record<string, unknown>;
  delete estimate.areas;
  estimate.conditions = { ...(estimate.conditions as object), confidence: 'guessed' };
  values.estimate.energy.price = 1.35;
  return JSON.parse(JSON.stringify(values)) as Partial<DraftValues>;
}

describe('drafts kept by an older form', () => {
  it('move their valve and flange-pair counts into the run’s fittings, covered as the old tick said', () => {
    const migrated = migrateDraft(olderDraft());
    const run = migrated.estimate?.runs[0] as Record<string, unknown>;
    expect(run.fittings).toEqual([
      { type: 'valve-flanged', count: 3, covered: true },
      { type: 'flange-pair', count: 2, covered: true },
    ]);
    expect(run).not.toHaveProperty('valves');
    expect(run).not.toHaveProperty('flangePairs');
    expect(run).not.toHaveProperty('fittingsInsulated');
    expect(migrated.estimate?.areas).toEqual([]);
    // The older form set the air's confidence itself; now an untouched figure is sent as a guess and a typed one as near enough.
    expect(migrated.estimate?.conditions).not.toHaveProperty('confidence');
  });

  it('keep a bare run’s fittings uncovered whatever the old tick said', () => {
    const draft = olderDraft();
    const run = draft.estimate?.runs[0] as Record<string, unknown>;
    run.current = { state: 'bare' };
    const migrated = migrateDraft(draft);
    expect((migrated.estimate?.runs[0] as Record<string, unknown>).fittings).toEqual([
      { type: 'valve-flanged', count: 3, covered: false },
      { type: 'flange-pair', count: 2, covered: false },
    ]);
  });

  it('give the estimate the same heat figures after migration as the older fields did', async () => {
    const { estimatePlant } = await import('../../engine');
    const draft = olderDraft();
    const before = estimatePlant(toPlantInput(draft.estimate as DraftValues['estimate'], 'US'));
    const after = estimatePlant(toPlantInput(migrateDraft(draft).estimate as DraftValues['estimate'], 'US'));
    expect(after.runs[0]?.fittings.equivalentLengthM).toBe(before.runs[0]?.fittings.equivalentLengthM);
    expect(after.totals.current.annualCost).toBe(before.totals.current.annualCost);
  });

  it('leave a current draft as it is', () => {
    const values = freshValues('SI');
    values.estimate.areas = [newArea('washdown-room', [])];
    expect(migrateDraft(values)).toEqual(values);
  });
});

describe('a new area', () => {
  it('takes its kind’s name and an id of its own', () => {
    const first = newArea('washdown-room', []);
    const second = newArea('washdown-room', [first]);
    expect(first).toMatchObject({ id: 'washdown-room', label: 'Washdown room', preset: 'washdown-room' });
    expect(second).toMatchObject({ id: 'washdown-room-2', label: 'Washdown room 2' });
  });

  it('sends its runs to the plant’s own air once it is taken off the list', () => {
    const values = freshValues('SI');
    values.estimate.energy.price = 0.05;
    const run = values.estimate.runs[0]!;
    run.lengthM = 10;
    run.areaId = 'cold-store';
    const posted = toPlantInput(values.estimate, 'DE');
    expect(posted.runs[0]).not.toHaveProperty('areaId');
    expect(plantInputSchema.safeParse(posted).success).toBe(true);
  });
});
