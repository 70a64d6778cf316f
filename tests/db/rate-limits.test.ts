import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { hitRateLimit } from '../../src/db/queries/rate-limits';
import { submitAssessment } from '../../src/lib/assessments/submit';
import { DomainError } from '../../src/lib/errors';
import { stopSender } from '../../src/lib/jobs/queue';
import { createAssessmentSchema } from '../../src/schemas/assessment';
import { validSubmission } from '../support/fixtures';

describe('rate limits', () => {
  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('counts hits per key and window, across concurrent callers', async () => {
    const key = `test:${randomUUID()}`;
    const now = new Date('2026-12-01T10:15:00Z');
    const verdicts = await Promise.all(Array.from({ length: 5 }, () => hitRateLimit(getDb(), key, { limit: 3, windowSeconds: 3600, now })));
    expect(verdicts.map((v) => v.allowed).filter(Boolean)).toHaveLength(3);
    expect(verdicts.map((v) => v.hits).sort()).toEqual([1, 2, 3, 4, 5]);
    const nextHour = await hitRateLimit(getDb(), key, { limit: 3, windowSeconds: 3600, now: new Date('2026-12-01T11:00:00Z') });
    expect(nextHour).toMatchObject({ allowed: true, hits: 1 });
  });

  it('refuses the submission past the per-address limit with a sentence saying when to retry', async () => {
    const limits = { perAddressPerHour: 2, perEmailPerHour: 100 };
    const clientAddress = `198.51.100.${Math.floor(Math.random() * 250)}-${randomUUID()}`;
    const submit = () => submitAssessment(createAssessmentSchema.parse(validSubmission()), [], { clientAddress, limits });
    await submit();
    await submit();
    const refusal = await submit().catch((error: unknown) => error);
    expect(refusal).toBeInstanceOf(DomainError);
    expect((refusal as DomainError).code).toBe('RATE_LIMITED');
    expect((refusal as DomainError).message).toMatch(/try again in \d+ minutes?/);
  });
});
