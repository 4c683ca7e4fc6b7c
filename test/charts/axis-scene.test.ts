// The axes a chart's binding gives and the renderer draws without vega's dataflow (src/charts/axis-scene.ts),
// against vega's own axes: the chart's handed-out spec, which keeps them, drawn afresh by vega-lite and vega
// in a View of their own (fresh-render.ts). test/charts/svg-scene.test.ts does the same for every chart kind;
// here a small chart of its own takes the axes where vega's rules matter: tick values off the plot (vega
// drops them), values not in ascending order (it sorts them by position), empty and missing labels, labels
// wide enough to set the title off, a linear axis across zero. The tick positions are also checked against
// the closed form of a log and a linear scale (common practice: a scale maps its domain linearly, after
// log10 for a log scale, onto the plot's px, and vega rounds a tick to the whole px).

import { describe, expect, it } from 'vitest';
import { compile, type TopLevelSpec } from 'vega-lite';
import { vega } from '../../src/charts/vega-runtime.js';
import { drawnSpec, lastSceneBounds, renderChart } from '../../src/charts/render.js';
import { frame } from '../../src/charts/frame.js';
import type { Ticks } from '../../src/charts/scales.js';
import { curveLayer, seriesEncoding } from '../../src/charts/spec-parts.js';
import { xyChart } from '../../src/charts/xy-chart.js';
import { freshSvg, isGridLayer } from './fresh-render.js';

interface AxesInput {
  x: { domain: [number, number]; ticks: Ticks };
  y: { domain: [number, number]; ticks: Ticks };
}

const FRAME = frame(300, 160, 20, 40);
const SERIES = { keys: ['a'], styles: [{ color: '#1f3d73', dash: [] as number[], width: 1.5 }] };

const chart = xyChart<AxesInput>({
  name: 'axis-test',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: 'Frequency' },
  y: { name: 'y', field: 'v', scale: 'linear', title: 'A value of some length, in its unit' },
  keyStyle: seriesEncoding(SERIES),
  marks: (X, Y) => [curveLayer('curve', X, Y, seriesEncoding(SERIES))],
  draw: (input) => ({
    x: input.x,
    y: input.y,
    datasets: { curve: [{ f: input.x.domain[0], v: input.y.domain[0], s: 'a', i: 0 }, { f: input.x.domain[1], v: input.y.domain[1], s: 'a', i: 1 }] },
    key: [{ kind: 'line', style: { s: 'a' }, text: 'a curve' }],
  }),
});

const draw = (input: AxesInput) => renderChart(chart, input, { title: 'Axes', description: 'Axes drawn for a test.' });

const ticks = (values: number[], labels: string[]): Ticks => ({ values, labels, minor: [] });

const CASES: [string, AxesInput][] = [
  ['decades with every label', { x: { domain: [1e2, 1e8], ticks: ticks([1e2, 1e4, 1e6, 1e8], ['100 Hz', '10 kHz', '1 MHz', '100 MHz']) }, y: { domain: [-2, 2], ticks: ticks([-2, -1, 0, 1, 2], ['−2', '−1', '0', '1', '2']) } }],
  ['values off the plot and out of order', { x: { domain: [1e3, 1e6], ticks: ticks([1e7, 1e5, 1e2, 1e3, 1e6, 1e4], ['10 MHz', '100 kHz', '100 Hz', '1 kHz', '1 MHz', '10 kHz']) }, y: { domain: [0, 10], ticks: ticks([12, 10, 5, 0, -3], ['12', '10', '5', '0', '−3']) } }],
  ['empty and missing labels', { x: { domain: [1, 1e4], ticks: ticks([1, 10, 100, 1e3, 1e4], ['1 Hz', '', '100 Hz', '']) }, y: { domain: [0, 1], ticks: ticks([0, 0.5, 1], ['', '0.5 units', '']) } }],
  ['wide labels', { x: { domain: [1e-3, 1e3], ticks: ticks([1e-3, 1, 1e3], ['1 mHz', '1 Hz', '1 kHz']) }, y: { domain: [-1e6, 1e6], ticks: ticks([-1e6, 0, 1e6], ['−1 000 000.000 01 units', '0', '1 000 000 units']) } }],
  ['no ticks at all', { x: { domain: [10, 1e3], ticks: ticks([], []) }, y: { domain: [0, 1], ticks: ticks([], []) } }],
];

describe('axes drawn without vega’s dataflow', () => {
  it('are vega’s own axes to the byte, in every case', async () => {
    for (const [what, input] of CASES) {
      const out = await draw(input);
      expect(out.svg, what).toBe(await freshSvg(out));
    }
  });

  it('are left out of the spec vega runs and kept in the spec handed out', async () => {
    const { spec, drawn } = drawnSpec(chart);
    // A layer's axis (spec-parts.ts: paramAxis, which starts with its title), not the configuration's.
    const axes = (s: unknown) => JSON.stringify(s).match(/"axis":\{"title"/g)?.length ?? 0;
    expect(axes(spec)).toBeGreaterThan(0);
    expect(axes(drawn)).toBe(0);
    const out = await draw(CASES[0][1]);
    expect(axes(out.spec)).toBe(axes(spec));
  });

  it('put each tick where the closed form of its scale puts it, rounded to the whole px', async () => {
    const out = await draw(CASES[0][1]);
    // The x ticks (bottom: down from the plot) and the y ticks (left), each a move then a 4 px line.
    const down = [...out.svg.matchAll(/M(-?[\d.]+),0v4/g)].map((m) => Number(m[1]));
    const left = [...out.svg.matchAll(/M0,(-?[\d.]+)h-4/g)].map((m) => Number(m[1]));
    const { width, height } = FRAME;
    expect(down).toEqual([1e2, 1e4, 1e6, 1e8].map((v) => Math.round((width * Math.log10(v / 1e2)) / Math.log10(1e8 / 1e2))));
    expect(left).toEqual([-2, -1, 0, 1, 2].map((v) => Math.round(height - (height * (v + 2)) / 4)));
  });

  it('cover what vega’s own axes cover, to the half px vega leaves out (the bounds that say nothing is drawn outside the chart)', async () => {
    for (const [what, input] of CASES) {
      const out = await draw(input);
      const ours = lastSceneBounds('axis-test')!;
      // Without the grid's layers, as renderChart's vega runs it (the grid is drawn inside the plot).
      const spec = out.spec as TopLevelSpec & { layer: { data?: { name?: string } }[] };
      const view = new vega.View(vega.parse(compile({ ...spec, layer: spec.layer.filter((l) => !isGridLayer(l)) } as TopLevelSpec).spec), { renderer: 'none' });
      await view.runAsync();
      const b = (view.scenegraph() as unknown as { root: { bounds: { x1: number; y1: number; x2: number; y2: number } } }).root.bounds;
      const pad = view.padding() as { left: number; top: number };
      view.finalize();
      // vega bounds an axis where it lays it out, half a px short of where it draws it (its axisLayout shifts
      // the group, not its bounds): ours are where the axes are drawn.
      const off = [ours.x1 - (b.x1 + pad.left), ours.y1 - (b.y1 + pad.top), ours.x2 - (b.x2 + pad.left), ours.y2 - (b.y2 + pad.top)];
      for (const d of off) expect(Math.abs(d), `${what}: ${off.join(', ')}`).toBeLessThanOrEqual(0.5 + 1e-9);
    }
  });
});
