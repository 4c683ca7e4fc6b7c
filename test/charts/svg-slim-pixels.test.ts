// The lines a chart draws as one path (svg-slim.ts: an axis's ticks) paint the very pixels the separate
// <line>s vega writes paint, in Chromium: a chart of each kind is drawn twice, as finished and
// with each such path written back as the lines it stands for (SVG 1.1 §9.5: a line is the path "M x1 y1
// L x2 y2"), and the screenshots compared pixel for pixel. Chromium's anti-aliasing of a line moved by a
// translate and of the same segment in a path differs by a few levels at a few edge pixels (at most 12 of
// 255 seen, at 3 device px a CSS px), which no eye tells apart; a tick missing or moved by a device pixel
// differs by far more (a 0.8 px tick in #1b1b1b on white changes a covered pixel by over 200).

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'puppeteer-core';
import { renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { PART_CHART_KINDS, renderPartChart } from '../../src/charts/part-charts.js';
import { renderRailChart } from '../../src/charts/rail-chart.js';
import { startChrome, stopChrome } from '../print/site-tabs.js';
import { ALL_PARTS, analysed, capacitorPart, demoRail, inductorPart } from './fixtures.js';

/** A path of relative straight segments only ("Mx,y" then one v, h or l each), with its attributes. */
const MERGED = /<path d="((?:M-?[\d.]+,-?[\d.]+(?:[vh]-?[\d.]+|l-?[\d.]+,-?[\d.]+))+)"([^>]*)\/>/g;

/** Each merged path back as vega writes lines: one <line> a segment, moved by a translate, in a group. */
function asLines(svg: string): string {
  return svg.replace(MERGED, (_, d: string, style: string) => {
    const lines = [...d.matchAll(/M(-?[\d.]+),(-?[\d.]+)(?:([vh])(-?[\d.]+)|l(-?[\d.]+),(-?[\d.]+))/g)].map((m) => {
      const [dx, dy] = m[3] === 'v' ? ['0', m[4]] : m[3] === 'h' ? [m[4], '0'] : [m[5], m[6]];
      return `<line transform="translate(${m[1]},${m[2]})" x2="${dx}" y2="${dy}"${style}/>`;
    });
    return `<g>${lines.join('')}</g>`;
  });
}

let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  context = await startChrome();
  page = await context.newPage();
  // Three device px a CSS px: the way a chart is looked at closely.
  await page.setViewport({ width: 700, height: 500, deviceScaleFactor: 3 });
}, 120_000);

afterAll(async () => {
  await stopChrome(context);
});

/** Levels (of 255) by which anti-aliasing may differ at a pixel. */
const AA_LEVELS = 24;

async function screenshot(svg: string): Promise<string> {
  await page.setContent(`<!doctype html><html><body style="margin:0;background:#fff">${svg}</body></html>`, { waitUntil: 'load' });
  const chart = await page.$('svg');
  return Buffer.from(await chart!.screenshot({ type: 'png' })).toString('base64');
}

/** The largest difference of any colour channel at any pixel of two PNGs of one size, decoded by Chromium. */
async function largestDifference(a: string, b: string): Promise<number> {
  return page.evaluate(async (pa: string, pb: string) => {
    const load = (data: string) =>
      new Promise<HTMLImageElement>((done) => {
        const image = new Image();
        image.onload = () => done(image);
        image.src = `data:image/png;base64,${data}`;
      });
    const [ia, ib] = await Promise.all([load(pa), load(pb)]);
    if (ia.width !== ib.width || ia.height !== ib.height) return 255;
    const rgba = (image: HTMLImageElement) => {
      const canvas = document.createElement('canvas');
      canvas.width = image.width;
      canvas.height = image.height;
      const c = canvas.getContext('2d')!;
      c.drawImage(image, 0, 0);
      return c.getImageData(0, 0, image.width, image.height).data;
    };
    const [da, db] = [rgba(ia), rgba(ib)];
    let largest = 0;
    for (let k = 0; k < da.length; k++) largest = Math.max(largest, Math.abs(da[k] - db[k]));
    return largest;
  }, a, b);
}

describe('ticks drawn as one path', () => {
  it('paint in Chromium what the separate lines paint, in every chart kind', async () => {
    // One chart of each kind: a capacitor's four (its complex plane is the admittance circle), an
    // inductor's impedance plane, a comparison and a rail.
    const svgs: string[] = [];
    for (const kind of PART_CHART_KINDS) svgs.push((await renderPartChart(kind, analysed(capacitorPart))).svg);
    svgs.push((await renderPartChart('plane', analysed(inductorPart))).svg);
    svgs.push((await renderComparisonChart(ALL_PARTS.map((p) => analysed(p)))).svg);
    svgs.push((await renderRailChart(demoRail())).svg);
    let merged = 0;
    for (const svg of svgs) {
      const lines = asLines(svg);
      if (lines === svg) continue;
      merged++;
      // The chart draws no group of undashed <line>s drawn alike; written back, it has them.
      expect(lines).toMatch(/<g><line [^>]*\/><line /);
      expect(await largestDifference(await screenshot(svg), await screenshot(lines))).toBeLessThanOrEqual(AA_LEVELS);
      // The check sees a tick that is not drawn.
      if (merged === 1) {
        const oneTickLess = lines.replace(/<line [^>]*stroke="#1b1b1b"[^>]*\/>/, '');
        expect(await largestDifference(await screenshot(svg), await screenshot(oneTickLess))).toBeGreaterThan(100);
      }
    }
    // Every chart has ticks on both axes.
    expect(merged).toBe(svgs.length);
  }, 120_000);
});
