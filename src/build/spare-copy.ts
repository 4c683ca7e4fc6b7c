// A spare for the next build, made by a build that leaves none: one without a record of the version it
// replaced (the first build of a site, or one after the cache was cleared), or one that made most units
// afresh (after an upgrade or a change of the library's settings), whose replaced version would be a spare
// of which the next build must replace nearly every unit (SiteUnits.keepsReplaced).
//
// A rebuild updates the spare in place (carry-over.ts). Without one it makes its new version from nothing,
// hard-linking every unchanged unit from the live site, and removes the version the build before it
// replaced, which no record describes. The first edit after such a build took 1.58 s against 0.81 s for the
// next at 1,000 parts (the linking 0.29 s, the removal 0.47 s), and 14.2 s against 0.90 s at 10,000 (2.4 s
// and 10.8 s): work the edit did not cause. The build without a spare does that work instead, at its end:
// the replaced version goes with the leftovers (output.ts), and the new version is copied by hard links
// into a spare whose record is the live version's with each folder's own stamp.

import { linkSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { removeTree } from './remove-tree.js';
import { join } from 'node:path';
import { isFolderUnit } from './carry-over.js';
import type { VersionRecord } from './site-record.js';

/**
 * Copy the folder `from` into `to` (which must not exist), folders made and files hard-linked. False, with
 * nothing left at `to`, when a file cannot be linked (a file system without hard links: a spare copied byte
 * for byte would cost what it saves) or a folder cannot be made.
 */
export function linkedCopy(from: string, to: string): boolean {
  try {
    linkTree(from, to);
    return true;
  } catch {
    removeTree(to);
    return false;
  }
}

function linkTree(from: string, to: string): void {
  mkdirSync(to);
  for (const entry of readdirSync(from, { withFileTypes: true })) {
    const a = join(from, entry.name);
    const b = join(to, entry.name);
    if (entry.isDirectory()) linkTree(a, b);
    else linkSync(a, b);
  }
}

/**
 * The record of `copyDir`, a linked copy of the version `live` describes, named `name`: the same units, keys
 * and data; a file unit's stamp is its file's, which it shares; a folder unit's stamp gets the copy's
 * folder's own mtime and inode. Undefined when a folder of a unit is missing from the copy.
 */
export function linkedCopyRecord(live: VersionRecord, copyDir: string, name: string): VersionRecord | undefined {
  const copy = live.renamed(name);
  const folders: string[] = [];
  copy.forEachUnit((unit) => void (isFolderUnit(unit) && folders.push(unit)));
  for (const unit of folders) {
    const entry = copy.get(unit)!;
    const s = statSync(`${copyDir}/${unit}`, { throwIfNoEntry: false });
    if (!s?.isDirectory() || entry.stamp.length !== 5) return undefined;
    copy.set(unit, { ...entry, stamp: [s.mtimeMs, s.ino, ...entry.stamp.slice(2)] });
  }
  return copy;
}
