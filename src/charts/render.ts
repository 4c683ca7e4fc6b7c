// Rendering a chart: a vega-lite spec (compiled to vega and parsed ONCE per chart kind and process) plus one
// chart's data, to a finished SVG string, without a browser or a canvas.
//
// Each chart kind is a ChartDefinition: a fixed spec whose data sources are named and empty and whose
// per-chart settings (domains, ticks, labels) are parameters, and a `bind` function that turns one input into
// datasets and parameter values. Each kind keeps one vega View, made once from the parsed runtime; a render
// clears what the last chart could leave behind (render-order.ts), then sets every parameter and dataset
// that differs from the last chart's (a dataset the binding leaves out is empty), runs the dataflow and
// serialises the scene. What the binding's underlay draws (the grid) is written into the SVG under every mark
// by the finishing step, not drawn by vega: its layers stay in the spec offered with the chart only. So are
// the axes of a kind that `drawsAxes`: vega's renderer writes them from items made without its dataflow
// (axis-scene.ts), after the underlay, where vega drew them.
// Renders of one kind queue behind each other on its View; kinds run independently. The output depends on
// the chart's own input only, never on what was drawn before (checked in test/charts/render.test.ts and
// test/charts/render-order.test.ts).

import type { Runtime, Spec as VegaSpec, View } from 'vega';
import { vega } from './vega-runtime.js';
import type { TopLevelSpec } from 'vega-lite';
import { outerSize, type Frame } from './frame.js';
import { finishSvg, type ChartText } from './svg-finish.js';
import { sceneSvg } from './svg-scene.js';
import { rawSceneMarkup } from './scene-markup.js';
import { axisBounds, axisScenes } from './axis-scene.js';
import { installTextMetrics } from './text-metrics.js';
import { COMPARED_ROWS, keyedItems, sameValue, type AxisKeys, type VegaOrderSpec } from './render-order.js';
import { compilerLoaded, inSpecTable, loadCompiler, vegaSpecOf } from './vega-specs.js';
import { cleaningView } from './cleaning-view.js';

export type { ChartText } from './svg-finish.js';

export type { ChartBinding, ChartDefinition, ChartLayout, Row } from './chart-definition.js';
import type { ChartBinding, ChartDefinition, ChartLayout, Row } from './chart-definition.js';

export interface ChartOutput {
  svg: string;
  /** The vega-lite spec with this chart's data and parameters written in: opens in any vega-lite tool. */
  spec: object;
  title: string;
  description: string;
}

interface Compiled {
  /** The whole spec, as offered with a chart (specWithData). */
  spec: TopLevelSpec;
  /** Names of every named data source of the whole spec, drawn by vega or not. */
  sources: ReadonlySet<string>;
  runtime: Runtime;
  view: View;
  /** Names of the named data sources vega draws (those of the spec without its underlaid layers). */
  datasets: string[];
  /** The spec's parameters with their placeholder values. */
  params: { name: string; value: unknown }[];
  /** The parameters whose placeholder is an empty list (an axis's ticks and labels): empty when a chart leaves one out. */
  emptied: ReadonlySet<string>;
  /** The data sources whose items vega joins by a key of their rows, and the axes (render-order.ts). */
  keyed: ReadonlySet<string>;
  axes: readonly AxisKeys[];
  /** Data sources holding rows in the View now (the others are empty). */
  filled: Set<string>;
  /** What the View holds now: each parameter's value, the frame, and a copy of each small source's rows. */
  now: { params: Map<string, unknown>; frame?: Frame; rows: Map<string, Row[]> };
  /** The last render queued on this View. */
  queue: Promise<unknown>;
  /** The axes the last chart drawn had (axis-scene.ts), for lastSceneBounds. */
  lastAxes?: readonly object[];
}

const compiled = new Map<string, Compiled>();
const counters = new Map<string, { compiles: number; renders: number }>();

function counter(name: string) {
  let c = counters.get(name);
  if (!c) counters.set(name, (c = { compiles: 0, renders: 0 }));
  return c;
}

let useVegaSvg = false;
const svgWriters = { scene: 0, vega: 0 };

/**
 * Whether charts are finished from vega's SVG string (`toSVG` and finishSvg) even where the scene writer
 * (svg-scene.ts) could write them; tests compare the two. Returns how many charts each has written.
 */
export function finishFromVegaSvg(on?: boolean): { scene: number; vega: number } {
  if (on !== undefined) useVegaSvg = on;
  return { ...svgWriters };
}

/** How often each chart kind was compiled and rendered in this process. */
export function chartStats(): Record<string, { compiles: number; renders: number }> {
  return Object.fromEntries([...counters].map(([k, v]) => [k, { ...v }]));
}

/**
 * Bounds of everything the last chart of a kind drew, in the SVG's coordinates (px from its top-left
 * corner), or undefined before the first render. Tests use it to check that nothing is drawn outside the
 * viewBox.
 */
export function lastSceneBounds(name: string): { x1: number; y1: number; x2: number; y2: number } | undefined {
  const c = compiled.get(name);
  if (!c || counter(name).renders === 0) return undefined;
  const root = (c.view.scenegraph() as unknown as { root: { bounds: { x1: number; y1: number; x2: number; y2: number } } }).root;
  const pad = c.view.padding() as { left: number; top: number };
  // The axes are not in vega's scene (axis-scene.ts): their bounds are added.
  const a = c.lastAxes ? axisBounds(c.lastAxes) : undefined;
  const b = a ? { x1: Math.min(root.bounds.x1, a.x1), y1: Math.min(root.bounds.y1, a.y1), x2: Math.max(root.bounds.x2, a.x2), y2: Math.max(root.bounds.y2, a.y2) } : root.bounds;
  return { x1: b.x1 + pad.left, y1: b.y1 + pad.top, x2: b.x2 + pad.left, y2: b.y2 + pad.top };
}

/** Forget compiled specs and their Views (benchmarks use it to time a cold first chart). */
export function resetChartCache(): void {
  for (const c of compiled.values()) c.view.finalize();
  compiled.clear();
}

/** Whether a kind's View can be compiled now: compiled already, or its spec compiled when zfolio was built, or vega-lite loaded. */
const compilable = <I>(def: ChartDefinition<I>) => compiled.has(def.name) || compilerLoaded() || inSpecTable(drawnSpec(def).drawn);

/** Compiles a kind's View before its first chart, unless its spec needs vega-lite loaded; true when compiled. */
export function precompileChart<I>(def: ChartDefinition<I>): boolean {
  if (!compilable(def)) return false;
  compiledOf(def);
  return true;
}

function compiledOf<I>(def: ChartDefinition<I>): Compiled {
  let c = compiled.get(def.name);
  if (!c) {
    installTextMetrics();
    const { spec, drawn } = drawnSpec(def);
    // The specs are fixed: compiled when zfolio is built (vega-specs.ts), else here.
    const vg = vegaSpecOf(drawn, def.name);
    const datasets = namedData(drawn);
    const params = paramsOf(spec);
    const emptied = new Set(params.filter((p) => Array.isArray(p.value) && p.value.length === 0).map((p) => p.name));
    const { sources: keyed, axes } = keyedItems(vg as VegaOrderSpec, datasets, [...emptied], def.name);
    const runtime = vega.parse(vg);
    const now = { params: new Map(params.map((p) => [p.name, p.value])), rows: new Map<string, Row[]>() };
    c = { spec, sources: new Set(namedData(spec)), runtime, view: cleaningView(runtime), datasets, params, emptied, keyed, axes, filled: new Set(), now, queue: Promise.resolve() };
    compiled.set(def.name, c);
    counter(def.name).compiles++;
  }
  return c;
}

/**
 * A chart kind's whole spec in its frame (as offered with a chart), and the spec vega draws: without the
 * layers its underlay draws instead, and without the axes of a kind that `drawsAxes`.
 */
export function drawnSpec(def: Pick<ChartDefinition<unknown>, 'spec' | 'frame' | 'underlaid' | 'drawsAxes'>): { spec: TopLevelSpec; drawn: TopLevelSpec } {
  const spec = withFrame(def.spec(), def.frame);
  const drawn = withoutLayers(spec, new Set(def.underlaid ?? []));
  return { spec, drawn: def.drawsAxes ? withoutAxes(drawn) : drawn };
}

/** The spec with every layer's x and y axis turned off (`axis: null`), for a kind whose binding draws them. */
function withoutAxes(spec: TopLevelSpec): TopLevelSpec {
  const layer = (spec as { layer?: { encoding?: Record<string, { axis?: unknown }> }[] }).layer ?? [];
  const off = (e: { axis?: unknown } | undefined) => (e && e.axis !== undefined ? { ...e, axis: null } : e);
  return { ...spec, layer: layer.map((l) => (l.encoding ? { ...l, encoding: { ...l.encoding, x: off(l.encoding.x), y: off(l.encoding.y) } } : l)) } as TopLevelSpec;
}

/** The spec without the top-level layers that read one of `sources` (their data sources go with them). */
function withoutLayers(spec: TopLevelSpec, sources: ReadonlySet<string>): TopLevelSpec {
  if (sources.size === 0) return spec;
  const layer = (spec as { layer?: { data?: { name?: string } }[] }).layer ?? [];
  return { ...spec, layer: layer.filter((l) => l.data?.name === undefined || !sources.has(l.data.name)) } as TopLevelSpec;
}

function withFrame(spec: TopLevelSpec, f: Frame): TopLevelSpec {
  return { ...spec, width: f.width, height: f.height, padding: { ...f.padding }, autosize: { type: 'none' } } as TopLevelSpec;
}

function paramsOf(spec: TopLevelSpec): { name: string; value: unknown }[] {
  return ((spec as { params?: { name: string; value?: unknown }[] }).params ?? []).map((p) => ({ name: p.name, value: p.value }));
}

/** Names of the named (value-less) data sources of a layered spec. */
function namedData(spec: TopLevelSpec): string[] {
  const names = new Set<string>();
  const visit = (node: unknown) => {
    if (!node || typeof node !== 'object') return;
    const { data, layer } = node as { data?: { name?: string; values?: unknown }; layer?: unknown[] };
    if (data?.name !== undefined && data.values === undefined) names.add(data.name);
    layer?.forEach(visit);
  };
  visit(spec);
  return [...names].sort();
}

/** Render one chart of a kind. */
export function renderChart<I>(def: ChartDefinition<I>, input: I, text: ChartText, layout?: ChartLayout): Promise<ChartOutput> {
  // A kind whose spec the table of compiled specs lacks is compiled by vega-lite, loaded only then (vega-specs.ts).
  if (!compilable(def)) return loadCompiler().then(() => renderChart(def, input, text, layout));
  const c = compiledOf(def);
  const binding = def.bind(input, layout);
  const unknown = Object.keys(binding.datasets).filter((name) => !c.sources.has(name));
  if (unknown.length > 0) throw new Error(`chart "${def.name}" has no data source ${unknown.join(', ')}`);
  const run = c.queue.then(async () => {
    const { view, now } = c;
    const f = binding.frame ?? def.frame;
    // Each parameter as this chart wants it: its binding's value; one the binding leaves out keeps its value,
    // except a list reset before each render (an axis's ticks and labels), which is empty.
    const wanted = new Map(c.params.map((p) => [p.name, p.name in binding.params ? binding.params[p.name] : c.emptied.has(p.name) ? p.value : now.params.get(p.name)]));
    const sameFrame = now.frame !== undefined && sameValue(f, now.frame);
    // vega keeps the scene items whose key survives an update, in their old place, and appends new ones
    // after them (render-order.ts). Items keyed by row follow the data's order, since a source whose rows
    // change is replaced whole. Two kinds are keyed by values the next chart may share: an axis's ticks and
    // labels, by tick value, and the lines of a faceted source, by series. An axis whose tick values, domain
    // and frame are all as they were keeps the same ticks in the same order; any other has its tick values
    // emptied first, and a faceted source whose rows change is emptied first, in a run that touches only
    // those. Then every parameter and source that differs from what the View holds is set: one that is the
    // same is left, with its items, as the last chart left it, which is as this chart would make it.
    let cleared = false;
    for (const axis of c.axes) {
      const kept = sameFrame && axis.domain !== undefined && sameValue(wanted.get(axis.ticks), now.params.get(axis.ticks)) && sameValue(wanted.get(axis.domain), now.params.get(axis.domain));
      if (kept || sameValue(now.params.get(axis.ticks), [])) continue;
      view.signal(axis.ticks, []);
      now.params.set(axis.ticks, []);
      cleared = true;
    }
    for (const name of c.keyed) {
      if (!c.filled.has(name) || sameRows(binding.datasets[name], now.rows.get(name))) continue;
      view.data(name, []);
      c.filled.delete(name);
      now.rows.delete(name);
      cleared = true;
    }
    if (cleared) await view.runAsync();
    if (!sameFrame) {
      view.width(f.width).height(f.height).padding(f.padding);
      now.frame = f;
    }
    for (const [name, value] of wanted) {
      if (sameValue(value, now.params.get(name))) continue;
      view.signal(name, value);
      now.params.set(name, value);
    }
    for (const name of c.datasets) {
      const rows = binding.datasets[name];
      if (rows && rows.length > 0) {
        if (c.filled.has(name) && sameRows(rows, now.rows.get(name))) continue;
        view.data(name, rows);
        c.filled.add(name);
        // vega writes into the rows it is given: a copy is kept to compare with the next chart's.
        if (rows.length <= COMPARED_ROWS) now.rows.set(name, rows.map((r) => ({ ...r })));
        else now.rows.delete(name);
      } else if (c.filled.delete(name)) {
        view.data(name, []);
        now.rows.delete(name);
      }
    }
    await view.runAsync();
    const size = outerSize(f);
    // The finished SVG written from the scene (svg-scene.ts), else vega's SVG string finished.
    const axes = binding.axes && axisScenes(binding.axes.x, binding.axes.y, binding.axes.width, binding.axes.height);
    c.lastAxes = axes;
    let svg = useVegaSvg ? undefined : sceneSvg(view, text, size, binding.underlay, axes);
    if (svg === undefined) {
      svg = finishSvg(await view.toSVG(), text, size, (binding.underlay ?? '') + (axes ? rawSceneMarkup(view, axes) : ''));
      svgWriters.vega++;
    } else svgWriters.scene++;
    counter(def.name).renders++;
    return {
      svg,
      spec: specWithData(c.spec, binding, f, text),
      title: text.title,
      description: text.description,
    };
  });
  // A failed render must not block the next one on this View.
  c.queue = run.catch(() => undefined);
  return run;
}

/** Whether a source's rows are those kept of the last chart (none kept: a large source, taken as changed). */
function sameRows(rows: Row[] | undefined, kept: Row[] | undefined): boolean {
  return rows !== undefined && kept !== undefined && sameValue(rows, kept);
}

/** The spec as drawn: datasets inlined, parameter values set, the text alternative as description and meta. */
function specWithData(spec: TopLevelSpec, binding: ChartBinding, f: Frame, text: ChartText): object {
  const s = withFrame(spec, f) as TopLevelSpec & { params?: { name: string; value?: unknown }[] };
  return {
    ...s,
    description: text.description,
    usermeta: { title: text.title, generator: 'zfolio' },
    params: (s.params ?? []).map((p) => (p.name in binding.params ? { ...p, value: binding.params[p.name] } : p)),
    datasets: binding.datasets,
  };
}
