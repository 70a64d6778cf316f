/**
 * What both fakes share as processes: configuration from the environment, the one "listening"
 * line the stack supervisor and the tests wait for, and a clean stop on SIGTERM/SIGINT.
 */
import type { Server } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export class ConfigError extends Error {}

/** Port 0 is allowed: the OS picks a free port and the listening line tells which. */
export function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new ConfigError(`${name} must be a port number between 0 and 65535; it is "${raw}".`);
  }
  return port;
}

export function dataDirFromEnv(name: string, fallbackUnderProject: string): string {
  const raw = process.env[name];
  return path.resolve(raw !== undefined && raw !== '' ? raw : path.join(projectRoot, fallbackUnderProject));
}

/** Grace for requests in flight before open keep-alive sockets are cut. */
const STOP_GRACE_MS = 3_000;

export function serve(label: string, server: Server, host: string, port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      const address = server.address();
      const actualPort = typeof address === 'object' && address ? address.port : port;
      const shownHost = host.includes(':') ? `[${host}]` : host;
      console.log(`${label} listening on http://${shownHost}:${actualPort}`);

      let stopping = false;
      const stop = (signal: NodeJS.Signals): void => {
        if (stopping) return;
        stopping = true;
        console.log(`${label} stopping (${signal})`);
        server.close(() => process.exit(0));
        server.closeIdleConnections();
        setTimeout(() => server.closeAllConnections(), STOP_GRACE_MS).unref();
      };
      process.on('SIGTERM', stop);
      process.on('SIGINT', stop);
      resolve();
    });
  });
}

export function exitOnStartError(label: string, err: unknown): never {
  if (err instanceof ConfigError) {
    console.error(`${label}: ${err.message}`);
  } else {
    console.error(`${label} could not start:`, err);
  }
  process.exit(1);
}
