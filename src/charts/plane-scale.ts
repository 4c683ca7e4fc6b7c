// The complex plane's scale: both axes signed-log, s(v) = sign(v)·log10(1 + |v|/c) (scales.ts), with c the
// power of ten at or below the part's least |Z|, so the path is linear within about ±c and logarithmic beyond.

import type { PartChartInput } from './part-marks.js';
import { decadeOf, signedLog } from './scales.js';

/** The linear zone never reaches below this fraction of the largest |Z| (a lossless part has min |Z| = 0). */
const MIN_LINEAR_ZONE = 1e-9;

/** The signed-log constant for a part: the power of ten at or below its least |Z|. */
export function planeConstant(magnitudes: ArrayLike<number>): number {
  let lo = Infinity;
  let hi = 0;
  for (let i = 0; i < magnitudes.length; i++) {
    const m = magnitudes[i];
    if (m > 0 && m < lo) lo = m;
    if (m > hi) hi = m;
  }
  if (!(hi > 0)) return 1;
  return 10 ** decadeOf(Math.max(lo, hi * MIN_LINEAR_ZONE));
}

/** The transformed domain covering `lo..hi` out to the next ±c·10^k, and never less than [0, s(10c)]. */
export function planeDomain(lo: number, hi: number, c: number): [number, number] {
  const edge = (v: number) => (v === 0 ? 0 : Math.sign(v) * signedLog(c * 10 ** Math.max(1, Math.ceil(Math.log10(Math.abs(v) / c) - 1e-9)), c));
  const margin = 0.12;
  return [Math.min(0, edge(lo)) - margin, Math.max(edge(10 * c), edge(hi)) + margin];
}

/** The signed-log constant of a part's path: planeConstant of its |Z| over the sweep. */
export function partPlaneConstant(input: Pick<PartChartInput, 'columns'>): number {
  return planeConstant(input.columns.magnitudeOhm);
}

/** [min(0, …), max(0, …)] of the finite values. */
export function finiteExtent(values: readonly number[]): [number, number] {
  let lo = 0;
  let hi = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}

