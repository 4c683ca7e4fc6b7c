// The stamps a rebuild takes in a worker thread (src/build/stamp-prefetch.ts) are the ones it would take
// itself: each part file's as the part cache stamps it, each spare folder unit's page as spareUnchanged
// reads it; what the worker did not list is not answered for (the build then takes it as before). A rebuild
// given them equals a build with nothing to carry over, a page changed by hand in the last site included.

import { mkdirSync, readdirSync, readFileSync, realpathSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PartCache } from '../../src/model/part-cache.js';
import { buildFolio } from '../../src/build/build.js';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import { prefetchStamps } from '../../src/build/stamp-prefetch.js';
import { spareUnchanged, unitStamp } from '../../src/build/unit-stamp.js';
import { tempDir, treeHashes } from '../site-helpers.js';

function library(): string {
  const root = tempDir('stamp-library');
  for (const dir of ['parts/a', 'parts/a/deeper', 'parts/b', 'parts/.hidden']) mkdirSync(join(root, dir), { recursive: true });
  for (const file of ['parts/top.yaml', 'parts/a/one.yaml', 'parts/a/deeper/two.YML', 'parts/b/three.yml', 'parts/b/notes.txt', 'parts/.hidden/four.yaml', 'parts/.dot.yaml']) writeFileSync(join(root, file), `id: ${file}\n`);
  return root;
}

function spare(): string {
  const dir = tempDir('stamp-spare');
  for (const unit of ['parts/P1', 'parts/P2', 'parts/NO-PAGE', 'comparisons/family-1']) mkdirSync(join(dir, unit), { recursive: true });
  writeFileSync(join(dir, 'parts/P1/index.html'), 'one');
  writeFileSync(join(dir, 'parts/P2/index.html'), 'page two');
  writeFileSync(join(dir, 'comparisons/family-1/index.html'), 'family');
  writeFileSync(join(dir, 'comparisons/index.html'), 'index');
  mkdirSync(join(dir, 'parts/P3/index.html'), { recursive: true });
  return dir;
}

describe('prefetchStamps', () => {
  it('stamps every part file as the part cache does, and every spare unit page as spareUnchanged reads it', async () => {
    const root = library();
    const spareDir = spare();
    const taken = prefetchStamps(root, spareDir);
    const stamps = { parts: await taken.parts, sparePages: await taken.sparePages };
    const cache = new PartCache(root, join(root, '.cache'), 'test');
    // YAML files at any depth under parts/, hidden names skipped, as the library walk (yamlFilesUnder) skips them.
    expect([...stamps.parts!.keys()].sort()).toEqual(['parts/a/deeper/two.YML', 'parts/a/one.yaml', 'parts/b/three.yml', 'parts/top.yaml']);
    for (const [path, stamp] of stamps.parts!) expect(stamp, path).toEqual(cache.stamp(path));
    // Folder units with a page file; a folder without one (or whose "page" is a folder) is not answered for.
    expect([...stamps.sparePages!.keys()].sort()).toEqual(['comparisons/family-1', 'parts/P1', 'parts/P2']);
    for (const [unit, page] of stamps.sparePages!) {
      const s = statSync(join(spareDir, unit, 'index.html'));
      expect(page, unit).toEqual([s.size, s.mtimeMs, s.ino]);
      // What the build recorded of the unit (unitStamp) is unchanged by the page as the worker saw it, and as this thread sees it.
      const recorded = unitStamp(join(spareDir, unit), true);
      expect(spareUnchanged(join(spareDir, unit), true, recorded, page)).toBe(true);
      expect(spareUnchanged(join(spareDir, unit), true, recorded)).toBe(true);
    }
  });

  it('sees a page changed since the unit was recorded, as the stat of this thread does', async () => {
    const spareDir = spare();
    const recorded = unitStamp(join(spareDir, 'parts/P1'), true);
    writeFileSync(join(spareDir, 'parts/P1/index.html'), 'edited by hand');
    const page = (await prefetchStamps(library(), spareDir).sparePages)!.get('parts/P1');
    expect(spareUnchanged(join(spareDir, 'parts/P1'), true, recorded, page)).toBe(false);
    expect(spareUnchanged(join(spareDir, 'parts/P1'), true, recorded)).toBe(false);
  });

  it('answers for the part files alone when there is no spare folder, and for nothing in a library without parts', async () => {
    const root = library();
    const stamps = prefetchStamps(root, join(root, 'no-such-folder'));
    expect((await stamps.parts)!.size).toBe(4);
    expect((await stamps.sparePages)!.size).toBe(0);
    const empty = prefetchStamps(tempDir('stamp-empty'), join(root, 'none'));
    expect([await empty.parts, await empty.sparePages]).toEqual([new Map(), new Map()]);
  });
});

describe('a rebuild whose stamps a worker took', () => {
  it('after a part edited and another part\'s page changed by hand in the site, equals a build with nothing to carry over, and reads only the edited file', async () => {
    const root = writeGeneratedLibrary(16, 7);
    const out = join(root, '_site');
    const build = (outDir = out, prefetch?: boolean) => buildFolio({ libraryRoot: root, outDir, workers: 0, prefetchStamps: prefetch });
    try {
      expect((await build()).ok).toBe(true);
      // Nothing changed: this one keeps the first site as the next build's spare.
      expect((await build(out, false)).ok).toBe(true);
      const edited = join(root, 'parts', 'group-0', 'gen-3.yaml');
      writeFileSync(edited, readFileSync(edited, 'utf8').replace(/esr: [^,}]+/, 'esr: 0.0321'));
      // A page the live site shares with the spare by hard link, changed in place.
      const site = realpathSync(out);
      const byHand = readdirSync(join(site, 'parts'))[9];
      writeFileSync(join(site, 'parts', byHand, 'index.html'), `${readFileSync(join(site, 'parts', byHand, 'index.html'), 'utf8')}<!-- by hand -->`);
      const rebuilt = await build(out, true);
      expect(rebuilt.ok).toBe(true);
      expect(rebuilt.work.filesParsed).toBe(1);
      expect(rebuilt.unitsKept).toBeGreaterThan(10);
      // The same library built where no last site is recorded: every unit made afresh.
      const fresh = await build(join(tempDir('stamp-fresh'), 'site'));
      expect(fresh.unitsKept + fresh.unitsLinked).toBe(0);
      const [a, b] = [treeHashes(realpathSync(out)), treeHashes(realpathSync(fresh.outDir))];
      expect([...a.keys()].sort()).toEqual([...b.keys()].sort());
      expect([...a].filter(([file, hash]) => b.get(file) !== hash).map(([file]) => file)).toEqual([]);
      expect(readFileSync(join(realpathSync(out), 'parts', byHand, 'index.html'), 'utf8')).not.toContain('by hand');
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
