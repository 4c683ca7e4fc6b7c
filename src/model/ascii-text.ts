// Cache files written as ASCII and read back as one-byte text. Node decodes a file of 12 MB as UTF-8 several
// times slower than as Latin-1 (measured: about 200 ms against under 10 ms for a build record of 10,000
// parts, whose listed data has Ω, µ, ≤ and — in it), and a string with one character beyond Latin-1 is held
// at two bytes a character. JSON keeps any character as a \u escape, so the caches (part-cache.ts, and the
// build record in src/build/site-record.ts) write every character beyond ASCII that way, and a file that is
// all ASCII is read as Latin-1, which gives the same string. A file with other bytes (written by an older
// version) is read as UTF-8, as before.

import { isAscii } from 'node:buffer';
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';

const BEYOND_ASCII = /[\u0080-\uffff]/g;

/** JSON text with every character beyond ASCII written as a \u escape: the same value when parsed. */
export function asciiJson(text: string): string {
  return text.replace(BEYOND_ASCII, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** Files up to this size are read into one buffer kept for the next (SCRATCH_LIMIT). */
const SCRATCH_LIMIT = 8 << 20;
let scratch = Buffer.alloc(0);

/**
 * A file's bytes, in a buffer valid until the next call. A file of up to SCRATCH_LIMIT is read into a buffer
 * kept from call to call: the pages of a buffer allocated afresh are faulted in by the kernel as they are
 * first written, which cost more than the read itself (64 files of 8.5 MB in all, measured: 20 to 33 ms of
 * system time read each into a new buffer, 2 to 11 ms into one kept).
 */
function readBytes(path: string): Buffer {
  const fd = openSync(path, 'r');
  try {
    return readOpen(fd, fstatSync(fd).size);
  } finally {
    closeSync(fd);
  }
}

/** The bytes of the open file `fd`, whose size was `size` (see readBytes). */
function readOpen(fd: number, size: number): Buffer {
  const bytes = size > SCRATCH_LIMIT ? Buffer.allocUnsafe(size) : scratch.length >= size + 1 ? scratch : (scratch = Buffer.allocUnsafe(Math.max(size + 1, 2 * scratch.length, 1 << 16)));
  let filled = 0;
  // Read up to the size the file had, and on past it should it have grown since.
  for (let n = 1; n > 0 && filled < bytes.length; filled += n) n = readSync(fd, bytes, filled, bytes.length - filled, null);
  if (filled === bytes.length && bytes !== scratch) return bytes;
  if (filled < bytes.length) return bytes.subarray(0, filled);
  // The file grew beyond its stated size: read it whole.
  const rest: Buffer[] = [Buffer.from(bytes.subarray(0, filled))];
  const chunk = Buffer.allocUnsafe(1 << 16);
  for (let n = readSync(fd, chunk, 0, chunk.length, null); n > 0; n = readSync(fd, chunk, 0, chunk.length, null)) rest.push(Buffer.from(chunk.subarray(0, n)));
  return Buffer.concat(rest);
}

/**
 * A file's text: decoded as Latin-1 when every byte is ASCII (the same string, decoded faster), else as UTF-8;
 * `ascii` says which, so that a cache file of an older version can be written again as ASCII.
 */
export function readText(path: string): { text: string; ascii: boolean } {
  return decoded(readBytes(path));
}

/** Bytes as readText decodes them. */
function decoded(bytes: Buffer): { text: string; ascii: boolean } {
  const ascii = isAscii(bytes);
  return { text: bytes.toString(ascii ? 'latin1' : 'utf8'), ascii };
}

/**
 * What files were parsed into, kept by path while a file's size, times, inode and device are unchanged, for a
 * process that builds again and again (zfolio serve): its rebuilds after one edit of 10,000 parts read the
 * caches' unchanged files (some 13 MB) once. `tag` names what else the value depends on (the code that
 * parsed it). At most `limit` files are kept, the least recently read dropped first. A value handed out is
 * shared by every read that finds it: callers must not change it.
 */
export class ParsedFiles<T> {
  private readonly kept = new Map<string, { stamp: string; value: T }>();

  constructor(private readonly limit: number) {}

  read(path: string, tag: string, parse: (text: string, ascii: boolean) => T): T {
    const fd = openSync(path, 'r');
    try {
      const s = fstatSync(fd);
      const stamp = `${tag}\n${s.size},${s.mtimeMs},${s.ctimeMs},${s.ino},${s.dev}`;
      const found = this.kept.get(path);
      this.kept.delete(path);
      if (found?.stamp === stamp) {
        this.kept.set(path, found);
        return found.value;
      }
      const { text, ascii } = decoded(readOpen(fd, s.size));
      const value = parse(text, ascii);
      this.kept.set(path, { stamp, value });
      if (this.kept.size > this.limit) this.kept.delete(this.kept.keys().next().value as string);
      return value;
    } finally {
      closeSync(fd);
    }
  }
}
