// The charts of the built demo folio as Chromium lays them out: no two words of a chart overlap, and no
// word (a resonance or peak label, a note, a key entry, a tick label) lies on a curve; no label of a part's
// schematic crosses a wire, a symbol or another label. The geometry is
// Chromium's own (getBoundingClientRect of each text, points along each curve's path), not zfolio's
// estimate of it, so a label placed by a wrong idea of a font's width or baseline is caught here.

import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findChrome, launchChrome } from '../../src/print/browser.js';
import { loadLibrary } from '../../src/model/library.js';
import { demoSite } from '../demo-site.js';
import { REPO } from '../site-helpers.js';

const library = loadLibrary(REPO).library!;
let site: string;
let browser: Browser;

beforeAll(async () => {
  // The demo built cold, once for the run (test/demo-site.ts): every chart drawn by this code.
  site = await demoSite();
  const chrome = findChrome(undefined, process.env);
  if (!('path' in chrome)) throw new Error(`browser tests need Chromium: ${chrome.problem}`);
  browser = await launchChrome(chrome.path);
}, 240_000);

afterAll(async () => {
  await browser?.close();
});

/** What a chart on a page breaks: overlapping words, and words lying on a curve. */
async function chartProblems(file: string): Promise<string[]> {
  const page = await browser.newPage();
  // Each chart at the width it is drawn for, so one CSS px is one px of its viewBox (frame.ts).
  await page.setViewport({ width: 1280, height: 900, deviceScaleFactor: 1 });
  await page.goto(`${pathToFileURL(site).href}/${file}`, { waitUntil: 'load' });
  const problems = await page.$$eval('figure.chart svg', (svgs) => {
    /** "A few pixels": a word may touch a curve or a neighbour by this much (anti-aliasing, glyph overhang). */
    const SLACK = 2;
    const out: string[] = [];
    for (const svg of svgs) {
      const chart = svg.closest('figure')?.id ?? '?';
      const texts = Array.from(svg.querySelectorAll('text'))
        .filter((t) => (t.textContent ?? '').trim() !== '')
        .map((t) => ({ text: t.textContent!.trim(), box: t.getBoundingClientRect() }));
      for (let i = 0; i < texts.length; i++) {
        for (let j = i + 1; j < texts.length; j++) {
          const a = texts[i].box;
          const b = texts[j].box;
          const w = Math.min(a.right, b.right) - Math.max(a.left, b.left);
          const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
          if (w > SLACK && h > SLACK) out.push(`${chart}: "${texts[i].text}" overlaps "${texts[j].text}" by ${w.toFixed(1)} × ${h.toFixed(1)} px`);
        }
      }
      // Curves: stroked, unfilled paths (vega's line marks); the key's symbols are <line>s, grids and rules too.
      const curves = Array.from(svg.querySelectorAll('path')).filter((p) => p.getAttribute('stroke') && (!p.getAttribute('fill') || p.getAttribute('fill') === 'none') && p.getAttribute('stroke') !== 'none');
      for (const curve of curves) {
        const matrix = curve.getScreenCTM();
        if (!matrix) continue;
        // Only what is drawn: a curve clipped to the plot (vega's clip-path on its group) counts inside the clip.
        const clipped = curve.closest('[clip-path]');
        const clipId = /url\(#([^)]+)\)/.exec(clipped?.getAttribute('clip-path') ?? '')?.[1];
        const clipShape = clipId ? svg.querySelector(`[id="${clipId}"] > *`) : null;
        const clip = clipShape ? clipShape.getBoundingClientRect() : null;
        const length = curve.getTotalLength();
        const points: { x: number; y: number }[] = [];
        for (let s = 0; s <= length; s += 1) {
          const p = curve.getPointAtLength(s);
          const x = matrix.a * p.x + matrix.c * p.y + matrix.e;
          const y = matrix.b * p.x + matrix.d * p.y + matrix.f;
          if (!clip || (x >= clip.left && x <= clip.right && y >= clip.top && y <= clip.bottom)) points.push({ x, y });
        }
        for (const t of texts) {
          const b = t.box;
          const inside = points.filter((p) => p.x > b.left + SLACK && p.x < b.right - SLACK && p.y > b.top + SLACK && p.y < b.bottom - SLACK);
          if (inside.length > 0) out.push(`${chart}: "${t.text}" lies on a curve (${curve.getAttribute('stroke')}) for ${inside.length} px`);
        }
      }
    }
    return out;
  });
  await page.close();
  return problems.map((p) => `${file} ${p}`);
}

/** What a part's schematic breaks: a value label crossing a wire or a symbol, or another label. */
async function schematicProblems(file: string): Promise<string[]> {
  const page = await browser.newPage();
  await page.setViewport({ width: 1280, height: 900, deviceScaleFactor: 1 });
  await page.goto(`${pathToFileURL(site).href}/${file}`, { waitUntil: 'load' });
  const problems = await page.$$eval('svg.schematic', (svgs) => {
    /** A label keeps this far (px, on screen where a schematic is drawn at 1.5 times its units) from every stroke and label. */
    const SLACK = 2;
    const out: string[] = [];
    for (const svg of svgs) {
      const texts = Array.from(svg.querySelectorAll('text')).map((t) => ({ text: (t.textContent ?? '').trim(), box: t.getBoundingClientRect() }));
      for (let i = 0; i < texts.length; i++) {
        for (let j = i + 1; j < texts.length; j++) {
          const a = texts[i].box;
          const b = texts[j].box;
          const w = Math.min(a.right, b.right) - Math.max(a.left, b.left);
          const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
          if (w > -SLACK && h > -SLACK) out.push(`"${texts[i].text}" is within ${SLACK} px of "${texts[j].text}"`);
        }
      }
      // Wires, symbols and terminals: every stroked shape, walked along its outline in Chromium's own geometry.
      for (const shape of Array.from(svg.querySelectorAll<SVGGeometryElement>('path, rect, circle, line'))) {
        const matrix = shape.getScreenCTM();
        if (!matrix) continue;
        const length = shape.getTotalLength();
        for (const t of texts) {
          const b = t.box;
          let crossing = 0;
          for (let s = 0; s <= length; s += 0.5) {
            const p = shape.getPointAtLength(s);
            const x = matrix.a * p.x + matrix.c * p.y + matrix.e;
            const y = matrix.b * p.x + matrix.d * p.y + matrix.f;
            if (x > b.left - SLACK && x < b.right + SLACK && y > b.top - SLACK && y < b.bottom + SLACK) crossing++;
          }
          if (crossing > 0) out.push(`"${t.text}" is within ${SLACK} px of a ${shape.tagName} (${(crossing / 2).toFixed(1)} px of it)`);
        }
      }
    }
    return out;
  });
  await page.close();
  return problems.map((p) => `${file}: ${p}`);
}

describe('schematics in the browser', () => {
  it('every part page: every value label keeps clear of the wires, the symbols and the other labels', async () => {
    const problems: string[] = [];
    for (const part of library.parts) problems.push(...(await schematicProblems(`parts/${part.id}/index.html`)));
    expect(problems).toEqual([]);
  }, 240_000);
});

describe('chart geometry in the browser', () => {
  it('every part page: no word of a chart overlaps another or lies on a curve', async () => {
    const problems: string[] = [];
    for (const part of library.parts) problems.push(...(await chartProblems(`parts/${part.id}/index.html`)));
    expect(problems).toEqual([]);
  }, 240_000);

  it('every rail plan and comparison page: the same', async () => {
    const problems: string[] = [];
    for (const plan of library.plans) problems.push(...(await chartProblems(`plans/${plan.rail}/index.html`)));
    const comparisons = readdirSync(join(site, 'comparisons'), { withFileTypes: true }).filter((d) => d.isDirectory());
    for (const c of comparisons) problems.push(...(await chartProblems(`comparisons/${c.name}/index.html`)));
    expect(problems).toEqual([]);
  }, 240_000);
});
