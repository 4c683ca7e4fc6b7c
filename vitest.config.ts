import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // Once a run: dist/ compiled if stale, and the demo built once for the files that read a built demo.
    globalSetup: ['test/setup/global.ts'],
    testTimeout: 60_000,
    hookTimeout: 180_000,
    // Site, browser and PDF tests each build a folio; two cores, so two forks.
    pool: 'forks',
    maxWorkers: 2,
    // Files in one fork share its modules: vega, eleventy and puppeteer load once a fork, not once a file
    // (that was most of the suite's time). No test mocks a module or leaves global state behind.
    isolate: false,
  },
});
