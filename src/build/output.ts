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
import { mkdirSync, readdirSync, readlinkSync, renameSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { holdingName, isOwnLink, LOCK_DRAFT, MARKER_TEXT, OutputRefused, SITE_MARKER } from './output-guard.js';
import { currentVersion, entryKind } from './writable.js';
import { linkedCopy } from './spare-copy.js';
import { removeTree, removeTrees } from './remove-tree.js';

export { checkSpare, checkWritable } from './writable.js';
import { untilDone } from '../on-exit.js';

/**
 * Points in a swap, reported to `onStep` (tests stop a build at each to check the site path); 'recorded' (the
 * record of the new site written, before what is left over is removed) is reported by the build itself.
 */
export type SwapStep = 'staged' | 'linked' | 'moved-aside' | 'swapped' | 'recorded' | 'cleaned';

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
   * build updates it); returns that version's name. What is left over stays until `removeLeftovers`.
   */
  commit(options?: { version?: string; keepReplaced?: boolean }): { replaced?: string };
  /**
   * After `commit`, and after the record of the new site is written: remove the versions and links left over
   * (see removeLeftovers), all but those named in `keep`. `onRemove` is called before the first version is
   * removed (one of 10,000 parts takes seconds). A build stopped meanwhile leaves the rest to the next build.
   */
  removeLeftovers(keep: readonly (string | undefined)[], onRemove?: () => void): Promise<void>;
  /** Give a claimed version back under its earlier name, unchanged (before it is changed), to be claimed again. */
  release(): void;
  /**
   * After `commit`, when the site path links to the new version: a copy of it made by hard links in the
   * holding folder, for the next build to update (spare-copy.ts); its path, or undefined when there is no such
   * link or no hard links can be made. A build stopped while copying leaves it to be removed as a leftover.
   */
  linkedSpare(): string | undefined;
  /** Throw the staging folder (and a claimed version) away; after `commit`, nothing: the site path links to one of them. */
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
  let claimedFrom: string | undefined;
  /** The version the site path links to after commit. */
  let linkedTo: string | undefined;
  let committed = false;
  const abandon = () => {
    if (link) rmSync(link, { force: true });
    // A failure after the swap (writing the record, say) must not remove the site it put in place.
    if (committed) return;
    removeTree(dir);
    if (claimed) removeTree(claimed);
  };
  // A process stopped before the swap removes its staging folder on the way out.
  const done = untilDone(abandon);
  return {
    dir,
    claim(earlier) {
      const current = currentVersion(sitePath);
      if (claimed || !VERSION_NAME.test(earlier) || earlier === current) return undefined;
      const to = join(holding, `site-${unique()}`);
      try {
        renameSync(join(holding, earlier), to);
      } catch {
        return undefined;
      }
      claimed = to;
      claimedFrom = join(holding, earlier);
      return to;
    },
    release() {
      if (!claimed || !claimedFrom) return;
      try {
        renameSync(claimed, claimedFrom);
        claimed = undefined;
      } catch {
        // left to be removed with the staging folder
      }
    },
    commit(options = {}) {
      done();
      const chosen = options.version ?? dir;
      if (chosen !== dir && chosen !== claimed) throw new Error(`not a version of this build: ${chosen}`);
      const chosenName = basename(chosen);
      step('staged');
      link = join(holding, `link-${unique()}`);
      const current = currentVersion(sitePath);
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
      committed = true;
      if (link) linkedTo = chosen;
      link = undefined;
      claimed = undefined;
      step('swapped');
      // Only a version the link replaced is kept: a real folder moved aside is not one the record describes.
      const replaced = options.keepReplaced && !aside && current && VERSION_NAME.test(current) ? current : undefined;
      // The staging folder whose files went into a claimed version first: this build's own, not a leftover to report.
      if (chosen !== dir) removeTree(dir);
      return { replaced };
    },
    async removeLeftovers(keep, onRemove) {
      await removeLeftovers(sitePath, keep, onRemove);
      step('cleaned');
    },
    abandon() {
      done();
      abandon();
    },
    linkedSpare() {
      if (!linkedTo || currentVersion(sitePath) !== basename(linkedTo)) return undefined;
      const copy = join(holding, `site-${unique()}`);
      return linkedCopy(linkedTo, copy) ? copy : undefined;
    },
  };
}

/**
 * Remove what no link points at: versions, links and lock drafts in the holding folder made by this process
 * or by one that is gone (a killed build), all but those named in `keep`, and the staging and previous folders the
 * two-rename swap of older zfolio versions left beside the site. Best effort: the new site is in place
 * whatever happens here. The folders go side by side (removeTrees).
 */
export async function removeLeftovers(sitePath: string, keep: readonly (string | undefined)[] = [], onRemove?: () => void): Promise<void> {
  const parent = dirname(sitePath);
  const name = basename(sitePath);
  const holding = join(parent, holdingName(name));
  const leftovers: string[] = [];
  let names: string[] = [];
  try {
    names = readdirSync(holding);
  } catch {
    // no holding folder
  }
  for (const entry of names) {
    const owner = VERSION_NAME.exec(entry) ?? LINK_NAME.exec(entry) ?? LOCK_DRAFT.exec(entry);
    if (!owner) continue;
    const pid = Number(owner[1]);
    // Whose first, then whether it is current: a build that is gone cannot make its version current later.
    if (pid !== process.pid && alive(pid)) continue;
    if (entry === currentVersion(sitePath) || keep.includes(entry)) continue;
    if (onRemove && VERSION_NAME.test(entry)) {
      onRemove();
      onRemove = undefined;
    }
    leftovers.push(join(holding, entry));
  }
  const legacy = new RegExp(`^\\.${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\.(?:staging|previous)-(\\d+)$`);
  let beside: string[] = [];
  try {
    beside = readdirSync(parent);
  } catch {
    // none beside it
  }
  for (const entry of beside) {
    const match = legacy.exec(entry);
    if (match && !alive(Number(match[1]))) leftovers.push(join(parent, entry));
  }
  // What cannot be removed now is left for the next build.
  await removeTrees(leftovers).catch(() => {});
}

/** Write a file, creating its folder. */
export function writeFileDeep(path: string, content: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, content);
}
