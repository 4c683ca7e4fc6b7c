// What a rebuild costs after one part file is edited, on a generated library of 300 invented parts (the
// benchmark's generator): only that part's folder and the pages that show it change (the SHA-256 of every
// file of the site before and after), the rebuilt site is byte for byte the one a cold build makes of the
// edited library, and the work done (parts analysed, folders written, pages rendered, units linked) is that
// of the edit, not of the library. Which pages show the part is read from the built HTML itself: every page
// outside the part's folder that links its page, and every row script of the index that names it.
// Every build draws its charts in this thread (workers 0): in a test the chart pool's worker threads each
// load the chart modules again through the TypeScript loader, about 3.5 s of CPU a cold build here, and
// what is checked here does not depend on where a chart is drawn (site.test.ts compares a site whose charts
// were drawn in worker threads with one drawn in this thread, byte for byte).

import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildFolio, CACHE_DIR, type BuildResult } from '../../src/build/build.js';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import { headParsed } from '../../src/model/lazy-head.js';
import { filesUnder, treeHashes } from '../site-helpers.js';
import { buildFromNothing } from './from-nothing.js';

const PARTS = 300;

let root: string;
let out: string;
let unchanged: BuildResult;

const build = async () => {
  const result = await buildFolio({ libraryRoot: root, outDir: out, workers: 0 });
  expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  expect(result.ok).toBe(true);
  return result;
};

function changedFiles(before: Map<string, string>, after: Map<string, string>): string[] {
  return [...new Set([...before.keys(), ...after.keys()])].filter((f) => before.get(f) !== after.get(f)).sort();
}

/** The files of the site that show part `id`, found in the built files (not by zfolio's own keys). */
function filesShowing(site: string, id: string): { pages: string[]; comparisons: string[]; allowed: Set<string> } {
  const files = filesUnder(site);
  const own = files.filter((f) => f.startsWith(`parts/${id}/`));
  const link = new RegExp(`parts/${id.replace(/[.]/g, '\\.')}/index\\.html`);
  const pages = files.filter((f) => f.endsWith('.html') && !f.startsWith(`parts/${id}/`) && link.test(readFileSync(join(site, f), 'utf8')));
  const scripts = files.filter((f) => /^list\/rows-\d+\.js$/.test(f) && readFileSync(join(site, f), 'utf8').includes(JSON.stringify(id)));
  const comparisons = pages.filter((f) => /^comparisons\/[^/]+\/index\.html$/.test(f)).map((f) => f.split('/')[1]);
  // A comparison's chart spec beside its page draws the part too.
  const specs = files.filter((f) => comparisons.some((c) => f.startsWith(`comparisons/${c}/`)));
  return { pages, comparisons, allowed: new Set([...own, ...pages, ...scripts, ...specs]) };
}

/** Edit one generated part's first parasitic value; returns its id. */
function editPart(index: number, value: string): string {
  const file = join(root, 'parts', `group-${Math.floor(index / 100)}`, `gen-${index}.yaml`);
  const before = readFileSync(file, 'utf8');
  const after = before.replace(/parasitics: \{(\w+): [^,}]+/, `parasitics: {$1: ${value}`);
  expect(after).not.toBe(before);
  writeFileSync(file, after);
  return /^id: (\S+)$/m.exec(after)![1];
}

beforeAll(async () => {
  root = writeGeneratedLibrary(PARTS, 1);
  out = join(root, '_site');
  const cold = await build();
  expect(cold.reused).toBe(0);
  expect(cold.work.partFolders).toBe(PARTS);
  expect(cold.work.filesParsed).toBe(PARTS);
  // Nothing changed: the record now has a spare version for the next build to update.
  const before = treeHashes(out);
  unchanged = await build();
  expect(treeHashes(out)).toEqual(before);
  // The warnings of parts taken from the part cache are those reading them gave.
  expect(unchanged.diagnostics).toEqual(cold.diagnostics);
}, 900_000);

afterAll(() => rmSync(root, { recursive: true, force: true }));

describe(`a rebuild of ${PARTS} generated parts`, () => {
  it('with nothing changed analyses, writes and renders no part, comparison or index page', () => {
    expect(unchanged.reused).toBe(PARTS);
    expect(unchanged.work).toMatchObject({ filesParsed: 0, partsAnalysed: 0, partFolders: 0, comparisons: 0, listFiles: 0 });
    expect(unchanged.charts!.rendered).toBe(0);
    // No part's fields were parsed (lazy-head.ts) but those of parts whose reading warned (kept parsed).
    const warned = new Set(unchanged.diagnostics.map((d) => d.file));
    expect(unchanged.library!.parts.filter((p) => headParsed(p) && !warned.has(p.source.path)).map((p) => p.id)).toEqual([]);
  });

  let firstEdit: { id: string; result: BuildResult };

  it('after one part is edited changes only its folder and the pages that show it, and updates the spare in place', async () => {
    const showing = filesShowing(out, 'GEN-00005');
    const before = treeHashes(out);
    const id = editPart(5, '0.0321');
    expect(id).toBe('GEN-00005');
    const result = await build();
    const changed = changedFiles(before, treeHashes(out));
    expect(changed.filter((f) => !showing.allowed.has(f))).toEqual([]);
    for (const f of [`parts/${id}/index.html`, `parts/${id}/sweep.csv`, `parts/${id}/figures.json`, ...showing.pages]) expect(changed).toContain(f);

    // The work of one part: its folder, the comparisons and index page that show it, the parts of those
    // comparisons (their chart is drawn again from every part on it), and the few pages every build renders.
    expect(showing.comparisons.length).toBeGreaterThan(0);
    expect(result.reused).toBe(PARTS - 1);
    expect(result.work.filesParsed).toBe(1);
    expect(result.work.partFolders).toBe(1);
    expect(result.work.comparisons).toBe(showing.comparisons.length);
    const indexPages = showing.pages.filter((f) => f === 'index.html' || /^list\/\d+\.html$/.test(f)).length;
    expect(indexPages).toBe(1);
    expect(result.work.pagesRendered - unchanged.work.pagesRendered).toBe(1 + showing.comparisons.length + indexPages);
    const onCharts = new Set(showing.comparisons.flatMap((c) => [...readFileSync(join(out, 'comparisons', c, 'index.html'), 'utf8').matchAll(/parts\/([^/"]+)\/index\.html/g)].map((m) => m[1])));
    expect(result.work.partsAnalysed).toBeLessThanOrEqual(onCharts.size);
    // Of the unchanged parts, only those on the redrawn charts (and parts whose reading warned) had their fields parsed.
    const warned = new Set(result.diagnostics.map((d) => d.file));
    expect(result.library!.parts.filter((p) => headParsed(p) && p.id !== id && !onCharts.has(p.id) && !warned.has(p.source.path)).map((p) => p.id)).toEqual([]);
    // Every other unit is the spare's own copy: nothing was linked or copied file by file.
    expect(result.unitsLinked).toBe(0);
    // The chart cache was not pruned (chart-cache-ledger.ts): its ledger counts the entries this build drew.
    const ledger = JSON.parse(readFileSync(join(root, CACHE_DIR, 'charts', 'ledger.json'), 'utf8')) as { written: number };
    expect(ledger.written).toBe(result.charts!.rendered);
    expect(result.charts!.rendered).toBeGreaterThan(0);
    firstEdit = { id, result };
  }, 600_000);

  it('after a second edit links from the live site only what the last build changed, and equals a cold build', async () => {
    const showing = filesShowing(out, 'GEN-00150');
    const before = treeHashes(out);
    const id = editPart(150, '0.0654');
    const result = await build();
    const changed = changedFiles(before, treeHashes(out));
    expect(changed.filter((f) => !showing.allowed.has(f))).toEqual([]);
    expect(changed).toContain(`parts/${id}/index.html`);
    expect(result.work.partFolders).toBe(1);
    // The spare is the site before the first edit: the units that edit made are linked from the live site.
    const firstUnits = 1 + firstEdit.result.work.comparisons + firstEdit.result.work.listFiles;
    expect(result.unitsLinked).toBeLessThanOrEqual(firstUnits);
    expect(result.unitsLinked).toBeGreaterThan(0);

    // The cold build, its charts from the cache the builds above filled (buildFromNothing).
    const { result: cold, hashes } = await buildFromNothing(root, 'carry-over-cold');
    expect(cold.ok).toBe(true);
    expect(cold.reused).toBe(0);
    expect(cold.work).toMatchObject({ filesParsed: PARTS, partsAnalysed: PARTS, partFolders: PARTS });
    expect(cold.charts!.rendered).toBe(0);
    expect(changedFiles(hashes, treeHashes(out))).toEqual([]);
  }, 900_000);
});
