// The record of the last build, read back: a unit's path and key are taken from the line as they stand when
// they hold no escape, and parsed as JSON when they do (a quote, a backslash, a character beyond ASCII).

import { mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readSiteRecord, VersionRecord, writeSiteRecord } from '../../src/build/site-record.js';
import { tempDir } from '../site-helpers.js';

const root = tempDir('site-record');
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('the site record', () => {
  it('gives back every unit\'s path, key and stamp, escaped or not', () => {
    const out = join(root, 'site');
    mkdirSync(out);
    const units: [string, string][] = [
      ['parts/CAP-1', 'plain0123456789abcdef'],
      ['parts/q"uote', 'key"with"quotes'],
      ['parts/back\\slash', 'key\\with\\backslash'],
      ['comparisons/ω-µ', 'key-Ω'],
      ['list/rows-1.js', ''],
    ];
    const live = new VersionRecord('site-1-aaaaaaaa');
    units.forEach(([unit, key], i) => live.set(unit, { key, stamp: [i, 1.5, 1796237860143.4019] }));
    const records = join(root, 'builds', 'one');
    writeSiteRecord(records, { outDir: out, live, pdfs: {} });
    const read = readSiteRecord(records, out)!.live!;
    expect([...read.units()].map(([unit, entry]) => [unit, entry.key, entry.stamp]).sort()).toEqual(units.map(([unit, key], i) => [unit, key, [i, 1.5, 1796237860143.4019]]).sort());
  });
});
