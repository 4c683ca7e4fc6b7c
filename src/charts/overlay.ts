// Styles for many curves on one plot (comparisons, rail branches): curve k gets colour k mod 8 and dash
// pattern k mod 9, so up to 72 curves differ in colour or dash, and up to 9 stay distinct in greyscale by
// their dash alone.

import { OVERLAY_COLORS, OVERLAY_DASHES } from './palette.js';
import type { Row } from './render.js';
import type { Json } from './spec-parts.js';

const COLOR_KEYS = OVERLAY_COLORS.map((_, k) => `c${k}`);
const DASH_KEYS = OVERLAY_DASHES.map((_, k) => `d${k}`);

/** Row fields that select curve k's style. */
export function overlayStyle(k: number): Row {
  return { c: COLOR_KEYS[k % COLOR_KEYS.length], d: DASH_KEYS[k % DASH_KEYS.length] };
}

/** Colour of curve k, for point marks drawn in a curve's colour. */
export function overlayColor(k: number): string {
  return OVERLAY_COLORS[k % OVERLAY_COLORS.length];
}

/** The encoding that draws rows with overlayStyle fields; `width` is the stroke width in px. */
export function overlayEncoding(width: number): Json {
  return {
    color: { field: 'c', type: 'nominal', scale: { domain: COLOR_KEYS, range: [...OVERLAY_COLORS] }, legend: null },
    strokeDash: { field: 'd', type: 'nominal', scale: { domain: DASH_KEYS, range: OVERLAY_DASHES.map((d) => [...d]) }, legend: null },
    strokeWidth: { value: width },
  };
}
