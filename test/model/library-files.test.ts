// What a library folder may hold besides good YAML files: every odd entry is a located error (or, for a
// stray pipe or device that is no library file, a warning), never a hang, a crash or another file's text.

import { execFileSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { firstInvalidUtf8 } from '../../src/model/library-files.js';
import { MAX_FILE_BYTES } from '../../src/model/yaml-limits.js';
import { CORPUS } from './bad-inputs-run.js';

const made: string[] = [];
afterEach(() => {
  for (const dir of made.splice(0)) rmSync(dir, { recursive: true, force: true });
});

/** A copy of the corpus base library (three parts, a plan, a comparison). */
function library(): string {
  const root = mkdtempSync(join(tmpdir(), 'zfolio-files-'));
  made.push(root);
  cpSync(join(CORPUS, 'base'), root, { recursive: true });
  return root;
}

const lines = (root: string) => loadLibrary(root).diagnostics.map(formatDiagnostic);
const mkfifo = (path: string) => execFileSync('mkfifo', [path]);
const PART = (id: string, extra = '') => `id: ${id}\nkind: capacitor\nnominal: 1n\n${extra}`;

describe('entries of the wrong kind', () => {
  it('folio.yaml that is a folder', () => {
    const root = library();
    rmSync(join(root, 'folio.yaml'));
    mkdirSync(join(root, 'folio.yaml'));
    expect(lines(root)).toEqual(['folio.yaml:1:1: folio.yaml is a folder; expected a YAML file']);
  });

  it('folio.yaml that is a named pipe: refused at once, never opened (a read would wait for a writer for ever)', () => {
    const root = library();
    rmSync(join(root, 'folio.yaml'));
    mkfifo(join(root, 'folio.yaml'));
    const started = Date.now();
    expect(lines(root)).toEqual(['folio.yaml:1:1: folio.yaml is a named pipe; expected a YAML file']);
    expect(Date.now() - started).toBeLessThan(2000);
  });

  it.each(['parts', 'plans', 'reviews', 'comparisons'])('%s that is a file', (folder) => {
    const root = library();
    rmSync(join(root, folder), { recursive: true, force: true });
    writeFileSync(join(root, folder), 'not a folder\n');
    const out = lines(root).filter((l) => l.startsWith(`${folder}:`));
    expect(out).toEqual([`${folder}:1:1: ${folder} is a file; expected a folder holding the library's ${folder} as YAML files`]);
  });

  it('a folder named like a YAML file, and a named pipe with a YAML name, under parts/', () => {
    const root = library();
    mkdirSync(join(root, 'parts', 'old.yaml'));
    mkfifo(join(root, 'parts', 'pipe.yaml'));
    mkfifo(join(root, 'parts', 'notes'));
    expect(lines(root)).toEqual([
      'parts/notes:1:1: warning: skipped: a named pipe in the library folder',
      'parts/old.yaml:1:1: a folder named like a YAML file; expected a file here (rename the folder)',
      'parts/pipe.yaml:1:1: a named pipe, not a file; a library file must be a regular file',
    ]);
  });
});

describe('symbolic links', () => {
  it('are followed inside the library', () => {
    const root = library();
    mkdirSync(join(root, 'shared'));
    writeFileSync(join(root, 'shared', 'linked.yaml'), PART('LINKED-C'));
    symlinkSync(join(root, 'shared', 'linked.yaml'), join(root, 'parts', 'linked.yaml'));
    const { library: lib, diagnostics } = loadLibrary(root);
    expect(diagnostics).toEqual([]);
    expect(lib?.partsById.has('LINKED-C')).toBe(true);
  });

  it('leading outside the library are refused, and the file they point at is never printed', () => {
    const root = library();
    const outside = mkdtempSync(join(tmpdir(), 'zfolio-outside-'));
    made.push(outside);
    writeFileSync(join(outside, 'secret.yaml'), 'SECRET-CONTENT: [unclosed\n');
    rmSync(join(root, 'folio.yaml'));
    symlinkSync(join(outside, 'secret.yaml'), join(root, 'folio.yaml'));
    symlinkSync(join(outside, 'secret.yaml'), join(root, 'parts', 'outside.yaml'));
    const out = lines(root);
    expect(out).toEqual([
      'folio.yaml:1:1: a symbolic link to a place outside the library folder; zfolio follows links only within the library, so copy the file in instead',
      'parts/outside.yaml:1:1: a symbolic link to a place outside the library folder; zfolio follows links only within the library, so copy the file in instead',
    ]);
    expect(out.join('\n')).not.toContain('SECRET');
  });

  it('to nothing, and a folder link that loops back, are reported once and end', () => {
    const root = library();
    symlinkSync(join(root, 'nowhere.yaml'), join(root, 'parts', 'dangling.yaml'));
    symlinkSync(join(root, 'parts'), join(root, 'parts', 'loop'));
    expect(lines(root)).toEqual([
      'parts/dangling.yaml:1:1: a symbolic link to nothing (its target does not exist); remove it or point it at a file in the library',
      'parts/loop:1:1: warning: skipped: a symbolic link to a folder that is already read',
    ]);
  });
});

describe('file contents that are not text zfolio reads', () => {
  it(`a file over ${MAX_FILE_BYTES / 1048576} MB is refused unread`, () => {
    const root = library();
    writeFileSync(join(root, 'parts', 'huge.yaml'), Buffer.alloc(MAX_FILE_BYTES + 1, 0x20));
    expect(lines(root)).toEqual(['parts/huge.yaml:1:1: the file is 5.0 MB; a library file may be at most 5 MB']);
  });

  it('bytes that are not UTF-8 are located', () => {
    const root = library();
    writeFileSync(join(root, 'parts', 'latin1.yaml'), Buffer.concat([Buffer.from('id: X\ntitle: caf'), Buffer.from([0xe9]), Buffer.from('\n')]));
    expect(lines(root)).toEqual(['parts/latin1.yaml:2:11: the file is not UTF-8 text (an invalid byte here); save it as UTF-8']);
  });

  it('finds the first invalid UTF-8 sequence: stray continuation, overlong form, surrogate, beyond U+10FFFF, cut short', () => {
    // RFC 3629, section 3 (the UTF-8 byte sequences) and section 10 (overlong forms are invalid).
    expect(firstInvalidUtf8(Buffer.from('aé€😀', 'utf8'))).toBe(-1);
    expect(firstInvalidUtf8(Buffer.from([0x61, 0x80]))).toBe(1);
    expect(firstInvalidUtf8(Buffer.from([0xc0, 0xaf]))).toBe(0);
    expect(firstInvalidUtf8(Buffer.from([0xe0, 0x80, 0xaf]))).toBe(0);
    expect(firstInvalidUtf8(Buffer.from([0xed, 0xa0, 0x80]))).toBe(0);
    expect(firstInvalidUtf8(Buffer.from([0xf4, 0x90, 0x80, 0x80]))).toBe(0);
    expect(firstInvalidUtf8(Buffer.from([0x61, 0xe2, 0x82]))).toBe(1);
  });
});

describe('names', () => {
  it('a file name with a line break is quoted, so every message stays one file:line:col line', () => {
    const root = library();
    writeFileSync(join(root, 'parts', 'two\nlines.yaml'), PART('NL-C', 'tolerance: 10\n'));
    const out = lines(root);
    expect(out).toHaveLength(1);
    expect(out[0]).toMatch(/^"parts\/two\\nlines\.yaml":4:12: tolerance: expected a fraction/);
    expect(out[0]).not.toContain('\n');
  });

  it('review and comparison files whose pages would be one folder are errors naming both files', () => {
    const root = library();
    const review = 'title: R\ndate: 2026-03-01\nboard: B\ncovers: {plans: [BASE_RAIL]}\n';
    writeFileSync(join(root, 'comparisons', 'pair b.yaml'), 'title: P\nparts: [BASE-C-10U]\n');
    writeFileSync(join(root, 'comparisons', 'pair-b.yaml'), 'title: P\nparts: [BASE-C-10U]\n');
    mkdirSync(join(root, 'reviews'));
    for (const name of ['r.yaml', 'r.yml', 'Q.yaml', 'q.yaml']) writeFileSync(join(root, 'reviews', name), review);
    expect(lines(root)).toEqual([
      `comparisons/pair-b.yaml:1:1: this comparison's page would be comparisons/pair-b/, the same folder as that of "comparisons/pair b.yaml" (file names that differ only in letter case, spaces, punctuation or .yaml/.yml make one page name); rename one of the files`,
      `reviews/q.yaml:1:1: this review's page would be reviews/q/, the same folder as that of "reviews/Q.yaml" (file names that differ only in letter case, spaces, punctuation or .yaml/.yml make one page name); rename one of the files`,
      `reviews/r.yml:1:1: this review's page would be reviews/r/, the same folder as that of "reviews/r.yaml" (file names that differ only in letter case, spaces, punctuation or .yaml/.yml make one page name); rename one of the files`,
    ]);
  });

  it('a duplicate id is reported even when one of the files has other errors, and each message names its own file', () => {
    const root = library();
    // Files are read in path order: zz-again.yaml comes after the sound base-c-100n.yaml, a-broken.yaml before it.
    writeFileSync(join(root, 'parts', 'zz-again.yaml'), PART('BASE-C-100N', 'voltage: lots\n'));
    writeFileSync(join(root, 'parts', 'lower.yaml'), PART('base-c-10u'));
    expect(lines(root)).toEqual([
      'parts/lower.yaml:1:5: id "base-c-10u" differs from "BASE-C-10U" only in letter case, and their pages would collide on many file systems: already defined at parts/base-c-10u.yaml:2:5',
      'parts/zz-again.yaml:1:5: duplicate id "BASE-C-100N": already defined at parts/base-c-100n.yaml:2:5',
      'parts/zz-again.yaml:4:10: voltage: expected a voltage in V (e.g. 16V), found "lots"',
    ]);
  });

  it('the first of two files with one id has errors: the duplicate is still reported, and references point at the broken file', () => {
    const root = library();
    writeFileSync(join(root, 'parts', 'a-broken.yaml'), PART('BASE-C-100N', 'voltage: lots\n'));
    expect(lines(root)).toEqual([
      'comparisons/base-pair.yaml:3:9: parts: part with id "BASE-C-100N" is defined in "parts/a-broken.yaml", which has errors (listed there); fix them first',
      'parts/a-broken.yaml:4:10: voltage: expected a voltage in V (e.g. 16V), found "lots"',
      'parts/base-c-100n.yaml:2:5: duplicate id "BASE-C-100N": already defined at parts/a-broken.yaml:1:5',
      'plans/base-rail.yaml:9:12: capacitors[0].part: part with id "BASE-C-100N" is defined in "parts/a-broken.yaml", which has errors (listed there); fix them first',
    ]);
  });

  it('rail names that differ only in letter case are one rail', () => {
    const root = library();
    writeFileSync(join(root, 'plans', 'lower.yaml'), 'rail: base_rail\nvoltage: 1V\ntarget: 10m\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\nregulator: {r: 1m}\n');
    expect(lines(root)).toEqual(['plans/lower.yaml:1:7: rail "base_rail" differs from "BASE_RAIL" only in letter case: already planned at plans/base-rail.yaml:2:7']);
  });
});
