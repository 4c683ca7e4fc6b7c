// A build that had no record of the site it replaced (the first build, or one after the cache was cleared or
// zfolio upgraded) leaves the next build a spare version, made by hard links (src/build/spare-copy.ts), and
// removes the version it replaced at once: so the first edit afterwards updates the spare in place like any
// other edit, instead of linking every unit from the live site and removing an old site of every part. So
// does a build that remade most of the site (a setting changed), whose replaced version would be no spare.
// Checked from the file system: the versions in the holding folder, each file's inode (stat), and the SHA-256
// of every file of the rebuilt site against a build of the same library into a new folder without a cache.
// Charts are drawn in this thread (workers 0), as in carry-over.test.ts.

import fs, { cpSync, existsSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { syncBuiltinESMExports } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildFolio, CACHE_DIR, type BuildOptions } from '../../src/build/build.js';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import type { Progress } from '../../src/build/progress.js';
import { sameInodes, tempDir, treeHashes } from '../site-helpers.js';
import { buildFromNothing } from './from-nothing.js';

const PARTS = 24;

let root: string;
let out: string;
let holding: string;

const build = async (more: Partial<BuildOptions> = {}) => {
  const result = await buildFolio({ libraryRoot: root, outDir: out, workers: 0, ...more });
  expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  expect(result.ok).toBe(true);
  return result;
};

/** The site versions in the holding folder, and which of them the site path links to. */
function versions(): { all: string[]; live: string } {
  return { all: readdirSync(holding).filter((n) => n.startsWith('site-')).sort(), live: fs.readlinkSync(out).split('/').pop()! };
}

/** The record's root file (which versions it describes). */
function recordRoot(): { live?: { name: string }; spare?: { name: string } } {
  const builds = join(root, CACHE_DIR, 'builds');
  const [dir] = readdirSync(builds);
  return JSON.parse(readFileSync(join(builds, dir, 'root.json'), 'utf8'));
}

/**
 * The holding folder holds the new site and its spare, a linked copy of it that the record names, and none of
 * the versions `earlier` (neither the version replaced nor a spare made for it is left for the next build).
 */
function expectLinkedSpare(earlier: readonly string[]): void {
  const after = versions();
  expect(after.all).toHaveLength(2);
  for (const old of earlier) expect(after.all).not.toContain(old);
  const spare = after.all.find((n) => n !== after.live)!;
  expect(sameInodes(join(holding, after.live), join(holding, spare))).toBe(true);
  expect(recordRoot()).toMatchObject({ live: { name: after.live }, spare: { name: spare } });
}

/** The stages a build reports (its progress), cleared by each `recorder()`. */
let stages: string[] = [];
const recorder = (): Progress => {
  stages = [];
  return { stage: (name) => void stages.push(name), tick() {}, note() {} };
};

function editPart(index: number, value: string): void {
  const file = join(root, 'parts', 'group-0', `gen-${index}.yaml`);
  const before = readFileSync(file, 'utf8');
  const after = before.replace(/parasitics: \{(\w+): [^,}]+/, `parasitics: {$1: ${value}`);
  expect(after).not.toBe(before);
  writeFileSync(file, after);
}

beforeAll(() => {
  root = writeGeneratedLibrary(PARTS, 3);
  out = join(root, '_site');
  holding = join(root, '._site.zfolio');
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('a build with no record of the site it replaces', () => {
  it('leaves a spare linked file by file to the new site, and the record names it', async () => {
    await build();
    const { all, live } = versions();
    expect(all).toHaveLength(2);
    const spare = all.find((n) => n !== live)!;
    expect(sameInodes(join(holding, live), join(holding, spare))).toBe(true);
    expect(recordRoot()).toMatchObject({ live: { name: live }, spare: { name: spare } });
  }, 300_000);

  it('after the record is lost, makes a new spare and then removes the version it replaced, saying so', async () => {
    const before = versions();
    rmSync(join(root, CACHE_DIR, 'builds'), { recursive: true, force: true });
    const result = await build({ progress: recorder() });
    // The removal last: the record and the spare are in place before it (output.test.ts stops a build there).
    expect(stages.slice(-2)).toEqual(['copying the site for the next build (hard links)', 'removing old versions of the site']);
    expect(result.reused).toBe(0);
    expectLinkedSpare(before.all);
  }, 300_000);

  it('lets the first edit afterwards update the spare in place, to the site a build from nothing makes', async () => {
    const before = versions();
    const spare = before.all.find((n) => n !== before.live)!;
    const spareDir = join(holding, spare);
    const untouched = statSync(join(spareDir, 'parts', 'GEN-00020', 'index.html')).ino;
    editPart(7, '0.0432');
    const result = await build({ progress: recorder() });
    expect(stages).not.toContain('removing old versions of the site');
    expect(stages).not.toContain('copying the site for the next build (hard links)');
    expect(result.reused).toBe(PARTS - 1);
    // Every unit the edit left alone was the spare's own: none was linked from the live site.
    expect(result.unitsLinked).toBe(0);
    expect(result.unitsKept).toBeGreaterThan(PARTS - 2);
    const after = versions();
    expect(after.all).toHaveLength(2);
    // The site path now links to the spare, updated (claimed under a new name), and the last live site is the spare.
    expect(after.all).toContain(before.live);
    expect(after.live).not.toBe(before.live);
    expect(statSync(join(holding, after.live, 'parts', 'GEN-00020', 'index.html')).ino).toBe(untouched);
    expect(existsSync(spareDir)).toBe(false);

    // The same library built into a new folder with no cache: every file the same bytes.
    const { result: cold, hashes } = await buildFromNothing(root, 'spare-copy-cold');
    expect(cold.ok).toBe(true);
    expect(cold.reused).toBe(0);
    expect(hashes).toEqual(treeHashes(out));
  }, 600_000);

  it('when it remade most units (a setting of the library changed), leaves a linked copy, not the version it replaced', async () => {
    const before = versions();
    const folio = join(root, 'folio.yaml');
    writeFileSync(folio, readFileSync(folio, 'utf8').replace(/^title: .*$/m, 'title: Generated library, retitled (invented parts)'));
    const result = await build();
    expect(result.unitsKept + result.unitsLinked).toBe(0);
    expectLinkedSpare(before.all);
    editPart(7, '0.0555');
    const edited = await build();
    expect(edited.reused).toBe(PARTS - 1);
    expect(edited.unitsLinked).toBe(0);
  }, 600_000);

  it('makes no spare when asked not to (a site built once, as zfolio print does)', async () => {
    const top = tempDir('spare-copy-once');
    const once = join(top, 'site');
    const result = await buildFolio({ libraryRoot: root, outDir: once, cache: join(top, 'cache'), workers: 0, spareCopy: false });
    expect(result.ok).toBe(true);
    expect(readdirSync(join(top, '.site.zfolio')).filter((n) => n.startsWith('site-'))).toHaveLength(1);
    rmSync(top, { recursive: true, force: true });
  }, 300_000);
});

describe('on a file system without hard links', () => {
  it('records no spare and leaves no copy behind; the next build still makes the same site', async () => {
    const realLink = fs.linkSync;
    // link(2) fails with EPERM everywhere, as on vfat (see site-lock-no-links.test.ts for how node:fs is replaced).
    fs.linkSync = () => {
      throw Object.assign(new Error('EPERM: operation not permitted, link'), { code: 'EPERM', errno: -1, syscall: 'link' });
    };
    syncBuiltinESMExports();
    try {
      const top = tempDir('spare-copy-no-links');
      const site = join(top, '_site');
      const cache = join(top, 'cache');
      cpSync(join(root, CACHE_DIR, 'charts'), join(cache, 'charts'), { recursive: true });
      await build({ outDir: site, cache });
      const names = () => readdirSync(join(top, '._site.zfolio')).filter((n) => n.startsWith('site-'));
      expect(names()).toHaveLength(1);
      const [dir] = readdirSync(join(cache, 'builds'));
      const rootFile = JSON.parse(readFileSync(join(cache, 'builds', dir, 'root.json'), 'utf8')) as { live?: unknown; spare?: unknown };
      expect(rootFile.live).toBeDefined();
      expect(rootFile.spare).toBeUndefined();
      const first = treeHashes(site);
      const file = join(root, 'parts', 'group-0', 'gen-7.yaml');
      const text = readFileSync(file, 'utf8');
      editPart(7, '0.0433');
      const edited = await build({ outDir: site, cache });
      // With no spare, the units the edit left alone come from the live site (copied, as links fail).
      expect(edited.unitsLinked).toBeGreaterThan(PARTS - 2);
      expect(treeHashes(site)).not.toEqual(first);
      writeFileSync(file, text);
      await build({ outDir: site, cache });
      expect(treeHashes(site)).toEqual(first);
      rmSync(top, { recursive: true, force: true });
    } finally {
      fs.linkSync = realLink;
      syncBuiltinESMExports();
    }
  }, 600_000);
});
