// A build of a library from nothing, to compare a rebuilt site with, byte for byte.

import { cpSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { buildFolio, CACHE_DIR, type BuildResult } from '../../src/build/build.js';
import { tempDir, treeHashes } from '../site-helpers.js';

/**
 * The library at `root` built into a new folder with no last site, no record and no part cache (every part
 * read and analysed, every page rendered), charts drawn in this thread; its charts come from a copy of the
 * library's chart cache (a cache hit gives the bytes of a drawn chart: reuse.test.ts compares rebuilds from
 * the cache with builds that draw every chart). Its result, and the SHA-256 of every file of its site; the
 * folder is removed.
 */
export async function buildFromNothing(root: string, stem: string): Promise<{ result: BuildResult; hashes: Map<string, string> }> {
  const top = tempDir(stem);
  try {
    cpSync(join(root, CACHE_DIR, 'charts'), join(top, 'cache', 'charts'), { recursive: true });
    const result = await buildFolio({ libraryRoot: root, outDir: join(top, '_site'), cache: join(top, 'cache'), workers: 0 });
    return { result, hashes: result.ok ? treeHashes(join(top, '_site')) : new Map() };
  } finally {
    rmSync(top, { recursive: true, force: true });
  }
}
