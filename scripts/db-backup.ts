// `npm run db:backup [FILE]`: the demo database (or DATABASE_URL's) to one pg_dump file.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { backupDatabase } from './stack/backup.ts';
import { databaseUrl, loadConfig, projectRoot, stateRoot } from './stack/config.ts';
import { StackError } from './stack/errors.ts';

try {
  const url = process.env.DATABASE_URL ?? databaseUrl(await loadConfig('demo'));
  const stamp = new Date().toISOString().replace(/[:]/g, '-').replace(/\..+$/, '');
  const file = path.resolve(process.argv[2] ?? path.join(stateRoot(), 'backups', `lagwise-${stamp}.dump`));
  mkdirSync(path.dirname(file), { recursive: true });
  backupDatabase(url, file);
  console.log(`[lagwise] backup written to ${path.relative(projectRoot, file) || file}; restore it with \`npm run db:restore ${path.relative(projectRoot, file)}\``);
} catch (error) {
  console.error(`[lagwise] ${error instanceof StackError ? error.message : String(error)} (Is \`npm start\` running? The backup reads the running demo database.)`);
  process.exit(1);
}
