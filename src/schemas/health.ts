/** The answer of GET /api/health, for load balancers and people. */
import * as z from 'zod/mini';

export const healthAnswerSchema = z.object({
  status: z.enum(['ok', 'unavailable']),
  version: z.string(),
  database: z.union([
    z.object({ ok: z.literal(true), latencyMs: z.number() }),
    z.object({ ok: z.literal(false), reason: z.string() }),
  ]),
});

export type HealthAnswer = z.output<typeof healthAnswerSchema>;
