import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = { '~': fileURLToPath(new URL('./src', import.meta.url)) };

// Files named *.sequential.test.ts switch shared services (e.g. the mail fake's outage) and
// run alone, after everything else has finished.
export default defineConfig({
  resolve: { alias },
  test: {
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'main',
          include: ['src/**/*.test.ts', 'tests/**/*.test.ts'],
          exclude: ['**/*.sequential.test.ts', '**/node_modules/**'],
          testTimeout: 60_000,
          hookTimeout: 60_000,
          sequence: { groupOrder: 0 },
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'alone',
          include: ['tests/**/*.sequential.test.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 60_000,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
