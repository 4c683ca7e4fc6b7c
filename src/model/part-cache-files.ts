// The part cache's files (part-cache.ts). A shard is two files: NN.lines holds one line an entry (its path,
// stamp and hash; the part's id, kind, flags and family fields, which a build reads of every part and a part
// handed out unparsed answers from (lazy-head.ts); its head: the part's early fields with the id it declares
// and its warnings, parsed when another early field is first read; and where its late fields are in
// NN.late), NN.late the late fields' texts (lazy-part.ts), which a build reads only when it first reads a
// late field of one of the shard's parts. Loading 10,000 cached parts reads the heads, a quarter of the
// bytes: reading and decoding the whole entries was most of loading them.
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
import { asciiJson, ParsedFiles } from './ascii-text.js';
import { writeAtomically } from './atomic-file.js';
import type { PartFacts } from './part-facts.js';

/**
 * A row's flags: `p` when its part is handed out parsed (it has measurements, warnings, an id declared other
 * than its own, or is kept as v8 bytes), else it is handed out with its head unparsed (lazy-head.ts); then `s`
 * when its part has a safety class; then `t` when its part has a temperature characteristic, followed by
 * `FROM:TO` (°C) when that is specified over a span (part-facts.ts).
 */
export const PARSED = 'p';
export const SAFETY = 's';
const TEMPERATURE = 't';

export function flagsText(parsed: boolean, { safety, temperature }: Pick<PartFacts, 'safety' | 'temperature'>): string {
  const span = typeof temperature === 'object' ? `${temperature.fromC}:${temperature.toC}` : '';
  return `${parsed ? PARSED : ''}${safety ? SAFETY : ''}${temperature === false ? '' : TEMPERATURE + span}`;
}

export function temperatureOf(flags: string): PartFacts['temperature'] {
  const at = flags.indexOf(TEMPERATURE);
  if (at < 0) return false;
  const span = flags.slice(at + 1);
  if (span === '') return true;
  const [fromC, toC] = span.split(':').map(Number);
  if (!Number.isFinite(fromC) || !Number.isFinite(toC)) throw new Error('not a part cache row');
  return { fromC, toC };
}

/** An entry as NN.lines holds it, each field as text. */
export interface HeadRow {
  /** The file's stamp as JSON text. */
  stamp: string;
  hash: string;
  /** The part's id and kind, its flags (flagsText, above) and its FAMILY_FIELDS as JSON text (part-facts.ts). */
  id: string;
  kind: string;
  flags: string;
  family: string;
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
  id: string;
  kind: string;
  flags: string;
  family: string;
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

/** The .lines files read in this process (ParsedFiles): 64 for a library's cache, a few libraries' worth. */
const HEADS = new ParsedFiles<Heads>(256);

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

  /**
   * A shard's head rows by path (none when its file is missing, unreadable or of other code). The rows are
   * shared with the other reads of the unchanged file in this process (HEADS) and are not changed.
   */
  heads(i: number): Heads {
    try {
      return { ...HEADS.read(this.file(i, 'lines'), `${this.format} ${this.key}`, (text, ascii) => this.parseHeads(text, ascii)) };
    } catch {
      // none yet, or unreadable: the shard's files are read again
      return { rows: new Map(), token: '', ascii: true };
    }
  }

  private parseHeads(text: string, ascii: boolean): Heads {
    const rows = new Map<string, HeadRow>();
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
      const line = asciiJson(`${JSON.stringify(e.path)}\t${e.stamp}\t${e.hash}\t${e.id}\t${e.kind}\t${e.flags}\t${e.family}\t${e.head}\t${holesAt.get(e.holes)}\t${at},${lateTexts[n].length}`);
      at += lateTexts[n].length + 1;
      return `${line}\n`;
    });
    writeAtomically(this.file(i, 'late'), header + lateTexts.map((t) => `${t}\n`).join(''));
    writeAtomically(this.file(i, 'lines'), header + heads.join(''));
  }
}

/** The fields of a .lines row: tab-separated (JSON text has no raw tab), the last holding the late text's offset and length. */
const ROW_FIELDS = 10;

function headRow(line: string, holes: readonly string[]): [string, HeadRow] {
  const cut: number[] = [];
  for (let from = 0, n = 0; n < ROW_FIELDS - 1; n++) {
    const tab = line.indexOf('\t', from);
    if (tab < 0) throw new Error('not a part cache line');
    cut.push(tab);
    from = tab + 1;
  }
  const field = (n: number) => line.slice(n === 0 ? 0 : cut[n - 1] + 1, cut[n]);
  const last = line.slice(cut[ROW_FIELDS - 2] + 1);
  const comma = last.indexOf(',');
  const hole = holes[Number(field(8))];
  const at = Number(last.slice(0, comma));
  const length = Number(last.slice(comma + 1));
  if (comma < 0 || hole === undefined || !Number.isInteger(at) || !Number.isInteger(length)) throw new Error('not a part cache line');
  return [JSON.parse(field(0)) as string, { stamp: field(1), hash: field(2), id: field(3), kind: field(4), flags: field(5), family: field(6), head: field(7), holes: hole, at, length }];
}

/** The late text of a row from its shard's .late bytes (ASCII: one byte a character). */
export function lateText(bytes: Buffer, row: HeadRow): string {
  if (row.at + row.length > bytes.length || bytes[row.at + row.length] !== 10) throw new Error('not the late text of this row');
  return bytes.toString('latin1', row.at, row.at + row.length);
}
