// Parts read before, kept between runs so that an unchanged part file is neither read nor parsed again.
// Each entry holds the file's stamp (size, mtime, ctime, inode and device, taken before it was read, so a
// file changed while it was read is read again next time), its content hash, the part read from it, the id
// it declares and the warnings reading it gave (replayed as if it had been read). Only files that read
// without errors are kept. A part from the cache has a source whose text and YAML document are read from
// the file on first use (only `zfolio diff`-style pairing of renamed parts asks for them).
//
// The entries are sharded by a hash of the path; a run writes only the shards it changed. A shard is one
// JSON file, parsed at once into every part it holds: each entry is written as exact JSON (exact-json.ts:
// undefined values kept, the text checked to give the entry back), or, should JSON not keep it exactly
// (a -0, say), v8-serialised (the structured clone keeps every value as it is). In a library of 10,000
// parts, one v8 deserialisation per part was half of loading, and JSON is read several times faster than
// v8's format. The parts handed out are the build's from then on (it adds measurement text to them, for
// one); a shard written again is made from its file as it is on disk and the entries this run stored.

import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { deserialize, serialize } from 'node:v8';
import { DiagnosticList, type Diagnostic, type SourcePosition } from './diagnostics.js';
import { asciiJson, readText } from './ascii-text.js';
import { decodeExact, encodeExact, type Holes } from './exact-json.js';
import type { Part } from './part.js';
import { parseYamlSource, type SourceFile } from './source.js';

const SHARDS = 64;
/** Changes whenever what an entry holds changes shape (or what reading a part gives does: see codeKey). */
const FORMAT = 3;

export interface CachedRead {
  part: Part;
  declared: { id: string; at: SourcePosition };
  diagnostics: Diagnostic[];
}

interface Entry {
  stamp: number[];
  hash: string;
  /** The part; its source (undefined here) is set when it is handed out. */
  part: Omit<Part, 'source'> & { source?: SourceFile };
  declared: { id: string; at: SourcePosition };
  diagnostics: Diagnostic[];
}

/** An entry as its shard file holds it: [path, entry as exact JSON, its holes] or [path, base64 of v8 bytes]. */
type Row = [string, unknown, Holes] | [string, string];

interface ShardFile {
  format?: number;
  key?: string;
  rows?: Row[];
}

/** An entry's row, as JSON text. */
function rowText(path: string, entry: Entry): string {
  const exact = encodeExact(entry);
  if (exact) return asciiJson(`[${JSON.stringify(path)},${exact.text},${JSON.stringify(exact.holes)}]`);
  return asciiJson(JSON.stringify([path, Buffer.from(serialize(entry)).toString('base64')]));
}

function rowEntry(row: Row): Entry {
  return row.length === 3 ? decodeExact<Entry>(row[1], row[2]) : (deserialize(Buffer.from(row[1], 'base64')) as Entry);
}

export class PartCache {
  private readonly shards: (Map<string, Entry> | undefined)[] = Array.from({ length: SHARDS }, () => undefined);
  /** Rows of the entries stored this run, made when stored (the part is the build's afterwards), by shard. */
  private readonly stored = new Map<number, Map<string, string>>();
  /** Entries dropped this run (the file now has errors), by shard. */
  private readonly dropped = new Map<number, Set<string>>();
  private readonly seen = new Set<string>();
  /** Shards read as UTF-8 (written by an older version): written again, as ASCII (ascii-text.ts). */
  private readonly notAscii = new Set<number>();
  /** Files read and parsed this run, and files taken from the cache. */
  readonly counts = { parsed: 0, cached: 0 };

  /** `key`: what else a part depends on (the code that reads it); a cache made under another key is ignored. */
  constructor(
    private readonly root: string,
    private readonly dir: string,
    private readonly key: string,
  ) {}

  /** The stamp of a library file now (to be passed to `store` after reading it), or undefined. */
  stamp(path: string): number[] | undefined {
    const s = statSync(join(this.root, path), { throwIfNoEntry: false });
    return s && [s.size, s.mtimeMs, s.ctimeMs, s.ino, s.dev];
  }

  /** The part read from `path` before, when the file is unchanged. Each entry is handed out once a run. */
  lookup(path: string, stamp: number[] | undefined): CachedRead | undefined {
    if (this.seen.has(path)) return undefined;
    this.seen.add(path);
    const entry = stamp && this.shard(path).get(path);
    if (!entry || !sameStamp(entry.stamp, stamp)) return undefined;
    const part = entry.part as Part;
    part.source = new LazySource(this.root, path, entry.hash);
    this.counts.cached++;
    return { part, declared: entry.declared, diagnostics: entry.diagnostics };
  }

  /** Keep what reading `path` gave (call only when it gave no errors). */
  store(path: string, stamp: number[] | undefined, read: CachedRead): void {
    this.counts.parsed++;
    this.seen.add(path);
    if (!stamp) return;
    const { source, ...rest } = read.part;
    const entry = { stamp, hash: source.hash, part: { ...rest, source: undefined }, declared: read.declared, diagnostics: read.diagnostics };
    this.changes(this.stored, shardOf(path), () => new Map()).set(path, rowText(path, entry));
    this.dropped.get(shardOf(path))?.delete(path);
  }

  /** A file read afresh that cannot be kept (it has errors): counted, and any old entry dropped. */
  parsed(path: string): void {
    this.counts.parsed++;
    this.seen.add(path);
    this.stored.get(shardOf(path))?.delete(path);
    if (this.shard(path).has(path)) this.changes(this.dropped, shardOf(path), () => new Set()).add(path);
  }

  /** Write the shards changed, dropping entries of files not looked up this run (removed from the library). */
  save(): void {
    const dirty = new Set<number>([...this.stored.keys(), ...this.dropped.keys(), ...this.notAscii]);
    for (let i = 0; i < SHARDS; i++) {
      const shard = this.shards[i];
      if (shard && [...shard.keys()].some((path) => !this.seen.has(path))) dirty.add(i);
    }
    if (dirty.size === 0) return;
    mkdirSync(this.dir, { recursive: true });
    for (const i of dirty) {
      // The rows as the file holds them (the parts handed out may have been changed since), less those of
      // files gone or now with errors, with those stored this run.
      const rows = new Map(this.readRows(i).map((row) => [row[0], asciiJson(JSON.stringify(row))]));
      for (const path of [...rows.keys()]) if (!this.seen.has(path) || this.dropped.get(i)?.has(path)) rows.delete(path);
      for (const [path, text] of this.stored.get(i) ?? []) rows.set(path, text);
      const file = this.shardFile(i);
      const temp = `${file}.${process.pid}.tmp`;
      writeFileSync(temp, `{"format":${FORMAT},"key":${asciiJson(JSON.stringify(this.key))},"rows":[\n${[...rows.values()].join(',\n')}\n]}\n`);
      renameSync(temp, file);
    }
    this.stored.clear();
    this.dropped.clear();
    this.notAscii.clear();
    for (const name of readdirSync(this.dir)) if (!/^\d\d\.json$/.test(name)) rmSync(join(this.dir, name), { force: true });
  }

  private changes<T>(all: Map<number, T>, i: number, make: () => T): T {
    let found = all.get(i);
    if (!found) all.set(i, (found = make()));
    return found;
  }

  private shardFile(i: number): string {
    return join(this.dir, `${String(i).padStart(2, '0')}.json`);
  }

  /** A shard's rows as its file holds them (none when it is missing, unreadable or of other code). */
  private readRows(i: number): Row[] {
    try {
      const { text, ascii } = readText(this.shardFile(i));
      if (!ascii) this.notAscii.add(i);
      const data = JSON.parse(text) as ShardFile;
      if (data.format === FORMAT && data.key === this.key && Array.isArray(data.rows)) return data.rows;
    } catch {
      // none yet, or unreadable: read the files again
    }
    return [];
  }

  private readShard(i: number): Map<string, Entry> {
    const entries = new Map<string, Entry>();
    try {
      for (const row of this.readRows(i)) entries.set(row[0], rowEntry(row));
    } catch {
      // a damaged row: read the shard's files again
      entries.clear();
    }
    return entries;
  }

  private shard(path: string): Map<string, Entry> {
    const i = shardOf(path);
    return (this.shards[i] ??= this.readShard(i));
  }
}

/** FNV-1a over the path's UTF-16 code units: a spread of paths over shards, cheap enough to run per file. */
function shardOf(path: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < path.length; i++) h = Math.imul(h ^ path.charCodeAt(i), 0x01000193);
  return (h >>> 0) % SHARDS;
}

const sameStamp = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/** A source whose text and document are read from the file when first asked for. */
class LazySource implements SourceFile {
  private parsed?: SourceFile;

  constructor(
    private readonly root: string,
    readonly path: string,
    readonly hash: string,
  ) {}

  private load(): SourceFile {
    if (!this.parsed) {
      const text = readFileSync(join(this.root, this.path), 'utf8');
      this.parsed = parseYamlSource(this.path, text, new DiagnosticList());
      if (!this.parsed) throw new Error(`${this.path} changed while it was read and no longer parses; run again`);
    }
    return this.parsed;
  }

  get text() {
    return this.load().text;
  }

  get document() {
    return this.load().document;
  }

  get lines() {
    return this.load().lines;
  }
}
