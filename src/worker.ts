/**
 * The background worker: takes jobs from PostgreSQL (pg-boss) and does them with retries.
 * Run one or more beside the web servers; pg-boss hands each job to exactly one worker.
 */
import PgBoss from 'pg-boss';
import { closeDb, getDb } from './db/client';
import { describeForLog } from './db/errors';
import { pruneRateLimits } from './db/queries/rate-limits';
import { jobHandlers } from './lib/jobs/handlers';
import { jobNames, STALE_CHECK_CRON } from './lib/jobs/names';

const connectionString = process.env.DATABASE_URL;
if (!connectionString) {
  console.error('[worker] DATABASE_URL is not set; start it with `npm start`, which sets it.');
  process.exit(1);
}

const pollingIntervalSeconds = Math.max(0.5, Number(process.env.LAGWISE_JOB_POLL_SECONDS ?? 2));
// `schedule`: this worker also sends the cron jobs (pg-boss makes sure only one worker sends each).
const boss = new PgBoss({ connectionString, max: 4, migrate: false, schedule: true });
boss.on('error', (error) => console.error('[worker]', error.message));
await boss.start();

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

console.log(`[worker] working ${Object.keys(jobHandlers).join(', ')} (polling every ${pollingIntervalSeconds} s)`);

// Rate-limit windows older than a day count for nothing; clear them out hourly.
const housekeeping = setInterval(() => {
  pruneRateLimits(getDb(), new Date(Date.now() - 24 * 3600 * 1000)).catch((error: unknown) =>
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
