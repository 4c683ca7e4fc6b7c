// The plot's grid, drawn as two paths (unlabelled lines, then labelled ones over them) instead of a vega
// layer per axis and kind of line: four layers of every chart were a fifth of its dataflow and a <line>
// element (about 80 bytes) per grid line. The renderer writes the paths first in the plot (render.ts:
// the binding's underlay), under the band's tint and every mark, where the grid layers were drawn.
// Positions follow the scales vega draws the marks with: x from the plot's left edge, y up from its bottom
// edge, on a log or linear scale over the axis's domain.

import { fixedText } from '../units/digits-text.js';
import { GRID_MAJOR, GRID_MINOR } from './palette.js';
import type { Ticks } from './scales.js';

/** The stroke width of a grid line, px. */
export const GRID_WIDTH = 0.6;

export interface GridAxis {
  scale: 'log' | 'linear';
  domain: [number, number];
  ticks: Pick<Ticks, 'values' | 'minor'>;
}

/** Where `v` falls on an axis of `length` px over `domain`, from its low end. */
export function gridOffset(axis: Pick<GridAxis, 'scale' | 'domain'>, v: number, length: number): number {
  const [d0, d1] = axis.domain;
  const t = axis.scale === 'log' ? Math.log(v / d0) / Math.log(d1 / d0) : (v - d0) / (d1 - d0);
  return t * length;
}

/** Coordinates to a tenth of a px, as the rest of a finished chart (svg-finish.ts). */
const px = (v: number) => fixedText(v, 1);

/**
 * The grid's markup in the plot's px (origin at its top-left corner, `width` × `height`): a path of the
 * minor lines of both axes, then one of the major lines; nothing for an axis with no lines.
 */
export function gridPaths(x: GridAxis, y: GridAxis, width: number, height: number): string {
  const lines = (which: 'values' | 'minor') => {
    let d = '';
    for (const v of x.ticks[which]) d += `M${px(gridOffset(x, v, width))},0V${px(height)}`;
    for (const v of y.ticks[which]) d += `M0,${px(height - gridOffset(y, v, height))}H${px(width)}`;
    return d;
  };
  const path = (d: string, colour: string) => (d === '' ? '' : `<path d="${d}" stroke="${colour}" stroke-width="${GRID_WIDTH}"/>`);
  return path(lines('minor'), GRID_MINOR) + path(lines('values'), GRID_MAJOR);
}
