/**
 * Brings a database up to date: Drizzle's committed migrations, then pg-boss's own schema
 * and the queues Lagwise sends to (sending to a queue that does not exist drops the job).
 */
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import pg from 'pg';
import PgBoss from 'pg-boss';
import path from 'node:path';
import { queuePolicies } from '../lib/jobs/names';

export async function migrateDatabase(
  databaseUrl: string,
  { migrationsFolder = path.resolve('drizzle'), retryDelaySeconds = 5, jobExpireSeconds = 300 } = {},
): Promise<void> {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  try {
    await migrate(drizzle(pool), { migrationsFolder });
  } finally {
    await pool.end();
  }
  const boss = new PgBoss({ connectionString: databaseUrl, max: 2, supervise: false, schedule: false });
  await boss.start();
  try {
    for (const [name, policy] of Object.entries(queuePolicies(retryDelaySeconds, jobExpireSeconds))) {
      const queue = { name, ...policy };
      if (await boss.getQueue(name)) await boss.updateQueue(name, queue);
      else await boss.createQueue(name, queue);
    }
  } finally {
    await boss.stop({ graceful: true, wait: true });
  }
}
