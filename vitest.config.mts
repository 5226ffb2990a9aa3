import { defineConfig } from 'vitest/config';

// Suites that start processes or browsers run one file at a time on a 2-core machine.
export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    maxWorkers: 2,
  },
});
