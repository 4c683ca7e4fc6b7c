// What a rebuild carries over, and how the new site is made from the last two. A build writes what it makes
// afresh into its staging folder; when the record (site-record.ts) names a spare version (the site before the
// one at the site path), the build takes that version and updates it in place into the new site: it removes
// the units whose keys changed and the files it no longer has, moves the staging folder's files in, and
// hard-links the units the last build made (which the spare does not have yet) from the live site. Units the
// spare already holds with the wanted key are not touched at all, so a rebuild after one edit moves, links
// and records a handful of files however large the library is. The spare is not served while this happens;
// the site path still shows the live site until the swap (output.ts), and a build killed on the way leaves
// the spare under its own name, removed by the next build as a leftover.
//
// Without a spare (the first rebuild, or a record lost), the staging folder becomes the new version, and
// every unit carried over is hard-linked into it from the live site.

import { constants, copyFileSync, linkSync, lstatSync, mkdirSync, readdirSync, renameSync, rmSync, type Dirent } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { checkSpare, currentVersion, PathsByFolder } from './writable.js';
import { removeStale } from './stale-sweep.js';
import { removeTree } from './remove-tree.js';
import { asciiJson } from '../model/ascii-text.js';
import { entryData, entryText, VersionRecord, type SiteRecord, type UnitEntry } from './site-record.js';
import { sameStamp, spareUnchanged, unitStamp } from './unit-stamp.js';

type Source = 'spare' | 'live' | 'fresh';

interface Wanted {
  key: string;
  from: Source;
  /** The record's entry of a unit kept from the spare or the live site. */
  entry?: UnitEntry;
  data?: unknown;
}

/** Part folders and comparison folders are units as a whole; index pages and row scripts are files. */
export const isFolderUnit = (unit: string) => unit.startsWith('parts/') || (unit.startsWith('comparisons/') && unit !== 'comparisons/index.html');

export class SiteUnits {
  private readonly wanted = new Map<string, Wanted>();
  /** The live version's folder, when the record describes the version at the site path. */
  private readonly liveDir?: string;

  /**
   * `record`: the last build's; `spareDir`: the spare version this build claimed (see output.ts), if any;
   * `outDir`: the site path.
   */
  constructor(
    private readonly record: SiteRecord | undefined,
    private readonly spareDir: string | undefined,
    private readonly outDir: string,
  ) {
    if (record?.live && currentVersion(outDir) === record.live.name) this.liveDir = outDir;
  }

  /**
   * Whether the version at the site path, which this build replaces, is worth keeping as the next build's
   * spare: the record describes it, and this build made at most half of the units afresh. A build that made
   * more (after an upgrade, or a change of the library's settings, every unit's key changes) would leave the
   * next build nearly every unit of it to replace; it leaves a linked copy of its own version instead
   * (spare-copy.ts). Call once every unit has been asked for (kept).
   */
  keepsReplaced(): boolean {
    if (this.liveDir === undefined) return false;
    const { fresh, spare, live } = this.counts();
    return fresh * 2 <= fresh + spare + live;
  }

  /** Where the new site is made: the claimed spare, or (without one) the staging folder. */
  target(staging: string): string {
    return this.spareDir ?? staging;
  }

  /**
   * Whether the unit with this key can be left as the last sites have it (true), or must be made afresh
   * into the staging folder (false). Every unit of the new site goes through here once.
   */
  kept(unit: string, key: string): boolean {
    const wanted = this.source(unit, key);
    this.wanted.set(unit, wanted);
    return wanted.from !== 'fresh';
  }

  /** The data recorded with a unit (a part's listed data), when it is kept. */
  recorded(unit: string): unknown {
    return entryData(this.recordedEntry(unit));
  }

  /** The record's entry of a kept unit (its data unread: see entryData). */
  recordedEntry(unit: string): UnitEntry | undefined {
    return this.wanted.get(unit)?.entry;
  }

  /** Data to record with a unit (kept or made afresh). */
  setData(unit: string, data: unknown): void {
    const w = this.wanted.get(unit);
    if (w) w.data = data;
  }

  /** Counts by where each unit comes from. */
  counts(): Record<Source, number> {
    const counts = { spare: 0, live: 0, fresh: 0 };
    for (const w of this.wanted.values()) counts[w.from]++;
    return counts;
  }

  /** Where a unit with this key comes from, with the record's entry when it is kept. */
  private source(unit: string, key: string): Wanted {
    const folder = isFolderUnit(unit);
    const spare = this.spareDir ? this.record?.spare?.get(unit) : undefined;
    // Unit paths are site-relative with forward slashes and no dot segments: joined as text (a 10,000-part rebuild joins 10,000).
    if (spare?.key === key && spareUnchanged(`${this.spareDir}/${unit}`, folder, spare.stamp)) return { key, from: 'spare', entry: spare };
    const live = this.liveDir ? this.record?.live?.get(unit) : undefined;
    if (live?.key === key && sameStamp(live.stamp, unitStamp(join(this.liveDir!, unit), folder))) return { key, from: 'live', entry: live };
    return { key, from: 'fresh' };
  }

  /**
   * Make the new site in `target(staging)`: the staging folder's files moved into the spare (when there is
   * one), then the units from the live site linked. Call once everything is written into the staging
   * folder, so that nothing is written through a link into the live site.
   */
  assemble(staging: string): void {
    const target = this.target(staging);
    if (target !== staging) {
      const keptHere = new PathsByFolder();
      const removed: string[] = [];
      this.record!.spare!.forEachUnit((unit) => {
        if (this.wanted.get(unit)?.from === 'spare') keptHere.add(unit);
        else removed.push(unit);
      });
      // Each folder of the spare is listed once, for the check and for the update (the parts/ folder of a
      // 10,000-part site holds 10,000 entries); the units removed below are skipped in those listings.
      const listings = new Map<string, Dirent[]>();
      const list = (dir: string) => {
        let found = listings.get(dir);
        if (!found) listings.set(dir, (found = readdirSync(dir, { withFileTypes: true })));
        return found;
      };
      // Before anything in it changes: a read-only folder there refuses the build, the spare given back as it was.
      checkSpare(this.outDir, { dir: target, shownAs: join(dirname(target), this.record!.spare!.name) }, keptHere, list);
      const gone = new PathsByFolder();
      for (const unit of removed) {
        removeTree(join(target, unit));
        gone.add(unit);
      }
      removeStale({ target, staging, kept: keptHere, gone, list }, '');
      moveInto(staging, target, '', this.wanted);
    }
    for (const [unit, w] of this.wanted) if (w.from === 'live') linkUnit(join(this.liveDir!, unit), join(target, unit));
  }

  /**
   * The record of the new site (in `target`, now at the site path) and of the version it replaced, kept
   * as the next build's spare when `replaced` names it.
   */
  nextRecord(target: string, replaced: string | undefined, pdfs: SiteRecord['pdfs']): SiteRecord {
    const name = basename(target);
    const base = this.spareDir ? this.record!.spare!.renamed(name) : new VersionRecord(name);
    if (this.spareDir) this.record!.spare!.forEachUnit((unit) => void (this.wanted.has(unit) || base.delete(unit)));
    for (const [unit, w] of this.wanted) {
      // A unit the spare keeps whose data was not set again is in `base` (the spare's record) as it is: not
      // looked up (10,000 units after one edit of 10,000 parts).
      if (w.from === 'spare' && w.data === undefined) continue;
      const before = this.spareDir ? base.get(unit) : undefined;
      if (w.from === 'spare' && before && sameData(before, w)) continue;
      const stamp = w.from === 'spare' && before ? before.stamp : unitStamp(join(target, unit), isFolderUnit(unit));
      const entry: UnitEntry = { key: w.key, stamp };
      // A kept unit whose data was not set again keeps what was recorded, unread.
      const kept = w.data === undefined ? this.recordedEntry(unit) : undefined;
      if (w.data !== undefined) entry.data = w.data;
      else if (kept?.text !== undefined) entry.text = kept.text;
      else if (kept?.data !== undefined) entry.data = kept.data;
      base.set(unit, entry);
    }
    const spare = replaced && this.record?.live?.name === replaced && this.liveDir ? this.record.live : undefined;
    return { outDir: this.outDir, live: base, spare, pdfs };
  }
}

/** A kept unit's recorded data is the same object when nothing set it again (and equal when it was: the record's text is ASCII). */
const sameData = (entry: UnitEntry, w: Wanted) => w.data === undefined || entry.data === w.data || asciiJson(entryText(entry) ?? '') === asciiJson(JSON.stringify(w.data));

/** Move the staging folder's files into `target`: a unit folder in one rename, other files one by one. */
function moveInto(staging: string, target: string, relative: string, units: ReadonlyMap<string, Wanted>): void {
  for (const entry of readdirSync(join(staging, relative), { withFileTypes: true })) {
    const path = relative ? `${relative}/${entry.name}` : entry.name;
    const from = join(staging, path);
    const to = join(target, path);
    if (entry.isDirectory() && !units.has(path)) {
      mkdirSync(to, { recursive: true });
      moveInto(staging, target, path, units);
    } else {
      if (entry.isDirectory()) rmSync(to, { recursive: true, force: true });
      mkdirSync(dirname(to), { recursive: true });
      renameSync(from, to);
    }
  }
}

/** Hard-link a unit (a folder's files, or a file) from the live site; a copy where links cannot be made. */
function linkUnit(from: string, to: string): void {
  rmSync(to, { recursive: true, force: true });
  const one = (a: string, b: string) => {
    try {
      linkSync(a, b);
    } catch {
      copyFileSync(a, b, constants.COPYFILE_EXCL);
    }
  };
  if (!lstatSync(from).isDirectory()) {
    mkdirSync(dirname(to), { recursive: true });
    one(from, to);
    return;
  }
  mkdirSync(to, { recursive: true });
  for (const name of readdirSync(from)) one(join(from, name), join(to, name));
}
