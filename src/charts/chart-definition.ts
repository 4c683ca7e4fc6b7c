// What a chart kind is (ChartDefinition) and what binding one input to it gives; render.ts renders them.

import type { TopLevelSpec } from 'vega-lite';
import type { AxisDrawing } from './axis-scene.js';
import type { Frame } from './frame.js';

/** One data row; values are numbers or short strings (labels already formatted). */
export type Row = Record<string, number | string | boolean | null>;

export interface ChartBinding {
  datasets: Record<string, Row[]>;
  params: Record<string, unknown>;
  /** Overrides the definition's frame (e.g. a legend that needs more rows). */
  frame?: Frame;
  /**
   * Markup drawn under every mark, in the plot's px (origin at its top-left corner): what the layers of the
   * definition's `underlaid` sources would draw (the grid, grid.ts), written without vega.
   */
  underlay?: string;
  /**
   * The chart's axes, drawn over the underlay by vega's renderer from items made without its dataflow
   * (axis-scene.ts), for a definition that `drawsAxes`; `width` × `height` is the plot's size.
   */
  axes?: { x: AxisDrawing; y: AxisDrawing; width: number; height: number };
}

export interface ChartDefinition<I> {
  /** The chart kind, e.g. "impedance"; one compiled runtime per name. */
  readonly name: string;
  readonly frame: Frame;
  /** The vega-lite spec, without data values; called once per process. */
  spec(): TopLevelSpec;
  /**
   * Data sources whose layers the binding's underlay draws: they stay in the spec offered with a chart (with
   * their rows) and are left out of the one vega runs.
   */
  readonly underlaid?: readonly string[];
  /**
   * Whether the binding gives the axes (`axes`): the spec's axes stay in the spec offered with a chart and are
   * left out of the one vega runs.
   */
  readonly drawsAxes?: boolean;
  bind(input: I, layout?: ChartLayout): ChartBinding;
  /** The rows its key takes for this input (charts with a key laid out by key.ts). */
  keyRows?(input: I): number;
}

/** How a chart is laid out beside others. */
export interface ChartLayout {
  /**
   * Rows its key takes at least: a chart drawn beside another whose key takes more rows gets as many, empty
   * ones under its own entries, so that the two plots start at the same height.
   */
  keyRows?: number;
}

/**
 * The layouts of charts a page sets two to a row, in this order: each chart's key takes as many rows as the
 * taller of its row's two keys, so the two plots of a row start at the same height.
 */
export function rowLayouts<I>(defs: readonly ChartDefinition<I>[], input: I): ChartLayout[] {
  const rows = defs.map((d) => d.keyRows?.(input) ?? 0);
  return rows.map((_, i) => ({ keyRows: Math.max(rows[i - (i % 2)], rows[i - (i % 2) + 1] ?? 0) }));
}
