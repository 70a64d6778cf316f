import { defineConfig } from 'drizzle-kit';

// Generating migrations needs no database; applying them is done by scripts/migrate.ts.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://localhost/lagwise' },
  strict: true,
  verbose: true,
});
