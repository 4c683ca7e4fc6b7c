// The grid drawn as two paths by the renderer (src/charts/grid.ts) instead of four vega layers: its lines lie
// where the scales put the ticks (closed form: a log scale maps v to L·ln(v/d0)/ln(d1/d0), a linear one to
// L·(v − d0)/(d1 − d0), y measured up from the plot's bottom), and every chart draws the very lines vega draws
// from the grid layers of the spec it hands out, in the grid's two colours, under everything else.

import { describe, expect, it } from 'vitest';
import { gridPaths } from '../../src/charts/grid.js';
import { renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { PART_CHART_KINDS, renderPartChart } from '../../src/charts/part-charts.js';
import { renderRailChart } from '../../src/charts/rail-chart.js';
import type { ChartOutput } from '../../src/charts/render.js';
import { ALL_PARTS, analysed, capacitorPart, demoRail } from './fixtures.js';
import { GRID_PATH, vegaSvg } from './fresh-render.js';

/** Grid colours of the design: unlabelled lines light, labelled ones darker (palette of the charts). */
const MINOR = '#ececec';
const MAJOR = '#c9c9c9';

type Segment = [number, number, number, number];

/** The straight segments of a path of "Mx,y" followed by "Vy" or "Hx" commands, by its stroke colour. */
function pathSegments(svg: string): Map<string, Segment[]> {
  const out = new Map<string, Segment[]>();
  for (const m of svg.matchAll(/<path d="([^"]*)" stroke="(#[0-9a-f]{6})" stroke-width="0.6"\/>/g)) {
    const list = out.get(m[2]) ?? [];
    for (const s of m[1].matchAll(/M(-?[\d.]+),(-?[\d.]+)([VH])(-?[\d.]+)/g)) {
      const [x, y, to] = [Number(s[1]), Number(s[2]), Number(s[4])];
      list.push(s[3] === 'V' ? [x, y, x, to] : [x, y, to, y]);
    }
    out.set(m[2], list);
  }
  return out;
}

/** The segments of vega's <line> elements in a grid colour (as vega writes them): translate(a,b) with x2, y2 is (a,b) to (a+x2, b+y2). */
function lineSegments(svg: string): Map<string, Segment[]> {
  const out = new Map<string, Segment[]>();
  const n = '(-?[\\d.]+(?:e[-+]?\\d+)?)';
  const line = new RegExp(`<line transform="translate\\(${n},${n}\\)" x2="${n}" y2="${n}" stroke="(#ececec|#c9c9c9)" stroke-width="0.6"\\/>`, 'g');
  for (const m of svg.matchAll(line)) {
    const [a, b, dx, dy] = m.slice(1, 5).map(Number);
    out.set(m[5], [...(out.get(m[5]) ?? []), [a, b, a + dx, b + dy]]);
  }
  return out;
}

/** Segments with their ends in order, sorted, to compare as sets. */
const normal = (segments: Segment[] = []) =>
  segments.map(([x1, y1, x2, y2]) => (x1 < x2 || (x1 === x2 && y1 <= y2) ? [x1, y1, x2, y2] : [x2, y2, x1, y1])).sort((p, q) => p[0] - q[0] || p[1] - q[1] || p[2] - q[2] || p[3] - q[3]);

function expectSameSegments(actual: Segment[] | undefined, expected: Segment[] | undefined, what: string) {
  const a = normal(actual);
  const e = normal(expected);
  expect(a.length, what).toBe(e.length);
  // vega's in full, the chart's to a tenth of a px, from scales computed in different orders: a tenth of a px apart at most.
  a.forEach((s, i) => s.forEach((v, k) => expect(Math.abs(v - e[i][k]), `${what}: segment ${i}`).toBeLessThanOrEqual(0.1 + 1e-9)));
}

describe('the grid as two paths', () => {
  it('puts each line where the closed-form log and linear scales put its value', () => {
    const x = { scale: 'log' as const, domain: [1e3, 1e10] as [number, number], ticks: { values: [1e4, 1e6, 1e8, 1e10], minor: [1e3, 1e5, 1e7, 1e9] } };
    const y = { scale: 'linear' as const, domain: [-90, 90] as [number, number], ticks: { values: [-90, -45, 0, 45, 90], minor: [-67.5, 22.5] } };
    const svg = gridPaths(x, y, 234, 160);
    const segments = pathSegments(svg);
    const logX = (v: number) => (234 * Math.log(v / 1e3)) / Math.log(1e7);
    const linY = (v: number) => 160 - (160 * (v + 90)) / 180;
    const expected = (t: { values: number[]; minor: number[] }, u: { values: number[]; minor: number[] }, which: 'values' | 'minor'): Segment[] => [
      ...t[which].map((v): Segment => [logX(v), 0, logX(v), 160]),
      ...u[which].map((v): Segment => [0, linY(v), 234, linY(v)]),
    ];
    expectSameSegments(segments.get(MINOR), expected(x.ticks, y.ticks, 'minor'), 'minor');
    expectSameSegments(segments.get(MAJOR), expected(x.ticks, y.ticks, 'values'), 'major');
    // The light lines first, so the labelled ones are drawn over them where they cross.
    expect(svg.indexOf(MINOR)).toBeLessThan(svg.indexOf(MAJOR));
    // No lines, no markup.
    expect(gridPaths({ ...x, ticks: { values: [], minor: [] } }, { ...y, ticks: { values: [], minor: [] } }, 234, 160)).toBe('');
  });

  it('draws in every chart the lines vega draws from the grid layers of its handed-out spec, under everything else', async () => {
    const charts: ChartOutput[] = [];
    for (const part of ALL_PARTS) for (const kind of PART_CHART_KINDS) charts.push(await renderPartChart(kind, analysed(part)));
    charts.push(await renderComparisonChart(ALL_PARTS.map((p) => analysed(p))));
    charts.push(await renderRailChart(demoRail()));
    // The capacitor's complex plane is its admittance circle: a chart kind of its own, checked too.
    expect(charts.some((c) => c.title.includes(capacitorPart.id) && c.title.includes('resonance circle'))).toBe(true);
    for (const out of charts) {
      const spec = JSON.parse(JSON.stringify(out.spec));
      // vega's own SVG, in the plot's px (its root group is moved by the paddings, as the chart's is).
      const byVega = lineSegments(await vegaSvg(spec));
      expect(byVega.size, out.title).toBeGreaterThan(0);
      const drawn = pathSegments((out.svg.match(GRID_PATH) ?? []).join(''));
      expectSameSegments(drawn.get(MINOR), byVega.get(MINOR), `${out.title}: minor`);
      expectSameSegments(drawn.get(MAJOR), byVega.get(MAJOR), `${out.title}: major`);
      // The chart itself draws no grid line as a <line>, and its grid paths come before any other drawing.
      expect(lineSegments(out.svg).size, out.title).toBe(0);
      const plot = out.svg.indexOf('<g transform="translate(0,0)">');
      const firstGrid = out.svg.search(GRID_PATH);
      expect(firstGrid, out.title).toBeGreaterThan(plot);
      expect(out.svg.slice(plot, firstGrid), out.title).not.toMatch(/<(?:line|text)|<path d="[^"]*" (?:fill|stroke)/);
    }
  });
});
