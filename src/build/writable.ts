// Whether a build may write where its site goes: nothing it would have to write or remove may be read-only
// (output.ts puts the site in place; carry-over.ts updates the spare version in place).

import { accessSync, constants, lstatSync, readdirSync, readlinkSync, statSync, type Dirent, type Stats } from 'node:fs';
import { dirname, join } from 'node:path';
import { holdingDir, OutputRefused } from './output-guard.js';

export function entryKind(path: string): 'none' | 'link' | 'folder' | 'other' {
  try {
    const s = lstatSync(path);
    return s.isSymbolicLink() ? 'link' : s.isDirectory() ? 'folder' : 'other';
  } catch {
    return 'none';
  }
}

/** The name of the version the site path links to. */
export function currentVersion(sitePath: string): string | undefined {
  try {
    return lstatSync(sitePath).isSymbolicLink() ? readlinkSync(sitePath).split(/[/\\]/).pop() : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Read-only folders: one the system will not let this process write, or one whose mode says nobody may
 * (chmod a-w), which zfolio respects even when run as root.
 */
function readOnly(path: string): boolean {
  return writable(path) === undefined;
}

/** A folder's stats when it is not read-only. */
function writable(path: string): Stats | undefined {
  try {
    accessSync(path, constants.W_OK | constants.X_OK);
    const stats = statSync(path);
    return (stats.mode & 0o222) === 0 ? undefined : stats;
  } catch {
    return undefined;
  }
}

/** This process's user id (a system call each time it is asked), undefined where there is none (Windows). */
const USER_ID = process.getuid?.();

/**
 * Whether a folder inside a site may be written, from its stats alone where they settle it: root, or its
 * owner with write and search permission, may write it unless its mode lets nobody write (which counts as
 * read-only, as in `writable`); in any other case the system is asked. One call per folder instead of two,
 * for the 10,000 part folders of a large site.
 */
function writableInside(path: string): Stats | undefined {
  let stats: Stats;
  try {
    stats = statSync(path);
  } catch {
    return undefined;
  }
  if ((stats.mode & 0o222) === 0) return undefined;
  const uid = USER_ID;
  if (uid === 0 || (uid === stats.uid && (stats.mode & 0o300) === 0o300)) return stats;
  return writable(path);
}

/**
 * The first read-only folder in a tree (whose entries could then not be removed), if any. A folder whose
 * link count is 2 (its entry in its parent and its own `.`) has no folder inside it on the file systems that
 * count the links of folders (ext4, XFS, tmpfs: each folder inside adds its `..`), so it is not listed: a
 * site's part folders hold files only, and a 10,000-part site is checked without listing 10,000 folders.
 * Where folders' links are not counted (btrfs gives 1), every folder is listed, as before. `skip` (given a
 * folder's site-relative path) says which folders are not looked at ('all') or not listed ('inside').
 */
function readOnlyFolderIn(dir: string, skip?: SkipFolder, relative = '', list: FolderLister = listFolder, inside = true): string | undefined {
  const stats = relative ? writableInside(dir) : writable(dir);
  if (!stats) return dir;
  if (stats.nlink === 2 || !inside) return undefined;
  for (const entry of list(dir)) {
    if (!entry.isDirectory()) continue;
    const skipped = skip?.(relative, entry.name);
    if (skipped === 'all') continue;
    const found = readOnlyFolderIn(join(dir, entry.name), skip, relative ? `${relative}/${entry.name}` : entry.name, list, skipped !== 'inside');
    if (found) return found;
  }
  return undefined;
}

/**
 * Which folders `readOnlyFolderIn` passes over: given a folder's site-relative path and the name of a folder
 * in it, 'all' (not looked at) or 'inside' (looked at, not listed). Asked by name, so that no path is made
 * for each of the 10,000 part folders of a large site.
 */
type SkipFolder = (folder: string, name: string) => 'all' | 'inside' | undefined;

/**
 * Site-relative paths grouped by their folder, asked by a folder's path and an entry's name: the entries of
 * a listing are looked up as they are, and the listing of a large site's parts/ folder makes no path a part.
 */
export class PathsByFolder {
  private readonly folders = new Map<string, Set<string>>();

  constructor(paths: Iterable<string> = []) {
    for (const path of paths) this.add(path);
  }

  add(path: string): void {
    const slash = path.lastIndexOf('/');
    const folder = slash < 0 ? '' : path.slice(0, slash);
    const names = this.folders.get(folder);
    if (names) names.add(path.slice(slash + 1));
    else this.folders.set(folder, new Set([path.slice(slash + 1)]));
  }

  has(folder: string, name: string): boolean {
    return this.folders.get(folder)?.has(name) ?? false;
  }
}

/** A folder's entries with their types (a caller may hand in one that remembers them, to list each folder once). */
export type FolderLister = (dir: string) => Dirent[];

const listFolder: FolderLister = (dir) => readdirSync(dir, { withFileTypes: true });

/** The folders holding the part and comparison folders, the units a rebuild with a spare leaves as they are. */
const unitsInside: SkipFolder = (folder, name) => (folder === '' && (name === 'parts' || name === 'comparisons') ? 'inside' : undefined);

/**
 * Throws OutputRefused when the site could not be swapped in and the old one removed: a read-only folder
 * where the site goes, above it, or in the site it would replace. Reads only; called before the build.
 * `keptAsSpare`: this build will keep the version at the site path as it is, as the next build's spare
 * (carry-over.ts), so the folders holding its part and comparison folders are not listed (at 10,000 parts, a
 * stat of each was a twentieth of a rebuild); the build that later changes them in the spare checks them first (`checkSpare`).
 */
export function checkWritable(sitePath: string, options: { keptAsSpare?: boolean } = {}): void {
  const refuse = (folder: string) => {
    throw new OutputRefused(`cannot write the site to ${sitePath}: ${folder} is read-only; make it writable or choose another --out`);
  };
  let parent = dirname(sitePath);
  while (entryKind(parent) === 'none' && dirname(parent) !== parent) parent = dirname(parent);
  if (readOnly(parent)) refuse(parent);
  const holding = holdingDir(sitePath);
  if (entryKind(holding) === 'folder' && readOnly(holding)) refuse(holding);
  const kind = entryKind(sitePath);
  const current = kind === 'link' ? join(dirname(sitePath), readlinkSync(sitePath)) : kind === 'folder' ? sitePath : undefined;
  if (current && entryKind(current) === 'folder') {
    const found = readOnlyFolderIn(current, options.keptAsSpare ? unitsInside : undefined);
    if (found) refuse(kind === 'link' && found === current ? sitePath : found);
  }
}

/** A refusal found in the spare version before it was changed: it can be given back as it was. */
export class SpareRefused extends OutputRefused {}

/**
 * Throws SpareRefused when a folder of the spare version that a build is about to change is read-only:
 * the spare's own folders and every folder of it but those of the units it keeps (`kept`, site-relative).
 * Called before the spare (`dir`, claimed under a name of this build's) is changed, so a refused build can
 * give it back as it was (Staging.release); the message names it where it is given back (`shownAs`). `list`:
 * how folders are listed (the build lists the spare's once, for this check and for updating it).
 */
export function checkSpare(sitePath: string, spare: { dir: string; shownAs: string }, kept: PathsByFolder, list?: FolderLister): void {
  const found = readOnlyFolderIn(spare.dir, (folder, name) => (kept.has(folder, name) ? 'all' : undefined), '', list);
  const shown = found && spare.shownAs + found.slice(spare.dir.length);
  if (shown) throw new SpareRefused(`cannot write the site to ${sitePath}: ${shown} (in the version before the site, which a rebuild updates) is read-only; make it writable or choose another --out`);
}
