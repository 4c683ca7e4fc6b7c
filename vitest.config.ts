import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 180_000,
    // Site, browser and PDF tests each build a folio; two cores, so two forks.
    pool: 'forks',
    maxWorkers: 2,
  },
});
