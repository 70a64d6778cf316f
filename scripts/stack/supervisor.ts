/**
 * One place that owns every process the stack starts, so Ctrl-C (or a failure) stops
 * them all, newest first, and waits until they are gone.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createWriteStream, type WriteStream } from 'node:fs';
import { createInterface } from 'node:readline';

export interface ServiceSpec {
  name: string;
  command: string;
  args: string[];
  env?: NodeJS.ProcessEnv;
  cwd?: string;
  /** Where the output goes; when absent it is echoed with a `[name]` prefix. */
  logFile?: string;
  /** The signal that asks this program for a clean, quick shutdown. */
  stopSignal?: NodeJS.Signals;
}

interface Running {
  spec: ServiceSpec;
  child: ChildProcess;
  exited: Promise<number | null>;
  log?: WriteStream;
}

export class Supervisor {
  private readonly running: Running[] = [];
  private stopping = false;
  /** Called when a service dies on its own while the stack is up. */
  onUnexpectedExit: (name: string, code: number | null) => void = () => {};

  start(spec: ServiceSpec): ChildProcess {
    const child = spawn(spec.command, spec.args, {
      cwd: spec.cwd,
      env: spec.env ?? process.env,
      stdio: ['ignore', 'pipe', 'pipe'],
      // Own process group: a terminal's Ctrl-C reaches us alone and we stop children in order.
      detached: true,
    });
    const log = spec.logFile ? createWriteStream(spec.logFile, { flags: 'a' }) : undefined;
    for (const stream of [child.stdout, child.stderr]) {
      if (!stream) continue;
      if (log) stream.pipe(log, { end: false });
      else {
        const prefix = `[${spec.name}]`;
        createInterface({ input: stream }).on('line', (line) => console.log(line.startsWith(prefix) ? line : `${prefix} ${line}`));
      }
    }
    const exited = new Promise<number | null>((resolve) => {
      child.on('exit', (code) => {
        if (!this.stopping) this.onUnexpectedExit(spec.name, code);
        resolve(code);
      });
      child.on('error', (error) => {
        console.error(`[${spec.name}] could not start ${spec.command}: ${error.message}`);
        resolve(-1);
      });
    });
    this.running.push({ spec, child, exited, log });
    return child;
  }

  async stop(name: string, timeoutMs = 15_000): Promise<void> {
    const index = this.running.findIndex((r) => r.spec.name === name);
    if (index < 0) return;
    const [entry] = this.running.splice(index, 1);
    if (entry) await this.terminate(entry, timeoutMs);
  }

  async stopAll(timeoutMs = 15_000): Promise<void> {
    this.stopping = true;
    while (this.running.length > 0) {
      const entry = this.running.pop();
      if (entry) await this.terminate(entry, timeoutMs);
    }
  }

  private async terminate(entry: Running, timeoutMs: number): Promise<void> {
    const { child, spec } = entry;
    if (child.exitCode === null && child.signalCode === null && child.pid) {
      const wasStopping = this.stopping;
      this.stopping = true;
      signalGroup(child.pid, spec.stopSignal ?? 'SIGTERM');
      const timer = setTimeout(() => child.pid && signalGroup(child.pid, 'SIGKILL'), timeoutMs);
      await entry.exited;
      clearTimeout(timer);
      this.stopping = wasStopping;
    }
    entry.log?.end();
  }
}

function signalGroup(pid: number, signal: NodeJS.Signals): void {
  try {
    process.kill(-pid, signal);
  } catch {
    try {
      process.kill(pid, signal);
    } catch {
      // already gone
    }
  }
}
