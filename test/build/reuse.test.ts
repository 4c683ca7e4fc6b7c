// Rebuilds that carry unchanged part folders over from the last site: after every kind of change the rebuilt
// site must be byte-for-byte the site a build from nothing makes of the same files (the reference here is
// a cold build with no cache), and only what changed may be drawn and written again. The library is the demo
// cut down to a part of every kind and the parts its plans, review and one comparison name, so that each of
// the cold reference builds costs a third of the whole demo's; three serve the five comparisons (two tests
// change only the last site, not the library).

import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildFolio } from '../../src/build/build.js';
import { entryData, readSiteRecord, recordDir, SHARDS, VersionRecord, writeSiteRecord } from '../../src/build/site-record.js';
import { loadLibrary } from '../../src/model/library.js';
import { copyLibrary, filesUnder, LIBRARY_ENTRIES, REPO, tempDir, treeHashes } from '../site-helpers.js';

/** Part files kept: every part the plans, the review and the comparison name, and one of each other kind. */
const KEPT_PARTS = [
  'capacitors/mlcc/orv-c-0402-100n-x7r.yaml',
  'capacitors/mlcc/orv-c-0402-1u-x5r.yaml',
  'capacitors/mlcc/orv-c-0402-2u2-x6s.yaml',
  'capacitors/mlcc/orv-c-0805-10u-x5r.yaml',
  'capacitors/mlcc/orv-c-0805-22u-x6s.yaml',
  'capacitors/mlcc/orv-c-1206-47u-x5r.yaml',
  'capacitors/bulk/orv-c-poly-220u-6v3.yaml',
  'capacitors/safety/orv-c-x2-100n-310v.yaml',
  'resistors/precision/orv-r-0603-100k-0p1.yaml',
  'beads/orv-fb-0603-600r-1a.yaml',
  'inductors/power/orv-l-pwr-10u-2a.yaml',
  'networks/orv-n-rc-snubber.yaml',
];
const KEPT_COMPARISONS = ['decoupling-0402.yaml'];

/** A copy of the demo library holding only the kept parts and comparisons. */
function demoSubset(): string {
  const copy = copyLibrary(REPO, 'reuse');
  for (const file of filesUnder(join(copy, 'parts'))) if (!KEPT_PARTS.includes(file)) rmSync(join(copy, 'parts', file));
  for (const file of readdirSync(join(copy, 'comparisons'))) if (!KEPT_COMPARISONS.includes(file)) rmSync(join(copy, 'comparisons', file));
  return copy;
}

let root: string;
let out: string;
let partCount: number;
let firstPages: number;

/** Files whose bytes differ between two built sites (or that only one has). */
function differences(a: string, b: string): string[] {
  const x = treeHashes(a);
  const y = treeHashes(b);
  return [...new Set([...x.keys(), ...y.keys()])].filter((f) => x.get(f) !== y.get(f)).sort();
}

/** The SHA-256 of every file of the library that a build reads, by path: equal for the same files. */
function libraryFiles(): string {
  const hashes: string[] = [];
  for (const entry of LIBRARY_ENTRIES.filter((e) => existsSync(join(root, e)))) {
    const path = join(root, entry);
    if (statSync(path).isDirectory()) for (const [file, hash] of treeHashes(path)) hashes.push(`${entry}/${file} ${hash}`);
    else hashes.push(`${entry} ${createHash('sha256').update(readFileSync(path)).digest('hex')}`);
  }
  return hashes.join('\n');
}

/**
 * Cold reference sites (no cache, no last site), by the library files they were built from. A test that
 * changes only the last site (a page edited by hand, the site removed) compares with the cold build of the
 * files the test before it built, as a build from nothing of the same files is the same site.
 */
const references = new Map<string, string>();

async function coldReference(): Promise<string> {
  const files = libraryFiles();
  let reference = references.get(files);
  if (!reference) {
    reference = join(tempDir('reuse-cold'), '_site');
    expect((await buildFolio({ libraryRoot: root, outDir: reference, workers: 0, cache: false })).ok).toBe(true);
    references.set(files, reference);
  }
  return reference;
}

/** Rebuild in place with the cache; a build of the same files from nothing must be the same site. */
async function rebuildAndCompare() {
  const rebuilt = await buildFolio({ libraryRoot: root, outDir: out, workers: 0 });
  expect(rebuilt.ok).toBe(true);
  expect(differences(out, await coldReference())).toEqual([]);
  return rebuilt;
}

function editFile(relative: string, edit: (text: string) => string): void {
  const file = join(root, relative);
  const before = readFileSync(file, 'utf8');
  const after = edit(before);
  expect(after, relative).not.toBe(before);
  writeFileSync(file, after);
}

beforeAll(async () => {
  root = demoSubset();
  out = join(root, '_site');
  const loaded = loadLibrary(root);
  expect(loaded.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  partCount = loaded.library!.parts.length;
  expect(partCount).toBe(KEPT_PARTS.length);
  const first = await buildFolio({ libraryRoot: root, outDir: out, workers: 0 });
  expect(first.ok).toBe(true);
  expect(first.reused).toBe(0);
  firstPages = first.pages;
}, 240_000);

describe('a rebuild with the last site and the cache in place', () => {
  it('carries every part folder over when nothing changed, and writes the same site', async () => {
    const before = treeHashes(out);
    const again = await buildFolio({ libraryRoot: root, outDir: out, workers: 0 });
    expect(again.reused).toBe(partCount);
    // Carried-over pages still count as pages of the site.
    expect(again.pages).toBe(firstPages);
    expect(again.charts!.drawn).toBe(0);
    expect(treeHashes(out)).toEqual(before);
  }, 120_000);

  it('draws only the edited part (and the comparisons holding it) again, and matches a cold build', async () => {
    // A part the demo review covers: its datasheet is printed in the review pack too.
    editFile('parts/capacitors/mlcc/orv-c-0402-100n-x7r.yaml', (t) => t.replace(/esr: *[^\s,}]+/, 'esr: 21m'));
    const rebuilt = await rebuildAndCompare();
    expect(rebuilt.reused).toBe(partCount - 1);
    expect(rebuilt.charts!.drawn).toBeGreaterThanOrEqual(4);
  }, 240_000);

  it('matches a cold build after a part is added and another removed', async () => {
    writeFileSync(join(root, 'parts', 'added.yaml'), 'id: ADDED-C-1\nkind: capacitor\ntitle: An added test capacitor (invented)\nnominal: 47n\nparasitics: {esr: 30m, esl: 0.5n}\n');
    rmSync(join(root, 'parts', 'resistors', 'precision', 'orv-r-0603-100k-0p1.yaml'), { force: false });
    const rebuilt = await rebuildAndCompare();
    expect(rebuilt.reused).toBe(partCount - 1);
  }, 240_000);

  it('rebuilds every part folder when the library settings change, and matches a cold build', async () => {
    editFile('folio.yaml', (t) => t.replace(/^owner: .*$/m, 'owner: Reuse test bench (invented)'));
    const rebuilt = await rebuildAndCompare();
    expect(rebuilt.reused).toBe(0);
  }, 240_000);

  it('never carries a page changed in the last site by hand into the new one', async () => {
    const page = join(out, 'parts', 'ORV-C-0402-1U-X5R', 'index.html');
    writeFileSync(page, readFileSync(page, 'utf8').replace('</main>', '<p>edited by hand</p></main>'));
    const rebuilt = await rebuildAndCompare();
    // Built afresh, or kept from the spare version when the spare's copy is not the edited file.
    expect(rebuilt.reused).toBeGreaterThanOrEqual(loadLibrary(root).library!.parts.length - 1);
    expect(readFileSync(page, 'utf8')).not.toContain('edited by hand');
  }, 240_000);

  it('puts back a download removed from the last site by hand, and a page replaced there by rename', async () => {
    // The live site's copy of a part folder changed by hand; the rebuild keeps the spare's copy (its page
    // shared with the live one by hard link, so the page's stamp is that of the live page) or makes it afresh.
    const folder = join(out, 'parts', 'ORV-C-0805-10U-X5R');
    rmSync(join(folder, 'sweep.csv'));
    writeFileSync(join(folder, 'index.tmp'), readFileSync(join(folder, 'index.html'), 'utf8').replace('</main>', '<p>replaced by hand</p></main>'));
    renameSync(join(folder, 'index.tmp'), join(folder, 'index.html'));
    const rebuilt = await rebuildAndCompare();
    expect(rebuilt.reused).toBeGreaterThanOrEqual(loadLibrary(root).library!.parts.length - 1);
    expect(readFileSync(join(folder, 'index.html'), 'utf8')).not.toContain('replaced by hand');
  }, 240_000);

  it('builds from nothing when the last site is gone, with the versions beside it', async () => {
    rmSync(out, { recursive: true, force: true });
    rmSync(join(root, '._site.zfolio'), { recursive: true, force: true });
    const rebuilt = await rebuildAndCompare();
    expect(rebuilt.reused).toBe(0);
    expect(existsSync(join(out, 'index.html'))).toBe(true);
  }, 240_000);
});

describe('the record of the last two versions', () => {
  it('reads back what was written, writes only the shards that changed, and is another output folder\'s only for it', () => {
    const dir = tempDir('reuse-record');
    const out = join(dir, 'site');
    const records = join(dir, 'builds', 'one');
    mkdirSync(out);
    const live = new VersionRecord('site-1-aaaaaaaa');
    for (let i = 0; i < 200; i++) live.set(`parts/P${i}`, { key: `k${i}`, stamp: [i], data: { listed: { id: `P${i}` } } });
    writeSiteRecord(records, { outDir: out, live, pdfs: {} });
    const shards = () => readdirSync(join(records, 'shards')).sort();
    const first = shards();
    // One file a shard, but shards with the same content (the empty ones) share one.
    expect(first.length).toBeGreaterThan(SHARDS / 2);
    expect(first.length).toBeLessThanOrEqual(SHARDS);
    const back = readSiteRecord(records, out)!;
    // The data comes back as its text, parsed when asked for.
    expect(back.live!.get('parts/P7')).toEqual({ key: 'k7', stamp: [7], text: '{"listed":{"id":"P7"}}' });
    expect(entryData(back.live!.get('parts/P7'))).toEqual({ listed: { id: 'P7' } });
    expect(back.live!.get('parts/P8')!.text).toBe('{"listed":{"id":"P8"}}');
    expect(back.spare).toBeUndefined();
    expect(readSiteRecord(records, join(dir, 'elsewhere'))).toBeUndefined();

    // One unit changes: the new live version shares all shards but one with the spare (the old live).
    const next = back.live!.renamed('site-2-bbbbbbbb');
    next.set('parts/P7', { key: 'changed', stamp: [70] });
    writeSiteRecord(records, { outDir: out, live: next, spare: back.live, pdfs: {} });
    // The version it was renamed from, which shares its shard maps, still has the unit as it was.
    expect(back.live!.get('parts/P7')!.key).toBe('k7');
    const second = shards();
    expect(second.filter((s) => !first.includes(s))).toHaveLength(1);
    const again = readSiteRecord(records, out)!;
    expect(again.live!.get('parts/P7')!.key).toBe('changed');
    expect(again.spare!.get('parts/P7')!.key).toBe('k7');
    expect(again.spare!.name).toBe('site-1-aaaaaaaa');

    // A shard is read when a version first asks for one of its units: one the live version alone names,
    // lost, leaves the spare readable and makes the live site's units in it unknown (made afresh).
    const liveOnly = join(records, 'shards', shards().filter((s) => !first.includes(s))[0]);
    const kept = readFileSync(liveOnly, 'utf8');
    rmSync(liveOnly);
    const partial = readSiteRecord(records, out)!;
    expect(partial.spare!.get('parts/P7')!.key).toBe('k7');
    expect(partial.live!.get('parts/P7')).toBeUndefined();
    expect(partial.live!.get('parts/P8')!.key).toBe('k8');
    writeFileSync(liveOnly, kept);

    // Without the spare, the shard only it named goes.
    writeSiteRecord(records, { outDir: out, live: again.live, pdfs: {} });
    expect(shards()).toHaveLength(first.length);
    rmSync(dir, { recursive: true, force: true });
  });

  it('forgets the records of output folders that are gone', () => {
    const dir = tempDir('reuse-records');
    const kept = join(dir, "kept \"site\"");
    const gone = join(dir, 'gone');
    for (const site of [kept, gone]) mkdirSync(site, { recursive: true });
    const version = () => {
      const v = new VersionRecord('site-1-aaaaaaaa');
      v.set('parts/A', { key: 'k', stamp: [] });
      return v;
    };
    writeSiteRecord(recordDir(dir, gone), { outDir: gone, live: version(), pdfs: {} });
    rmSync(gone, { recursive: true });
    writeSiteRecord(recordDir(dir, kept), { outDir: kept, live: version(), pdfs: {} });
    expect(existsSync(recordDir(dir, gone))).toBe(false);
    expect(readSiteRecord(recordDir(dir, kept), kept)?.live?.get('parts/A')?.key).toBe('k');
    rmSync(dir, { recursive: true, force: true });
  });
});
