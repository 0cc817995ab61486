import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// The same .env that ops/lib/env.sh reads, so `npx vitest …` run by hand meets the same MariaDB and fake services as
// `npm test` (variables already set in the environment win).
const envFile = fileURLToPath(new URL('./.env', import.meta.url));
if (existsSync(envFile)) process.loadEnvFile(envFile);

// Node-side tests. The Angular component tests run through `ng test` (Angular's Vitest runner).
const alias = { '@shared': fileURLToPath(new URL('./shared', import.meta.url)) };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          environment: 'node',
          include: [
            'shared/**/*.spec.ts',
            'backend/src/**/*.spec.ts',
            'test/reference/**/*.test.ts',
            'test/quality/**/*.test.ts',
            'ops/**/*.spec.ts',
          ],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          environment: 'node',
          include: ['test/api/**/*.test.ts'],
          globalSetup: ['test/support/global-setup.ts'],
          // One MariaDB for all files; files run in parallel workers but each test makes its own records.
          testTimeout: 30_000,
          hookTimeout: 60_000,
          pool: 'forks',
          maxWorkers: 2,
        },
      },
      {
        resolve: { alias },
        test: {
          // Servers in their own processes under hostile uploads and faults (MariaDB killed or paused, SMTP down).
          name: 'resilience',
          environment: 'node',
          include: ['test/resilience/**/*.test.ts'],
          globalSetup: ['test/support/global-setup.ts'],
          testTimeout: 600_000,
          hookTimeout: 180_000,
          pool: 'forks',
          maxWorkers: 2,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['test/e2e/**/*.test.ts'],
          globalSetup: ['test/support/global-setup.ts'],
          // Generous limits: these tests assert outcomes, never speed, and the 2-core machine may be busy.
          testTimeout: 180_000,
          hookTimeout: 120_000,
          expect: { poll: { timeout: 15_000 } },
          fileParallelism: false,
        },
      },
    ],
  },
});
