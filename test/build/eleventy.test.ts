// Part pages are rendered by several eleventy runs of a few hundred pages each (a run holds every page it
// renders until it ends), from the site header alone and while other parts' charts are still drawn
// (part-page-runs.ts): the site must not depend on how they are split. A generated library of 30 parts,
// built with no charts drawn (charts are not what is checked), rendered in runs of 7 part pages and in one
// run, gives the same files, byte for byte, and every part its page; so does a build run from a folder the
// templates are not under (eleventy's ignores once matched nothing there, and every run rendered every
// page); and the demo's part pages are those one run with the whole site's data renders.

import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import { buildFolio } from '../../src/build/build.js';
import { noCharts } from './no-charts.js';
import { PART_PAGES_PER_RUN, renderPages } from '../../src/build/eleventy.js';
import { filesUnder, read, REPO, tempDir, treeHashes } from '../site-helpers.js';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';

const PARTS = 30;
const root = writeGeneratedLibrary(PARTS, 5);
writeFileSync(join(root, 'folio.yaml'), 'title: Generated library (invented parts)\nsweep: {from: 100, to: 10G, per-decade: 10}\n');
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('part pages rendered in runs', () => {
  it('gives the same site whether the part pages are rendered 7 to a run or all in one', async () => {
    expect(PART_PAGES_PER_RUN).toBeGreaterThan(PARTS);
    const split = await buildFolio({ libraryRoot: root, outDir: join(root, 'split'), cache: false, charts: noCharts, partPagesPerRun: 7 });
    const whole = await buildFolio({ libraryRoot: root, outDir: join(root, 'whole'), cache: false, charts: noCharts });
    expect(split.ok && whole.ok).toBe(true);
    // Every page once: the runs after the first render part pages only.
    expect(split.pages).toBe(whole.pages);
    expect(split.work.pagesRendered).toBe(whole.work.pagesRendered);
    const files = filesUnder(join(root, 'split'));
    for (let i = 0; i < PARTS; i++) expect(files).toContain(`parts/GEN-${String(i).padStart(5, '0')}/index.html`);
    expect(files).toContain('index.html');
    expect(files).toContain('comparisons/index.html');
    expect(treeHashes(join(root, 'split'))).toEqual(treeHashes(join(root, 'whole')));
  }, 120_000);

  it('renders every page once when run from a folder the templates are not under', async () => {
    const elsewhere = tempDir('cwd');
    const out = join(root, 'elsewhere');
    const was = process.cwd();
    process.chdir(elsewhere);
    let result: Awaited<ReturnType<typeof buildFolio>>;
    try {
      result = await buildFolio({ libraryRoot: root, outDir: out, cache: false, charts: noCharts, partPagesPerRun: 7 });
    } finally {
      process.chdir(was);
      rmSync(elsewhere, { recursive: true, force: true });
    }
    expect(result.ok).toBe(true);
    // Each page rendered once: as many as the site has pages.
    expect(result.work.pagesRendered).toBe(filesUnder(out).filter((f) => f.endsWith('.html')).length);
    expect(treeHashes(out)).toEqual(treeHashes(join(root, 'whole')));
  }, 120_000);

  it("renders the demo's part pages from the site header as one run with the whole site's data does", async () => {
    const built = join(root, 'demo');
    const direct = join(root, 'demo-direct');
    const result = await buildFolio({ libraryRoot: REPO, outDir: built, cache: false, charts: noCharts });
    expect(result.ok).toBe(true);
    const parts = result.folio!.partPages;
    expect(parts.length).toBeGreaterThan(10);
    // Every page the build rendered, again in one run that is given the whole site's data.
    await renderPages(direct, result.folio!);
    const pages = filesUnder(direct);
    for (const p of parts) expect(pages).toContain(`parts/${p.id}/index.html`);
    for (const page of pages) expect(readFileSync(join(built, page)).equals(readFileSync(join(direct, page))), page).toBe(true);
    // The demo has rail plans and reviews: a part page links to both lists.
    const html = read(built, `parts/${parts[0].id}/index.html`);
    expect(html).toContain('href="../../plans/index.html"');
    expect(html).toContain('href="../../reviews/index.html"');
  }, 120_000);
});
