import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // Once a run: dist/ compiled if stale, and a folder for the demo build the files share (test/demo-site.ts).
    globalSetup: ['test/setup/global.ts'],
    // Before each file: with ZFOLIO_TEST_CPU=FILE, each file's CPU time is recorded there (nothing otherwise).
    setupFiles: ['test/setup/file-cpu.ts'],
    // Generous: with several suites on two cores a browser test that opens ten pages took over 60 s. A time
    // limit is not a check of speed; where speed matters, the test states its own bound.
    testTimeout: 120_000,
    hookTimeout: 180_000,
    // Site, browser and PDF tests each build a folio; two cores, so two forks.
    pool: 'forks',
    maxWorkers: 2,
    // Files in one fork share its modules: vega, eleventy and puppeteer load once a fork, not once a file
    // (that was most of the suite's time). No test mocks a module or leaves global state behind.
    isolate: false,
  },
});
