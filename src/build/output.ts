// Putting a new site in place without ever leaving the site path empty or half-written.
//
// The site path (say `_site`) is a symbolic link to one version of the site, kept in a holding folder beside
// it (`._site.zfolio/site-PID-RANDOM`; the link text is relative, so the library can move). A build writes
// its version there, makes a second link to it, and renames that link over the site path: rename(2) replaces
// the old link in one step, so a reader — a browser, the preview server, a killed build — sees the old site
// or the new one and nothing between. Then the versions no link points at, left by this build or by builds
// that were killed, are removed; a version of another build still running is left to it.
//
// Where the site path is still a real folder (an empty folder, or a site written where links cannot be
// made), it is moved aside into the holding folder and the link renamed in its place: two renames, once.
// On a file system without symbolic links every build does that, as zfolio always did before.

import { randomBytes } from 'node:crypto';
import { accessSync, constants, lstatSync, mkdirSync, readdirSync, readlinkSync, renameSync, rmSync, statSync, symlinkSync, writeFileSync, type Stats } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { holdingName, isOwnLink, MARKER_TEXT, OutputRefused, SITE_MARKER } from './output-guard.js';
import { untilDone } from '../on-exit.js';

/** Points in a swap, reported to `onStep` (tests stop a build at each to check the site path). */
export type SwapStep = 'staged' | 'linked' | 'moved-aside' | 'swapped' | 'cleaned';

export interface Staging {
  /** Where to write the new site. */
  dir: string;
  /**
   * Take an earlier version in the holding folder, one the site path does not point at, to update in place
   * into the new site (renamed to a name of this process, so a build killed while changing it leaves it to
   * be removed as its leftover). Returns its path, or undefined when it is not there (or another build took it).
   */
  claim(name: string): string | undefined;
  /**
   * Put the new site in place of the old one: `version` (the staging folder, or a claimed version), default
   * the staging folder. With `keepReplaced`, the version it replaces stays in the holding folder (the next
   * build updates it); returns that version's name.
   */
  commit(options?: { version?: string; keepReplaced?: boolean }): { replaced?: string };
  /** Throw the staging folder (and a claimed version) away. */
  abandon(): void;
}

export interface StageOptions {
  onStep?(step: SwapStep): void;
}

const VERSION_NAME = /^site-(\d+)-[0-9a-f]+$/;
const LINK_NAME = /^link-(\d+)-[0-9a-f]+$/;
const unique = () => `${process.pid}-${randomBytes(4).toString('hex')}`;

/** Whether process `pid` is running (this one always is). */
export function alive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: it exists, but belongs to someone else.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function entryKind(path: string): 'none' | 'link' | 'folder' | 'other' {
  try {
    const s = lstatSync(path);
    return s.isSymbolicLink() ? 'link' : s.isDirectory() ? 'folder' : 'other';
  } catch {
    return 'none';
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
 * Where folders' links are not counted (btrfs gives 1), every folder is listed, as before.
 */
function readOnlyFolderIn(dir: string, inside = false): string | undefined {
  const stats = inside ? writableInside(dir) : writable(dir);
  if (!stats) return dir;
  if (stats.nlink === 2) return undefined;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (!entry.isDirectory()) continue;
    const found = readOnlyFolderIn(join(dir, entry.name), true);
    if (found) return found;
  }
  return undefined;
}

/**
 * Throws OutputRefused when the site could not be swapped in and the old one removed: a read-only folder
 * where the site goes, above it, or in the site it would replace. Reads only; called before the build.
 */
export function checkWritable(sitePath: string): void {
  const refuse = (folder: string) => {
    throw new OutputRefused(`cannot write the site to ${sitePath}: ${folder} is read-only; make it writable or choose another --out`);
  };
  let parent = dirname(sitePath);
  while (entryKind(parent) === 'none' && dirname(parent) !== parent) parent = dirname(parent);
  if (readOnly(parent)) refuse(parent);
  const holding = join(dirname(sitePath), holdingName(basename(sitePath)));
  if (entryKind(holding) === 'folder' && readOnly(holding)) refuse(holding);
  const kind = entryKind(sitePath);
  const current = kind === 'link' ? join(dirname(sitePath), readlinkSync(sitePath)) : kind === 'folder' ? sitePath : undefined;
  if (current && entryKind(current) === 'folder') {
    const found = readOnlyFolderIn(current);
    if (found) refuse(kind === 'link' && found === current ? sitePath : found);
  }
}

export function stageOutput(sitePath: string, options: StageOptions = {}): Staging {
  const step = options.onStep ?? (() => {});
  const parent = dirname(sitePath);
  const name = basename(sitePath);
  const holding = join(parent, holdingName(name));
  mkdirSync(holding, { recursive: true });
  const version = `site-${unique()}`;
  const dir = join(holding, version);
  mkdirSync(dir);
  // Written first, so that whatever of this folder ends up at the site path, the next build recognises it.
  writeFileSync(join(dir, SITE_MARKER), MARKER_TEXT);
  let link: string | undefined;
  let claimed: string | undefined;
  const abandon = () => {
    if (link) rmSync(link, { force: true });
    rmSync(dir, { recursive: true, force: true });
    if (claimed) rmSync(claimed, { recursive: true, force: true });
  };
  // A process stopped before the swap removes its staging folder on the way out.
  const done = untilDone(abandon);
  return {
    dir,
    claim(earlier) {
      const current = entryKind(sitePath) === 'link' ? readlinkSync(sitePath).split(/[/\\]/).pop() : undefined;
      if (claimed || !VERSION_NAME.test(earlier) || earlier === current) return undefined;
      const to = join(holding, `site-${unique()}`);
      try {
        renameSync(join(holding, earlier), to);
      } catch {
        return undefined;
      }
      claimed = to;
      return to;
    },
    commit(options = {}) {
      done();
      const chosen = options.version ?? dir;
      if (chosen !== dir && chosen !== claimed) throw new Error(`not a version of this build: ${chosen}`);
      const chosenName = basename(chosen);
      step('staged');
      link = join(holding, `link-${unique()}`);
      const current = entryKind(sitePath) === 'link' ? readlinkSync(sitePath).split(/[/\\]/).pop() : undefined;
      try {
        symlinkSync(`${holdingName(name)}/${chosenName}`, link);
      } catch {
        link = undefined; // no symbolic links here: the site path stays a real folder
      }
      if (link) step('linked');
      const kind = entryKind(sitePath);
      let aside: string | undefined;
      if (kind === 'folder' || (kind === 'link' && !link)) {
        aside = join(holding, `site-${unique()}`);
        renameSync(sitePath, aside);
        step('moved-aside');
      } else if (kind === 'other' || (kind === 'link' && !isOwnLink(sitePath, readlinkSync(sitePath)))) {
        throw new OutputRefused(`will not write the site to ${sitePath}: it changed during the build and is no longer a site zfolio wrote`);
      }
      try {
        renameSync(link ?? chosen, sitePath);
      } catch (error) {
        if (aside) renameSync(aside, sitePath); // put the old site back
        throw error;
      }
      link = undefined;
      claimed = undefined;
      step('swapped');
      // Only a version the link replaced is kept: a real folder moved aside is not one the record describes.
      const replaced = options.keepReplaced && !aside && current && VERSION_NAME.test(current) ? current : undefined;
      removeLeftovers(sitePath, replaced);
      step('cleaned');
      return { replaced };
    },
    abandon() {
      done();
      abandon();
    },
  };
}

/**
 * Remove what no link points at: versions and links in the holding folder made by this process or by one
 * that is gone (a killed build), and the staging and previous folders the two-rename swap of older zfolio
 * versions left beside the site. Best effort: the new site is in place whatever happens here.
 */
export function removeLeftovers(sitePath: string, keep?: string): void {
  const parent = dirname(sitePath);
  const name = basename(sitePath);
  const holding = join(parent, holdingName(name));
  const current = () => (entryKind(sitePath) === 'link' ? readlinkSync(sitePath).split(/[/\\]/).pop() : undefined);
  let names: string[] = [];
  try {
    names = readdirSync(holding);
  } catch {
    // no holding folder
  }
  for (const entry of names) {
    const owner = VERSION_NAME.exec(entry) ?? LINK_NAME.exec(entry);
    if (!owner) continue;
    const pid = Number(owner[1]);
    // Whose first, then whether it is current: a build that is gone cannot make its version current later.
    if (pid !== process.pid && alive(pid)) continue;
    if (entry === current() || entry === keep) continue;
    try {
      rmSync(join(holding, entry), { recursive: true, force: true });
    } catch {
      // left for the next build
    }
  }
  const legacy = new RegExp(`^\\.${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\.(?:staging|previous)-(\\d+)$`);
  let beside: string[] = [];
  try {
    beside = readdirSync(parent);
  } catch {
    return;
  }
  for (const entry of beside) {
    const match = legacy.exec(entry);
    if (match && !alive(Number(match[1]))) rmSync(join(parent, entry), { recursive: true, force: true });
  }
}

/** Write a file, creating its folder. */
export function writeFileDeep(path: string, content: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, content);
}
