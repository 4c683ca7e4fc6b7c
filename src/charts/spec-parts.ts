// Building blocks of the vega-lite specs. Conventions shared by every chart:
//   fields   f frequency (Hz) · v value on the y axis · s series key · t label text ·
//            dx, dy, al, bl label placement (px, align, baseline) · x0, x1, y key positions in px
//   params   <axis>Domain, <axis>Ticks, <axis>Labels per axis; tick labels are looked up, so every label
//            on every axis comes from formatEng (engineering notation, SI prefixes).
// Each piece is a plain object; a chart spec is a list of layers built from them.

import { GRID_WIDTH } from './grid.js';
import type { Ticks } from './scales.js';
import { BAND_EDGE, BAND_FILL, BAND_OPACITY, FONT_SIZE, GRID_MAJOR, GRID_MINOR, INK, RESONANCE_MARK, SPREAD_FILL, SPREAD_OPACITY, type SeriesStyle } from './palette.js';

// vega-lite's layer and encoding types are deep unions; the pieces here are checked by compiling every spec
// in the tests (with vega-lite's warnings turned into failures), which says more than the static type.
export type Json = Record<string, unknown>;

export interface SeriesScale {
  /** Series keys in data (fixed per chart kind). */
  keys: string[];
  styles: SeriesStyle[];
}

/** A positional axis whose domain, tick values and tick labels are parameters named after `axis`. */
export function paramAxis(axis: string, title: string, extra: Json = {}): Json {
  return {
    title,
    values: { expr: `${axis}Ticks` },
    labelExpr: `indexof(${axis}Ticks, datum.value) < 0 ? '' : ${axis}Labels[indexof(${axis}Ticks, datum.value)]`,
    ...extra,
  };
}

export function paramScale(axis: string, type: 'log' | 'linear'): Json {
  return type === 'log' ? { type, domain: { expr: `${axis}Domain` }, nice: false } : { type, domain: { expr: `${axis}Domain` }, nice: false, zero: false };
}

/** Positional encoding of `field` on the scale and axis named `axis`. */
export function position(field: string, axis: string, type: 'log' | 'linear', title: string, axisExtra: Json = {}): Json {
  return { field, type: 'quantitative', scale: paramScale(axis, type), axis: paramAxis(axis, title, axisExtra) };
}

/** Parameters of one axis, with placeholder values (every render sets them). */
export function axisParams(axis: string): Json[] {
  return [
    { name: `${axis}Domain`, value: [1, 10] },
    { name: `${axis}Ticks`, value: [] },
    { name: `${axis}Labels`, value: [] },
  ];
}

/** Parameter values and grid rows for an axis named `axis` (see axisParams and gridLayers). */
export function axisBinding(axis: string, domain: [number, number], ticks: Ticks): { params: Record<string, unknown>; datasets: Record<string, { v: number }[]> } {
  return {
    params: { [`${axis}Domain`]: domain, [`${axis}Ticks`]: ticks.values, [`${axis}Labels`]: ticks.labels },
    datasets: { [`${axis}Minor`]: ticks.minor.map((v) => ({ v })), [`${axis}Major`]: ticks.values.map((v) => ({ v })) },
  };
}

/** Fixed colour, dash and width scales for the series keys of a chart. */
export function seriesEncoding(series: SeriesScale): Json {
  return {
    color: { field: 's', type: 'nominal', scale: { domain: series.keys, range: series.styles.map((s) => s.color) }, legend: null },
    strokeDash: { field: 's', type: 'nominal', scale: { domain: series.keys, range: series.styles.map((s) => s.dash) }, legend: null },
    strokeWidth: { field: 's', type: 'ordinal', sort: series.keys, scale: { type: 'ordinal', domain: series.keys, range: series.styles.map((s) => s.width) }, legend: null },
  };
}

/**
 * Curves: rows {f|x, v, i, …style fields, detail?}, drawn in row order `i`; `style` is the colour/dash/width
 * encoding (seriesEncoding or overlayEncoding); `detail` names a field that splits a style into separate
 * lines (segments, parts). A row with v = null breaks its line.
 */
export function curveLayer(data: string, x: Json, y: Json, style: Json, detail?: string): Json {
  return {
    data: { name: data },
    mark: { type: 'line', clip: true },
    encoding: { x, y, ...style, ...(detail ? { detail: { field: detail, type: 'nominal' } } : {}), order: { field: 'i', type: 'quantitative' } },
  };
}

/**
 * Grid lines: rows {v} drawn across the plot along `channel`; `major` at labelled ticks. The grid is drawn as
 * marks (not by the axis) so that it lies under the band's tint and the curves. These layers are the grid in
 * the spec offered with a chart; the renderer draws the same lines itself, as two paths (grid.ts).
 */
export function gridLayer(data: string, channel: 'x' | 'y', enc: Json, major = false): Json {
  return {
    data: { name: data },
    mark: { type: 'rule', color: major ? GRID_MAJOR : GRID_MINOR, strokeWidth: GRID_WIDTH },
    encoding: { [channel]: { ...enc, field: 'v' } },
  };
}

/** Grid layers for one axis: minor rows in `<axis>Minor`, major rows in `<axis>Major`. */
export function gridLayers(axis: string, channel: 'x' | 'y', enc: Json): Json[] {
  const [minor, major] = gridSources(axis);
  return [gridLayer(minor, channel, enc), gridLayer(major, channel, enc, true)];
}

/** The data sources of an axis's grid layers (the renderer draws them itself: grid.ts). */
export function gridSources(axis: string): [string, string] {
  return [`${axis}Minor`, `${axis}Major`];
}

/** The plot's outline, drawn last so tints and curves never cover it. */
export function frameLayer(): Json {
  return {
    data: { values: [{}] },
    mark: { type: 'rect', fill: null, stroke: INK, strokeWidth: 0.8 },
    encoding: { x: { value: 0 }, x2: { value: 'width' }, y: { value: 0 }, y2: { value: 'height' } },
  };
}

/**
 * The usable band (rows {f, f2}) as a translucent tint over the grid (so grid lines show through), and its
 * inner edges (rows {f}) as thin lines.
 */
export function bandLayers(x: Json): Json[] {
  return [
    { data: { name: 'band' }, mark: { type: 'rect', color: BAND_FILL, fillOpacity: BAND_OPACITY, clip: true }, encoding: { x, x2: { field: 'f2' } } },
    {
      data: { name: 'bandEdges' },
      mark: { type: 'rule', color: BAND_EDGE, strokeWidth: 0.9, strokeDash: [4, 2], clip: true },
      encoding: { x },
    },
  ];
}

/**
 * The least and greatest |Z| over the corners of a spread (rows {f, v, v2, i}) as a tinted area, drawn behind
 * the curves so the nominal curve reads on top of it.
 */
export function envelopeLayer(data: string, x: Json, y: Json): Json {
  return {
    data: { name: data },
    mark: { type: 'area', color: SPREAD_FILL, fillOpacity: SPREAD_OPACITY, clip: true },
    // No `order` channel: on an area it sets the stacking order and would split the area point by point; the
    // area follows x.
    encoding: { x, y, y2: { field: 'v2' } },
  };
}

/** A straight reference line at y = v (rows {v}): zero lines, targets. */
export function referenceLineLayer(data: string, y: Json, style: { color: string; width: number; dash?: number[] }): Json {
  return {
    data: { name: data },
    mark: { type: 'rule', color: style.color, strokeWidth: style.width, strokeDash: style.dash ?? [], clip: true },
    encoding: { y: { ...y, field: 'v' } },
  };
}

/** Marked points (rows {f|x, v}), drawn as small rings over the curves. */
export function pointLayer(data: string, x: Json, y: Json, color = RESONANCE_MARK, shape = 'circle'): Json {
  return {
    data: { name: data },
    mark: { type: 'point', shape, size: 42, filled: true, color, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true },
    encoding: { x, y },
  };
}

/** Marked points each in its own colour (rows {f|x, v, color}): a comparison's SRFs, a rail's peaks. */
export function colouredPointLayer(data: string, x: Json, y: Json, size: number): Json {
  return {
    data: { name: data },
    mark: { type: 'point', shape: 'circle', size, filled: true, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true },
    encoding: { x, y, color: { field: 'color', type: 'nominal', scale: null } },
  };
}

/** Labels placed by labels.ts: rows {…position, t, dx, dy, al, bl}. */
export function placedLabelLayer(data: string, x: Json, y: Json, color = RESONANCE_MARK): Json {
  return {
    data: { name: data },
    mark: {
      type: 'text',
      fontSize: FONT_SIZE.note,
      color,
      dx: { expr: 'datum.dx' },
      dy: { expr: 'datum.dy' },
      align: { expr: 'datum.al' },
      baseline: { expr: 'datum.bl' },
    },
    encoding: { x, y, text: { field: 't' } },
  };
}

/** Notes at fixed pixel positions inside or around the plot: rows {x, y, t, al, bl}. */
export function pixelTextLayer(data: string, color: string, fontSize: number = FONT_SIZE.note, style: Json = {}): Json {
  return {
    data: { name: data },
    mark: { type: 'text', fontSize, color, align: { expr: 'datum.al' }, baseline: { expr: 'datum.bl' }, ...style },
    encoding: { x: { field: 'x', type: 'quantitative', scale: null }, y: { field: 'y', type: 'quantitative', scale: null }, text: { field: 't' } },
  };
}

/**
 * The key above the plot (see key.ts): symbol lines, band swatches, point symbols and texts. `lineStyle` is
 * the colour/dash/width encoding of the chart's curves (seriesEncoding for a fixed set of series).
 */
export function keyLayers(lineStyle: Json): Json[] {
  const px = (field: string) => ({ field, type: 'quantitative', scale: null });
  return [
    { data: { name: 'keyBands' }, mark: { type: 'rect', color: BAND_FILL, fillOpacity: BAND_OPACITY, stroke: BAND_EDGE, strokeWidth: 0.8, strokeDash: [4, 2] }, encoding: { x: px('x0'), x2: px('x1'), y: px('y0'), y2: px('y1') } },
    { data: { name: 'keySpread' }, mark: { type: 'rect', color: SPREAD_FILL, fillOpacity: SPREAD_OPACITY }, encoding: { x: px('x0'), x2: px('x1'), y: px('y0'), y2: px('y1') } },
    { data: { name: 'keyLines' }, mark: { type: 'rule' }, encoding: { x: px('x0'), x2: px('x1'), y: px('y'), ...lineStyle } },
    {
      data: { name: 'keyPoints' },
      mark: { type: 'point', size: 42, filled: true, stroke: '#ffffff', strokeWidth: 1, opacity: 1 },
      encoding: { x: px('x'), y: px('y'), color: { field: 'c', type: 'nominal', scale: null }, shape: { field: 'sh', type: 'nominal', scale: null } },
    },
    { data: { name: 'keyText' }, mark: { type: 'text', fontSize: FONT_SIZE.legend, color: INK, align: 'left', baseline: 'middle' }, encoding: { x: px('x'), y: px('y'), text: { field: 't' } } },
  ];
}

/** Names of the datasets a key fills. */
export const KEY_DATASETS = ['keyBands', 'keySpread', 'keyLines', 'keyPoints', 'keyText'] as const;
