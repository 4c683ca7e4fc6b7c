// The record of the sites a build left: for the version at the site path (live) and for the one it replaced
// (spare, kept in the holding folder for the next build to update in place), what each unit of the site
// holds. A unit is a part folder (parts/ID), a comparison folder (comparisons/SLUG), an index page or a row
// script of the index: something the build can leave as it is when its key is unchanged. Each unit has a key
// (everything its bytes are made of, hashed), a stamp (size, mtime and inode of what a hand edit would touch)
// and, for a part, the data the index and the comparisons list of it.
//
// The record is sharded so that a build writes what changed, not the library: units go into SHARDS shards
// by a hash of their path; a shard is a file named by its content's hash, written once and shared by every
// version that holds it; a version is a list of shard names. A build that changes one part writes one or
// two shard files and a root file of a few kilobytes. Shards no version names any longer are removed.
//
// A unit's data is kept in its shard as JSON text and parsed only when asked for (entryData): a rebuild
// reads the data of the few parts on the pages it renders, not of the library, and the record of 10,000
// parts reads as 10,000 strings rather than a few hundred thousand objects.

import { sha256Hex } from '../model/sha256.js';
import { fnv1a } from '../model/fnv1a.js';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { PdfStamp } from './pdf-reuse.js';
import { asciiJson, ParsedFiles } from '../model/ascii-text.js';
import { writeAtomically } from '../model/atomic-file.js';

/** Shards of a version's units. */
export const SHARDS = 64;

export interface UnitEntry {
  key: string;
  /** See unitStamp (unit-stamp.ts). */
  stamp: number[];
  /** A part's data for the index and comparisons (ListedPart), and its full page data when a review shows it. */
  data?: unknown;
  /** The data as JSON text, as the record file holds it (read with entryData). */
  text?: string;
}

/** A unit's recorded data (parsed from its text when it was read from the record). */
export function entryData(entry: UnitEntry | undefined): unknown {
  if (!entry) return undefined;
  return entry.data !== undefined ? entry.data : entry.text !== undefined ? JSON.parse(entry.text) : undefined;
}

/** A unit's data as JSON text, or undefined when it has none. */
export function entryText(entry: UnitEntry): string | undefined {
  return entry.text ?? (entry.data === undefined ? undefined : JSON.stringify(entry.data));
}

/**
 * A shard's line for a unit: its path and stamp as JSON, its key, and its data's JSON text (empty for none),
 * separated by tabs (JSON text holds no raw tab or line end). Reading a shard splits lines and takes the
 * data's text as it stands, unparsed and unescaped; as a JSON string inside JSON, every quote in it was
 * escaped and had to be unescaped again, which was most of reading the record of 10,000 parts.
 */
function shardLine(unit: string, entry: UnitEntry): string {
  return asciiJson(`${JSON.stringify(unit)}\t${JSON.stringify(entry.key)}\t${JSON.stringify(entry.stamp)}\t${entryText(entry) ?? ''}`);
}

function readShardLines(text: string): Map<string, UnitEntry> {
  const map = new Map<string, UnitEntry>();
  for (const line of text.split('\n')) {
    if (line === '') continue;
    const a = line.indexOf('\t');
    const b = line.indexOf('\t', a + 1);
    const c = line.indexOf('\t', b + 1);
    if (a < 0 || b < 0 || c < 0) throw new Error('not a record shard');
    const entry: UnitEntry = { key: jsonString(line, a + 1, b), stamp: JSON.parse(line.slice(b + 1, c)) as number[] };
    if (c + 1 < line.length) entry.text = line.slice(c + 1);
    map.set(jsonString(line, 0, a), entry);
  }
  return map;
}

/**
 * The JSON string `text.slice(start, end)`: cut out of the line when it holds no escape (a unit's path and a
 * key seldom do), which spares a parse and a copy for each of the 20,000 strings of a 10,000-part record.
 */
function jsonString(text: string, start: number, end: number): string {
  const inner = text.slice(start + 1, end - 1);
  if (text.charCodeAt(start) === 34 && text.charCodeAt(end - 1) === 34 && end - start >= 2 && !inner.includes('\\') && !inner.includes('"')) return inner;
  return JSON.parse(text.slice(start, end)) as string;
}

/**
 * The shard files read in this process (ParsedFiles): a shard file is named by its content's hash and shared by
 * the versions that name it, 128 for the two versions of a site, and as many kept of shards since replaced
 * (the least recently read go first). Their maps are never changed (VersionRecord copies a shard before
 * changing it).
 */
const SHARD_FILES = new ParsedFiles<Map<string, UnitEntry>>(256);

/** Shards read as UTF-8 (written by an older version): saved again, as ASCII (ascii-text.ts). */
const NOT_ASCII = new WeakSet<Map<string, UnitEntry>>();

/** A shard's map, or a function that reads it (once: it is shared by the versions that name it). */
type ShardSource = Map<string, UnitEntry> | (() => Map<string, UnitEntry>);

/**
 * One version of the site: its folder's name in the holding folder, and its units by site-relative path.
 * Shard maps are shared (between the two versions read from one record, and with a renamed copy) until a
 * version changes one: it copies that shard first, so a rebuild copies the few shards it changes.
 */
export class VersionRecord {
  /** The name of each shard's file, as read (undefined: not written yet). */
  private readonly names: (string | undefined)[];
  /** Each shard's map, or what reads it on first use (a version whose units are all found in the other is never read). */
  private readonly shards: ShardSource[];
  private readonly dirty = new Set<number>();
  /** Shards this version may change in place (its own copies). */
  private readonly owned = new Set<number>();

  constructor(
    public name: string,
    shards?: ShardSource[],
    names?: (string | undefined)[],
  ) {
    this.shards = shards ? [...shards] : Array.from({ length: SHARDS }, () => new Map());
    if (!shards) for (let i = 0; i < SHARDS; i++) this.owned.add(i);
    this.names = names ?? Array.from({ length: SHARDS }, () => undefined);
    if (!names) for (let i = 0; i < SHARDS; i++) this.dirty.add(i);
  }

  get(unit: string): UnitEntry | undefined {
    return this.shard(shardOf(unit)).get(unit);
  }

  set(unit: string, entry: UnitEntry): void {
    const i = shardOf(unit);
    this.own(i).set(unit, entry);
    this.dirty.add(i);
  }

  delete(unit: string): void {
    const i = shardOf(unit);
    if (!this.shard(i).has(unit)) return;
    this.own(i).delete(unit);
    this.dirty.add(i);
  }

  *units(): IterableIterator<[string, UnitEntry]> {
    for (let i = 0; i < SHARDS; i++) yield* this.shard(i);
  }

  /** Each unit's path to `visit`, shard by shard: no iterator result or entry pair made a unit, as `units` makes. */
  forEachUnit(visit: (unit: string) => void): void {
    for (let i = 0; i < SHARDS; i++) this.shard(i).forEach((_entry, unit) => visit(unit));
  }

  /** A copy under another name, sharing the shard files and maps (entries are never changed in place). */
  renamed(name: string): VersionRecord {
    const copy = new VersionRecord(name, this.shards, [...this.names]);
    for (const i of this.dirty) copy.dirty.add(i);
    // Both now share every map: either copies a shard before changing it.
    this.owned.clear();
    return copy;
  }

  private own(i: number): Map<string, UnitEntry> {
    if (!this.owned.has(i)) {
      this.shards[i] = new Map(this.shard(i));
      this.owned.add(i);
    }
    return this.shard(i);
  }

  private shard(i: number): Map<string, UnitEntry> {
    const found = this.shards[i];
    if (found instanceof Map) return found;
    const map = (this.shards[i] = found());
    if (NOT_ASCII.has(map)) this.dirty.add(i);
    return map;
  }

  /** Write the shards changed since reading into `dir`; the names of all shards. */
  save(dir: string): string[] {
    for (const i of this.dirty) {
      const text = [...this.shard(i)].sort((a, b) => (a[0] < b[0] ? -1 : 1)).map(([unit, entry]) => `${shardLine(unit, entry)}\n`).join('');
      const name = `${sha256Hex(text).slice(0, 24)}.tsv`;
      if (!existsSync(join(dir, name))) writeAtomically(join(dir, name), text);
      this.names[i] = name;
    }
    this.dirty.clear();
    return this.names as string[];
  }
}

/** Every look-up of a unit goes through it, 10,000 and more a build. */
const shardOf = (unit: string) => fnv1a(unit) % SHARDS;

export interface SiteRecord {
  outDir: string;
  live?: VersionRecord;
  spare?: VersionRecord;
  /** The PDFs in the live site, by site-relative path (pdf-reuse.ts). */
  pdfs: Record<string, PdfStamp>;
}

interface RootFile {
  format: 4;
  outDir: string;
  live?: { name: string; shards: string[] };
  spare?: { name: string; shards: string[] };
  pdfs: Record<string, PdfStamp>;
}

/** The folder of an output folder's record under the cache's builds/. */
export function recordDir(cacheRoot: string, outDir: string): string {
  return join(cacheRoot, 'builds', sha256Hex(outDir).slice(0, 16));
}

const ROOT = 'root.json';

export function readSiteRecord(dir: string, outDir: string): SiteRecord | undefined {
  try {
    const root = JSON.parse(readFileSync(join(dir, ROOT), 'utf8')) as RootFile;
    if (root.format !== 4 || root.outDir !== outDir) return undefined;
    const cache = new Map<string, Map<string, UnitEntry>>();
    // Read when a version first asks (the spare is read whole, the live site only where the spare lacks a
    // unit), once for both versions, which share it: a version copies a shard before changing it. A shard
    // that cannot be read is empty: its units are then made afresh.
    const shard = (name: string) => () => {
      let map = cache.get(name);
      if (!map) {
        try {
          map = SHARD_FILES.read(join(dir, 'shards', name), '', (text, ascii) => {
            const read = readShardLines(text);
            if (!ascii) NOT_ASCII.add(read);
            return read;
          });
        } catch {
          map = new Map();
        }
        cache.set(name, map);
      }
      return map;
    };
    const version = (v: RootFile['live']) => (v && v.shards.length === SHARDS ? new VersionRecord(v.name, v.shards.map(shard), [...v.shards]) : undefined);
    return { outDir, live: version(root.live), spare: version(root.spare), pdfs: root.pdfs ?? {} };
  } catch {
    return undefined;
  }
}

/** Forget the record (before a version it describes is changed or replaced). */
export function dropSiteRecord(dir: string): void {
  rmSync(join(dir, ROOT), { force: true });
}

/** Write the record: the changed shards, then the root; then remove shards neither version names. */
export function writeSiteRecord(dir: string, record: SiteRecord): void {
  const shardDir = join(dir, 'shards');
  mkdirSync(shardDir, { recursive: true });
  const live = record.live && { name: record.live.name, shards: record.live.save(shardDir) };
  const spare = record.spare && { name: record.spare.name, shards: record.spare.save(shardDir) };
  const root: RootFile = { format: 4, outDir: record.outDir, live, spare, pdfs: record.pdfs };
  writeAtomically(join(dir, ROOT), JSON.stringify(root));
  const named = new Set([...(live?.shards ?? []), ...(spare?.shards ?? [])]);
  for (const name of readdirSync(shardDir)) if (!named.has(name)) rmSync(join(shardDir, name), { force: true });
  pruneRecords(join(dir, '..'));
}

/** Records of other output folders: the latest few are kept, so switching between two does not rebuild all. */
const RECORDS_KEPT = 8;

/** Drop records of output folders that are gone (a scratch folder of `zfolio print`, say), older formats, and all but the latest few. */
function pruneRecords(buildsDir: string): void {
  const records: { name: string; mtimeMs: number; outDir?: string }[] = [];
  for (const name of readdirSync(buildsDir)) {
    const path = join(buildsDir, name);
    try {
      const root = JSON.parse(readFileSync(join(path, ROOT), 'utf8')) as RootFile;
      records.push({ name, mtimeMs: statSync(join(path, ROOT)).mtimeMs, outDir: root.outDir });
    } catch {
      // A record of an older format (a .json file), or one being written by another build: the old kind goes.
      if (name.endsWith('.json')) rmSync(path, { force: true });
    }
  }
  records.sort((a, b) => b.mtimeMs - a.mtimeMs || (a.name < b.name ? -1 : 1));
  records.forEach(({ name, outDir }, i) => {
    if (i >= RECORDS_KEPT || outDir === undefined || !existsSync(outDir)) rmSync(join(buildsDir, name), { recursive: true, force: true });
  });
}
