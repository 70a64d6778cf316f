/**
 * A long-running process (web server, worker) must outlive a database restart: libraries that
 * lose their connection sometimes reject a promise nobody awaits or emit an error nobody hears.
 * Those are logged and the process goes on; anything else is a bug, so the process exits and
 * the supervisor starts a fresh one.
 *
 * It must not outlive its supervisor, though. Left behind (the supervisor killed), its log pipe
 * is closed: each line written fails, and logging that failure fails again — a loop that would
 * hold a core forever while nobody reads or restarts it. So a failed write to its own output
 * ends the process, and so does finding itself handed to another parent.
 */
import { describeForLog, isDatabaseUnavailable } from '../db/errors';

/** Exit status when the process's own output can no longer be written (EX_IOERR). */
export const EXIT_OUTPUT_GONE = 74;
/** Exit status when the process that started it has gone (EX_TEMPFAIL: a new start will do). */
export const EXIT_ORPHANED = 75;
/** How often a process checks that the one that started it is still there. */
const PARENT_CHECK_MS = 2_000;

let installed = false;

export function installProcessGuards(name: string): void {
  if (installed) return;
  installed = true;
  for (const stream of [process.stdout, process.stderr]) {
    stream.on('error', () => process.exit(EXIT_OUTPUT_GONE));
  }
  const parent = process.ppid;
  setInterval(() => {
    if (process.ppid !== parent) process.exit(EXIT_ORPHANED);
  }, PARENT_CHECK_MS).unref();
  process.on('unhandledRejection', (reason) => {
    if (isDatabaseUnavailable(reason)) {
      console.error(`[${name}] database unavailable (unawaited): ${describeForLog(reason)}`);
      return;
    }
    console.error(`[${name}] unhandled rejection, carrying on: ${describeForLog(reason)}`);
  });
  process.on('uncaughtException', (error) => {
    if (isDatabaseUnavailable(error)) {
      console.error(`[${name}] database unavailable (uncaught): ${describeForLog(error)}`);
      return;
    }
    console.error(`[${name}] uncaught exception; exiting so a fresh process takes over: ${describeForLog(error)}`);
    process.exit(70);
  });
}
