// Clearing a spare version of what the new site no longer has (carry-over.ts): every file outside the units it
// keeps that the staging folder does not hold, and the folders that leaves empty. It walks listings it is
// handed, so that each folder of the spare is listed once a build (the parts/ folder of a 10,000-part site
// holds 10,000 entries, and the check before it, writable.ts, lists it too).

import { lstatSync, rmdirSync, rmSync, type Dirent } from 'node:fs';
import { join } from 'node:path';
import type { PathsByFolder } from './writable.js';

export interface StaleSweep {
  target: string;
  staging: string;
  /** Units kept as they are, and units already removed (site-relative paths, asked by folder and name). */
  kept: PathsByFolder;
  gone: PathsByFolder;
  /** Lists a folder of `target` as it was before the units in `gone` were removed. */
  list(dir: string): Dirent[];
}

/**
 * Remove from `target` every file that is not in a kept unit and that the staging folder does not hold, and
 * every folder left empty that the staging folder does not hold. Returns whether the folder is now empty.
 */
export function removeStale(sweep: StaleSweep, relative: string): boolean {
  const { target, staging } = sweep;
  let left = 0;
  for (const entry of sweep.list(join(target, relative))) {
    if (sweep.gone.has(relative, entry.name)) continue;
    if (sweep.kept.has(relative, entry.name)) {
      left++;
      continue;
    }
    const path = relative ? `${relative}/${entry.name}` : entry.name;
    if (entry.isDirectory()) {
      if (removeStale(sweep, path) && !exists(join(staging, path))) rmdirSync(join(target, path));
      else left++;
    } else if (!exists(join(staging, path))) rmSync(join(target, path), { force: true });
    else left++;
  }
  return left === 0;
}

function exists(path: string): boolean {
  try {
    lstatSync(path);
    return true;
  } catch {
    return false;
  }
}
