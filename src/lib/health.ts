/**
 * What /api/health reports: the database (one bounded round trip) and the job queue (the oldest
 * job still waiting — a worker that is down or stuck shows as a growing wait). `down` names
 * each part that is not working, so a person reading it knows where to look.
 */
import { sql } from 'drizzle-orm';
import { getDb } from '../db/client';
import { checkDatabase } from '../db/health';
import type { HealthAnswer } from '../schemas/health';
import { describeForLog } from '../db/errors';
import { APP_VERSION } from './site';

/** A mail or alert job waiting longer than this means the worker is down or stuck. */
export const JOB_WAIT_WARNING_SECONDS = 300;

/** The health answer's shape is declared once, in src/schemas/health.ts. */
export type Health = HealthAnswer;
export type JobsHealth = HealthAnswer['jobs'];

async function checkJobs(): Promise<JobsHealth> {
  try {
    const result = await getDb().execute(
      sql`select count(*)::int as waiting, coalesce(extract(epoch from now() - min(start_after)), 0)::int as oldest
          from pgboss.job where state in ('created', 'retry') and start_after <= now()`,
    );
    const row = result.rows[0] as { waiting: number; oldest: number } | undefined;
    const waiting = row?.waiting ?? 0;
    const oldest = row?.oldest ?? 0;
    return waiting > 0 && oldest > JOB_WAIT_WARNING_SECONDS
      ? { ok: false, waiting, oldestWaitingSeconds: oldest, reason: `A job has waited ${oldest} s; is the worker running?` }
      : { ok: true, waiting, oldestWaitingSeconds: oldest };
  } catch (error) {
    return { ok: false, reason: `The job queue could not be read: ${describeForLog(error).split('\n')[0]}` };
  }
}

export async function checkHealth(): Promise<Health> {
  const database = await checkDatabase();
  const jobs: JobsHealth = database.ok ? await checkJobs() : { ok: false, reason: 'Unknown while the database is down.' };
  const down: Health['down'] = [];
  if (!database.ok) down.push('database');
  if (!jobs.ok) down.push('jobs');
  return { status: !database.ok ? 'unavailable' : jobs.ok ? 'ok' : 'degraded', version: APP_VERSION, database, jobs, down };
}
