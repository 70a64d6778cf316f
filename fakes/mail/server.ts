/**
 * Local stand-in for Resend's HTTP API. Start: `node --import tsx fakes/mail/server.ts`.
 * Env: FAKE_MAIL_PORT (4322), FAKE_MAIL_HOST (127.0.0.1), FAKE_MAIL_DATA_DIR (.lagwise/fakes/mail).
 */
import { createServer } from 'node:http';
import { dataDirFromEnv, exitOnStartError, portFromEnv, serve } from '../serve.ts';
import { createMailFake } from './app.ts';

const label = 'mail fake';
try {
  const port = portFromEnv('FAKE_MAIL_PORT', 4322);
  const host = process.env.FAKE_MAIL_HOST || '127.0.0.1';
  const fake = createMailFake({ dataDir: dataDirFromEnv('FAKE_MAIL_DATA_DIR', '.lagwise/fakes/mail') });
  await serve(label, createServer(fake.handle), host, port);
} catch (err) {
  exitOnStartError(label, err);
}
