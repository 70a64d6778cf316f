import { connect } from 'node:net';

/** Polls an HTTP address until it answers 200, or gives up with the reason. */
export async function waitForHttp(
  url: string,
  { timeoutMs = 30_000, hasExited = () => false }: { timeoutMs?: number; hasExited?: () => boolean } = {},
): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < deadline) {
    if (hasExited()) throw new Error(`the process behind ${url} exited before it answered`);
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (response.ok) return;
      last = `HTTP ${response.status}`;
    } catch (error) {
      last = (error as Error).message;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s (${last})`);
}

/** Waits until something accepts TCP connections on 127.0.0.1:port. */
export async function waitForPort(
  port: number,
  { timeoutMs = 30_000, hasExited = () => false }: { timeoutMs?: number; hasExited?: () => boolean } = {},
): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (hasExited()) throw new Error(`the process meant to listen on port ${port} exited`);
    const open = await new Promise<boolean>((resolve) => {
      const socket = connect(port, '127.0.0.1');
      socket.once('connect', () => {
        socket.destroy();
        resolve(true);
      });
      socket.once('error', () => resolve(false));
    });
    if (open) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`nothing listened on port ${port} within ${timeoutMs / 1000} s`);
}
