// `npm run db:migrate`: apply migrations to DATABASE_URL (the start and test commands do this themselves).
import { migrateDatabase } from '../src/db/migrate';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('Set DATABASE_URL to the database to migrate, e.g. postgres://lagwise:…@127.0.0.1:54329/lagwise');
  process.exit(1);
}
await migrateDatabase(url);
console.log('migrations applied');
