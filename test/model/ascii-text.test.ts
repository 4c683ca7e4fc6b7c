// Cache text written as ASCII and read back as one-byte text (src/model/ascii-text.ts): the escapes give back
// every character (JSON's \u escapes, ECMA-404 section 9, UTF-16 code units: a character beyond U+FFFF is a
// surrogate pair), and a file of other bytes is still read as UTF-8. The build record and the part cache that
// write through it are checked here too: a shard an older version wrote with UTF-8 is written again as ASCII.

import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { asciiJson, ParsedFiles, readText } from '../../src/model/ascii-text.js';
import { entryData, readSiteRecord, VersionRecord, writeSiteRecord } from '../../src/build/site-record.js';
import { tempDir } from '../site-helpers.js';

const SAMPLE = { title: '100 nF ±10 %, 0402 — X7R', esr: '≤ 30 mΩ', tags: ['µ', 'é', '😀', 'tab\tand\nline'], n: 1.5e-9 };
const allAscii = (bytes: Buffer) => bytes.every((b) => b < 0x80);

describe('asciiJson', () => {
  it('escapes every character beyond ASCII, and the text parses to the same value', () => {
    const text = asciiJson(JSON.stringify(SAMPLE));
    expect(allAscii(Buffer.from(text, 'utf8'))).toBe(true);
    expect(text).toContain('\\u03a9'); // Ω, GREEK CAPITAL LETTER OMEGA (U+03A9)
    expect(text).toContain('\\ud83d\\ude00'); // U+1F600 as its UTF-16 surrogate pair
    expect(JSON.parse(text)).toEqual(SAMPLE);
    expect(asciiJson('{"a":"plain"}')).toBe('{"a":"plain"}');
  });
});

describe('readText', () => {
  it('reads an ASCII file as the same string, and a file with other bytes as UTF-8', () => {
    const dir = tempDir('ascii-text');
    writeFileSync(join(dir, 'a.json'), asciiJson(JSON.stringify(SAMPLE)));
    writeFileSync(join(dir, 'u.json'), JSON.stringify(SAMPLE));
    const a = readText(join(dir, 'a.json'));
    expect(a.ascii).toBe(true);
    expect(a.text).toBe(readFileSync(join(dir, 'a.json'), 'utf8'));
    const u = readText(join(dir, 'u.json'));
    expect(u.ascii).toBe(false);
    expect(JSON.parse(u.text)).toEqual(SAMPLE);
  });

  it('gives each file its own text whatever the files read before it (a buffer is kept between reads)', () => {
    const dir = tempDir('ascii-sizes');
    // Sizes around the kept buffer's first size (64 KiB), growing and shrinking, empty, and past the 8 MiB
    // beyond which a file gets a buffer of its own; each file's bytes differ from the others' at every place.
    const sizes = [10, 0, 65_535, 65_536, 65_537, 200_000, 3, 1_000_000, 9 << 20, 150_000, 1];
    const texts = sizes.map((size, n) => {
      const bytes = Buffer.alloc(size);
      for (let i = 0; i < size; i++) bytes[i] = 33 + ((i * 7 + n * 13) % 90);
      return bytes.toString('latin1');
    });
    texts.forEach((text, n) => writeFileSync(join(dir, `${n}.txt`), text));
    for (const round of [0, 1]) {
      texts.forEach((text, n) => {
        const read = readText(join(dir, `${n}.txt`));
        expect(read.ascii, `file ${n}, round ${round}`).toBe(true);
        expect(read.text === text, `file ${n} (${sizes[n]} bytes), round ${round}`).toBe(true);
      });
    }
    // A file with bytes beyond ASCII read after a longer ASCII one: none of the longer one's bytes follow it.
    writeFileSync(join(dir, 'u.txt'), 'µΩ');
    expect(readText(join(dir, 'u.txt'))).toEqual({ text: 'µΩ', ascii: false });
  });
});

describe('the build record', () => {
  it('writes its shards as ASCII, and writes a UTF-8 shard of an older version again as ASCII', () => {
    const dir = tempDir('ascii-record');
    const out = join(dir, 'site');
    const records = join(dir, 'builds', 'one');
    mkdirSync(out);
    const live = new VersionRecord('site-1-aaaaaaaa');
    for (let i = 0; i < 100; i++) live.set(`parts/P${i}`, { key: `k${i}`, stamp: [i], data: { listed: { id: `P${i}`, ...SAMPLE } } });
    writeSiteRecord(records, { outDir: out, live, pdfs: {} });
    const shardDir = join(records, 'shards');
    const files = () => readdirSync(shardDir).map((name) => readFileSync(join(shardDir, name)));
    expect(files().every(allAscii)).toBe(true);
    expect(entryData(readSiteRecord(records, out)!.live!.get('parts/P7'))).toEqual({ listed: { id: 'P7', ...SAMPLE } });

    // As an older version wrote them: the same lines, with the characters as UTF-8, in files named otherwise
    // (a shard is named by a hash of its text).
    let root = readFileSync(join(records, 'root.json'), 'utf8');
    for (const name of readdirSync(shardDir)) {
      const text = readFileSync(join(shardDir, name), 'utf8');
      writeFileSync(join(shardDir, `old${name}`), text.replace(/\\u([0-9a-f]{4})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16))));
      rmSync(join(shardDir, name));
      root = root.replaceAll(`"${name}"`, `"old${name}"`);
    }
    writeFileSync(join(records, 'root.json'), root);
    expect(files().some((b) => !allAscii(b))).toBe(true);
    const old = readSiteRecord(records, out)!;
    expect(entryData(old.live!.get('parts/P7'))).toEqual({ listed: { id: 'P7', ...SAMPLE } });
    for (const _ of old.live!.units()); // read every shard, as a rebuild reads its spare's
    writeSiteRecord(records, { outDir: out, live: old.live, pdfs: {} });
    expect(files().every(allAscii)).toBe(true);
    expect(entryData(readSiteRecord(records, out)!.live!.get('parts/P9'))).toEqual({ listed: { id: 'P9', ...SAMPLE } });
  });
});

describe('ParsedFiles', () => {
  /** A ParsedFiles whose parse counts its calls and gives a new object each time. */
  const counting = (limit = 8) => {
    const calls: string[] = [];
    const files = new ParsedFiles<{ text: string; ascii: boolean }>(limit);
    const read = (path: string, tag = '') => files.read(path, tag, (text, ascii) => (calls.push(text), { text, ascii }));
    return { calls, read };
  };

  it('parses a file once while it is unchanged, and again once it is written', () => {
    const dir = tempDir('parsed-files');
    const file = join(dir, 'a.tsv');
    writeFileSync(file, 'first\n');
    const { calls, read } = counting();
    const a = read(file);
    expect(a).toEqual({ text: 'first\n', ascii: true });
    expect(read(file)).toBe(a);
    expect(calls).toEqual(['first\n']);
    // Written again in place, and replaced through a rename (a new inode), as the caches write their files.
    writeFileSync(file, 'again, longer\n');
    expect(read(file)).toEqual({ text: 'again, longer\n', ascii: true });
    writeFileSync(join(dir, 'b.tsv'), 'moved\n');
    renameSync(join(dir, 'b.tsv'), file);
    expect(read(file).text).toBe('moved\n');
    expect(calls).toEqual(['first\n', 'again, longer\n', 'moved\n']);
    // Bytes beyond ASCII are read as UTF-8, as readText reads them.
    writeFileSync(file, 'Ω\n');
    expect(read(file)).toEqual({ text: 'Ω\n', ascii: false });
  });

  it('parses again under another tag (the code that parses), and drops the least recently read beyond its limit', () => {
    const dir = tempDir('parsed-files-limit');
    const [a, b, c] = ['a', 'b', 'c'].map((name) => {
      writeFileSync(join(dir, name), name);
      return join(dir, name);
    });
    const { calls, read } = counting(2);
    read(a, 'one');
    read(a, 'two');
    expect(calls).toEqual(['a', 'a']);
    read(b);
    read(a, 'two'); // a is now the most recently read
    read(c); // b goes
    read(a, 'two');
    expect(calls).toEqual(['a', 'a', 'b', 'c']);
    read(b);
    expect(calls).toEqual(['a', 'a', 'b', 'c', 'b']);
  });

  it('throws for a missing file without parsing anything', () => {
    const { calls, read } = counting();
    expect(() => read(join(tempDir('parsed-files-missing'), 'none.tsv'))).toThrow();
    expect(calls).toEqual([]);
  });
});
