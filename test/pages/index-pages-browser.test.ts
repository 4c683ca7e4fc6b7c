// The parts index of a generated 2,000-part library (invented parts, bench/generate.ts) in the system
// Chromium, from the file system: the first page opens quickly with 200 rows, every part is reachable
// through the page links with script off, and with script on the fields filter and the headings sort all
// 2,000 parts, shown a page at a time. Charts and sweeps are not what this test looks at, so the build draws
// no chart (a chart maker that returns empty charts) and sweeps 10 points a decade rather than 100 (the index
// shows each part's figures, which come from its poles and zeros, not from the plain sweep's points, and
// every sweep file is written for every part all the same); every page and the index's row scripts are the
// real ones.

import { rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BrowserContext, Page } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import { buildFolio } from '../../src/build/build.js';
import { noCharts } from '../build/no-charts.js';
import type { Library } from '../../src/model/library.js';
import { ARTIFACTS, keepScreenshot, siteTabs, startChrome, stopChrome } from '../print/site-tabs.js';

const PARTS = 2000;
let root: string;
let site: string;
let library: Library;
let browser: BrowserContext;
const problems: string[] = [];


beforeAll(async () => {
  root = writeGeneratedLibrary(PARTS, 3);
  writeFileSync(join(root, 'folio.yaml'), 'title: Generated library (invented parts)\nsweep: {from: 100, to: 10G, per-decade: 10}\n');
  site = join(root, '_site');
  const result = await buildFolio({ libraryRoot: root, outDir: site, cache: false, charts: noCharts });
  expect(result.ok).toBe(true);
  // The part files as the build read them (loadLibrary): read once, not a second time for the test.
  library = result.library!;
  expect(library.parts).toHaveLength(PARTS);
  browser = await startChrome();
}, 300_000);

afterAll(async () => {
  await stopChrome(browser);
  if (root) rmSync(root, { recursive: true, force: true });
});

const open = siteTabs(() => browser, () => site, problems);
/** The walk's own tab: a test may hold a page of `open` while the walk is made. */
const openForWalk = siteTabs(() => browser, () => site, problems);

const ids = (page: Page) => page.$$eval('table.parts-index tbody tr', (rows) => rows.filter((r) => !(r as HTMLElement).hidden).map((r) => r.querySelector('a')!.textContent!.trim()));
const count = (page: Page) => page.$eval('output[name=count]', (o) => (o as HTMLOutputElement).value);
/** What the find field matches, by the test's own reading of the part files: every word in id, title, kind, package, dielectric or tags. */
const matching = (words: string[]) =>
  library.parts
    .filter((p) => {
      const text = [p.id, p.title, p.kind, p.package ?? '', p.dielectric ?? '', ...p.tags].join(' ').toLowerCase();
      return words.every((w) => text.includes(w));
    })
    .map((p) => p.id)
    .sort();

/** One page of the index as a reader without script sees it. */
interface StaticPage {
  file: string;
  formHidden: boolean;
  ids: string[];
  /** The SRF column's values, as the cells hold them. */
  srfs: string[];
}

let walked: Promise<StaticPage[]> | undefined;
/**
 * The index with script off, from its first page through each page's link to the next (the link after the
 * current page's number), in one tab; read once, for the test that walks it and the one that sorts.
 */
function walkWithoutScript(): Promise<StaticPage[]> {
  walked ??= (async () => {
    const out: StaticPage[] = [];
    let file: string | undefined = 'index.html';
    const page = await openForWalk(file, false);
    while (file) {
      const read = await page.evaluate(() => {
        const rows = Array.from(document.querySelectorAll<HTMLTableRowElement>('table.parts-index tbody tr'));
        const current = document.querySelector('nav[data-pager] [aria-current=page]')!;
        const after = current.nextElementSibling as HTMLAnchorElement | null;
        return {
          formHidden: (document.querySelector('form[data-filters]') as HTMLFormElement).hidden,
          ids: rows.filter((r) => !r.hidden).map((r) => r.querySelector('a')!.textContent!.trim()),
          srfs: rows.map((r) => r.cells[5].dataset.value ?? ''),
          next: after ? after.getAttribute('href') : null,
        };
      });
      out.push({ file, formHidden: read.formHidden, ids: read.ids, srfs: read.srfs });
      // Links are relative to the page: resolve against its folder.
      file = read.next ? join(dirname(file), read.next).split('\\').join('/') : undefined;
      if (file) await page.goto(`${pathToFileURL(site).href}/${file}`, { waitUntil: 'load' });
    }
    await page.close();
    return out;
  })();
  return walked;
}

describe(`the index of ${PARTS.toLocaleString('en-GB')} parts`, () => {
  it('shows its first page of 200 parts quickly, from a page far smaller than the whole list', async () => {
    expect(statSync(join(site, 'index.html')).size).toBeLessThan(250_000);
    const page = await browser.newPage();
    await page.setViewport({ width: 1280, height: 900 });
    const started = performance.now();
    await page.goto(`${pathToFileURL(site).href}/index.html`, { waitUntil: 'load' });
    await page.screenshot({ path: join(ARTIFACTS, 'index-2000-first.png') });
    const seconds = (performance.now() - started) / 1000;
    console.log(`index of ${PARTS} parts: first screenshot ${seconds.toFixed(2)} s after navigation started`);
    // A loose bound for a shared, busy machine; the figure itself is printed above.
    expect(seconds).toBeLessThan(5);
    expect(await ids(page)).toEqual(library.parts.map((p) => p.id).sort().slice(0, 200));
    await page.close();
  });

  it('reaches every part through its page links with script off', async () => {
    const walk = await walkWithoutScript();
    expect(walk.map((p) => p.file)).toEqual(['index.html', ...Array.from({ length: 9 }, (_, i) => `list/${i + 2}.html`)]);
    expect(walk.every((p) => p.formHidden)).toBe(true);
    expect(walk.flatMap((p) => p.ids)).toEqual(library.parts.map((p) => p.id).sort());
  });

  it('filters all parts from any page and pages through the matches', async () => {
    const page = await open('list/3.html');
    await page.type('input[name=q]', 'generated capacitor');
    const expected = matching(['generated', 'capacitor']);
    expect(expected.length).toBeGreaterThan(200);
    await page.waitForFunction(() => /shown/.test((document.querySelector('output[name=count]') as HTMLOutputElement).value));
    const pages = Math.ceil(expected.length / 200);
    expect(await count(page)).toBe(`${expected.length} of ${PARTS} shown, page 1 of ${pages}`);
    expect(await ids(page)).toEqual(expected.slice(0, 200));
    // Links from a page in list/ lead to the part pages one folder up.
    expect(await page.$eval('table.parts-index tbody a', (a) => a.getAttribute('href'))).toBe(`../parts/${expected[0]}/index.html`);
    await page.click('nav[data-pager] button:last-of-type');
    expect(await count(page)).toBe(`${expected.length} of ${PARTS} shown, page 2 of ${pages}`);
    expect(await ids(page)).toEqual(expected.slice(200, 400));
    await keepScreenshot(page, 'index-2000-filtered.png');

    await page.click('input[name=q]', { clickCount: 3 });
    await page.keyboard.press('Backspace');
    await page.select('select[name=kind]', 'bead');
    const beads = library.parts.filter((p) => p.kind === 'bead').map((p) => p.id).sort();
    expect(await count(page)).toBe(`${beads.length} of ${PARTS} shown, page 1 of ${Math.ceil(beads.length / 200)}`);
    expect(await ids(page)).toEqual(beads.slice(0, 200));
  });

  it('sorts all parts by a column, both ways, with the order of the numbers', async () => {
    const page = await open('index.html');
    await page.click('th[data-key=srf] button');
    await page.waitForFunction(() => /shown/.test((document.querySelector('output[name=count]') as HTMLOutputElement).value));
    const srfs = () => page.$$eval('table.parts-index tbody tr', (rows) => rows.map((r) => r.cells[5].dataset.value ?? ''));
    // Every part's SRF, read back from the no-script pages of the same site (the walk of the test above).
    const all = (await walkWithoutScript()).flatMap((p) => p.srfs).filter((v) => v !== '').map(Number);
    all.sort((a, b) => a - b);
    expect((await srfs()).map(Number)).toEqual(all.slice(0, 200));
    await page.click('th[data-key=srf] button');
    expect((await srfs()).map(Number)).toEqual([...all].reverse().slice(0, 200));
    await keepScreenshot(page, 'index-2000-sorted.png');
  });

  it('raised no console error and no failed request', () => {
    expect(problems).toEqual([]);
  });
});
