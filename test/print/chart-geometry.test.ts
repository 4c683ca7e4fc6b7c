// The charts of the built demo folio as Chromium lays them out: no two words of a chart overlap, and no
// word (a resonance or peak label, a note, a key entry, a tick label) lies on a curve; no label of a part's
// schematic crosses a wire, a symbol or another label. The geometry is
// Chromium's own (getBoundingClientRect of each text, points along each curve's path), not zfolio's
// estimate of it, so a label placed by a wrong idea of a font's width or baseline is caught here.
// Every page is opened once, in one tab, and read in one call into the page (both checks of a part page).

import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BrowserContext, Page } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { demoSite } from '../demo-site.js';
import { REPO } from '../site-helpers.js';
import { startChrome, stopChrome } from './site-tabs.js';

const library = loadLibrary(REPO).library!;
let site: string;
let browser: BrowserContext;
let page: Page;

beforeAll(async () => {
  // The demo built cold, once for the run (test/demo-site.ts): every chart drawn by this code.
  site = await demoSite();
  browser = await startChrome();
  page = await browser.newPage();
  // Each chart at the width it is drawn for, so one CSS px is one px of its viewBox (frame.ts).
  await page.setViewport({ width: 1280, height: 900, deviceScaleFactor: 1 });
}, 240_000);

afterAll(async () => {
  await stopChrome(browser);
});

/** What a page's charts break (overlapping words, words on a curve) and what its schematics break. */
interface PageProblems {
  charts: string[];
  schematics: string[];
}

/** Reads the page open in the tab; runs in Chromium. */
function readPage(): PageProblems {
  type Word = { text: string; box: DOMRect };
  type Point = { x: number; y: number };
  const words = (svg: Element): Word[] => Array.from(svg.querySelectorAll('text')).map((t) => ({ text: (t.textContent ?? '').trim(), box: t.getBoundingClientRect() }));
  /** Pairs of words whose boxes overlap by more than `by` px both ways (a negative `by`: come closer than it). */
  const overlaps = (texts: Word[], by: number, say: (a: Word, b: Word, w: number, h: number) => string, out: string[]) => {
    for (let i = 0; i < texts.length; i++) {
      for (let j = i + 1; j < texts.length; j++) {
        const a = texts[i].box;
        const b = texts[j].box;
        const w = Math.min(a.right, b.right) - Math.max(a.left, b.left);
        const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
        if (w > by && h > by) out.push(say(texts[i], texts[j], w, h));
      }
    }
  };
  /** Points every `step` px along a shape's outline, in page coordinates, as Chromium places them. */
  const pointsAlong = (shape: SVGGeometryElement, step: number): Point[] => {
    const matrix = shape.getScreenCTM();
    if (!matrix) return [];
    const length = shape.getTotalLength();
    const points: Point[] = [];
    for (let s = 0; s <= length; s += step) {
      const p = shape.getPointAtLength(s);
      points.push({ x: matrix.a * p.x + matrix.c * p.y + matrix.e, y: matrix.b * p.x + matrix.d * p.y + matrix.f });
    }
    return points;
  };
  /** How many of `points` lie inside `box` grown by `by` px on each side (a negative `by`: shrunk). */
  const within = (points: Point[], box: DOMRect, by: number) => {
    let n = 0;
    for (const p of points) if (p.x > box.left - by && p.x < box.right + by && p.y > box.top - by && p.y < box.bottom + by) n++;
    return n;
  };

  const charts: string[] = [];
  for (const svg of Array.from(document.querySelectorAll('figure.chart svg'))) {
    /** "A few pixels": a word may touch a curve or a neighbour by this much (anti-aliasing, glyph overhang). */
    const SLACK = 2;
    const chart = svg.closest('figure')?.id ?? '?';
    const texts = words(svg).filter((t) => t.text !== '');
    overlaps(texts, SLACK, (a, b, w, h) => `${chart}: "${a.text}" overlaps "${b.text}" by ${w.toFixed(1)} × ${h.toFixed(1)} px`, charts);
    // Curves: stroked, unfilled paths (vega's line marks); the key's symbols are <line>s, rules too. The grid
    // is two paths in its own light greys (#ececec, #c9c9c9: src/charts/grid.ts), which a label may cross.
    const GRID = ['#ececec', '#c9c9c9'];
    const curves = Array.from(svg.querySelectorAll('path')).filter((p) => p.getAttribute('stroke') && (!p.getAttribute('fill') || p.getAttribute('fill') === 'none') && p.getAttribute('stroke') !== 'none' && !GRID.includes(p.getAttribute('stroke')!));
    for (const curve of curves) {
      // Only what is drawn: a curve clipped to the plot (vega's clip-path on its group) counts inside the clip.
      const clipped = curve.closest('[clip-path]');
      const clipId = /url\(#([^)]+)\)/.exec(clipped?.getAttribute('clip-path') ?? '')?.[1];
      const clipShape = clipId ? svg.querySelector(`[id="${clipId}"] > *`) : null;
      const clip = clipShape ? clipShape.getBoundingClientRect() : null;
      const points = pointsAlong(curve, 1).filter((p) => !clip || (p.x >= clip.left && p.x <= clip.right && p.y >= clip.top && p.y <= clip.bottom));
      for (const t of texts) {
        const inside = within(points, t.box, -SLACK);
        if (inside > 0) charts.push(`${chart}: "${t.text}" lies on a curve (${curve.getAttribute('stroke')}) for ${inside} px`);
      }
    }
  }

  const schematics: string[] = [];
  for (const svg of Array.from(document.querySelectorAll('svg.schematic'))) {
    /** A label keeps this far (px, on screen where a schematic is drawn at 1.5 times its units) from every stroke and label. */
    const SLACK = 2;
    const texts = words(svg);
    overlaps(texts, -SLACK, (a, b) => `"${a.text}" is within ${SLACK} px of "${b.text}"`, schematics);
    // Wires, symbols and terminals: every stroked shape, walked along its outline in Chromium's own geometry.
    for (const shape of Array.from(svg.querySelectorAll<SVGGeometryElement>('path, rect, circle, line'))) {
      const points = pointsAlong(shape, 0.5);
      for (const t of texts) {
        const crossing = within(points, t.box, SLACK);
        if (crossing > 0) schematics.push(`"${t.text}" is within ${SLACK} px of a ${shape.tagName} (${(crossing / 2).toFixed(1)} px of it)`);
      }
    }
  }
  return { charts, schematics };
}

async function problemsOf(file: string): Promise<PageProblems> {
  await page.goto(`${pathToFileURL(site).href}/${file}`, { waitUntil: 'load' });
  const found = await page.evaluate(readPage);
  return { charts: found.charts.map((p) => `${file} ${p}`), schematics: found.schematics.map((p) => `${file}: ${p}`) };
}

/** Every part page read once, for both checks. */
let partPages: Promise<PageProblems[]> | undefined;
const readPartPages = () => {
  partPages ??= (async () => {
    const out: PageProblems[] = [];
    for (const part of library.parts) out.push(await problemsOf(`parts/${part.id}/index.html`));
    return out;
  })();
  return partPages;
};

describe('schematics in the browser', () => {
  it('every part page: every value label keeps clear of the wires, the symbols and the other labels', async () => {
    const pages = await readPartPages();
    expect(pages).toHaveLength(library.parts.length);
    expect(pages.flatMap((p) => p.schematics)).toEqual([]);
  }, 240_000);
});

describe('chart geometry in the browser', () => {
  it('every part page: no word of a chart overlaps another or lies on a curve', async () => {
    expect((await readPartPages()).flatMap((p) => p.charts)).toEqual([]);
  }, 240_000);

  it('every rail plan and comparison page: the same', async () => {
    const problems: string[] = [];
    for (const plan of library.plans) problems.push(...(await problemsOf(`plans/${plan.rail}/index.html`)).charts);
    const comparisons = readdirSync(join(site, 'comparisons'), { withFileTypes: true }).filter((d) => d.isDirectory());
    for (const c of comparisons) problems.push(...(await problemsOf(`comparisons/${c.name}/index.html`)).charts);
    expect(problems).toEqual([]);
  }, 240_000);
});
