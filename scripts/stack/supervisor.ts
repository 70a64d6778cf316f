/**
 * One place that owns every process the stack starts. A service that dies on its own is
 * started again after a pause that grows with each crash in a row (so a crash loop does not
 * spin); only Ctrl-C (or the command finishing) stops them all, newest first, waiting until
 * they are gone.
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
  /** Start it again when it exits on its own (with backoff). */
  restart?: boolean;
}

/** Pauses before restarting a crashed service: 0.5 s, then doubling up to 15 s. */
export interface Backoff {
  firstMs: number;
  maxMs: number;
  /** A run at least this long counts as healthy, and the next crash starts the backoff afresh. */
  healthyAfterMs: number;
}

export const defaultBackoff: Backoff = { firstMs: 500, maxMs: 15_000, healthyAfterMs: 30_000 };

interface Running {
  spec: ServiceSpec;
  child: ChildProcess;
  exited: Promise<number | null>;
  log?: WriteStream;
  /** Crashes in a row (reset by a healthy run). */
  crashes: number;
  startedAt: number;
  restartTimer?: NodeJS.Timeout;
  /** Stopped on purpose: no restart. */
  stopped: boolean;
}

export class Supervisor {
  private readonly running: Running[] = [];
  private stopping = false;
  /** Called when a service without `restart` dies on its own while the stack is up. */
  onUnexpectedExit: (name: string, code: number | null) => void = () => {};
  /** Called each time a crashed service is started again. */
  onRestart: (name: string, code: number | null, delayMs: number) => void = (name, code, delayMs) =>
    console.error(`[lagwise] ${name} stopped unexpectedly (exit ${code}); starting it again in ${(delayMs / 1000).toFixed(1)} s.`);

  constructor(private readonly backoff: Backoff = defaultBackoff) {}

  start(spec: ServiceSpec): ChildProcess {
    const entry: Running = { spec, crashes: 0, startedAt: 0, stopped: false } as Running;
    this.launch(entry);
    this.running.push(entry);
    return entry.child;
  }

  /** The current process of a service (it changes on every restart). */
  current(name: string): ChildProcess | undefined {
    return this.running.find((r) => r.spec.name === name)?.child;
  }

  /** Resolves when the named service has a live process (other than `previousPid`, after a restart). */
  async whenRunning(name: string, { previousPid, timeoutMs = 60_000 }: { previousPid?: number; timeoutMs?: number } = {}): Promise<ChildProcess> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const child = this.current(name);
      if (child && child.pid !== previousPid && child.exitCode === null && child.signalCode === null && child.pid) return child;
      if (Date.now() > deadline) throw new Error(`${name} did not come back within ${timeoutMs / 1000} s`);
      await new Promise((r) => setTimeout(r, 100));
    }
  }

  private launch(entry: Running): void {
    const { spec } = entry;
    const child = spawn(spec.command, spec.args, {
      cwd: spec.cwd,
      env: spec.env ?? process.env,
      stdio: ['ignore', 'pipe', 'pipe'],
      // Own process group: a terminal's Ctrl-C reaches us alone and we stop children in order.
      detached: true,
    });
    entry.log ??= spec.logFile ? createWriteStream(spec.logFile, { flags: 'a' }) : undefined;
    for (const stream of [child.stdout, child.stderr]) {
      if (!stream) continue;
      if (entry.log) stream.pipe(entry.log, { end: false });
      else {
        const prefix = `[${spec.name}]`;
        createInterface({ input: stream }).on('line', (line) => console.log(line.startsWith(prefix) ? line : `${prefix} ${line}`));
      }
    }
    entry.child = child;
    entry.startedAt = Date.now();
    entry.exited = new Promise<number | null>((resolve) => {
      child.on('exit', (code) => {
        resolve(code);
        if (!this.stopping && !entry.stopped) this.exitedOnItsOwn(entry, code);
      });
      child.on('error', (error) => {
        console.error(`[${spec.name}] could not start ${spec.command}: ${error.message}`);
        resolve(-1);
      });
    });
  }

  private exitedOnItsOwn(entry: Running, code: number | null): void {
    if (!entry.spec.restart) {
      this.onUnexpectedExit(entry.spec.name, code);
      return;
    }
    if (Date.now() - entry.startedAt >= this.backoff.healthyAfterMs) entry.crashes = 0;
    const delayMs = Math.min(this.backoff.maxMs, this.backoff.firstMs * 2 ** entry.crashes);
    entry.crashes += 1;
    this.onRestart(entry.spec.name, code, delayMs);
    entry.restartTimer = setTimeout(() => {
      entry.restartTimer = undefined;
      if (!this.stopping && !entry.stopped) this.launch(entry);
    }, delayMs);
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
    entry.stopped = true;
    if (entry.restartTimer) clearTimeout(entry.restartTimer);
    const { child, spec } = entry;
    if (child.exitCode === null && child.signalCode === null && child.pid) {
      signalGroup(child.pid, spec.stopSignal ?? 'SIGTERM');
      const timer = setTimeout(() => child.pid && signalGroup(child.pid, 'SIGKILL'), timeoutMs);
      await entry.exited;
      clearTimeout(timer);
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
