// The part cache's files (part-cache.ts). A shard is two files: NN.lines holds one line an entry (its path,
// stamp and hash, its head: the part's early fields with the id it declares and its warnings, and where its
// late fields are in NN.late), NN.late the late fields' texts (lazy-part.ts), which a build reads only when
// it first reads a late field of one of the shard's parts. Loading 10,000 cached parts reads the heads, a
// quarter of the bytes: reading and decoding the whole entries was most of loading them.
//
// Both files start with a header line: the format, the code key, and a hash of the late texts (the token),
// which the .lines file names, so that a .late file whose .lines was not written after it (a run stopped
// between the two renames) is known and not read. Fields on a line are tab-separated (JSON text holds no raw
// tab or line end); both files are ASCII (ascii-text.ts), so a byte offset is a character offset. Where a
// head's undefined values are (its holes, exact-json.ts) is the same for most parts of a kind: the .lines
// header lists each distinct holes text once and a line names its own by index.

import { sha256Hex } from './sha256.js';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { asciiJson, readText } from './ascii-text.js';
import { writeAtomically } from './atomic-file.js';

/** An entry as NN.lines holds it, each field as text. */
export interface HeadRow {
  /** The file's stamp as JSON text. */
  stamp: string;
  hash: string;
  head: string;
  /** Where the head's undefined values are (exact-json.ts), as JSON text: one string per distinct text in a shard. */
  holes: string;
  /** Where its late text is in NN.late: byte offset and length. */
  at: number;
  length: number;
}

/** An entry to write: its head row's fields and its late text. */
export interface ShardEntry {
  path: string;
  stamp: string;
  hash: string;
  head: string;
  holes: string;
  late: string;
}

export interface Heads {
  rows: Map<string, HeadRow>;
  /** The hash of the .late file's texts that go with these rows. */
  token: string;
  /** False when the file had bytes beyond ASCII (written by hand or damaged): written again. */
  ascii: boolean;
}

interface Header {
  format?: number;
  key?: string;
  token?: string;
  /** The distinct holes texts of the shard's rows (a row names its own by index): 10,000 parts have a handful. */
  holes?: string[];
}

export class ShardFiles {
  constructor(
    private readonly dir: string,
    private readonly key: string,
    private readonly format: number,
  ) {}

  private file(i: number, suffix: 'lines' | 'late'): string {
    return join(this.dir, `${String(i).padStart(2, '0')}.${suffix}`);
  }

  private header(line: string): Header | undefined {
    const header = JSON.parse(line) as Header;
    return header.format === this.format && header.key === this.key && typeof header.token === 'string' ? header : undefined;
  }

  /** A shard's head rows by path (none when its file is missing, unreadable or of other code). */
  heads(i: number): Heads {
    const rows = new Map<string, HeadRow>();
    let ascii = true;
    try {
      const read = readText(this.file(i, 'lines'));
      ascii = read.ascii;
      const { text } = read;
      const end = text.indexOf('\n');
      const header = this.header(text.slice(0, end));
      if (!header || !Array.isArray(header.holes) || !header.holes.every((h) => typeof h === 'string')) return { rows, token: '', ascii };
      for (let at = end + 1; at < text.length; ) {
        const next = text.indexOf('\n', at);
        const stop = next < 0 ? text.length : next;
        if (stop > at) {
          const [path, row] = headRow(text.slice(at, stop), header.holes);
          rows.set(path, row);
        }
        at = stop + 1;
      }
      return { rows, token: header.token!, ascii };
    } catch {
      // none yet, or unreadable: the shard's files are read again
      rows.clear();
      return { rows, token: '', ascii };
    }
  }

  /** The bytes of a shard's .late file when its header names this token, else undefined. */
  late(i: number, token: string): Buffer | undefined {
    if (!token) return undefined;
    try {
      const bytes = readFileSync(this.file(i, 'late'));
      const end = bytes.indexOf(10);
      return this.header(bytes.toString('latin1', 0, end))?.token === token ? bytes : undefined;
    } catch {
      return undefined;
    }
  }

  /** Write a shard's two files: the late texts first, then the heads that name them. */
  write(i: number, entries: readonly ShardEntry[]): void {
    const lateTexts = entries.map((e) => asciiJson(e.late));
    const token = sha256Hex(lateTexts.join('\n')).slice(0, 32);
    const holes = [...new Set(entries.map((e) => e.holes))];
    const holesAt = new Map(holes.map((h, i) => [h, i]));
    const header = `${asciiJson(JSON.stringify({ format: this.format, key: this.key, token, holes }))}\n`;
    let at = header.length;
    const heads = entries.map((e, n) => {
      const line = asciiJson(`${JSON.stringify(e.path)}\t${e.stamp}\t${e.hash}\t${e.head}\t${holesAt.get(e.holes)}\t${at},${lateTexts[n].length}`);
      at += lateTexts[n].length + 1;
      return `${line}\n`;
    });
    writeAtomically(this.file(i, 'late'), header + lateTexts.map((t) => `${t}\n`).join(''));
    writeAtomically(this.file(i, 'lines'), header + heads.join(''));
  }
}

function headRow(line: string, holes: readonly string[]): [string, HeadRow] {
  const a = line.indexOf('\t');
  const b = line.indexOf('\t', a + 1);
  const c = line.indexOf('\t', b + 1);
  const d = line.indexOf('\t', c + 1);
  const h = line.indexOf('\t', d + 1);
  const e = line.indexOf(',', h + 1);
  if (a < 0 || b < 0 || c < 0 || d < 0 || h < 0 || e < 0) throw new Error('not a part cache line');
  const hole = holes[Number(line.slice(d + 1, h))];
  const at = Number(line.slice(h + 1, e));
  const length = Number(line.slice(e + 1));
  if (hole === undefined || !Number.isInteger(at) || !Number.isInteger(length)) throw new Error('not a part cache line');
  return [JSON.parse(line.slice(0, a)) as string, { stamp: line.slice(a + 1, b), hash: line.slice(b + 1, c), head: line.slice(c + 1, d), holes: hole, at, length }];
}

/** The late text of a row from its shard's .late bytes (ASCII: one byte a character). */
export function lateText(bytes: Buffer, row: HeadRow): string {
  if (row.at + row.length > bytes.length || bytes[row.at + row.length] !== 10) throw new Error('not the late text of this row');
  return bytes.toString('latin1', row.at, row.at + row.length);
}
