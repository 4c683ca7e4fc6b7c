// Parts read before, kept between runs so that an unchanged part file is neither read nor parsed again.
// Each entry holds the file's stamp (size, mtime, ctime, inode and device, taken before it was read, so a
// file changed while it was read is read again next time), its content hash, the part read from it, the id
// it declares and the warnings reading it gave (replayed as if it had been read). Only files that read
// without errors are kept. A part from the cache has a source whose text and YAML document are read from
// the file on first use (only `zfolio diff`-style pairing of renamed parts asks for them).
//
// The entries are sharded by a hash of the path; a run writes only the shards it changed. Each entry is
// written as exact JSON (exact-json.ts: undefined values kept, the text checked to give the entry back), or,
// should JSON not keep it exactly (a -0, say), v8-serialised (the structured clone keeps every value as it
// is), in two pieces (part-cache-files.ts): its head (the part's early fields, with the id it declares and
// its warnings), parsed when another field than those its row answers is first used (lazy-head.ts: a part
// with measurements or warnings is parsed when handed out), and its late fields (lazy-part.ts), read and
// parsed only when the build first reads one (the title, the model, the parameters …: for the parts whose
// pages or charts it makes). Reading and parsing every part of a 10,000-part library whole at each build, the objects
// it made kept through the build, was a fifth of a rebuild after one edit. The parts handed out are the
// build's from then on (it adds measurement text to them, for one); a shard written again is made from its
// files as they are on disk and the entries this run stored.

import { mkdirSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { deserialize } from 'node:v8';
import { DiagnosticList, type Diagnostic, type SourcePosition } from './diagnostics.js';
import { decodeExact, type Holes } from './exact-json.js';
import { fromExactText, shardEntry, V8, type CachedRead, type Head } from './part-cache-entry.js';
import { lazyPart, splitPart } from './lazy-part.js';
import { partOnDemand } from './lazy-head.js';
import { LazySource } from './lazy-source.js';
import { lateText, PARSED, ShardFiles, SAFETY, temperatureOf, type HeadRow, type Heads, type ShardEntry } from './part-cache-files.js';
import { readPart } from './part.js';
import { fnv1a } from './fnv1a.js';
import type { Part } from './part.js';
import { parseYamlSource, type SourceFile } from './source.js';

const SHARDS = 64;
/** Changes whenever what an entry holds changes shape (or what reading a part gives does: see codeKey). */
const FORMAT = 6;
const SHARD_NAME = /^\d\d\.(lines|late)$/;

/** A shard as read: its head rows, and its late bytes once a part's late fields are asked for (null: not to be had). */
interface Shard extends Heads {
  late?: Buffer | null;
}

/** Where a cached part's late fields are: read when the part's first late field is. */
class LateFields {
  constructor(
    protected readonly cache: PartCache,
    private readonly shard: number,
    protected readonly path: string,
    protected readonly row: HeadRow,
  ) {}

  read(): Record<string, unknown> {
    return this.cache.lateFields(this.shard, this.path, this.row);
  }
}

/** Where a part handed out unparsed finds its head, and its late fields after. */
class HeadFields extends LateFields {
  head(): { early: Record<string, unknown>; lateKeys: readonly string[] } {
    return this.cache.earlyFields(this.path, this.row);
  }
}

export class PartCache {
  private readonly shards: (Shard | undefined)[] = Array.from({ length: SHARDS }, () => undefined);
  private readonly files: ShardFiles;
  /** Entries stored this run, made when stored (the part is the build's afterwards), by shard. */
  private readonly stored = new Map<number, Map<string, ShardEntry>>();
  /** Entries dropped this run (the file now has errors), by shard. */
  private readonly dropped = new Map<number, Set<string>>();
  private readonly seen = new Set<string>();
  private readonly parsedHoles = new Map<string, Holes>();
  /** The root as a prefix of library-relative paths (normalized, forward slashes: yamlFilesUnder). */
  private readonly prefix: string;
  /** Files read and parsed this run, and files taken from the cache. */
  readonly counts = { parsed: 0, cached: 0 };

  /** `key`: what else a part depends on (the code that reads it); a cache made under another key is ignored. */
  constructor(
    private readonly root: string,
    private readonly dir: string,
    key: string,
  ) {
    this.files = new ShardFiles(dir, key, FORMAT);
    this.prefix = root === '' || root.endsWith('/') ? root : `${root}/`;
  }

  /**
   * The stamp of a library file now (to be passed to `store` after reading it), or undefined: its size, mtime,
   * ctime, inode and device as the JSON text of their list (written out: the same text for finite numbers,
   * compared with the row's as it is); the path joined as text, as a 10,000-part build stamps 10,000 files.
   */
  stamp(path: string): string | undefined {
    const s = statSync(this.prefix + path, { throwIfNoEntry: false });
    return s && `[${s.size},${s.mtimeMs},${s.ctimeMs},${s.ino},${s.dev}]`;
  }

  /** The part read from `path` before, when the file is unchanged. Each entry is handed out once a run. */
  lookup(path: string, stamp: string | undefined): CachedRead | undefined {
    if (this.seen.has(path)) return undefined;
    this.seen.add(path);
    const i = shardOf(path);
    const row = stamp && this.shard(i).rows.get(path);
    if (!row || row.stamp !== stamp) return undefined;
    const parsed = row.flags.includes(PARSED), source = new LazySource(this.root, path, row.hash);
    let read: CachedRead;
    try {
      if (!parsed) {
        const part = partOnDemand({ id: row.id, kind: row.kind, source, facts: { family: row.family, safety: row.flags.includes(SAFETY), temperature: temperatureOf(row.flags) } }, new HeadFields(this, i, path, row));
        // The id the file declares is the part's own, at the part's own position.
        read = { part, declared: part, diagnostics: [] };
      } else if (row.head === V8) read = deserialize(Buffer.from(this.late(i, path, row), 'base64')) as CachedRead;
      else {
        const head = this.head(row);
        const declared = head.declared ?? { id: head.early.id as string, at: head.early.at as SourcePosition };
        read = { part: lazyPart(head.early, head.lateKeys, new LateFields(this, i, path, row)) as Part, declared, diagnostics: head.diagnostics ?? [] };
      }
    } catch {
      // a damaged row: read the file again
      return undefined;
    }
    if (parsed) read.part.source = source;
    this.counts.cached++;
    return read;
  }

  /** A row's head parsed. */
  head(row: HeadRow): Head {
    return decodeExact<Head>(JSON.parse(row.head), this.holes(row.holes));
  }

  /** A holes text parsed, once a build (a shard's rows share a handful; decodeExact only reads them). */
  private holes(text: string): Holes {
    let found = this.parsedHoles.get(text);
    if (!found) this.parsedHoles.set(text, (found = JSON.parse(text) as Holes));
    return found;
  }

  /** A cached part's late fields: from its shard's .late file, else (that file lost or rewritten by another run) from the part file, when its hash is unchanged. */
  lateFields(i: number, path: string, row: HeadRow): Record<string, unknown> {
    try {
      return fromExactText<Record<string, unknown>>(this.late(i, path, row));
    } catch {
      return this.fromFile(path, row).late;
    }
  }

  /** A part's early fields and late keys, from its row's head, else (the head damaged) from the part file, when its hash is unchanged. */
  earlyFields(path: string, row: HeadRow): { early: Record<string, unknown>; lateKeys: readonly string[] } {
    try {
      return this.head(row);
    } catch {
      const { early, late } = this.fromFile(path, row);
      return { early, lateKeys: Object.keys(late) };
    }
  }

  /** A part's fields read afresh from its file, split as the cache keeps them; an error when the file changed since its row was written. */
  private fromFile(path: string, row: HeadRow): { early: Record<string, unknown>; late: Record<string, unknown> } {
    const text = readFileSync(join(this.root, path), 'utf8');
    const source = parseYamlSource(path, text, new DiagnosticList());
    const part = source?.hash === row.hash ? readPart({ source, diagnostics: new DiagnosticList() }) : undefined;
    if (!part) throw new Error(`${path} changed while it was read; run again`);
    const { source: _source, ...fields } = part;
    return splitPart(fields);
  }

  private late(i: number, path: string, row: HeadRow): string {
    const shard = this.shard(i);
    if (shard.late === undefined) shard.late = this.files.late(i, shard.token) ?? null;
    if (!shard.late) throw new Error(`no late fields for ${path}`);
    return lateText(shard.late, row);
  }

  /** Keep what reading `path` gave (call only when it gave no errors). */
  store(path: string, stamp: string | undefined, read: CachedRead): void {
    this.counts.parsed++;
    this.seen.add(path);
    if (!stamp) return;
    this.changes(this.stored, shardOf(path), () => new Map()).set(path, shardEntry(path, stamp, read));
    this.dropped.get(shardOf(path))?.delete(path);
  }

  /** A file read afresh that cannot be kept (it has errors): counted, and any old entry dropped. */
  parsed(path: string): void {
    this.counts.parsed++;
    this.seen.add(path);
    this.stored.get(shardOf(path))?.delete(path);
    if (this.shard(shardOf(path)).rows.has(path)) this.changes(this.dropped, shardOf(path), () => new Set()).add(path);
  }

  /** Write the shards changed, dropping entries of files not looked up this run (removed from the library). */
  save(): void {
    const dirty = new Set<number>([...this.stored.keys(), ...this.dropped.keys()]);
    for (let i = 0; i < SHARDS; i++) {
      const shard = this.shards[i];
      if (shard && (!shard.ascii || [...shard.rows.keys()].some((path) => !this.seen.has(path)))) dirty.add(i);
    }
    if (dirty.size === 0) return;
    mkdirSync(this.dir, { recursive: true });
    for (const i of dirty) {
      // The entries as the files hold them (the parts handed out may have been changed since), less those of
      // files gone or now with errors, with those stored this run.
      const onDisk = this.files.heads(i);
      const lateBytes = this.files.late(i, onDisk.token);
      const entries = new Map<string, ShardEntry>();
      for (const [path, row] of onDisk.rows) {
        if (!this.seen.has(path) || this.dropped.get(i)?.has(path) || !lateBytes) continue;
        try {
          entries.set(path, { path, stamp: row.stamp, hash: row.hash, id: row.id, kind: row.kind, flags: row.flags, family: row.family, head: row.head, holes: row.holes, late: lateText(lateBytes, row) });
        } catch {
          // a damaged row: its file is read again next time
        }
      }
      for (const [path, entry] of this.stored.get(i) ?? []) entries.set(path, entry);
      // The parts handed out from this shard read their late fields from the bytes they were read with.
      const shard = this.shards[i];
      if (shard && shard.late === undefined) shard.late = shard.token === onDisk.token ? (lateBytes ?? null) : null;
      this.files.write(i, [...entries.values()]);
    }
    this.stored.clear();
    this.dropped.clear();
    for (const name of readdirSync(this.dir)) if (!SHARD_NAME.test(name)) rmSync(join(this.dir, name), { force: true });
  }

  private changes<T>(all: Map<number, T>, i: number, make: () => T): T {
    let found = all.get(i);
    if (!found) all.set(i, (found = make()));
    return found;
  }

  private shard(i: number): Shard {
    return (this.shards[i] ??= this.files.heads(i));
  }
}

/** A spread of paths over shards, cheap enough to run per file. */
const shardOf = (path: string) => fnv1a(path) % SHARDS;
