/** The answer of GET /api/health, for load balancers and people. */
import * as z from 'zod/mini';

export const healthAnswerSchema = z.object({
  status: z.enum(['ok', 'degraded', 'unavailable']),
  version: z.string(),
  database: z.union([
    z.object({ ok: z.literal(true), latencyMs: z.number() }),
    z.object({ ok: z.literal(false), reason: z.string() }),
  ]),
  jobs: z.object({
    ok: z.boolean(),
    waiting: z.optional(z.number()),
    oldestWaitingSeconds: z.optional(z.number()),
    reason: z.optional(z.string()),
  }),
  /** Each part that is not working, so a person reading it knows where to look. */
  down: z.array(z.enum(['database', 'jobs'])),
});

export type HealthAnswer = z.output<typeof healthAnswerSchema>;
