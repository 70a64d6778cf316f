/**
 * A stack of its own for the fault suite — PostgreSQL, the mail fake, the web server and the
 * worker, under a Supervisor as `npm start` runs them — so it can restart PostgreSQL and kill
 * processes without disturbing the shared test stack. It reuses the build `npm test` made.
 */
import { rmSync } from 'node:fs';
import path from 'node:path';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { appUrl, databaseUrl, loadConfig, projectRoot, type StackConfig } from '../../scripts/stack/config';
import { ensureDatabase, ensurePostgresInstalled, initCluster, startPostgres } from '../../scripts/stack/postgres';
import { appEnvironment, mailFakeSpec, mailFakeUrl, tsxCommand } from '../../scripts/stack/services';
import { Supervisor, type ServiceSpec } from '../../scripts/stack/supervisor';
import { waitForHttp } from '../../scripts/stack/wait';
import { migrateDatabase } from '../../src/db/migrate';
import * as schema from '../../src/db/schema';
import { ensureTestRegion } from '../support/fixtures';

export interface PrivateStack {
  config: StackConfig;
  supervisor: Supervisor;
  appUrl: string;
  mailUrl: string;
  databaseUrl: string;
  /** Our own pool on the private database, for assertions. */
  pool: pg.Pool;
  binDir: string;
  startPostgres(): Promise<void>;
  stop(): Promise<void>;
}

function envFor(config: StackConfig): NodeJS.ProcessEnv {
  const env = appEnvironment(config);
  env.PUBLIC_BASE_URL = appUrl(config);
  env.BETTER_AUTH_URL = appUrl(config);
  env.DATABASE_URL = databaseUrl(config);
  // The shared stack's variables point at its own fakes; ours are private.
  env.RESEND_API_KEY = 're_local_fake_key';
  env.RESEND_BASE_URL = mailFakeUrl(config);
  return env;
}

function service(config: StackConfig, name: string, script: string): ServiceSpec {
  const [command, args] = tsxCommand(script);
  return { name, command, args, cwd: projectRoot, env: envFor(config), logFile: path.join(config.stateDir, `${name}.log`), restart: true };
}

export async function startPrivateStack(name: string): Promise<PrivateStack> {
  const previous = { state: process.env.LAGWISE_STATE_DIR, ports: [process.env.LAGWISE_TEST_PORT, process.env.LAGWISE_TEST_PG_PORT] };
  process.env.LAGWISE_STATE_DIR = path.join(projectRoot, '.lagwise', name);
  delete process.env.LAGWISE_TEST_PORT;
  delete process.env.LAGWISE_TEST_PG_PORT;
  delete process.env.LAGWISE_TEST_MAIL_PORT;
  delete process.env.LAGWISE_TEST_S3_PORT;
  const config = await loadConfig('test');
  if (previous.state === undefined) delete process.env.LAGWISE_STATE_DIR;
  else process.env.LAGWISE_STATE_DIR = previous.state;
  for (const log of ['postgres', 'web', 'worker', 'mail']) rmSync(path.join(config.stateDir, `${log}.log`), { force: true });
  // The database starts empty each run; so must the mail fake's store, or counts mix runs.
  rmSync(path.join(config.stateDir, 'mail'), { recursive: true, force: true });

  const supervisor = new Supervisor({ firstMs: 300, maxMs: 3_000, healthyAfterMs: 10_000 });
  const binDir = ensurePostgresInstalled();
  initCluster(binDir, config);
  await startPostgres(binDir, config, supervisor);
  await ensureDatabase(config, { fresh: true });
  await migrateDatabase(databaseUrl(config), { migrationsFolder: path.join(projectRoot, 'drizzle'), retryDelaySeconds: 1, jobExpireSeconds: 8 });
  const pool = new pg.Pool({ connectionString: databaseUrl(config), max: 3 });
  pool.on('error', () => {});
  await ensureTestRegion(drizzle(pool, { schema }));

  const mail = supervisor.start(mailFakeSpec(config));
  await waitForHttp(`${mailFakeUrl(config)}/_fake/health`, { hasExited: () => mail.exitCode !== null });
  const web = supervisor.start(service(config, 'web', 'src/server/serve.ts'));
  supervisor.start(service(config, 'worker', 'src/worker.ts'));
  await waitForHttp(`${appUrl(config)}/api/health`, { hasExited: () => web.exitCode !== null, timeoutMs: 60_000 });

  return {
    config,
    supervisor,
    appUrl: appUrl(config),
    mailUrl: mailFakeUrl(config),
    databaseUrl: databaseUrl(config),
    pool,
    binDir,
    startPostgres: () => startPostgres(binDir, config, supervisor),
    async stop() {
      await pool.end().catch(() => {});
      await supervisor.stopAll();
    },
  };
}
