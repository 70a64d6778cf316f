/**
 * A private PostgreSQL cluster for one profile: found (or installed from Debian's packages),
 * initialised in the profile's git-ignored folder, listening on 127.0.0.1 only.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import type { StackConfig } from './config.ts';
import type { Supervisor } from './supervisor.ts';
import { aptInstall, canInstallPackages } from './debian.ts';
import { StackError } from './errors.ts';

const isRoot = process.getuid?.() === 0;

export function findBinDir(): string | undefined {
  const base = '/usr/lib/postgresql';
  if (existsSync(base)) {
    const versions = readdirSync(base)
      .filter((v) => existsSync(path.join(base, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    if (versions[0]) return path.join(base, versions[0], 'bin');
  }
  const onPath = spawnSync('sh', ['-c', 'command -v initdb'], { encoding: 'utf8' });
  return onPath.status === 0 ? path.dirname(onPath.stdout.trim()) : undefined;
}

/** The folder holding initdb, postgres and pg_ctl, installing the Debian package if allowed. */
export function ensurePostgresInstalled(): string {
  const found = findBinDir();
  if (found) return found;
  if (canInstallPackages()) {
    console.log('[lagwise] PostgreSQL server not found; installing the Debian package "postgresql"…');
    if (aptInstall('postgresql')) {
      const installed = findBinDir();
      if (installed) return installed;
    }
  }
  throw new StackError(
    'The PostgreSQL server is not installed. Install it (on Debian or Ubuntu: `sudo apt-get install postgresql`) and run the command again.',
  );
}

/** Runs a PostgreSQL program as the cluster's owner: `postgres` when we are root (initdb refuses root). */
function asOwner(bin: string, args: string[]): [string, string[]] {
  return isRoot ? ['runuser', ['-u', 'postgres', '--', bin, ...args]] : [bin, args];
}

function chownToPostgres(target: string): void {
  if (!isRoot) return;
  const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
  const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
  chownSync(target, uid, gid);
}

/** Whether the `postgres` system user can enter `folder` (every parent on the way must let it through). */
function postgresCanEnter(folder: string): boolean {
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', folder]).status === 0;
}

const reachable = new Map<string, boolean>();

/**
 * Where PostgreSQL keeps its data: in the profile's folder, or — when we are root in a folder
 * the `postgres` user cannot enter (a clone in /root, mode 700) — under /var/tmp, in a folder
 * named after this checkout and its secrets: two clones never share a cluster, and a new clone
 * in the place of a deleted one (new secrets, same path) never meets the old cluster, whose
 * password it could not know.
 */
export function clusterDir(config: StackConfig): string {
  const inState = path.join(config.stateDir, 'pg');
  if (!isRoot) return inState;
  let ok = reachable.get(config.stateDir);
  if (ok === undefined) {
    ok = postgresCanEnter(config.stateDir);
    reachable.set(config.stateDir, ok);
  }
  return ok ? inState : path.join(outsideClusterRoot(config.stateDir, config.secrets.pgPassword), 'pg');
}

/** The /var/tmp folder standing in for a state folder the postgres user cannot reach. */
export function outsideClusterRoot(stateDir: string, pgPassword: string): string {
  const tag = createHash('sha256').update(`${path.resolve(stateDir)}\0${pgPassword}`).digest('hex').slice(0, 12);
  return path.join('/var/tmp', `lagwise-${tag}`, path.basename(stateDir));
}

/** True when the cluster lives outside the project (see clusterDir). */
export function clusterIsOutside(config: StackConfig): boolean {
  return clusterDir(config) !== path.join(config.stateDir, 'pg');
}

export function initCluster(binDir: string, config: StackConfig): void {
  const dataDir = clusterDir(config);
  if (existsSync(path.join(dataDir, 'PG_VERSION'))) return;
  rmSync(dataDir, { recursive: true, force: true });
  // Parents readable by all (so the postgres user can pass), the cluster itself closed.
  mkdirSync(path.dirname(dataDir), { recursive: true, mode: 0o755 });
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  chownToPostgres(dataDir);
  if (isRoot && spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-w', dataDir]).status !== 0) {
    throw new StackError(
      `The "postgres" system user cannot reach ${dataDir}: a parent folder is closed to other users. ` +
        'Set LAGWISE_STATE_DIR to a folder it can reach (for example /var/tmp/lagwise) or clone the project outside /root.',
    );
  }
  // Beside the cluster, where initdb (running as postgres) can read it; removed straight after.
  const pwFile = path.join(path.dirname(dataDir), 'pg-password');
  writeFileSync(pwFile, config.secrets.pgPassword, { mode: 0o600 });
  chownToPostgres(pwFile);
  const [cmd, args] = asOwner(path.join(binDir, 'initdb'), [
    '-D', dataDir, '-U', 'lagwise', `--pwfile=${pwFile}`, '--auth=scram-sha-256',
    '-E', 'UTF8', '--locale=C.UTF-8', '--no-sync',
  ]);
  const result = spawnSync(cmd, args, { encoding: 'utf8' });
  rmSync(pwFile, { force: true });
  if (result.status !== 0) {
    throw new StackError(`initdb failed for ${dataDir}:\n${result.stderr || result.stdout}`);
  }
  const settings = [
    '',
    '# Lagwise: private cluster, loopback only; the port is given at start.',
    "listen_addresses = '127.0.0.1'",
    `unix_socket_directories = '${dataDir}'`,
    'max_connections = 100',
    ...(config.profile !== 'demo' ? ['fsync = off', 'synchronous_commit = off', 'full_page_writes = off'] : []),
  ];
  const conf = path.join(dataDir, 'postgresql.conf');
  writeFileSync(conf, readFileSync(conf, 'utf8') + settings.join('\n') + '\n');
}

/** A cluster left running by a stack that was killed rather than stopped. */
function runningPostmasterPid(dataDir: string): number | undefined {
  const pidFile = path.join(dataDir, 'postmaster.pid');
  if (!existsSync(pidFile)) return undefined;
  const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return undefined;
  }
}

export async function startPostgres(binDir: string, config: StackConfig, supervisor: Supervisor): Promise<void> {
  const dataDir = clusterDir(config);
  const leftover = runningPostmasterPid(dataDir);
  if (leftover !== undefined) {
    if (config.profile === 'demo') {
      throw new StackError(
        `PostgreSQL for this project is already running (pid ${leftover}, data in ${dataDir}). ` +
          'Is another `npm start` open? Stop it with Ctrl-C first, or stop the leftover with `npm run stop-db`.',
      );
    }
    stopLeftoverCluster(binDir, config);
  }
  const [cmd, args] = asOwner(path.join(binDir, 'postgres'), ['-D', dataDir, '-p', String(config.pgPort)]);
  const logFile = path.join(config.stateDir, 'postgres.log');
  const child = supervisor.start({ name: 'postgres', command: cmd, args, logFile, stopSignal: 'SIGINT', restart: true });
  await waitForPostgres(config, () => child.exitCode !== null, logFile);
}

export function stopLeftoverCluster(binDir: string, config: StackConfig): void {
  const dataDir = clusterDir(config);
  if (runningPostmasterPid(dataDir) === undefined) return;
  const [cmd, args] = asOwner(path.join(binDir, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  spawnSync(cmd, args, { stdio: 'ignore' });
}

async function waitForPostgres(config: StackConfig, hasExited: () => boolean, logFile: string): Promise<void> {
  const deadline = Date.now() + 30_000;
  for (;;) {
    const client = new pg.Client(adminConnection(config));
    try {
      await client.connect();
      await client.end();
      return;
    } catch (error) {
      await client.end().catch(() => {});
      if (hasExited() || Date.now() > deadline) {
        const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-12).join('\n') : '';
        throw new StackError(
          `PostgreSQL did not come up on 127.0.0.1:${config.pgPort} (${(error as Error).message}). ` +
            `Is the port taken? Set ${config.profile === 'test' ? 'LAGWISE_TEST_PG_PORT' : 'LAGWISE_PG_PORT'} to another. Log:\n${tail}`,
        );
      }
      await new Promise((r) => setTimeout(r, 150));
    }
  }
}

function adminConnection(config: StackConfig): pg.ClientConfig {
  return {
    host: '127.0.0.1',
    port: config.pgPort,
    user: 'lagwise',
    password: config.secrets.pgPassword,
    database: 'postgres',
  };
}

/** Creates the profile's database; `fresh` drops it first (the test profile starts empty each run). */
export async function ensureDatabase(config: StackConfig, { fresh }: { fresh: boolean }): Promise<void> {
  const client = new pg.Client(adminConnection(config));
  await client.connect();
  try {
    const name = pg.escapeIdentifier(config.databaseName);
    if (fresh) await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [config.databaseName]);
    if (!rowCount) await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
}
