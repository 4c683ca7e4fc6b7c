// Mains parts as a reader meets them, in a small library built for the test: a banner at the very top of
// the sheet (HTML and PDF), "310 V AC" in the index and the facts table, a mark in the index with its
// meaning in words (tooltip, screen-reader text and a legend). And titles as the browser tab shows them:
// text from the library appears once, as written, never with its escapes shown (&lt;script&gt;).
// Checked in the system Chromium and with poppler's pdftotext.

import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BrowserContext, Page } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildFolio, type BuildResult } from '../../src/build/build.js';
import { read, REPO, tempDir } from '../site-helpers.js';
import { startChrome, stopChrome } from '../print/site-tabs.js';

const X2 = 'ORV-C-X2-100N-310V';
const Y2 = 'ORV-C-Y2-2N2-300V';
const FOLIO_TITLE = `Lab <b>folio</b> & "co"`;
const PART_TITLE = `<script>alert(1)</script> & 'quoted'`;
const REVIEW_TITLE = `<script>alert(2)</script> review & co`;
const COMPARISON_TITLE = `<i>X & Y</i> parts`;

let root: string;
let site: string;
let result: BuildResult;
let browser: BrowserContext;

beforeAll(async () => {
  root = tempDir('mains');
  mkdirSync(join(root, 'parts'));
  mkdirSync(join(root, 'reviews'));
  mkdirSync(join(root, 'comparisons'));
  copyFileSync(join(REPO, 'parts/capacitors/safety/orv-c-x2-100n-310v.yaml'), join(root, 'parts/x2.yaml'));
  copyFileSync(join(REPO, 'parts/capacitors/safety/orv-c-y2-2n2-300v.yaml'), join(root, 'parts/y2.yaml'));
  writeFileSync(join(root, 'parts/plain.yaml'), `id: T-PLAIN\nkind: capacitor\ntitle: ${JSON.stringify(PART_TITLE)}\nnominal: 100n\nvoltage: 16V\nparasitics: {esr: 20m, esl: 0.5n}\n`);
  writeFileSync(join(root, 'folio.yaml'), `title: ${JSON.stringify(FOLIO_TITLE)}\nsweep: {from: 1k, to: 1G, per-decade: 20}\n`);
  writeFileSync(join(root, 'comparisons/xy.yaml'), `title: ${JSON.stringify(COMPARISON_TITLE)}\nparts: [${X2}, ${Y2}]\n`);
  writeFileSync(
    join(root, 'reviews/r.yaml'),
    `title: ${JSON.stringify(REVIEW_TITLE)}\ndate: 2026-03-18\nboard: test board\nreviewers: [A. Person]\ncovers: {parts: [${X2}, T-PLAIN]}\ndecisions: [Keep the X2 part]\n`,
  );
  site = join(root, '_site');
  // The run's Chromium for printing (test/setup/shared-chrome.ts) prints the PDFs and opens the pages, in this
  // file's context of it.
  browser = await startChrome('print');
  result = await buildFolio({ libraryRoot: root, outDir: site, cache: false, workers: 0, pdf: { env: process.env, browser, select: { parts: new Set([X2]), reviews: new Set() } } });
  if (result.pdfProblem) throw new Error(`these tests need Chromium: ${result.pdfProblem}`);
}, 240_000);

afterAll(async () => {
  await stopChrome(browser);
});

/** One tab for the titles, going from page to page: a new tab costs Chromium about a second of CPU. */
let titleTab: Promise<Page> | undefined;
async function tabTitle(file: string): Promise<string> {
  titleTab ??= browser.newPage();
  const page = await titleTab;
  await page.goto(pathToFileURL(join(site, file)).href, { waitUntil: 'load' });
  return page.title();
}

describe('titles in the browser tab', () => {
  it.each([
    ['index.html', `Parts · ${FOLIO_TITLE}`],
    ['parts/T-PLAIN/index.html', `T-PLAIN · ${FOLIO_TITLE}`],
    ['comparisons/xy/index.html', `${COMPARISON_TITLE} · ${FOLIO_TITLE}`],
    ['reviews/r/index.html', `${REVIEW_TITLE} · ${FOLIO_TITLE}`],
    ['reviews/r/pack.html', `Review pack: ${REVIEW_TITLE} · ${FOLIO_TITLE}`],
  ])('%s shows the text as written', async (file, expected) => {
    expect(result.ok).toBe(true);
    expect(await tabTitle(file)).toBe(expected);
    // Escaped once in the HTML source, so nothing in it runs.
    expect(read(site, file)).not.toContain('<script>alert');
  });
});

describe('a mains part', () => {
  it('opens its sheet with a banner, above the part id, naming the class, the standard and the hazard', async () => {
    const page = await browser.newPage();
    await page.setViewport({ width: 1280, height: 900 });
    await page.goto(pathToFileURL(join(site, `parts/${X2}/index.html`)).href, { waitUntil: 'load' });
    const banner = await page.$eval('.mains-banner', (el) => ({ text: (el as HTMLElement).innerText, top: el.getBoundingClientRect().top }));
    const idTop = await page.$eval('h1.part-id', (el) => el.getBoundingClientRect().top);
    expect(banner.top).toBeLessThan(idTop);
    expect(banner.top).toBeLessThan(900);
    expect(banner.text).toMatch(/class X2 safety capacitor \(IEC 60384-14\)/i);
    expect(banner.text).toMatch(/Hazardous voltage \(rated 310 V AC\)/);
    expect(banner.text).toMatch(/local electrical codes and licensed practice/);
    await page.close();
  });

  it('states its rating as 310 V AC in the facts table and the index', () => {
    expect(read(site, `parts/${X2}/index.html`)).toMatch(/<th scope="row">Rated voltage<\/th><td>310 V AC/);
    const index = read(site, 'index.html');
    const row = index.slice(index.indexOf(`href="parts/${X2}/index.html"`), index.indexOf('</tr>', index.indexOf(`href="parts/${X2}/index.html"`)));
    expect(row).toContain('>310 V AC</td>');
  });

  it('is marked in the index, the mark explained in words (tooltip, screen-reader text, legend)', async () => {
    const page = await browser.newPage();
    await page.goto(pathToFileURL(join(site, 'index.html')).href, { waitUntil: 'load' });
    const marks = await page.$$eval('table.parts-index tbody tr', (rows) =>
      rows.map((r) => ({ id: r.querySelector('a')!.textContent, mark: r.querySelector('.mains-mark')?.textContent ?? null, tip: r.querySelector('.mains-mark')?.getAttribute('title') ?? null })),
    );
    expect(marks.find((m) => m.id === X2)).toEqual({ id: X2, mark: '⚠ MAINS X2', tip: expect.stringMatching(/^Mains safety capacitor, class X2 \(IEC 60384-14\), for use across the line/) });
    expect(marks.find((m) => m.id === Y2)!.tip).toMatch(/across the insulation barrier \(line to protective earth/);
    expect(marks.find((m) => m.id === 'T-PLAIN')!.mark).toBeNull();
    expect(await page.$eval('.mains-legend', (el) => (el as HTMLElement).innerText)).toMatch(/X across the line, Y across the insulation barrier/);
    // Filtering by the word finds the mains parts.
    await page.type('input[name=q]', 'mains');
    const shown = await page.$$eval('table.parts-index tbody tr', (rows) => rows.filter((r) => !(r as HTMLElement).hidden).map((r) => r.querySelector('a')!.textContent));
    expect(shown.sort()).toEqual([X2, Y2]);
    await page.close();
  });

  it('prints the banner at the top of the first page of its PDF', () => {
    const pdf = join(site, 'pdf', 'parts', `${X2}.pdf`);
    const first = execFileSync('pdftotext', ['-f', '1', '-l', '1', '-layout', pdf, '-'], { encoding: 'utf8' });
    const banner = first.search(/MAINS PART: CLASS X2 SAFETY CAPACITOR \(IEC 60384-14\)/i);
    expect(banner).toBeGreaterThanOrEqual(0);
    expect(banner).toBeLessThan(first.indexOf(X2, first.indexOf('CAPACITOR', banner + 10)));
    expect(first.replace(/\s+/g, ' ')).toMatch(/At the 438 V peak of its 310 V AC rating \(√2 × r\.m\.s\.\) it holds 9\.61 mJ/);
  });
});
