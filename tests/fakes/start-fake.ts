/**
 * Starts a fake the way the stack does, as its own process, and hands back its URL. Port 0 lets
 * the OS pick a free port; the fake's "listening on" line says which one it got.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export interface RunningFake {
  url: string;
  /** Everything the process printed so far, for failure messages. */
  output(): string;
  /** SIGTERM, then the exit code once the process is gone. */
  stop(): Promise<number | null>;
}

export function startFake(entry: string, env: Record<string, string>): Promise<RunningFake> {
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', path.join(projectRoot, entry)], {
    cwd: projectRoot,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));

  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer): void => {
      output += chunk.toString('utf8');
      const match = /listening on (http:\/\/\S+)/.exec(output);
      if (match?.[1]) {
        child.stdout?.off('data', onData);
        child.stdout?.on('data', (more: Buffer) => (output += more.toString('utf8')));
        resolve({
          url: match[1],
          output: () => output,
          stop: async () => {
            if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
            return exited;
          },
        });
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString('utf8')));
    void exited.then((code) => reject(new Error(`${entry} exited with ${code} before listening:\n${output}`)));
  });
}
