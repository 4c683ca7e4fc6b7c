// Curves over an axis: sweep values with exact points merged in (resonances, peaks), down-sampled in screen
// space, broken at gaps, and the same curve as an obstacle that labels keep clear of.

import type { Row } from './render.js';
import type { AxisMap } from './scales.js';
import type { Obstacle } from './labels.js';
import { simplifyPolyline, simplifyPolylines } from './simplify.js';

/**
 * Rows of an envelope (min and max at each frequency, rows {f, v, v2, i}) with both ends on the plot,
 * thinned in screen space as the curves are (both edges within the tolerance of simplify.ts), each value to
 * 6 significant digits as in the sweep CSV: a part's envelope spans its whole sweep, and at every point it
 * cost the page and the downloadable spec bytes nobody can see.
 */
export function envelopeRows(frequencies: ArrayLike<number>, min: ArrayLike<number>, max: ArrayLike<number>, xMap: AxisMap, yMap: AxisMap): Row[] {
  const at: number[] = [];
  for (let i = 0; i < frequencies.length; i++) if (min[i] > 0 && Number.isFinite(max[i])) at.push(i);
  const xs = at.map((i) => xMap.toPx(frequencies[i]));
  const lower = at.map((i) => yMap.toPx(min[i]));
  const upper = at.map((i) => yMap.toPx(max[i]));
  return simplifyPolylines(xs, [lower, upper]).map((k) => {
    const i = at[k];
    return { f: round6(frequencies[i]), v: round6(min[i]), v2: round6(max[i]), i };
  });
}

const round6 = (x: number) => Number(x.toPrecision(6));

/** A curve with some exact points inserted; `keep` marks points down-sampling must keep. */
export interface Curve {
  f: number[];
  v: number[];
  keep: boolean[];
}

/**
 * The values `valueAt(i)` at `xs` (ascending) with extra exact points (e.g. resonances) merged in order.
 * Non-finite values (or ≤ 0 on a log axis, when `positive`) become gaps.
 */
export function mergeCurve(xs: ArrayLike<number>, valueAt: (i: number) => number, extra: readonly { f: number; v: number }[], positive: boolean): Curve {
  const pts = extra.filter((e) => e.f >= xs[0] && e.f <= xs[xs.length - 1]).sort((a, b) => a.f - b.f);
  const out: Curve = { f: [], v: [], keep: [] };
  const push = (f: number, v: number, keep: boolean) => {
    out.f.push(f);
    out.v.push(Number.isFinite(v) && (!positive || v > 0) ? v : NaN);
    out.keep.push(keep);
  };
  let k = 0;
  for (let i = 0; i < xs.length; i++) {
    while (k < pts.length && pts[k].f < xs[i]) push(pts[k].f, pts[k++].v, true);
    if (k < pts.length && pts[k].f === xs[i]) {
      push(pts[k].f, pts[k++].v, true);
      continue;
    }
    push(xs[i], valueAt(i), i === 0 || i === xs.length - 1);
  }
  while (k < pts.length) push(pts[k].f, pts[k++].v, true);
  return out;
}

/** The points as they are, the ends and those `keep(i)` says kept by down-sampling. */
export function plainCurve(xs: ArrayLike<number>, values: ArrayLike<number>, keep: (i: number) => boolean = () => false): Curve {
  const out: Curve = { f: [], v: [], keep: [] };
  for (let i = 0; i < xs.length; i++) {
    out.f.push(xs[i]);
    out.v.push(values[i]);
    out.keep.push(i === 0 || i === xs.length - 1 || keep(i));
  }
  return out;
}

/** Rows {f, v, s, i} of a curve, down-sampled on the chart's axes; gaps are kept as null values. */
export function curveRows(curve: Curve, xMap: AxisMap, yMap: AxisMap, s: string, extra: Row = {}): Row[] {
  const xs = curve.f.map((f) => xMap.toPx(f));
  const ys = curve.v.map((v) => (Number.isFinite(v) ? yMap.toPx(v) : NaN));
  const kept = simplifyPolyline(xs, ys, undefined, (i) => curve.keep[i]);
  const rows: Row[] = [];
  let previous = -1;
  for (const i of kept) {
    // A gap between two kept points: one null row breaks the line there.
    if (previous >= 0 && i - previous > 1 && hasGap(curve.v, previous, i)) rows.push({ f: curve.f[previous + 1], v: null, s, i: rows.length, ...extra });
    rows.push({ f: curve.f[i], v: curve.v[i], s, i: rows.length, ...extra });
    previous = i;
  }
  return rows;
}

function hasGap(v: number[], a: number, b: number): boolean {
  for (let i = a + 1; i < b; i++) if (!Number.isFinite(v[i])) return true;
  return false;
}

/** A curve as labels see it: px from the plot's top-left corner (gaps as NaN). */
export function curveObstacle(curve: Curve, xMap: AxisMap, yMap: AxisMap): Obstacle {
  return {
    xs: curve.f.map((f) => xMap.toPx(f)),
    ys: curve.v.map((v) => (Number.isFinite(v) ? yMap.rangePx - yMap.toPx(v) : NaN)),
  };
}

/** A horizontal line across the plot at value `v`, as labels see it. */
export function levelObstacle(v: number, xMap: AxisMap, yMap: AxisMap): Obstacle {
  const y = yMap.rangePx - yMap.toPx(v);
  return { xs: [0, xMap.rangePx], ys: [y, y] };
}

/** The plot-area pixel of a point (y measured down from the top). */
export function toPlot(xMap: AxisMap, yMap: AxisMap, x: number, y: number): { x: number; y: number } {
  return { x: xMap.toPx(x), y: yMap.rangePx - yMap.toPx(y) };
}
