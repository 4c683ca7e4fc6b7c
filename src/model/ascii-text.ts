// Cache files written as ASCII and read back as one-byte text. Node decodes a file of 12 MB as UTF-8 several
// times slower than as Latin-1 (measured: about 200 ms against under 10 ms for a build record of 10,000
// parts, whose listed data has Ω, µ, ≤ and — in it), and a string with one character beyond Latin-1 is held
// at two bytes a character. JSON keeps any character as a \u escape, so the caches (part-cache.ts, and the
// build record in src/build/site-record.ts) write every character beyond ASCII that way, and a file that is
// all ASCII is read as Latin-1, which gives the same string. A file with other bytes (written by an older
// version) is read as UTF-8, as before.

import { isAscii } from 'node:buffer';
import { readFileSync } from 'node:fs';

const BEYOND_ASCII = /[\u0080-\uffff]/g;

/** JSON text with every character beyond ASCII written as a \u escape: the same value when parsed. */
export function asciiJson(text: string): string {
  return text.replace(BEYOND_ASCII, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/**
 * A file's text: decoded as Latin-1 when every byte is ASCII (the same string, decoded faster), else as UTF-8;
 * `ascii` says which, so that a cache file of an older version can be written again as ASCII.
 */
export function readText(path: string): { text: string; ascii: boolean } {
  const bytes = readFileSync(path);
  const ascii = isAscii(bytes);
  return { text: bytes.toString(ascii ? 'latin1' : 'utf8'), ascii };
}
