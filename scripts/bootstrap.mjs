#!/usr/bin/env node
// The one entry point behind `npm start`, `npm test` and `npm run reset`.
// Plain Node on purpose: it must run before any dependency (tsx included) is installed.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const [major, minor] = process.versions.node.split('.').map(Number);
if (major < 20 || (major === 20 && minor < 19)) {
  console.error(`Lagwise needs Node.js 20.19 or newer; this is ${process.version}. Install a newer Node.js and try again.`);
  process.exit(1);
}

/** node_modules is stale when it is missing or older than the lock file npm ci installs from. */
function dependenciesAreCurrent() {
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  if (!existsSync(marker)) return false;
  return statSync(marker).mtimeMs >= statSync(path.join(root, 'package-lock.json')).mtimeMs;
}

if (!dependenciesAreCurrent()) {
  console.log('[lagwise] installing dependencies (npm ci)…');
  const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
  const result = spawnSync(npm, ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[lagwise] npm ci failed; see the messages above (is the npm registry reachable?).');
    process.exit(result.status ?? 1);
  }
}

const command = process.argv[2] ?? 'start';
const child = spawn(
  process.execPath,
  ['--import', 'tsx', path.join(root, 'scripts', 'stack', 'cli.ts'), command, ...process.argv.slice(3)],
  { cwd: root, stdio: 'inherit', env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' } },
);
// Ctrl-C reaches the whole process group; the stack shuts itself down, so wait for it
// rather than dying first and leaving the terminal to a half-stopped stack.
process.on('SIGINT', () => {});
process.on('SIGTERM', () => child.kill('SIGTERM'));
process.on('SIGHUP', () => child.kill('SIGHUP'));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 130 : 1)));
