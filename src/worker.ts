/**
 * The background worker: takes jobs from PostgreSQL (pg-boss) and does them with retries.
 * Run one or more beside the web servers; pg-boss hands each job to exactly one worker.
 */
import PgBoss from 'pg-boss';
import { closeDb, getDb } from './db/client';
import { describeForLog } from './db/errors';
import { pruneRateLimits } from './db/queries/rate-limits';
import { pruneThrottles } from './db/queries/sign-in-throttles';
import { jobHandlers } from './lib/jobs/handlers';
import { jobNames, STALE_CHECK_CRON } from './lib/jobs/names';
import { installProcessGuards } from './lib/process-guards';
import { RETENTION_SWEEP_CRON } from './lib/retention/policy';

// pg-boss and pg lose their connections when PostgreSQL restarts; they reconnect on their own
// as long as the process outlives the moment.
installProcessGuards('worker');

const connectionString = process.env.DATABASE_URL;
if (!connectionString) {
  console.error('[worker] DATABASE_URL is not set; start it with `npm start`, which sets it.');
  process.exit(1);
}

const pollingIntervalSeconds = Math.max(0.5, Number(process.env.LAGWISE_JOB_POLL_SECONDS ?? 2));
// Maintenance moves jobs whose worker died (expired) back to the queue; the test stack runs it often.
const maintenanceIntervalSeconds = Math.max(1, Number(process.env.LAGWISE_JOB_MAINTENANCE_SECONDS ?? 60));
// `schedule`: this worker also sends the cron jobs (pg-boss makes sure only one worker sends each).
const boss = new PgBoss({ connectionString, max: 4, migrate: false, schedule: true, maintenanceIntervalSeconds });
boss.on('error', (error) => console.error(`[worker] ${describeForLog(error)}`));
try {
  await boss.start();
} catch (error) {
  // Nothing to work without the database; the supervisor starts us again shortly.
  console.error(`[worker] could not start: ${describeForLog(error)}`);
  process.exit(75);
}

for (const [queue, handle] of Object.entries(jobHandlers)) {
  let workerId = '';
  workerId = await boss.work(queue, { pollingIntervalSeconds, batchSize: 1 }, async (jobs) => {
    for (const job of jobs) {
      try {
        await handle(job as never);
      } catch (error) {
        console.error(`[worker] ${queue} job ${job.id} failed; it will be retried: ${describeForLog(error)}`);
        throw error;
      }
    }
    // A job was waiting, so more may be: fetch again at once instead of sleeping a polling interval.
    boss.notifyWorker(workerId);
  });
}
await boss.schedule(jobNames.checkStaleLeads, STALE_CHECK_CRON, {}, { tz: 'UTC' });
await boss.schedule(jobNames.sweepRetention, RETENTION_SWEEP_CRON, {}, { tz: 'UTC' });

console.log(`[worker] working ${Object.keys(jobHandlers).join(', ')} (polling every ${pollingIntervalSeconds} s)`);

// Rate-limit windows and wrong-password runs older than a day count for nothing; clear them out hourly.
const housekeeping = setInterval(() => {
  const dayAgo = new Date(Date.now() - 24 * 3600 * 1000);
  Promise.all([pruneRateLimits(getDb(), dayAgo), pruneThrottles(getDb(), dayAgo)]).catch((error: unknown) =>
    console.error(`[worker] housekeeping failed: ${describeForLog(error)}`),
  );
}, 3600 * 1000);
housekeeping.unref();

async function stop(): Promise<void> {
  clearInterval(housekeeping);
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  await closeDb();
  process.exit(0);
}
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());
