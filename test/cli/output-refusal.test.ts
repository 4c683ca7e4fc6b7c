// build, serve and print refuse to replace what zfolio did not write: exit 2, one line, and the whole tree on
// disk (library, cache, the folder named and everything around it) exactly as it was.

import { cpSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { SITE_MARKER } from '../../src/build/output-guard.js';
import { diskSnapshot, tempDir } from '../site-helpers.js';
import { GOOD_LIBRARY, run } from './fake-io.js';

let top: string;
let lib: string;

beforeEach(() => {
  top = tempDir('refusal');
  lib = join(top, 'lib');
  cpSync(GOOD_LIBRARY, lib, { recursive: true });
  // A folder that is not the library's, as a checkout has.
  mkdirSync(join(lib, '.git'));
  writeFileSync(join(lib, '.git', 'HEAD'), 'ref: refs/heads/main\n');
});

/** Runs the command line and checks: exit 2, nothing on stdout, one line on stderr, nothing on disk changed. */
async function refused(argv: string[], cwd: string, env: Record<string, string> = {}): Promise<string> {
  const before = diskSnapshot(top);
  const r = await run(argv, cwd, env);
  expect(r.code).toBe(2);
  expect(r.out).toBe('');
  expect(r.err.split('\n')).toHaveLength(2);
  expect(r.err.endsWith('\n')).toBe(true);
  expect(diskSnapshot(top)).toEqual(before);
  return r.err.trimEnd();
}

describe('zfolio build --out refuses', () => {
  it('the library folder (--out . in the library), with a built site and its cache in place', async () => {
    expect((await run(['build', '--workers', '0'], lib)).code).toBe(0);
    expect(existsSync(join(lib, '_site', 'index.html')) && existsSync(join(lib, '.zfolio-cache'))).toBe(true);
    expect(await refused(['build', '--out', '.'], lib)).toBe(`zfolio build: will not write the site to ${lib}: it is the library folder; choose another --out`);
  });

  it('the library folder named from elsewhere', async () => {
    expect(await refused(['build', '--library', lib, '--out', lib], top)).toMatch(/: it is the library folder/);
  });

  it('a folder holding the library', async () => {
    expect(await refused(['build', '--out', '..'], lib)).toMatch(new RegExp(`^zfolio build: will not write the site to ${top}: it holds the library`));
  });

  it('the current folder and a folder above it', async () => {
    const shell = join(top, 'shell', 'deep');
    mkdirSync(shell, { recursive: true });
    expect(await refused(['build', '--library', lib, '--out', '.'], shell)).toMatch(/: it is the current folder; choose another --out$/);
    expect(await refused(['build', '--library', lib, '--out', '..'], shell)).toMatch(/: it holds the current folder/);
  });

  it('the root of the file system', async () => {
    expect(await refused(['build', '--out', '/'], lib)).toBe('zfolio build: will not write the site to /: it is the root of the file system');
  });

  it('the home folder, even when empty', async () => {
    const home = join(top, 'home');
    mkdirSync(home);
    expect(await refused(['build', '--out', home], lib, { HOME: home })).toMatch(/: it is your home folder/);
  });

  it('a folder of the user, and the file in it survives', async () => {
    const mine = join(top, 'mine');
    mkdirSync(mine);
    writeFileSync(join(mine, 'thesis.tex'), 'years of work');
    expect(await refused(['build', '--out', mine], lib)).toMatch(/: it holds files zfolio did not write \(no \.zfolio-site marker\)/);
    expect(readFileSync(join(mine, 'thesis.tex'), 'utf8')).toBe('years of work');
  });

  it('a file', async () => {
    writeFileSync(join(top, 'site'), 'not a folder');
    expect(await refused(['build', '--out', join(top, 'site')], lib)).toMatch(/: it is a file, not a folder/);
  });
});

describe('zfolio serve refuses as build does, before listening', () => {
  it('the library folder', async () => {
    expect(await refused(['serve', '--out', '.', '--port', '0'], lib)).toMatch(/^zfolio serve: will not write the site to .*: it is the library folder/);
  });
});

describe('zfolio print', () => {
  it('will not overwrite a file that is not a PDF zfolio made', async () => {
    const out = join(top, 'pdfs');
    mkdirSync(out);
    writeFileSync(join(out, 'CAP-TEST-100N.pdf'), '%PDF-1.4 somebody else\'s');
    expect(await refused(['print', 'CAP-TEST-100N', '--out', out], lib)).toBe(
      `zfolio print: will not replace ${join(out, 'CAP-TEST-100N.pdf')}: it is not a PDF zfolio made; move it or choose another --out`,
    );
  });

  it('will not write into a file', async () => {
    writeFileSync(join(top, 'pdfs'), 'x');
    expect(await refused(['print', 'CAP-TEST-100N', '--out', join(top, 'pdfs')], lib)).toMatch(/: it is not a folder; choose another --out$/);
  });
});

describe('zfolio build --out allows', () => {
  it('an empty folder, and replaces the site it wrote there at the next build', async () => {
    const out = join(top, 'empty');
    mkdirSync(out);
    const first = await run(['build', '--out', out, '--workers', '0'], lib);
    expect(first.err).not.toMatch(/will not|error/);
    expect(first.code).toBe(0);
    expect(readFileSync(join(out, SITE_MARKER), 'utf8')).toMatch(/^zfolio site\n/);
    expect(existsSync(join(out, 'index.html'))).toBe(true);
    const again = await run(['build', '--out', out, '--workers', '0'], lib);
    expect(again.code).toBe(0);
    expect(existsSync(join(out, 'index.html'))).toBe(true);
  }, 120_000);
});
