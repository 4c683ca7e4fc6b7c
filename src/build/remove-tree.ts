// Removing a folder of a site: a version of 10,000 parts holds some 60,000 files and folders.

import { readdirSync, rmdirSync, rmSync, unlinkSync } from 'node:fs';
import { rmdir, unlink } from 'node:fs/promises';

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

/**
 * Remove each of `paths` and everything under it, as removeTree does, with up to `width` removals in flight
 * (Node's thread pool): removing a folder here waits on the disk more than it works, so removals side by side
 * finish sooner. A copy of a 1,000-part site (6,300 entries, each file its own) took 0.60 to 0.76 s so
 * against 1.06 to 1.08 s one after another, for 0.6 to 0.7 s of CPU against 0.4. Files go first, then the
 * folders deepest first; whatever fails is left to rmSync, which throws what it cannot remove.
 */
export async function removeTrees(paths: readonly string[], width = 8): Promise<void> {
  let files: string[] = [];
  const folders: string[][] = [];
  const listed: string[] = [];
  for (const path of paths) {
    try {
      const own = { files: [] as string[], folders: [] as string[][] };
      listInto(path, 0, own.files, own.folders);
      files = files.concat(own.files);
      own.folders.forEach((at, depth) => (folders[depth] = (folders[depth] ?? []).concat(at)));
      listed.push(path);
    } catch {
      removeTree(path); // a file, a missing path, a folder that cannot be listed
    }
  }
  try {
    await inFlight(files, width, unlink);
    for (let depth = folders.length - 1; depth >= 0; depth--) await inFlight(folders[depth]!, width, rmdir);
  } catch {
    for (const path of listed) rmSync(path, { recursive: true, force: true });
  }
}

function listInto(dir: string, depth: number, files: string[], folders: string[][]): void {
  const entries = readdirSync(dir, { withFileTypes: true });
  (folders[depth] ??= []).push(dir);
  for (const entry of entries) {
    const path = `${dir}/${entry.name}`;
    if (entry.isDirectory()) listInto(path, depth + 1, files, folders);
    else files.push(path);
  }
}

/** Each path removed, `width` at a time; the first failure stops every lane (and is thrown once all have stopped). */
async function inFlight(paths: readonly string[], width: number, remove: (path: string) => Promise<void>): Promise<void> {
  let next = 0;
  let failure: unknown;
  const lane = async () => {
    while (next < paths.length && failure === undefined) {
      try {
        await remove(paths[next++]!);
      } catch (error) {
        failure ??= error;
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(width, paths.length) }, lane));
  if (failure !== undefined) throw failure;
}
