/**
 * A long-running process (web server, worker) must outlive a database restart: libraries that
 * lose their connection sometimes reject a promise nobody awaits or emit an error nobody hears.
 * Those are logged and the process goes on; anything else is a bug, so the process exits and
 * the supervisor starts a fresh one.
 */
import { describeForLog, isDatabaseUnavailable } from '../db/errors';

let installed = false;

export function installProcessGuards(name: string): void {
  if (installed) return;
  installed = true;
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
