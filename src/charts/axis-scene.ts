// A chart's two axes (x at the bottom, y at the left) as the scene items vega's axis guides make, written by
// vega's own SVG renderer after the underlay instead of run through vega's dataflow. In a View, each axis is
// a tick transform, four marks with their encoders and a layout pass that measures every label, run again
// for every chart: a part's four charts took 10.0 to 10.7 ms of CPU with the axes made here against 11.3 to
// 12.6 ms with vega's (medians of five rounds of 200 generated parts, three processes each way, alternated).
//
// The items are those vega's axis encoders and its axis layout (vega-view-transforms' axisLayout) make from
// the spec's axis and the chart configuration (theme.ts: AXIS_STYLE), with vega's defaults where the
// configuration says nothing: a tick at each tick value on the plot, at its scale position rounded to the
// whole px; its label beside it; the title centred along the axis and set off by the extent of the ticks
// and labels. The scales and the text metrics are vega's own. test/charts/axis-scene.test.ts and
// test/charts/svg-scene.test.ts compare the bytes with vega's drawing of the handed-out spec, which keeps
// its axes.

import { vega } from './vega-runtime.js';
import { AXIS_STYLE as AXIS } from './theme.js';

/** One axis as a chart draws it: its scale over the domain, its tick values and their labels, its title. */
export interface AxisDrawing {
  scale: 'log' | 'linear';
  domain: readonly [number, number];
  values: readonly number[];
  labels: readonly string[];
  title: string;
}

/** What vega's renderer reads of a scene item (vega-scenegraph's marks). */
type Item = Record<string, unknown>;
interface Mark {
  marktype: string;
  role: string;
  aria: false;
  interactive: false;
  items: Item[];
}

// vega's axis defaults (vega-parser's config) for what theme.ts leaves unset.
const LABEL_LIMIT = 180;
const MIN_EXTENT = 0;
const MAX_EXTENT = 200;
/** Half a px, by which vega shifts an axis so that its 1 px lines fall on whole pixels. */
const DELTA = 0.5;

const metrics = (vega as unknown as { textMetrics: { width(item: Item, text: unknown): number; height(item: Item): number } }).textMetrics;
type Scale = ((v: number) => number) & { domain(d: readonly number[]): Scale; range(r: readonly number[]): Scale };
const scaleOf = (axis: AxisDrawing, range: readonly number[]) => (vega.scale(axis.scale) as unknown as () => Scale)().domain(axis.domain).range(range);

/** vega's text offset for a baseline (vega-scenegraph's text `offset`), px down from the anchor. */
const baselineOffset = (baseline: string, size: number) => Math.round(baseline === 'top' ? 0.79 * size : baseline === 'middle' ? 0.3 * size : baseline === 'bottom' ? -0.21 * size : 0);

/**
 * The bounds vega gives a text item (vega-scenegraph's text `bound`, single line, no angle): x from the
 * anchor by its alignment, y from the anchor by its baseline less four fifths of its size.
 */
function textBounds(item: Item): { x1: number; y1: number; x2: number; y2: number } {
  const size = metrics.height(item);
  const w = metrics.width(item, item.text == null ? '' : item.text);
  const x1 = (item.x as number) - (item.align === 'center' ? w / 2 : item.align === 'right' ? w : 0);
  const y1 = (item.y as number) + baselineOffset(item.baseline as string, size) - Math.round(0.8 * size);
  return { x1, y1, x2: x1 + w, y2: y1 + size };
}

/** The values vega's axis ticks keep (vega-encode's validTicks): those on the plot, in the order of their position. */
function validTicks(values: readonly number[], scale: Scale, range: readonly number[]): number[] {
  const ascending = range[0] <= range[range.length - 1];
  const lo = Math.floor(Math.min(range[0], range[range.length - 1]));
  const hi = Math.ceil(Math.max(range[0], range[range.length - 1]));
  const kept = values.map((v) => [v, scale(v)] as const).filter(([, p]) => lo <= p && p <= hi);
  kept.sort((a, b) => (ascending ? a[1] - b[1] : b[1] - a[1]));
  // vega thins the ticks to its tick count, which for a list of values is the list's length: never here.
  return kept.map(([v]) => v);
}

/** The label of a tick value, as the spec's label expression reads it (spec-parts.ts: paramAxis). */
function labelOf(axis: AxisDrawing, v: number): string | undefined {
  const i = axis.values.indexOf(v);
  return i < 0 ? '' : axis.labels[i];
}

const group = (role: string, marktype: string, items: Item[]): Mark => ({ marktype, role, aria: false, interactive: false, items });

/**
 * The scene marks of a chart's axes, x then y as vega-lite orders them, for a plot of `width` × `height`
 * px: each an axis group holding its ticks, labels and title.
 */
export function axisScenes(x: AxisDrawing, y: AxisDrawing, width: number, height: number): object[] {
  return [axisScene(x, 'bottom', [0, width], height), axisScene(y, 'left', [height, 0], height)];
}

function axisScene(axis: AxisDrawing, orient: 'bottom' | 'left', range: readonly number[], height: number): Mark {
  const horizontal = orient === 'bottom';
  const sign = horizontal ? 1 : -1;
  const scale = scaleOf(axis, range);
  const values = validTicks(axis.values, scale, range);
  const tickEnd = sign * AXIS.tickSize;
  const labelAt = sign * AXIS.tickSize + sign * AXIS.labelPadding;
  const ticks = values.map((v) => {
    const at = Math.round(scale(v));
    const item: Item = { opacity: 1, stroke: AXIS.tickColor, strokeWidth: AXIS.tickWidth };
    return Object.assign(item, horizontal ? { x: at, y: 0, y2: tickEnd } : { x: 0, y: at, x2: tickEnd });
  });
  const labels = values.map((v) => {
    const item: Item = { opacity: 1, text: labelOf(axis, v), align: horizontal ? 'center' : 'right', baseline: horizontal ? 'top' : 'middle', fill: AXIS.labelColor, font: AXIS.labelFont, fontSize: AXIS.labelFontSize, limit: LABEL_LIMIT };
    return Object.assign(item, horizontal ? { x: scale(v), y: labelAt } : { x: labelAt, y: scale(v) });
  });
  // The ticks' and labels' extent away from the plot sets the title off (vega's axisLayout).
  const stroke = AXIS.tickWidth / 2;
  let extent = ticks.length > 0 ? AXIS.tickSize + stroke : 0;
  for (const label of labels) {
    const b = textBounds(label);
    extent = Math.max(extent, horizontal ? b.y2 : -b.x1);
  }
  const offset = Math.max(MIN_EXTENT, Math.min(MAX_EXTENT, extent)) + AXIS.titlePadding;
  const title: Item = {
    opacity: 1,
    text: axis.title,
    align: 'center',
    angle: horizontal ? 0 : -90,
    baseline: horizontal ? 'top' : 'bottom',
    fill: AXIS.titleColor,
    font: AXIS.titleFont,
    fontSize: AXIS.titleFontSize,
    fontWeight: AXIS.titleFontWeight,
    x: horizontal ? (range[0] + range[1]) / 2 : -offset,
    y: horizontal ? offset : (range[0] + range[1]) / 2,
  };
  const item: Item = {
    x: DELTA,
    y: (horizontal ? height : 0) + DELTA,
    items: [group('axis-tick', 'rule', ticks), group('axis-label', 'text', labels), group('axis-title', 'text', [title])],
  };
  return group('axis', 'group', [item]);
}

type Box = { x1: number; y1: number; x2: number; y2: number };

/**
 * What the axes cover, in the plot's px (origin at its top-left corner): their ticks with half their stroke,
 * their labels and titles as vega bounds text (the y title turned a quarter left about its anchor).
 */
export function axisBounds(scenes: readonly object[]): Box {
  const box: Box = { x1: Infinity, y1: Infinity, x2: -Infinity, y2: -Infinity };
  const add = (b: Box, dx: number, dy: number) => {
    box.x1 = Math.min(box.x1, b.x1 + dx);
    box.y1 = Math.min(box.y1, b.y1 + dy);
    box.x2 = Math.max(box.x2, b.x2 + dx);
    box.y2 = Math.max(box.y2, b.y2 + dy);
  };
  for (const scene of scenes as Mark[]) {
    for (const axis of scene.items) {
      const [dx, dy] = [axis.x as number, axis.y as number];
      for (const mark of axis.items as Mark[]) {
        for (const item of mark.items) {
          if (mark.marktype === 'rule') {
            const [x, y] = [item.x as number, item.y as number];
            const [x2, y2] = [(item.x2 as number | undefined) ?? x, (item.y2 as number | undefined) ?? y];
            const e = (item.strokeWidth as number) / 2;
            add({ x1: Math.min(x, x2) - e, y1: Math.min(y, y2) - e, x2: Math.max(x, x2) + e, y2: Math.max(y, y2) + e }, dx, dy);
          } else {
            const b = textBounds(item);
            const [x, y] = [item.x as number, item.y as number];
            // Turned a quarter left (−90°) about the anchor: (u, v) → (x + (v − y), y − (u − x)).
            add(item.angle === -90 ? { x1: x + (b.y1 - y), y1: y - (b.x2 - x), x2: x + (b.y2 - y), y2: y - (b.x1 - x) } : b, dx, dy);
          }
        }
      }
    }
  }
  return box;
}
