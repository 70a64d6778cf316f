import { describe, expect, it } from 'vitest';
import { Supervisor } from '../../scripts/stack/supervisor';

const crashAtOnce = { command: process.execPath, args: ['-e', 'process.exit(3)'] };
const runForever = { command: process.execPath, args: ['-e', 'setInterval(() => {}, 1000)'] };

describe('the stack supervisor', () => {
  it('starts a crashed service again, pausing longer after each crash in a row', async () => {
    const supervisor = new Supervisor({ firstMs: 50, maxMs: 400, healthyAfterMs: 60_000 });
    const delays: number[] = [];
    supervisor.onRestart = (_name, code, delayMs) => {
      expect(code).toBe(3);
      delays.push(delayMs);
    };
    supervisor.start({ name: 'crasher', ...crashAtOnce, restart: true });
    while (delays.length < 5) await new Promise((r) => setTimeout(r, 20));
    await supervisor.stopAll();
    expect(delays.slice(0, 5)).toEqual([50, 100, 200, 400, 400]);
  });

  it('starts a killed service again (kill -9), with a new process', async () => {
    const supervisor = new Supervisor({ firstMs: 50, maxMs: 400, healthyAfterMs: 60_000 });
    supervisor.onRestart = () => {};
    const first = supervisor.start({ name: 'steady', ...runForever, restart: true });
    process.kill(first.pid!, 'SIGKILL');
    const second = await supervisor.whenRunning('steady', { previousPid: first.pid });
    expect(second.pid).not.toBe(first.pid);
    await supervisor.stopAll();
    expect(second.exitCode !== null || second.signalCode !== null).toBe(true);
  });

  it('stops a service on purpose without starting it again', async () => {
    const supervisor = new Supervisor({ firstMs: 50, maxMs: 400, healthyAfterMs: 60_000 });
    let restarts = 0;
    supervisor.onRestart = () => (restarts += 1);
    supervisor.start({ name: 'steady', ...runForever, restart: true });
    await supervisor.stop('steady');
    await new Promise((r) => setTimeout(r, 200));
    expect(restarts).toBe(0);
    expect(supervisor.current('steady')).toBeUndefined();
  });

  it('reports a service without restart when it dies, and leaves the decision to its owner', async () => {
    const supervisor = new Supervisor();
    const exited = new Promise<number | null>((resolve) => (supervisor.onUnexpectedExit = (_name, code) => resolve(code)));
    supervisor.start({ name: 'one-shot', ...crashAtOnce });
    expect(await exited).toBe(3);
    await supervisor.stopAll();
  });
});
