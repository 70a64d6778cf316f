/**
 * A web server or worker left behind by its supervisor ends instead of spinning: real child
 * processes with the guards installed, their output pipe closed or their parent gone.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXIT_ORPHANED, EXIT_OUTPUT_GONE } from './process-guards';

const guards = path.resolve(import.meta.dirname, 'process-guards.ts');
/** A process that installs the guards and then logs a line every 20 ms, as a busy server would. */
const loggingService = `import(${JSON.stringify(guards)}).then((m) => { m.installProcessGuards('test'); setInterval(() => console.error('still here'), 20); });`;

function exitOf(child: ChildProcess): Promise<number | null> {
  return new Promise((resolve) => child.on('exit', (code) => resolve(code)));
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

describe('a service whose supervisor is gone', () => {
  it('ends when its log pipe is closed, rather than logging the failure to write forever', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', loggingService], { stdio: ['ignore', 'pipe', 'pipe'] });
    const exited = exitOf(child);
    await new Promise<void>((resolve) => child.stderr?.once('data', () => resolve()));
    child.stdout?.destroy();
    child.stderr?.destroy();
    expect(await exited).toBe(EXIT_OUTPUT_GONE);
  }, 60_000);

  it('ends when the process that started it has gone', async () => {
    // A stand-in supervisor starts the service in its own group (as the stack's does) and dies.
    const supervisor = `const { spawn } = await import('node:child_process');
      const child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', ${JSON.stringify(`import(${JSON.stringify(guards)}).then((m) => { m.installProcessGuards('test'); setInterval(() => {}, 1000); });`)}], { stdio: 'ignore', detached: true });
      console.log(child.pid);
      setTimeout(() => process.exit(0), 1500);`;
    const parent = spawn(process.execPath, ['--input-type=module', '-e', supervisor], { stdio: ['ignore', 'pipe', 'inherit'] });
    let output = '';
    parent.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    await exitOf(parent);
    const pid = Number(output.trim());
    expect(pid).toBeGreaterThan(0);
    // The check runs every 2 s; allow a loaded machine far longer before calling it stuck.
    const deadline = Date.now() + 45_000;
    while (alive(pid) && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 200));
    const stillAlive = alive(pid);
    if (stillAlive) process.kill(pid, 'SIGKILL');
    expect(stillAlive).toBe(false);
  }, 60_000);
});
