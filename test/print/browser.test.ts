// The built demo folio in the system Chromium, opened from the file system as a reader would: the index
// filters and sorts, part and comparison pages show their charts, nothing is fetched from outside and no
// error reaches the console. With ZFOLIO_TEST_SCREENSHOTS=1, screenshots go to test/.artifacts/ for people to look at.

import type { BrowserContext, Page } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { demoSite } from '../demo-site.js';
import { REPO } from '../site-helpers.js';
import { keepScreenshot, siteTabs, startChrome, stopChrome } from './site-tabs.js';

const library = loadLibrary(REPO).library!;
let site: string;
let browser: BrowserContext;
const problems: string[] = [];

beforeAll(async () => {
  // The demo built cold, once for the run (test/demo-site.ts).
  site = await demoSite();
  browser = await startChrome();
}, 240_000);

afterAll(async () => {
  await stopChrome(browser);
});

const open = siteTabs(() => browser, () => site, problems);

const visibleIds = (page: Page) =>
  page.$$eval('table.parts-index tbody tr', (rows) => rows.filter((r) => !(r as HTMLElement).hidden).map((r) => r.querySelector('a')!.textContent!.trim()));

describe('the index', () => {
  it('filters by text and by kind', async () => {
    const page = await open('index.html');
    expect(await page.$eval('form[data-filters]', (f) => (f as HTMLFormElement).hidden)).toBe(false);
    expect(await visibleIds(page)).toHaveLength(library.parts.length);

    const beads = library.parts.filter((p) => p.kind === 'bead').map((p) => p.id);
    await page.select('select[name=kind]', 'bead');
    expect((await visibleIds(page)).sort()).toEqual([...beads].sort());
    expect(await page.$eval('output[name=count]', (o) => (o as HTMLOutputElement).value)).toBe(`${beads.length} of ${library.parts.length} shown`);

    await page.select('select[name=kind]', '');
    const word = '0402';
    await page.type('input[name=q]', word);
    const expected = library.parts.filter((p) => [p.id, p.title, p.package ?? '', ...p.tags].join(' ').toLowerCase().includes(word)).map((p) => p.id);
    expect((await visibleIds(page)).sort()).toEqual(expected.sort());
    await keepScreenshot(page, 'index-filtered.png');
  });

  it('sorts by SRF, both ways, with the order of the numbers and not of the text', async () => {
    const page = await open('index.html');
    const srfs = () => page.$$eval('table.parts-index tbody tr', (rows) => rows.map((r) => r.cells[5].dataset.value ?? ''));
    const header = await page.$('th[data-key=srf] button');
    await header!.click();
    expect(await page.$eval('th[data-key=srf]', (th) => th.getAttribute('aria-sort'))).toBe('ascending');
    const up = (await srfs()).filter((v) => v !== '').map(Number);
    expect(up).toEqual([...up].sort((a, b) => a - b));
    await header!.click();
    const down = (await srfs()).filter((v) => v !== '').map(Number);
    expect(down).toEqual([...down].sort((a, b) => b - a));
    await keepScreenshot(page, 'index-sorted.png');
  });

  it('is complete and readable with script off', async () => {
    const page = await open('index.html', false);
    expect(await page.$$eval('table.parts-index tbody tr', (rows) => rows.length)).toBe(library.parts.length);
    expect(await page.$eval('form[data-filters]', (f) => (f as HTMLFormElement).hidden)).toBe(true);
  });
});

describe('pages', () => {
  it('a part page, reached from the index, shows its four charts and the schematic', async () => {
    const page = await open('index.html');
    const id = library.parts.find((p) => p.kind === 'capacitor')!.id;
    await Promise.all([page.waitForNavigation({ waitUntil: 'load' }), page.click(`a[href="parts/${id}/index.html"]`)]);
    expect(await page.$eval('h1.part-id', (h) => h.textContent)).toBe(id);
    const boxes = await page.$$eval('figure.chart svg, .schematic-figure svg', (svgs) => svgs.map((s) => s.getBoundingClientRect()).map((r) => [r.width, r.height]));
    expect(boxes).toHaveLength(5);
    for (const [w, h] of boxes) expect(w * h).toBeGreaterThan(10_000);
    await keepScreenshot(page, 'part-page.png', true);
  });

  it('every kind of part page opens cleanly', async () => {
    for (const kind of ['inductor', 'resistor', 'bead', 'network'] as const) {
      const part = library.parts.find((p) => p.kind === kind)!;
      const page = await open(`parts/${part.id}/index.html`);
      // Four charts, and three more for each measurement the part has.
      expect(await page.$$eval('figure.chart svg', (s) => s.length)).toBe(4 + 3 * part.measurements.length);
      await keepScreenshot(page, `part-${kind}.png`, true);
      }
  });

  it('a comparison page overlays the parts on one chart', async () => {
    // The demo's inductors are one family of every inductor.
    const page = await open('comparisons/family-inductor/index.html');
    const box = await page.$eval('figure.chart svg', (s) => s.getBoundingClientRect().width);
    expect(box).toBeGreaterThan(300);
    const rows = await page.$$eval('table.grid tbody tr', (r) => r.length);
    expect(rows).toBe(library.parts.filter((p) => p.kind === 'inductor').length);
    await keepScreenshot(page, 'comparison.png', true);
  });

  it('raised no console error, no failed request and no request outside the site', () => {
    expect(problems).toEqual([]);
  });
});
