// A unit's stamp and the one-stat check of a spare unit (src/build/unit-stamp.ts): a page edited in place, a
// page replaced, a file missing, all on a real folder; what the spare check leaves to the live site's copy
// (a file added to or removed from the folder) is stated, as the build relies on it (carry-over.ts).

import { linkSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sameStamp, spareUnchanged, unitStamp } from '../../src/build/unit-stamp.js';
import { tempDir } from '../site-helpers.js';

function unitFolder(): string {
  const dir = join(tempDir('unit-stamp'), 'parts', 'P-1');
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'index.html'), '<p>page</p>');
  writeFileSync(join(dir, 'sweep.csv'), '1,2,3\n');
  return dir;
}

describe('a unit stamp', () => {
  it('of a folder holds the folder and its page; of a file, the file; empty when missing or of the wrong kind', () => {
    const dir = unitFolder();
    expect(unitStamp(dir, true)).toHaveLength(5);
    expect(unitStamp(join(dir, 'index.html'), false)).toHaveLength(3);
    expect(unitStamp(join(dir, 'gone'), true)).toEqual([]);
    expect(unitStamp(dir, false)).toEqual([]);
    expect(unitStamp(join(dir, 'index.html'), true)).toEqual([]);
    expect(sameStamp([], [])).toBe(false);
  });
});

describe('the check of a spare unit', () => {
  it('holds while the page is the one stamped, and fails when it is edited in place, replaced or removed', () => {
    const dir = unitFolder();
    const stamp = unitStamp(dir, true);
    expect(spareUnchanged(dir, true, stamp)).toBe(true);
    // Edited in place (same inode, new size and mtime), as through a hard link shared with the live site.
    writeFileSync(join(dir, 'index.html'), '<p>page, edited by hand</p>');
    expect(spareUnchanged(dir, true, stamp)).toBe(false);
    const edited = unitStamp(dir, true);
    // Replaced by rename (a new inode).
    writeFileSync(join(dir, 'new.html'), '<p>page, edited by hand</p>');
    renameSync(join(dir, 'new.html'), join(dir, 'index.html'));
    expect(spareUnchanged(dir, true, edited)).toBe(false);
    const replaced = unitStamp(dir, true);
    rmSync(join(dir, 'index.html'));
    expect(spareUnchanged(dir, true, replaced)).toBe(false);
    expect(spareUnchanged(join(dir, 'gone'), true, replaced)).toBe(false);
    expect(spareUnchanged(dir, true, [])).toBe(false);
  });

  it('sees an edit made through a hard link to the page (the live site shares the spare\'s files)', () => {
    const dir = unitFolder();
    const live = join(dir, '..', '..', 'live-page.html');
    linkSync(join(dir, 'index.html'), live);
    const stamp = unitStamp(dir, true);
    writeFileSync(live, '<p>changed through the other name</p>');
    expect(spareUnchanged(dir, true, stamp)).toBe(false);
  });

  it('reads the page alone: a file added to or removed from the folder leaves it standing', () => {
    // The live site's copy of a folder is a folder of its own: a file removed there leaves the spare's copy,
    // which is what the new site gets, whole. This check does not see the spare's own folder changed by hand.
    const dir = unitFolder();
    const stamp = unitStamp(dir, true);
    rmSync(join(dir, 'sweep.csv'));
    writeFileSync(join(dir, 'extra.txt'), 'x');
    expect(sameStamp(stamp, unitStamp(dir, true))).toBe(false);
    expect(spareUnchanged(dir, true, stamp)).toBe(true);
  });

  it('of a file unit compares the file\'s own stamp', () => {
    const dir = unitFolder();
    const file = join(dir, 'sweep.csv');
    const stamp = unitStamp(file, false);
    expect(spareUnchanged(file, false, stamp)).toBe(true);
    writeFileSync(file, '1,2,3,4\n');
    expect(spareUnchanged(file, false, stamp)).toBe(false);
  });
});
