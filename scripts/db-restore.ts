// `npm run db:restore FILE`: replaces the demo database's contents (or DATABASE_URL's) with a backup.
import path from 'node:path';
import { restoreDatabase } from './stack/backup.ts';
import { databaseUrl, loadConfig } from './stack/config.ts';
import { StackError } from './stack/errors.ts';

const file = process.argv[2];
if (!file) {
  console.error('[lagwise] Name the backup to restore: npm run db:restore .lagwise/backups/lagwise-….dump');
  process.exit(1);
}
try {
  const url = process.env.DATABASE_URL ?? databaseUrl(await loadConfig('demo'));
  restoreDatabase(url, path.resolve(file));
  console.log(`[lagwise] restored ${file}; restart \`npm start\` so every process reads the restored data afresh.`);
} catch (error) {
  console.error(`[lagwise] ${error instanceof StackError ? error.message : String(error)} (Is \`npm start\` running? The restore writes into the running demo database.)`);
  process.exit(1);
}
