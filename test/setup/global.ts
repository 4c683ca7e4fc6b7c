// Run once before any test file (vitest's globalSetup), in the main process:
// - dist/ compiled from the sources under test when it is stale, so tests that start zfolio as a process
//   run bin/zfolio.js (the installed entry point) rather than compiling the sources again in every process;
// - a temporary folder for the demo site that the files reading a built demo share (test/demo-site.ts):
//   the first of them to ask builds it there, the others wait for it; removed after the run.

import { rmSync } from 'node:fs';
import type { TestProject } from 'vitest/node';
import { tempDir } from '../site-helpers.js';
import { compileDist } from './compiled.js';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the run's shared demo site is built (test/demo-site.ts). */
    demoSiteFolder: string;
  }
}

export default function setup(project: TestProject) {
  compileDist();
  const folder = tempDir('demo-site');
  project.provide('demoSiteFolder', folder);
  return () => rmSync(folder, { recursive: true, force: true });
}
