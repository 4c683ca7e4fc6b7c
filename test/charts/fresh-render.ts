// A chart drawn from its handed-out spec by vega-lite and vega afresh, in a View of its own: what a chart is
// when nothing was drawn before it.

import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import type { ChartOutput } from '../../src/charts/render.js';
import { finishSvg } from '../../src/charts/svg-finish.js';

type DrawnSpec = TopLevelSpec & { width: number; height: number; padding: { left: number; right: number; top: number; bottom: number } };

/** The SVG that `out.spec` draws in a new View, finished as renderChart finishes its own. */
export async function freshSvg(out: ChartOutput): Promise<string> {
  const spec = JSON.parse(JSON.stringify(out.spec)) as DrawnSpec;
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  await view.runAsync();
  const size = { width: spec.width + spec.padding.left + spec.padding.right, height: spec.height + spec.padding.top + spec.padding.bottom };
  const svg = finishSvg(await view.toSVG(), { title: out.title, description: out.description }, size);
  view.finalize();
  return svg;
}
