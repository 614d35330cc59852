import { defineConfig } from 'vitest/config';

/**
 * Two projects: `unit` (pure computation and reference checks, runs anywhere) and
 * `integration` (real redis-server started by the global setup; files named *.redis.test.ts).
 */
export default defineConfig({
  test: {
    reporters: ['default', './tests/support/summary-reporter.ts'],
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts'],
          exclude: ['**/*.redis.test.ts'],
          testTimeout: 120_000,
          pool: 'forks',
        },
      },
      {
        test: {
          name: 'integration',
          include: ['tests/service/**/*.test.ts', 'tests/**/*.redis.test.ts'],
          globalSetup: ['tests/support/redis-global-setup.ts'],
          testTimeout: 180_000,
          hookTimeout: 60_000,
          pool: 'forks',
          fileParallelism: false,
        },
      },
    ],
  },
});
