// A chart drawn from its handed-out spec by vega-lite and vega afresh, in a View of its own: what a chart is
// when nothing was drawn before it.

import { vega } from '../../src/charts/vega-runtime.js';
import { compile, type TopLevelSpec } from 'vega-lite';
import type { ChartOutput } from '../../src/charts/render.js';
import { finishSvg } from '../../src/charts/svg-finish.js';

type DrawnSpec = TopLevelSpec & { width: number; height: number; padding: { left: number; right: number; top: number; bottom: number }; layer?: { data?: { name?: string } }[] };

/** The grid's layers of a handed-out spec: those reading an axis's <axis>Minor or <axis>Major rows (the rows of grid lines). */
export const isGridLayer = (l: { data?: { name?: string } }) => /^[a-z]+(?:Minor|Major)$/.test(l.data?.name ?? '');

/** The grid's two paths as a chart draws them (stroke #ececec or #c9c9c9, width 0.6, only moves and straight lines). */
export const GRID_PATH = /<path d="[MVH\d.,-]*" stroke="#(?:ececec|c9c9c9)" stroke-width="0.6"\/>/g;

/** The SVG vega writes for `spec` in a new View, as it is (not finished). */
export async function vegaSvg(spec: DrawnSpec): Promise<string> {
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  await view.runAsync();
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

/** The SVG that `spec` draws in a new View, finished with `underlay`, as renderChart finishes its own. */
export async function drawFresh(spec: DrawnSpec, out: Pick<ChartOutput, 'title' | 'description'>, underlay = ''): Promise<string> {
  const size = { width: spec.width + spec.padding.left + spec.padding.right, height: spec.height + spec.padding.top + spec.padding.bottom };
  return finishSvg(await vegaSvg(spec), { title: out.title, description: out.description }, size, underlay);
}

/**
 * The SVG that `out.spec` draws in a new View, finished as renderChart finishes its own: the grid's layers
 * left out of vega and the chart's own grid paths written under everything (the grid's geometry is checked
 * against vega's own drawing of those layers in test/charts/grid.test.ts).
 */
export async function freshSvg(out: ChartOutput): Promise<string> {
  const spec = JSON.parse(JSON.stringify(out.spec)) as DrawnSpec;
  const grid = (out.svg.match(GRID_PATH) ?? []).join('');
  return drawFresh({ ...spec, layer: (spec.layer ?? []).filter((l) => !isGridLayer(l)) } as DrawnSpec, out, grid);
}
