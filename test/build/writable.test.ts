// Read-only folders and a rebuild that keeps the version at the site path as its spare (src/build/writable.ts):
// the part and comparison folders of the live site are not walked before such a build (it leaves that version
// as it is), and the build that later has to change one of them in the spare checks it first, refuses with an
// OutputRefused, and gives the spare back unchanged; once the folder is writable again the next build goes
// through and equals a cold build. The unit checks of a whole tree are in output.test.ts. Builds draw their
// charts in this thread (workers 0), on the test suite's good library of five invented parts.

import { chmodSync, existsSync, readFileSync, readlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { buildFolio } from '../../src/build/build.js';
import { OutputRefused } from '../../src/build/output-guard.js';
import { copyLibrary, diskSnapshot, REPO, tempDir, treeHashes } from '../site-helpers.js';

const GOOD = join(REPO, 'test/fixtures/good-library');
const PART = 'CAP-TEST-100N';

const locked: string[] = [];
afterEach(() => {
  for (const path of locked.splice(0)) if (existsSync(path)) chmodSync(path, 0o755);
});

describe('a read-only part folder in the site of a rebuild', () => {
  it('is left as it is while the live site is kept, then refused, the spare given back, when the spare must change it', async () => {
    const root = copyLibrary(GOOD, 'writable');
    const out = join(root, '_site');
    const build = () => buildFolio({ libraryRoot: root, outDir: out, cwd: root, workers: 0 });
    const file = join(root, 'parts', 'capacitor.yaml');
    const edit = (value: string) => writeFileSync(file, readFileSync(file, 'utf8').replace(/^title: .*$/m, `title: ${value}`));
    expect((await build()).ok).toBe(true);
    expect((await build()).ok).toBe(true); // now the record has a spare

    // chmod follows the site link: the live version's part folder.
    const folder = join(out, 'parts', PART);
    const version = join(root, readlinkSync(out));
    locked.push(join(version, 'parts', PART));
    chmodSync(folder, 0o555);
    // This build changes the spare (another version) and keeps the live one, read-only folder and all.
    edit('Edited once (invented)');
    const kept = await build();
    expect(kept.ok).toBe(true);
    expect(kept.unitsLinked + kept.unitsKept).toBeGreaterThan(0);
    expect(readFileSync(join(out, 'parts', PART, 'index.html'), 'utf8')).toContain('Edited once');
    expect(existsSync(version)).toBe(true);

    // The next build claims that version to update: its read-only folder must change, so the build is refused.
    edit('Edited twice (invented)');
    const holding = join(root, '._site.zfolio');
    const before = diskSnapshot(holding);
    const refused = await build().then(
      () => undefined,
      (error: unknown) => error,
    );
    expect(refused).toBeInstanceOf(OutputRefused);
    expect((refused as Error).message).toContain(join(version, 'parts', PART));
    expect((refused as Error).message).toContain('is read-only');
    // The site and both versions as they were: the spare given back under its name, unchanged.
    expect(diskSnapshot(holding)).toEqual(before);
    expect(readFileSync(join(out, 'parts', PART, 'index.html'), 'utf8')).toContain('Edited once');

    // Writable again: the build goes through and equals a cold build of the same files.
    chmodSync(join(version, 'parts', PART), 0o755);
    const done = await build();
    expect(done.ok).toBe(true);
    const reference = join(tempDir('writable-cold'), '_site');
    expect((await buildFolio({ libraryRoot: root, outDir: reference, cache: false, cwd: root, workers: 0 })).ok).toBe(true);
    expect(treeHashes(out)).toEqual(treeHashes(reference));
  }, 300_000);
});
