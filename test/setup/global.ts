// Run once before any test file (vitest's globalSetup), in the main process:
// - dist/ compiled from the sources under test when it is stale, so tests that start zfolio as a process
//   run bin/zfolio.js (the installed entry point) rather than compiling the sources again in every process;
// - a temporary folder for the demo site that the files reading a built demo share (test/demo-site.ts):
//   the first of them to ask builds it there, the others wait for it; removed after the run;
// - one temporary folder for the whole run, made the TMPDIR of the test processes and of every process they
//   start (builds, Chromium profiles), so the folders tests make with os.tmpdir() go with it after the run
//   instead of piling up in /tmp. ZFOLIO_KEEP_TEST_TMP=1 keeps it (its path is printed) to look into;
// - one Chromium for the browser test files, started when the first of them asks (test/setup/shared-chrome.ts)
//   and closed here when the run ends.

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { tempDir } from '../site-helpers.js';
import { compileDist } from './compiled.js';
import { serveChrome } from './shared-chrome.js';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the run's shared demo site is built (test/demo-site.ts). */
    demoSiteFolder: string;
    /** The socket that gives the run's shared Chromium (test/setup/shared-chrome.ts). */
    chromeSocket: string;
  }
}

export default function setup(project: TestProject) {
  compileDist();
  const run = mkdtempSync(join(tmpdir(), 'zfolio-test-run-'));
  const previous = process.env.TMPDIR;
  // The test forks start after the global setup and inherit this environment.
  process.env.TMPDIR = run;
  const folder = tempDir('demo-site');
  project.provide('demoSiteFolder', folder);
  const chrome = serveChrome(run);
  project.provide('chromeSocket', chrome.socket);
  return async () => {
    await chrome.close();
    if (previous === undefined) delete process.env.TMPDIR;
    else process.env.TMPDIR = previous;
    if (process.env.ZFOLIO_KEEP_TEST_TMP === '1') process.stdout.write(`test files kept in ${run}\n`);
    else rmSync(run, { recursive: true, force: true });
  };
}
