// The demo library's site, built once a run and shared by the files that read a built demo: cold (into an
// empty cache folder of its own, so every chart is drawn and then kept there), no PDFs, charts drawn in two
// worker threads. The first file to ask builds it in the run's folder (test/setup/global.ts); a file in the
// other fork that asks meanwhile waits for it. Tests only read it; a test that needs other options (PDFs, a
// changed library) builds its own, and may start from a copy of the charts this build drew (demoCache()).

import { cpSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { inject } from 'vitest';
import { buildFolio } from '../src/build/build.js';
import { REPO, tempDir } from './site-helpers.js';

/** The options the shared demo site is built with besides its cache folder, an empty one of its own. */
export const DEMO_SITE_OPTIONS = { workers: 2 } as const;

let building: Promise<string> | undefined;

/** The built demo site's folder (the site path, a link as a build leaves it). */
export function demoSite(): Promise<string> {
  building ??= sharedBuild(inject('demoSiteFolder'));
  return building;
}

/**
 * A copy of the cache folder the shared demo build filled (its parts read and every chart drawn), to give
 * a build of the demo with other options (PDFs) as its cache: its charts then come from the cache, drawn by
 * the shared build of the same code, rather than being drawn again. Each call makes a copy of its own, in a
 * new temporary folder or at `copy` (a library's .zfolio-cache, say).
 */
export async function demoCache(copy = join(tempDir('demo-cache'), 'cache')): Promise<string> {
  await demoSite();
  cpSync(join(inject('demoSiteFolder'), 'cache'), copy, { recursive: true });
  return copy;
}

async function sharedBuild(folder: string): Promise<string> {
  const site = join(folder, '_site');
  const cache = join(folder, 'cache');
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
    const result = await buildFolio({ libraryRoot: REPO, outDir: site, cache, ...DEMO_SITE_OPTIONS });
    if (!result.ok) throw new Error(result.diagnostics.map((d) => `${d.file}:${d.line}:${d.column} ${d.message}`).join('\n'));
    if (result.charts?.fromCache !== 0) throw new Error(`the shared demo build took ${result.charts?.fromCache} charts from a cache that should have been empty`);
    writeFileSync(done, '');
    return site;
  } catch (error) {
    writeFileSync(failed, String(error));
    throw error;
  }
}
