/**
 * `npm start`, `npm test`, `npm run reset`, `npm run dev`: each brings up what it needs
 * (PostgreSQL, the fakes, the app), does its job, and takes everything down again.
 */
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { migrateDatabase } from '../../src/db/migrate.ts';
import { appUrl, databaseUrl, loadConfig, projectRoot, stateRoot, type StackConfig } from './config.ts';
import { ensureChromium } from './chromium.ts';
import { ensurePdftotext } from './poppler.ts';
import { StackError } from './errors.ts';
import { clusterDir, clusterIsOutside, outsideClusterRoot, ensureDatabase, ensurePostgresInstalled, initCluster, startPostgres, stopLeftoverCluster } from './postgres.ts';
import {
  appEnvironment,
  mailFakeSpec,
  mailFakeUrl,
  storageFakeSpec,
  storageFakeUrl,
  tsxCommand,
  usesRealMail,
  usesRealStorage,
  webServerSpec,
  workerSpec,
} from './services.ts';
import { Supervisor } from './supervisor.ts';
import { DEMO_PASSWORD, demoSignInLines } from '../seed/demo-people.ts';
import { waitForHttp, waitForPort } from './wait.ts';

const supervisor = new Supervisor();
let shuttingDown = false;

function say(line: string): void {
  console.log(`[lagwise] ${line}`);
}

async function shutDown(code: number): Promise<never> {
  if (!shuttingDown) {
    shuttingDown = true;
    say('stopping…');
    await supervisor.stopAll();
    say('stopped.');
  }
  process.exit(code);
}

for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
  process.on(signal, () => void shutDown(130));
}

/** Runs a program to completion; output goes to the terminal or, for tests, to a log file. */
function run(command: string, args: string[], options: { env?: NodeJS.ProcessEnv; logFile?: string } = {}): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(command, args, {
      cwd: projectRoot,
      env: options.env ?? process.env,
      stdio: options.logFile ? ['ignore', 'pipe', 'pipe'] : 'inherit',
    });
    if (options.logFile) {
      const chunks: Buffer[] = [];
      child.stdout?.on('data', (c: Buffer) => chunks.push(c));
      child.stderr?.on('data', (c: Buffer) => chunks.push(c));
      child.on('close', (code) => {
        writeFileSync(options.logFile!, Buffer.concat(chunks));
        resolve(code ?? 1);
      });
    } else {
      child.on('close', (code) => resolve(code ?? 1));
    }
    child.on('error', () => resolve(127));
  });
}

function bin(name: string): string {
  return path.join(projectRoot, 'node_modules', '.bin', name);
}

function printTail(file: string, lines = 40): void {
  if (!existsSync(file)) return;
  console.error(`--- last lines of ${path.relative(projectRoot, file)} ---`);
  console.error(readFileSync(file, 'utf8').split('\n').slice(-lines).join('\n'));
}

async function bringUpDatabase(config: StackConfig, { fresh }: { fresh: boolean }): Promise<void> {
  const binDir = ensurePostgresInstalled();
  initCluster(binDir, config);
  if (clusterIsOutside(config)) {
    say(`the postgres system user cannot enter ${config.stateDir}, so PostgreSQL keeps its data in ${clusterDir(config)}`);
  }
  await startPostgres(binDir, config, supervisor);
  const where = clusterIsOutside(config) ? clusterDir(config) : path.relative(projectRoot, clusterDir(config));
  say(`PostgreSQL up on 127.0.0.1:${config.pgPort} (data in ${where})`);
  await ensureDatabase(config, { fresh });
  await migrateDatabase(databaseUrl(config), {
    migrationsFolder: path.join(projectRoot, 'drizzle'),
    retryDelaySeconds: config.profile === 'test' ? 1 : 5,
    // A job whose worker was killed comes back this soon (tests kill workers on purpose).
    jobExpireSeconds: config.profile === 'test' ? 8 : 300,
  });
  say('migrations applied');
  const [command, args] = tsxCommand('scripts/seed.ts');
  const code = await run(command, args, { env: appEnvironment(config) });
  if (code !== 0) throw new StackError('Loading the demo data failed; see the messages above.');
}

async function startFakes(config: StackConfig): Promise<void> {
  if (!usesRealMail()) {
    const child = supervisor.start(mailFakeSpec(config));
    await waitForHttp(`${mailFakeUrl(config)}/_fake/health`, { hasExited: () => child.exitCode !== null });
  }
  if (!usesRealStorage()) {
    const child = supervisor.start(storageFakeSpec(config));
    await waitForPort(config.s3Port, { hasExited: () => child.exitCode !== null });
  }
}

async function build(config: StackConfig): Promise<void> {
  say('building the site (astro build)…');
  const logFile = config.profile === 'test' ? path.join(config.stateDir, 'build.log') : undefined;
  const code = await run(bin('astro'), ['build'], { env: { ...appEnvironment(config), NODE_ENV: 'production' }, logFile });
  if (code !== 0) {
    if (logFile) printTail(logFile);
    throw new StackError('The build failed; see the messages above.');
  }
}

async function startApp(config: StackConfig): Promise<void> {
  const web = supervisor.start(webServerSpec(config));
  supervisor.start(workerSpec(config));
  await waitForHttp(`${appUrl(config)}/api/health`, { hasExited: () => web.exitCode !== null });
}

async function start(): Promise<void> {
  const config = await loadConfig('demo');
  supervisor.onUnexpectedExit = (name, code) => {
    console.error(`[lagwise] ${name} stopped unexpectedly (exit ${code}); stopping everything.`);
    void shutDown(1);
  };
  await bringUpDatabase(config, { fresh: false });
  await startFakes(config);
  await build(config);
  await startApp(config);
  const url = appUrl(config);
  console.log(
    [
      '',
      '  Lagwise is running.',
      `    site           ${url}`,
      `    health         ${url}/api/health`,
      usesRealMail() ? '    e-mail         the real mail service (RESEND_API_KEY)' : `    e-mail inbox   ${mailFakeUrl(config)}  (local fake)`,
      usesRealStorage() ? '    photo storage  the real S3 service (S3_ENDPOINT)' : `    photo storage  ${storageFakeUrl(config)}  (local S3 fake)`,
      `    PostgreSQL     postgres://lagwise@127.0.0.1:${config.pgPort}/${config.databaseName}  (password in .lagwise/demo/secrets.json)`,
      '',
      `  Demo sign-ins at ${url}/sign-in (password for all: ${DEMO_PASSWORD})`,
      ...demoSignInLines().map((line) => `    ${line}`),
      `    owner       ines@tamsincreek.example (and the other demo plants): no password — ask for a link at /sign-in, open it in the inbox`,
      '',
      '  Ctrl-C stops the site, the fakes and PostgreSQL. `npm run reset` wipes the demo data.',
      '',
    ].join('\n'),
  );
  await new Promise(() => {});
}

async function dev(): Promise<void> {
  const config = await loadConfig('demo');
  await bringUpDatabase(config, { fresh: false });
  await startFakes(config);
  supervisor.start({
    name: 'astro-dev',
    command: bin('astro'),
    args: ['dev', '--host', config.host, '--port', String(config.appPort)],
    cwd: projectRoot,
    env: { ...appEnvironment(config), NODE_ENV: 'development' },
  });
  supervisor.start(workerSpec(config));
  say(`dev server starting on ${appUrl(config)} (Ctrl-C stops everything)`);
  await new Promise(() => {});
}

interface VitestReport {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTotalTests: number;
}

async function test(): Promise<void> {
  const config = await loadConfig('test');
  const started = Date.now();
  // Each run's logs start empty, so a failure shows this run's lines only.
  for (const name of ['postgres', 'web', 'worker', 'mail', 's3', 'build', 'check']) rmSync(path.join(config.stateDir, `${name}.log`), { force: true });
  const chromium = ensureChromium();
  const pdftotext = ensurePdftotext();
  await bringUpDatabase(config, { fresh: true });
  await startFakes(config);
  await build(config);
  await startApp(config);
  say(`test stack up in ${((Date.now() - started) / 1000).toFixed(1)} s: app ${appUrl(config)}`);

  say('typecheck (astro check)…');
  const checkLog = path.join(config.stateDir, 'check.log');
  const typecheckPassed = (await run(bin('astro'), ['check'], { logFile: checkLog })) === 0;
  if (!typecheckPassed) printTail(checkLog, 60);
  say(`typecheck ${typecheckPassed ? 'passed' : 'FAILED'}`);

  const reportFile = path.join(config.stateDir, 'vitest.json');
  rmSync(reportFile, { force: true });
  const env: NodeJS.ProcessEnv = {
    ...appEnvironment(config),
    NODE_ENV: 'test',
    LAGWISE_APP_URL: appUrl(config),
    LAGWISE_MAIL_FAKE_URL: mailFakeUrl(config),
    LAGWISE_CHROMIUM: chromium,
    LAGWISE_PDFTOTEXT: pdftotext,
    LAGWISE_TEST_STATE_DIR: config.stateDir,
  };
  const extra = process.argv.slice(3);
  await run(bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile=${reportFile}`, ...extra], { env });
  let report: VitestReport = { numPassedTests: 0, numFailedTests: 1, numPendingTests: 0, numTotalTests: 1 };
  if (existsSync(reportFile)) report = JSON.parse(readFileSync(reportFile, 'utf8')) as VitestReport;
  else console.error('[lagwise] vitest wrote no report; counting the run as one failure.');

  const passed = report.numPassedTests + (typecheckPassed ? 1 : 0);
  const failed = report.numFailedTests + (typecheckPassed ? 0 : 1);
  if (failed > 0) {
    for (const name of ['web', 'worker', 'mail', 's3']) printTail(path.join(config.stateDir, `${name}.log`), 25);
  }
  say(`finished in ${((Date.now() - started) / 1000).toFixed(1)} s (typecheck counted as one test)`);
  await supervisor.stopAll();
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed === 0 && report.numTotalTests > 0 ? 0 : 1);
}

function reset(): void {
  const dir = path.join(stateRoot(), 'demo');
  const secretsFile = path.join(dir, 'secrets.json');
  // Without its secrets there is no cluster outside the project to find (its folder is named by them).
  const pgPassword = existsSync(secretsFile) ? (JSON.parse(readFileSync(secretsFile, 'utf8')) as { pgPassword: string }).pgPassword : null;
  const clusters = [path.join(dir, 'pg'), ...(pgPassword ? [path.join(outsideClusterRoot(dir, pgPassword), 'pg')] : [])];
  if (clusters.some((cluster) => existsSync(path.join(cluster, 'postmaster.pid')))) {
    throw new StackError('The demo database looks like it is running; stop `npm start` (Ctrl-C) first, then reset.');
  }
  rmSync(dir, { recursive: true, force: true });
  if (clusters[1]) rmSync(path.dirname(clusters[1]), { recursive: true, force: true });
  say(`wiped ${path.relative(projectRoot, dir)}; the next \`npm start\` begins with fresh demo data.`);
}

/** Stops a demo PostgreSQL left running by an `npm start` that did not shut down (killed, say). */
async function stopDb(): Promise<void> {
  const config = await loadConfig('demo');
  const binDir = ensurePostgresInstalled();
  const dataDir = clusterDir(config);
  if (!existsSync(path.join(dataDir, 'postmaster.pid'))) {
    say('the demo database is not running; nothing to stop.');
    return;
  }
  stopLeftoverCluster(binDir, config);
  say(existsSync(path.join(dataDir, 'postmaster.pid')) ? `could not stop the demo database in ${dataDir}; see its log in ${config.stateDir}.` : 'stopped the demo database.');
}

async function main(): Promise<void> {
  const command = process.argv[2];
  switch (command) {
    case 'start':
      return start();
    case 'dev':
      return dev();
    case 'test':
      return test();
    case 'reset':
      return reset();
    case 'stop-db':
      return stopDb();
    default:
      throw new StackError(`Unknown command "${command}". Use start, dev, test, reset or stop-db.`);
  }
}

main().catch(async (error: unknown) => {
  const message = error instanceof StackError ? error.message : error instanceof Error ? (error.stack ?? error.message) : String(error);
  console.error(`[lagwise] ${message}`);
  await shutDown(1);
});
