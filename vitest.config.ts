import { defineConfig } from 'vitest/config';
import { findPostgresBin, POSTGRES_MISSING } from './tests/helpers/postgres';

// The API suite runs a second time on PostgreSQL (a throwaway cluster, tests/helpers/postgres.ts).
// Without the server binaries that project is left out, loudly; in CI their absence is a failure.
const postgresHere = findPostgresBin() !== null;
if (!postgresHere && !process.env.CI) console.warn(`[vitest] project api-pg skipped: ${POSTGRES_MISSING}`);
const postgresProjects =
  postgresHere || process.env.CI
    ? [
        {
          extends: true as const,
          test: {
            name: 'api-pg',
            include: ['tests/server/**/*.test.ts'],
            testTimeout: 90_000,
            env: { FALSETRACE_TEST_DB: 'postgres' },
            globalSetup: ['tests/helpers/postgres-global-setup.ts'],
          },
        },
      ]
    : [];

export default defineConfig({
  test: {
    environment: 'node',
    globalSetup: ['tests/global-setup.ts'],
    hookTimeout: 60_000,
    // e2e suites each start a server and a browser; 2 cores cannot run many at once
    maxWorkers: 2,
    projects: [
      ...postgresProjects,
      // generous: a loaded 2-core machine runs the heavier API tests (imports, crash runs) near 30 s
      { extends: true, test: { name: 'unit', include: ['tests/shared/**/*.test.ts', 'tests/server/**/*.test.ts', 'tests/client/**/*.test.ts'], testTimeout: 90_000 } },
      {
        extends: true,
        // a real browser on a busy 2-core machine is slow; the time limits are generous, and
        // each wait inside the test gives up first, naming what it waited for. In CI a failed
        // browser test runs once more (its first failure is still reported with its pages);
        // a test that is really broken fails both times.
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 120_000,
          hookTimeout: 120_000,
          setupFiles: ['tests/e2e/setup.ts'],
          retry: process.env.CI ? 1 : 0,
          // expect.poll waits 1 s by default: far too short for a busy browser
          expect: { poll: { timeout: 30_000 } },
        },
      },
    ],
  },
});
