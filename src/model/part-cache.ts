// Parts read before, kept between runs so that an unchanged part file is neither read nor parsed again.
// Each entry holds the file's stamp (size, mtime, ctime, inode and device, taken before it was read, so a
// file changed while it was read is read again next time), its content hash, the part read from it, the id
// it declares and the warnings reading it gave (replayed as if it had been read). Only files that read
// without errors are kept. A part from the cache has a source whose text and YAML document are read from
// the file on first use (only `zfolio diff`-style pairing of renamed parts asks for them).
//
// The entries are sharded by a hash of the path, a shard a file of v8-serialised entries (the structured
// clone keeps undefined, -0 and every number as they are); a run writes only the shards it changed.

import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { deserialize, serialize } from 'node:v8';
import { DiagnosticList, type Diagnostic, type SourcePosition } from './diagnostics.js';
import type { Part } from './part.js';
import { parseYamlSource, type SourceFile } from './source.js';

const SHARDS = 64;
/** Changes whenever what an entry holds changes shape (or what reading a part gives does: see codeKey). */
const FORMAT = 1;

export interface CachedRead {
  part: Part;
  declared: { id: string; at: SourcePosition };
  diagnostics: Diagnostic[];
}

interface Entry {
  stamp: number[];
  hash: string;
  /** v8-serialised Part without its source. */
  part: Uint8Array;
  declared: { id: string; at: SourcePosition };
  diagnostics: Diagnostic[];
}

export class PartCache {
  private readonly shards: (Map<string, Entry> | undefined)[] = Array.from({ length: SHARDS }, () => undefined);
  private readonly dirty = new Set<number>();
  private readonly seen = new Set<string>();
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
    try {
      const s = statSync(join(this.root, path));
      return [s.size, s.mtimeMs, s.ctimeMs, s.ino, s.dev];
    } catch {
      return undefined;
    }
  }

  /** The part read from `path` before, when the file is unchanged. */
  lookup(path: string, stamp: number[] | undefined): CachedRead | undefined {
    this.seen.add(path);
    const entry = stamp && this.shard(path).get(path);
    if (!entry || !sameStamp(entry.stamp, stamp)) return undefined;
    try {
      const part = deserialize(entry.part) as Part;
      part.source = lazySource(this.root, path, entry.hash);
      this.counts.cached++;
      return { part, declared: entry.declared, diagnostics: entry.diagnostics };
    } catch {
      return undefined;
    }
  }

  /** Keep what reading `path` gave (call only when it gave no errors). */
  store(path: string, stamp: number[] | undefined, read: CachedRead): void {
    this.counts.parsed++;
    if (!stamp) return;
    const { source, ...rest } = read.part;
    const i = shardOf(path);
    this.shard(path).set(path, { stamp, hash: source.hash, part: serialize({ ...rest, source: undefined }), declared: read.declared, diagnostics: read.diagnostics });
    this.dirty.add(i);
  }

  /** A file read afresh that cannot be kept (it has errors): counted, and any old entry dropped. */
  parsed(path: string): void {
    this.counts.parsed++;
    if (this.shard(path).delete(path)) this.dirty.add(shardOf(path));
  }

  /** Write the shards changed, dropping entries of files not looked up this run (removed from the library). */
  save(): void {
    for (let i = 0; i < SHARDS; i++) {
      const shard = this.shards[i];
      if (!shard) continue;
      for (const path of shard.keys()) {
        if (this.seen.has(path)) continue;
        shard.delete(path);
        this.dirty.add(i);
      }
    }
    if (this.dirty.size === 0) return;
    mkdirSync(this.dir, { recursive: true });
    for (const i of this.dirty) {
      const file = join(this.dir, `${String(i).padStart(2, '0')}.v8`);
      const temp = `${file}.${process.pid}.tmp`;
      writeFileSync(temp, serialize({ format: FORMAT, key: this.key, entries: this.shards[i] }));
      renameSync(temp, file);
    }
    this.dirty.clear();
    for (const name of readdirSync(this.dir)) if (!/^\d\d\.v8$/.test(name)) rmSync(join(this.dir, name), { force: true });
  }

  private shard(path: string): Map<string, Entry> {
    const i = shardOf(path);
    let shard = this.shards[i];
    if (!shard) {
      shard = new Map();
      try {
        const data = deserialize(readFileSync(join(this.dir, `${String(i).padStart(2, '0')}.v8`))) as { format?: number; key?: string; entries?: Map<string, Entry> };
        if (data.format === FORMAT && data.key === this.key && data.entries instanceof Map) shard = data.entries;
      } catch {
        // none yet, or unreadable: read the files again
      }
      this.shards[i] = shard;
    }
    return shard;
  }
}

const shardOf = (path: string) => createHash('sha1').update(path).digest().readUInt32BE(0) % SHARDS;

const sameStamp = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/** A source whose text and document are read from the file when first asked for. */
function lazySource(root: string, path: string, hash: string): SourceFile {
  let parsed: SourceFile | undefined;
  const load = (): SourceFile => {
    if (!parsed) {
      const text = readFileSync(join(root, path), 'utf8');
      parsed = parseYamlSource(path, text, new DiagnosticList());
      if (!parsed) throw new Error(`${path} changed while it was read and no longer parses; run again`);
    }
    return parsed;
  };
  return {
    path,
    hash,
    get text() {
      return load().text;
    },
    get document() {
      return load().document;
    },
    get lines() {
      return load().lines;
    },
  };
}
