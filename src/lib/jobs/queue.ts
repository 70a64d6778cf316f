/**
 * Background work lives in PostgreSQL (pg-boss), so a job is committed with the data that
 * caused it and survives restarts and outages of the services it calls.
 */
import PgBoss from 'pg-boss';
import type { SqlRunner } from '../../db/transaction';
import type { JobName, JobPayloads } from './names';

export { jobNames, type JobName, type JobPayloads } from './names';

let boss: PgBoss | undefined;
let starting: Promise<PgBoss> | undefined;

function connectionString(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set; start the app with `npm start`, which sets it.');
  return url;
}

/**
 * A pg-boss handle for sending. Its schema and queues are made by the migrate step;
 * a web server neither migrates nor supervises.
 */
export function getSender(): Promise<PgBoss> {
  starting ??= (async () => {
    boss = new PgBoss({ connectionString: connectionString(), max: 2, migrate: false, supervise: false, schedule: false });
    boss.on('error', (error) => console.error('[jobs]', error.message));
    await boss.start();
    return boss;
  })().catch((error) => {
    starting = undefined;
    throw error;
  });
  return starting;
}

/** Queues a job; pass the transaction's runner so it commits with the rows that caused it. */
export async function enqueue<N extends JobName>(
  name: N,
  data: JobPayloads[N],
  options: { sqlRunner?: SqlRunner } = {},
): Promise<string> {
  const sender = await getSender();
  const id = await sender.send(name, data as object, { db: options.sqlRunner });
  if (!id) throw new Error(`The job queue "${name}" refused the job; has the migrate step created it?`);
  return id;
}

export async function stopSender(): Promise<void> {
  if (boss) await boss.stop({ graceful: true, wait: true });
  boss = undefined;
  starting = undefined;
}
