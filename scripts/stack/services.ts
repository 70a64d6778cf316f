/**
 * The environment each process of the stack gets, and the commands that start them.
 * Hosted services (mail, object storage) are replaced by the local fakes unless real
 * ones are configured.
 */
import path from 'node:path';
import { appUrl, databaseUrl, projectRoot, type StackConfig } from './config.ts';
import type { ServiceSpec } from './supervisor.ts';

/** A real mail service is used when its key is given and no local base URL overrides it. */
export function usesRealMail(): boolean {
  return Boolean(process.env.RESEND_API_KEY) && !process.env.LAGWISE_FORCE_FAKES;
}

export function usesRealStorage(): boolean {
  return Boolean(process.env.S3_ENDPOINT) && !process.env.LAGWISE_FORCE_FAKES;
}

export function mailFakeUrl(config: StackConfig): string {
  return `http://127.0.0.1:${config.mailPort}`;
}

export function storageFakeUrl(config: StackConfig): string {
  return `http://127.0.0.1:${config.s3Port}`;
}

/** What the web server and the worker read (see README, "Configuration"). */
export function appEnvironment(config: StackConfig): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'production',
    ASTRO_TELEMETRY_DISABLED: '1',
    HOST: config.host,
    PORT: String(config.appPort),
    DATABASE_URL: databaseUrl(config),
    BETTER_AUTH_SECRET: process.env.BETTER_AUTH_SECRET ?? config.secrets.authSecret,
    BETTER_AUTH_URL: process.env.PUBLIC_BASE_URL ?? appUrl(config),
    PUBLIC_BASE_URL: process.env.PUBLIC_BASE_URL ?? appUrl(config),
    LAGWISE_PROFILE: config.profile,
  };
  if (!usesRealMail()) {
    env.RESEND_API_KEY = 're_local_fake_key';
    env.RESEND_BASE_URL = mailFakeUrl(config);
  }
  env.MAIL_FROM ??= 'Lagwise <assessments@lagwise.example>';
  if (!usesRealStorage()) {
    env.S3_ENDPOINT = storageFakeUrl(config);
    env.S3_REGION = 'us-east-1';
    env.S3_BUCKET = 'lagwise-uploads';
    env.S3_ACCESS_KEY_ID = config.secrets.s3AccessKeyId;
    env.S3_SECRET_ACCESS_KEY = config.secrets.s3SecretAccessKey;
    env.S3_FORCE_PATH_STYLE = '1';
  }
  if (config.profile === 'test') {
    // Tests wait for retried mail; the production default backs off from 5 s.
    env.LAGWISE_JOB_POLL_SECONDS = '0.5';
    env.LAGWISE_JOB_MAINTENANCE_SECONDS = '2';
    // Every test submits from 127.0.0.1; the limit itself has its own test with its own numbers.
    env.LAGWISE_SUBMISSIONS_PER_ADDRESS_PER_HOUR = '100000';
    env.LAGWISE_SUBMISSIONS_PER_EMAIL_PER_HOUR = '100000';
    env.LAGWISE_REQUEST_LIMIT_MULTIPLIER = '1000';
    // A hung mail call fails this soon (the mail-timeout test hangs the fake on purpose).
    env.LAGWISE_MAIL_TIMEOUT_MS = '2000';
  }
  return env;
}

/** Tests keep service output in files (shown when something fails); the demo echoes it. */
function logFileFor(config: StackConfig, name: string): string | undefined {
  return config.profile === 'test' ? path.join(config.stateDir, `${name}.log`) : undefined;
}

function withRestart(spec: ServiceSpec): ServiceSpec {
  return { ...spec, restart: true };
}

export function tsxCommand(script: string): [string, string[]] {
  return [process.execPath, ['--import', 'tsx', path.join(projectRoot, script)]];
}

/** A TypeScript program of ours, run with tsx from the project root. */
function tsxService(config: StackConfig, name: string, script: string, env: NodeJS.ProcessEnv): ServiceSpec {
  const [command, args] = tsxCommand(script);
  return { name, command, args, cwd: projectRoot, env, logFile: logFileFor(config, name) };
}

export function mailFakeSpec(config: StackConfig): ServiceSpec {
  return withRestart(tsxService(config, 'mail', 'fakes/mail/server.ts', {
    ...process.env,
    FAKE_MAIL_PORT: String(config.mailPort),
    FAKE_MAIL_HOST: '127.0.0.1',
    FAKE_MAIL_DATA_DIR: path.join(config.stateDir, 'mail'),
  }));
}

export function storageFakeSpec(config: StackConfig): ServiceSpec {
  return withRestart(tsxService(config, 's3', 'fakes/s3/server.ts', {
    ...process.env,
    FAKE_S3_PORT: String(config.s3Port),
    FAKE_S3_HOST: '127.0.0.1',
    FAKE_S3_DATA_DIR: path.join(config.stateDir, 's3'),
    FAKE_S3_BUCKETS: 'lagwise-uploads',
    FAKE_S3_ACCESS_KEY_ID: config.secrets.s3AccessKeyId,
    FAKE_S3_SECRET_ACCESS_KEY: config.secrets.s3SecretAccessKey,
  }));
}

/** Our server (src/server/serve.ts) around Astro's built handler. */
export function webServerSpec(config: StackConfig): ServiceSpec {
  return { ...tsxService(config, 'web', 'src/server/serve.ts', appEnvironment(config)), restart: true };
}

export function workerSpec(config: StackConfig): ServiceSpec {
  return { ...tsxService(config, 'worker', 'src/worker.ts', appEnvironment(config)), restart: true };
}
