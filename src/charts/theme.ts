// The vega-lite configuration shared by every zfolio chart: a boxed plot with a light grid, thin lines, plain
// upright type, legends in one row above the plot, and no interactive or ARIA extras (the finished SVG is a
// single image with its own title and description).

import type { Config } from 'vega-lite';
import { FONT, FONT_SIZE, INK, INK_SOFT, PAPER } from './palette.js';

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
    tickColor: INK,
    tickWidth: 0.8,
    tickSize: 4,
    labelColor: INK,
    labelFont: FONT,
    labelFontSize: FONT_SIZE.tick,
    labelPadding: 3,
    labelOverlap: false,
    labelFlush: false,
    titleColor: INK_SOFT,
    titleFont: FONT,
    titleFontSize: FONT_SIZE.title,
    titleFontWeight: 'normal',
    titlePadding: 7,
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
