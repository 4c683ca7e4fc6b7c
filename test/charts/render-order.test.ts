// The order of a chart's SVG elements does not depend on the chart drawn before it on the same View
// (render-order.ts). vega keeps an item whose key survives an update in its old place and appends new ones:
// each case below first shows that happen on a View that is not cleared between two charts (so the case
// can tell), then that renderChart draws the second chart as a View of its own draws it.

import { vega } from '../../src/charts/vega-runtime.js';
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { frame, outerSize } from '../../src/charts/frame.js';
import { PART_SERIES } from '../../src/charts/palette.js';
import { PART_CHART_KINDS, renderPartChart } from '../../src/charts/part-charts.js';
import { renderChart, type ChartDefinition, type ChartText } from '../../src/charts/render.js';
import { axisBinding, axisParams, curveLayer, position, seriesEncoding, type Json } from '../../src/charts/spec-parts.js';
import { finishSvg } from '../../src/charts/svg-finish.js';
import { ALL_PARTS, analysed } from './fixtures.js';
import { freshSvg } from './fresh-render.js';
import { svgTexts } from './svg-text.js';

/** Lines, one a series in the order given (each at its own level), on an x axis with the ticks given. */
interface Toy {
  series: string[];
  ticks: number[];
  /** The x domain; [0, 20] when absent. */
  domain?: [number, number];
}

const X = position('x', 'x', 'linear', 'x');
const Y = position('v', 'y', 'linear', 'level');
const SERIES = { keys: ['a', 'b', 'c'], styles: [PART_SERIES.magnitude, PART_SERIES.resistance, PART_SERIES.phase] };
const axis = (values: number[]) => ({ values, labels: values.map((v) => `t${v}`), minor: [] });

function toyChart(name: string, layer: (x: Json, y: Json) => object = (x, y) => curveLayer('lines', x, y, seriesEncoding(SERIES))): ChartDefinition<Toy> {
  return {
    name,
    frame: frame(200, 100),
    spec: () => ({ params: [...axisParams('x'), ...axisParams('y')], layer: [layer(X, Y)] }) as unknown as TopLevelSpec,
    bind: ({ series, ticks, domain = [0, 20] }) => ({
      params: { ...axisBinding('x', domain, axis(ticks)).params, ...axisBinding('y', [0, 4], axis([0, 4])).params },
      datasets: { lines: series.flatMap((s, k) => [0, 20].map((x, i) => ({ x, v: k + 1, s, i }))) },
    }),
  };
}

const text: ChartText = { title: 'order', description: 'a chart drawn to check the order of its elements' };

/** `inputs` drawn one after another on one View that nothing clears between them; the last one's SVG. */
async function uncleared(def: ChartDefinition<Toy>, inputs: Toy[]): Promise<string> {
  const spec = { ...def.spec(), width: def.frame.width, height: def.frame.height, padding: def.frame.padding, autosize: { type: 'none' } } as TopLevelSpec;
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  for (const input of inputs) {
    const b = def.bind(input);
    for (const [name, value] of Object.entries(b.params)) view.signal(name, value);
    for (const [name, rows] of Object.entries(b.datasets)) view.data(name, rows);
    await view.runAsync();
  }
  const svg = finishSvg(await view.toSVG(), text, outerSize(def.frame));
  view.finalize();
  return svg;
}

/** The x axis's tick labels, in the order the SVG lists them. */
const tickLabels = (svg: string) => svgTexts(svg).filter((t) => /^t\d+$/.test(t) && t !== 't0' && t !== 't4');
/** The series' stroke colours, in the order the SVG lists their lines. */
const lineColours = (svg: string) => [...svg.matchAll(/<path [^>]*stroke="(#[0-9a-f]{6})"/g)].map((m) => m[1]).filter((c) => SERIES.styles.some((s) => s.color === c));

describe('a chart drawn after another on the same View', () => {
  it('lists its axis ticks in their own order, not after the ticks the chart before shared with it', async () => {
    const def = toyChart('order-ticks');
    const before: Toy = { series: ['a'], ticks: [2, 4, 6, 8] };
    const after: Toy = { series: ['a'], ticks: [1, 2, 3, 5] };
    const own = await freshSvg(await renderChart(def, after, text));
    expect(tickLabels(own)).toEqual(['t1', 't2', 't3', 't5']);
    // Not cleared, the tick kept from before (2) comes first.
    expect(tickLabels(await uncleared(def, [before, after]))).toEqual(['t2', 't1', 't3', 't5']);
    await renderChart(def, before, text);
    expect((await renderChart(def, after, text)).svg).toBe(own);
  });

  it('lists its axis ticks in their own order when its tick values are the last chart\'s but its domain is not', async () => {
    // vega draws only the ticks inside the domain: 2 is outside the first chart's, inside the second's.
    const def = toyChart('order-domain');
    const before: Toy = { series: ['a'], ticks: [2, 8, 12], domain: [5, 20] };
    const after: Toy = { series: ['a'], ticks: [2, 8, 12], domain: [0, 20] };
    const own = await freshSvg(await renderChart(def, after, text));
    expect(tickLabels(own)).toEqual(['t2', 't8', 't12']);
    expect(tickLabels(await uncleared(def, [before, after]))).toEqual(['t8', 't12', 't2']);
    await renderChart(def, before, text);
    expect((await renderChart(def, after, text)).svg).toBe(own);
  });

  it('lists its lines in the order of its rows, not after the series the chart before shared with it', async () => {
    const def = toyChart('order-series');
    const before: Toy = { series: ['a', 'b'], ticks: [5] };
    const after: Toy = { series: ['c', 'a'], ticks: [5] };
    const own = await freshSvg(await renderChart(def, after, text));
    expect(lineColours(own)).toEqual([PART_SERIES.phase.color, PART_SERIES.magnitude.color]);
    // Not cleared, the line of the series kept from before (a) comes first.
    expect(lineColours(await uncleared(def, [before, after]))).toEqual([PART_SERIES.magnitude.color, PART_SERIES.phase.color]);
    await renderChart(def, before, text);
    expect((await renderChart(def, after, text)).svg).toBe(own);
  });

  it('draws each part chart of every demo part as a View of its own does, whichever part came before', async () => {
    const parts = ALL_PARTS.map((p) => analysed(p));
    for (const kind of PART_CHART_KINDS) {
      for (const part of parts) {
        const own = await freshSvg(await renderPartChart(kind, part));
        for (const before of parts) {
          await renderPartChart(kind, before);
          expect((await renderPartChart(kind, part)).svg, `${kind} of ${part.part.id} after ${before.part.id}`).toBe(own);
        }
      }
    }
  }, 120_000);
});

describe('a chart kind whose items vega would keep from one chart to the next', () => {
  const refused = (name: string, layer: (x: Json, y: Json) => object) => expect(async () => renderChart(toyChart(name, layer), { series: ['a'], ticks: [5] }, text)).rejects.toThrow(/keeps from one chart to the next/);

  it('is refused when a transform makes rows of its own (an aggregate)', async () => {
    await refused('order-aggregate', (x) => ({ data: { name: 'lines' }, mark: 'bar', encoding: { x, y: { aggregate: 'sum', field: 'v', type: 'quantitative' } } }));
  });

  it('is refused when it has a legend', async () => {
    await refused('order-legend', (x, y) => ({ data: { name: 'lines' }, mark: 'line', encoding: { x, y, color: { field: 's', type: 'nominal' } } }));
  });

  it('is refused when an axis takes its ticks from its scale', async () => {
    await refused('order-axis', (_, y) => ({ data: { name: 'lines' }, mark: 'line', encoding: { x: { field: 'x', type: 'quantitative' }, y } }));
  });
});
