// Where the sweep must look closer: the sweep's own points plus, around every lightly damped natural
// frequency, a ladder of points that resolves the feature it makes on the jω axis.
//
// Near a pole or zero p = −α + jβ, Z(jω) varies like (jω − p)^±1, so |Z| changes on the scale of the
// distance from ω to p: about α at ω = β, and |ω − β| further away. The ladder places points at
// β ± α/4·2^k (k = 0, 1, …) until the spacing reaches the sweep's own step, so every stretch of the axis
// is sampled at a fraction of its distance to the nearest such pole or zero, however sharp the feature:
// a peak between two sweep points shows as a peak of the samples, and two resonances closer than a
// sweep step are told apart. Between ladders the sweep's spacing already resolves the smoother variation.

import type { ComplexFrequency } from '../circuit/natural-frequencies.js';

/** The closest a ladder goes to its centre, relative to the frequency: below this the root finders' own
 *  tolerance (1e-9) takes over, so a lossless pole or zero gets the same ladder as a Q of about 1e9. */
const FINEST_RELATIVE_STEP = 1e-9;

/**
 * The sorted union of `sweep` (ascending, Hz) and ladders around each natural frequency (rad/s) whose
 * oscillation lies within the sweep. Every sweep point is kept, bit for bit.
 */
export function featureGrid(sweep: Float64Array, roots: readonly ComplexFrequency[]): Float64Array {
  const n = sweep.length;
  if (n < 2 || roots.length === 0) return sweep;
  const low = sweep[0];
  const high = sweep[n - 1];
  const extra: number[] = [];
  for (const root of roots) {
    const f = root.im / (2 * Math.PI);
    if (!(f > low && f < high)) continue;
    const halfWidth = Math.abs(root.re) / (2 * Math.PI);
    // The sweep's own step where the root sits: the ladder stops once it is as coarse as that.
    const i = upperIndex(sweep, f);
    const step = sweep[i] - sweep[i - 1];
    let d = Math.max(halfWidth / 4, f * FINEST_RELATIVE_STEP);
    if (d >= step) continue;
    extra.push(f);
    for (; d < step; d *= 2) {
      if (f - d > low) extra.push(f - d);
      if (f + d < high) extra.push(f + d);
    }
  }
  if (extra.length === 0) return sweep;
  const all = new Float64Array(n + extra.length);
  all.set(sweep);
  all.set(extra, n);
  all.sort();
  // Drop exact repeats (a root on a sweep point), which would make an empty bracket.
  let k = 1;
  for (let j = 1; j < all.length; j++) if (all[j] !== all[k - 1]) all[k++] = all[j];
  return all.subarray(0, k);
}

/** The first index whose frequency is above `f` (f inside the sweep). */
function upperIndex(sweep: Float64Array, f: number): number {
  let lo = 0;
  let hi = sweep.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (sweep[mid] > f) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** A sweep's ends: the range for naturalFrequencies(). */
export function sweepRange(sweep: Float64Array): { fromHz: number; toHz: number } {
  return { fromHz: sweep[0], toHz: sweep[sweep.length - 1] };
}

/** Positions in `grid` of each point of `sweep` (a subset of it, both ascending). */
export function sweepIndices(grid: Float64Array, sweep: Float64Array): Int32Array {
  const out = new Int32Array(sweep.length);
  for (let i = 0, j = 0; i < sweep.length; i++) {
    while (grid[j] !== sweep[i]) j++;
    out[i] = j;
  }
  return out;
}
