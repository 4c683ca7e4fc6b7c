// Removing a folder of a site: a version of 10,000 parts holds some 60,000 files and folders.

import { readdirSync, rmdirSync, rmSync, unlinkSync } from 'node:fs';

/**
 * Remove `path` and everything under it, as rmSync(path, { recursive, force }) does, in fewer system calls:
 * Node 20's rmSync looks at each entry (lstat) before removing it and tries each folder's rmdir before listing
 * it, where a listing with entry types says what each entry is. Removing a copy of a 1,000-part site
 * (6,300 entries, each file its own) took 1.0 s against 1.2 to 1.4 s, and 0.27 to 0.29 s against 0.38 s when
 * its files were hard links of another's (two runs each way). Whatever fails (a missing path, a file, a
 * folder that changes meanwhile) is left to rmSync.
 */
export function removeTree(path: string): void {
  try {
    removeUnder(path);
    rmdirSync(path);
  } catch {
    rmSync(path, { recursive: true, force: true });
  }
}

function removeUnder(dir: string): void {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = `${dir}/${entry.name}`;
    if (entry.isDirectory()) {
      removeUnder(path);
      rmdirSync(path);
    } else unlinkSync(path);
  }
}
