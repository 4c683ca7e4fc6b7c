// The skeleton every zfolio chart is built on: an x and a y axis whose domains, ticks and labels are
// parameters (spec-parts.ts), their grid, an optional shaded band and zero line, the chart's own marks, the
// plot's outline and the key above it. A chart kind gives its axes, its marks and a `draw` that turns one
// input into axis domains and ticks, datasets and key entries; the skeleton lays out the key, sizes the
// frame to it and binds everything in one order, so every kind's spec and data read alike.

import type { Frame } from './frame.js';
import { gridPaths } from './grid.js';
import { frameForKey, gridColumns, layoutKey, type KeyItem, type KeyLayout } from './key.js';
import type { ChartDefinition, Row } from './render.js';
import type { Ticks } from './scales.js';
import { axisBinding, axisParams, bandLayers, frameLayer, gridLayers, gridSources, keyLayers, position, referenceLineLayer, type Json } from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';

export interface AxisSpec {
  /** The name of the axis's parameters and grid datasets: 'f', 'r', 'y'. */
  name: string;
  /** The row field it reads. */
  field: string;
  scale: 'log' | 'linear';
  title: string;
}

export interface XYChartKind<I> {
  name: string;
  frame: Frame;
  x: AxisSpec;
  y: AxisSpec;
  /** The colour, dash and width encoding of the key's line symbols (the curves' own). */
  keyStyle: Json;
  /** A shaded band (rows `band` {f, f2} and `bandEdges` {f}) over the grid, under the curves. */
  band?: boolean;
  /** A reference line at y = 0. */
  zeroLine?: { color: string; width: number };
  /** vega-lite's resolve block, for kinds whose layers keep scales of their own. */
  resolve?: Json;
  /** The kind's own layers, given the x and y encodings: over the grid, band and zero line, under the outline. */
  marks(x: Json, y: Json): Json[];
  /** Key layers of its own, drawn after the standard ones. */
  keyExtra?(): Json[];
  draw(input: I): XYDrawing;
}

export interface XYDrawing {
  x: { domain: [number, number]; ticks: Ticks };
  y: { domain: [number, number]; ticks: Ticks };
  /** The band's rows, when the kind shades one (none: an empty band). */
  band?: { band: Row[]; bandEdges: Row[] };
  /** The kind's datasets, in the order its layers read them. */
  datasets: Record<string, Row[]>;
  key: readonly KeyItem[];
  /** Lay the key out in equal columns (many entries of similar length, such as part ids). */
  keyGrid?: boolean;
  /** Datasets that replace or follow the key's own (key symbols drawn with another style). */
  keyDatasets?(key: KeyLayout['datasets']): Record<string, Row[]>;
}

export function xyChart<I>(kind: XYChartKind<I>): ChartDefinition<I> {
  const X = position(kind.x.field, kind.x.name, kind.x.scale, kind.x.title);
  const Y = position(kind.y.field, kind.y.name, kind.y.scale, kind.y.title);
  // The drawing of the input last asked for: a chart laid out beside another is asked for its key's rows, then bound.
  let last: { input: I; drawing: XYDrawing } | undefined;
  const drawn = (input: I) => (last?.input === input ? last.drawing : (last = { input, drawing: kind.draw(input) }).drawing);
  const keyOf = (d: XYDrawing, minRows?: number) => layoutKey(d.key, kind.frame.width, d.keyGrid ? gridColumns(d.key, kind.frame.width) : undefined, minRows);
  return {
    name: kind.name,
    frame: kind.frame,
    // The grid's layers are in the spec offered with a chart; the renderer draws them as two paths (grid.ts).
    underlaid: [...gridSources(kind.x.name), ...gridSources(kind.y.name)],
    // So are the axes: the binding gives them, and the renderer draws them without vega's dataflow (axis-scene.ts).
    drawsAxes: true,
    spec() {
      return {
        config: CHART_CONFIG,
        params: [...axisParams(kind.x.name), ...axisParams(kind.y.name)],
        ...(kind.resolve ? { resolve: kind.resolve } : {}),
        layer: [
          ...gridLayers(kind.x.name, 'x', X),
          ...gridLayers(kind.y.name, 'y', Y),
          ...(kind.band ? bandLayers(X) : []),
          ...(kind.zeroLine ? [referenceLineLayer('zero', Y, kind.zeroLine)] : []),
          ...kind.marks(X, Y),
          frameLayer(),
          ...keyLayers(kind.keyStyle),
          ...(kind.keyExtra?.() ?? []),
        ],
      } as never;
    },
    keyRows: (input) => keyOf(drawn(input)).rows,
    bind(input, layout) {
      const d = drawn(input);
      last = undefined;
      const xa = axisBinding(kind.x.name, d.x.domain, d.x.ticks);
      const ya = axisBinding(kind.y.name, d.y.domain, d.y.ticks);
      const key = keyOf(d, layout?.keyRows);
      return {
        frame: frameForKey(kind.frame, key),
        underlay: gridPaths({ scale: kind.x.scale, domain: d.x.domain, ticks: d.x.ticks }, { scale: kind.y.scale, domain: d.y.domain, ticks: d.y.ticks }, kind.frame.width, kind.frame.height),
        axes: {
          x: { scale: kind.x.scale, domain: d.x.domain, values: d.x.ticks.values, labels: d.x.ticks.labels, title: kind.x.title },
          y: { scale: kind.y.scale, domain: d.y.domain, values: d.y.ticks.values, labels: d.y.ticks.labels, title: kind.y.title },
          width: kind.frame.width,
          height: kind.frame.height,
        },
        params: { ...xa.params, ...ya.params },
        datasets: {
          ...xa.datasets,
          ...ya.datasets,
          ...(kind.band ? { band: d.band?.band ?? [], bandEdges: d.band?.bandEdges ?? [] } : {}),
          ...(kind.zeroLine ? { zero: [{ v: 0 }] } : {}),
          ...d.datasets,
          ...key.datasets,
          ...(d.keyDatasets?.(key.datasets) ?? {}),
        },
      };
    },
  };
}
