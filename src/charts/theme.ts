// The vega-lite configuration shared by every zfolio chart: a boxed plot with a light grid, thin lines, plain
// upright type, legends in one row above the plot, and no interactive or ARIA extras (the finished SVG is a
// single image with its own title and description).

import type { Config } from 'vega-lite';
import { FONT, FONT_SIZE, INK, INK_SOFT, PAPER } from './palette.js';

/** How an axis is drawn: its ticks, labels and title (the renderer draws the axes from these, axis-scene.ts). */
export const AXIS_STYLE = {
  tickColor: INK,
  tickWidth: 0.8,
  tickSize: 4,
  labelColor: INK,
  labelFont: FONT,
  labelFontSize: FONT_SIZE.tick,
  labelPadding: 3,
  titleColor: INK_SOFT,
  titleFont: FONT,
  titleFontSize: FONT_SIZE.title,
  titleFontWeight: 'normal',
  titlePadding: 7,
} as const;

export const CHART_CONFIG: Config = {
  aria: false,
  background: PAPER,
  font: FONT,
  view: { stroke: null, fill: null },
  axis: {
    domain: false,
    // Grid lines are marks of their own (spec-parts.ts: gridLayers; the renderer draws them, grid.ts), under the band tint.
    grid: false,
    ticks: true,
    tickColor: AXIS_STYLE.tickColor,
    tickWidth: AXIS_STYLE.tickWidth,
    tickSize: AXIS_STYLE.tickSize,
    labelColor: AXIS_STYLE.labelColor,
    labelFont: AXIS_STYLE.labelFont,
    labelFontSize: AXIS_STYLE.labelFontSize,
    labelPadding: AXIS_STYLE.labelPadding,
    labelOverlap: false,
    labelFlush: false,
    titleColor: AXIS_STYLE.titleColor,
    titleFont: AXIS_STYLE.titleFont,
    titleFontSize: AXIS_STYLE.titleFontSize,
    titleFontWeight: AXIS_STYLE.titleFontWeight,
    titlePadding: AXIS_STYLE.titlePadding,
  },
  legend: {
    orient: 'top',
    direction: 'horizontal',
    title: null,
    labelFont: FONT,
    labelFontSize: FONT_SIZE.legend,
    labelColor: INK,
    labelLimit: 220,
    symbolType: 'stroke',
    symbolSize: 700,
    symbolStrokeWidth: 1.6,
    columnPadding: 16,
    rowPadding: 4,
    offset: 10,
    padding: 0,
  },
  line: { strokeCap: 'butt', strokeJoin: 'round', interpolate: 'linear' },
  text: { font: FONT, fontSize: FONT_SIZE.note, fill: INK },
  rule: { color: INK },
};
