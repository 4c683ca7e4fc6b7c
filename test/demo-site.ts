// The demo library's site, built once a run and shared by the files that read a built demo: cold (no chart
// cache), no PDFs, charts drawn in two worker threads. The first file to ask builds it in the run's folder
// (test/setup/global.ts); a file in the other fork that asks meanwhile waits for it. Tests only read it;
// a test that needs other options (PDFs, a cache, a changed library) builds its own.

import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { inject } from 'vitest';
import { buildFolio } from '../src/build/build.js';
import { REPO } from './site-helpers.js';

/** The options the shared demo site is built with (a test that builds it again to compare uses them too). */
export const DEMO_SITE_OPTIONS = { cache: false, workers: 2 } as const;

let building: Promise<string> | undefined;

/** The built demo site's folder (the site path, a link as a build leaves it). */
export function demoSite(): Promise<string> {
  building ??= sharedBuild(inject('demoSiteFolder'));
  return building;
}

async function sharedBuild(folder: string): Promise<string> {
  const site = join(folder, '_site');
  const done = join(folder, 'built');
  const failed = join(folder, 'failed');
  try {
    // mkdir is atomic: exactly one process of the run builds.
    mkdirSync(join(folder, 'claim'));
  } catch {
    for (;;) {
      if (existsSync(done)) return site;
      if (existsSync(failed)) throw new Error(`the shared demo build failed: ${readFileSync(failed, 'utf8')}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
  try {
    const result = await buildFolio({ libraryRoot: REPO, outDir: site, ...DEMO_SITE_OPTIONS });
    if (!result.ok) throw new Error(result.diagnostics.map((d) => `${d.file}:${d.line}:${d.column} ${d.message}`).join('\n'));
    writeFileSync(done, '');
    return site;
  } catch (error) {
    writeFileSync(failed, String(error));
    throw error;
  }
}
