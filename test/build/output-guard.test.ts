// Which folders a build may replace: every place refused, every place allowed, and nothing on disk changed by
// asking. The cases are the ones a user can reach with --out: the library, a folder holding it, the current
// folder and those above it, the root, the home folder, a folder of the user's, a file, a foreign link.

import { mkdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, parse } from 'node:path';
import { describe, expect, it } from 'vitest';
import { guardOutput, hasSiteMarker, MARKER_TEXT, OutputRefused, SITE_MARKER, holdingName, isOwnLink } from '../../src/build/output-guard.js';
import { diskSnapshot, tempDir } from '../site-helpers.js';

/** A scratch world: a library with a part, a user's folder, a home folder and a working folder. */
function world() {
  const top = tempDir('guard');
  const library = join(top, 'work', 'lib');
  mkdirSync(join(library, 'parts'), { recursive: true });
  writeFileSync(join(library, 'parts', 'a.yaml'), 'id: A\n');
  const home = join(top, 'home');
  mkdirSync(home);
  const cwd = join(top, 'shell', 'here');
  mkdirSync(cwd, { recursive: true });
  return { top, library, home, cwd, context: { libraryRoot: library, cwd, home } };
}

function refusal(path: string, context: Parameters<typeof guardOutput>[1]): string {
  try {
    guardOutput(path, context);
  } catch (error) {
    expect(error).toBeInstanceOf(OutputRefused);
    return (error as Error).message;
  }
  return 'allowed';
}

describe('guardOutput refuses', () => {
  const w = world();
  const cases: [string, string, RegExp][] = [
    ['the file system root', parse(w.top).root, /: it is the root of the file system$/],
    ['the library folder', w.library, /: it is the library folder; choose another --out$/],
    ['the library folder written with ..', join(w.library, 'parts', '..'), /: it is the library folder/],
    ['the folder holding the library', join(w.top, 'work'), /: it holds the library \(.*lib\); choose another --out$/],
    ['a folder further up holding the library', w.top, /: it holds the library/],
    ['the home folder', w.home, /: it is your home folder; choose another --out$/],
    ['the current folder', w.cwd, /: it is the current folder; choose another --out$/],
    ['the folder holding the current folder', join(w.top, 'shell'), /: it holds the current folder \(.*here\); choose another --out$/],
  ];
  it.each(cases)('%s', (_name, path, message) => {
    const before = diskSnapshot(w.top);
    const text = refusal(path, w.context);
    expect(text).toMatch(/^will not write the site to \//);
    expect(text).toMatch(message);
    expect(text).not.toContain('\n');
    expect(diskSnapshot(w.top)).toEqual(before);
  });

  it('the library reached through a symbolic link to a folder above it', () => {
    const link = join(w.top, 'via');
    symlinkSync(join(w.top, 'work'), link);
    expect(refusal(join(link, 'lib'), w.context)).toMatch(/: it is the library folder/);
    expect(refusal(link + '/', w.context)).toMatch(/: it is a symbolic link zfolio did not make/);
  });

  it('an empty home folder and an empty current folder, although empty folders are otherwise allowed', () => {
    const empty = tempDir('guard-empty');
    expect(refusal(empty, { libraryRoot: w.library, cwd: w.cwd, home: empty })).toMatch(/home folder/);
    expect(refusal(empty, { libraryRoot: w.library, cwd: empty, home: w.home })).toMatch(/current folder/);
  });

  it('a folder of the user with no marker, and changes nothing in it', () => {
    const mine = join(w.top, 'mine');
    mkdirSync(mine);
    writeFileSync(join(mine, 'notes.txt'), 'keep me');
    const before = diskSnapshot(w.top);
    expect(refusal(mine, w.context)).toMatch(/: it holds files zfolio did not write \(no \.zfolio-site marker\); zfolio replaces only a site it built or an empty folder/);
    expect(diskSnapshot(w.top)).toEqual(before);
  });

  it('a folder whose marker is not zfolio\'s', () => {
    const fake = join(w.top, 'fake');
    mkdirSync(fake);
    writeFileSync(join(fake, SITE_MARKER), 'something else\n');
    expect(refusal(fake, w.context)).toMatch(/holds files zfolio did not write/);
  });

  it('a file', () => {
    const file = join(w.top, 'file.txt');
    writeFileSync(file, 'x');
    expect(refusal(file, w.context)).toMatch(/: it is a file, not a folder/);
  });

  it('a symbolic link it did not make, even to an empty folder', () => {
    const target = join(w.top, 'empty-target');
    mkdirSync(target);
    symlinkSync(target, join(w.top, 'site-link'));
    expect(refusal(join(w.top, 'site-link'), w.context)).toMatch(/: it is a symbolic link zfolio did not make/);
  });
});

describe('guardOutput allows', () => {
  const w = world();
  it('a path where nothing is yet, inside the library or elsewhere', () => {
    expect(refusal(join(w.library, '_site'), w.context)).toBe('allowed');
    expect(refusal(join(w.top, 'new', 'deeper', 'site'), w.context)).toBe('allowed');
  });

  it('an empty folder', () => {
    mkdirSync(join(w.top, 'empty'));
    expect(refusal(join(w.top, 'empty'), w.context)).toBe('allowed');
  });

  it('a folder holding zfolio\'s marker', () => {
    const site = join(w.top, 'built');
    mkdirSync(site);
    writeFileSync(join(site, SITE_MARKER), MARKER_TEXT);
    writeFileSync(join(site, 'index.html'), '<p>old</p>');
    expect(hasSiteMarker(site)).toBe(true);
    expect(refusal(site, w.context)).toBe('allowed');
  });

  it('a link of the form zfolio makes at the site path', () => {
    const target = `${holdingName('_site')}/site-123-abcdef01`;
    expect(isOwnLink(join(w.library, '_site'), target)).toBe(true);
    expect(isOwnLink(join(w.library, 'other'), target)).toBe(false);
    expect(isOwnLink(join(w.library, '_site'), `${holdingName('_site')}/../x`)).toBe(false);
    symlinkSync(target, join(w.library, '_site'));
    expect(refusal(join(w.library, '_site'), w.context)).toBe('allowed');
  });
});
