/**
 * Background work lives in PostgreSQL (pg-boss), so a job is committed with the data that
 * caused it and survives restarts and outages of the services it calls.
 */
import { createHash } from 'node:crypto';
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

/**
 * A job id made from what the job is about (e.g. "the alert to consultant C for job J"), so a
 * job that runs twice — its worker killed after queuing but before finishing — queues the same
 * follow-up once: pg-boss keeps the first job with an id and ignores the second.
 */
export function derivedJobId(...parts: string[]): string {
  const hex = createHash('sha256').update(parts.join('\u0000')).digest('hex');
  // Shaped as a version-5-style UUID (pg-boss ids are uuid).
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${((parseInt(hex.slice(16, 18), 16) & 0x3f) | 0x80).toString(16)}${hex.slice(18, 20)}-${hex.slice(20, 32)}`;
}

/**
 * Queues a job; pass the transaction's runner so it commits with the rows that caused it. With
 * an `id` (see derivedJobId), a job already queued under it counts as done.
 */
export async function enqueue<N extends JobName>(
  name: N,
  data: JobPayloads[N],
  options: { sqlRunner?: SqlRunner; id?: string } = {},
): Promise<string> {
  const sender = await getSender();
  const id = await sender.send(name, data as object, { db: options.sqlRunner, ...(options.id ? { id: options.id } : {}) });
  if (id) return id;
  if (options.id && (await sender.getJobById(name, options.id))) return options.id;
  throw new Error(`The job queue "${name}" refused the job; has the migrate step created it?`);
}

/** True when a job with this id exists in the queue (in any state). */
export async function jobExists(name: JobName, id: string): Promise<boolean> {
  const sender = await getSender();
  return Boolean(await sender.getJobById(name, id));
}

export async function stopSender(): Promise<void> {
  if (boss) await boss.stop({ graceful: true, wait: true });
  boss = undefined;
  starting = undefined;
}
