// Writing a site without ever leaving a half-written one: build into a staging folder beside the output,
// then swap it in with two renames. A failed build removes its staging folder and leaves the old site alone.

import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, basename, join } from 'node:path';
import { MARKER_TEXT, SITE_MARKER } from './output-guard.js';

export interface Staging {
  /** Where to write the new site. */
  dir: string;
  /** Put the new site in place of the old one. */
  commit(): void;
  /** Throw the staging folder away. */
  abandon(): void;
}

export function stageOutput(outDir: string): Staging {
  const parent = dirname(outDir);
  mkdirSync(parent, { recursive: true });
  const dir = join(parent, `.${basename(outDir)}.staging-${process.pid}`);
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  // Written first, so that whatever of this folder ends up at the site path, the next build recognises it.
  writeFileSync(join(dir, SITE_MARKER), MARKER_TEXT);
  return {
    dir,
    commit() {
      const previous = join(parent, `.${basename(outDir)}.previous-${process.pid}`);
      rmSync(previous, { recursive: true, force: true });
      if (existsSync(outDir)) renameSync(outDir, previous);
      renameSync(dir, outDir);
      rmSync(previous, { recursive: true, force: true });
    },
    abandon() {
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Write a file, creating its folder. */
export function writeFileDeep(path: string, content: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, content);
}
