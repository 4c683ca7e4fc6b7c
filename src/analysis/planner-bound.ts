// One node of the planner's branch and bound (planner.ts, whose header gives the arguments): which violated
// points it looks at, the covering relaxation's bound on the weight still needed, and where to branch.

import type { Grid } from './planner-grid.js';
import { reachMultiplier } from './planner-grid.js';

/** Violated sweep points a node samples at most (by stride; the worst of each violated run comes on top). */
export const MAX_SAMPLES = 24;
/** Bounds and helpfulness are compared with this slack, in favour of keeping a branch. */
export const SLACK = 1e-9;

/**
 * The violated points to bound and branch on, written into `samples`; returns how many: the worst of each
 * violated run of the sweep, every stride-th violated sweep point, and every violated cut. P = Pr + j·Pi is
 * the admittance placed so far at each grid point; a point is violated where |P|² < t2.
 */
export function violatedSamples(grid: Grid, Pr: Float64Array, Pi: Float64Array, t2: number, stride: number, samples: Int32Array): number {
  let s = 0;
  let runWorst = -1;
  let runWorstValue = Infinity;
  for (let k = 0; k <= grid.sorted; k++) {
    const v = k < grid.sorted ? Pr[k] * Pr[k] + Pi[k] * Pi[k] : Infinity;
    if (v < t2) {
      if (v < runWorstValue) {
        runWorstValue = v;
        runWorst = k;
      }
      if (k % stride === 0 && s < MAX_SAMPLES) samples[s++] = k;
    } else if (runWorst >= 0) {
      if (s === 0 || samples[s - 1] !== runWorst) samples[s++] = runWorst;
      runWorst = -1;
      runWorstValue = Infinity;
    }
    if (s >= MAX_SAMPLES * 2) break;
  }
  for (let k = grid.sorted; k < grid.size; k++) if (Pr[k] * Pr[k] + Pi[k] * Pi[k] < t2) samples[s++] = k;
  return s;
}

export interface NodeState {
  grid: Grid;
  Pr: Float64Array;
  Pi: Float64Array;
  /** The node's violated points (violatedSamples) and how many there are. */
  samples: Int32Array;
  count: number;
  weights: readonly number[];
  /** Whether the budget is in weight (a search by cost with an incumbent) or in placements. */
  weighted: boolean;
  /** 1 where a candidate may still be added at this node. */
  allowed: Uint8Array;
  /** The budget left, with its slack. */
  lim: number;
  t2: number;
  /** Scratch, filled here: τ for each sample and candidate (row per sample), least need per sample, load. */
  tBuf: Float64Array;
  need: Float64Array;
  load: Float64Array;
}

/**
 * The node's bound: -1 when no completion within the budget can meet the target (some sample has no helpful
 * candidate, or the dual bound of the covering relaxation exceeds the budget); otherwise the sample to branch
 * on (the one with the fewest helpful candidates), whose τ row is left in `tBuf`.
 */
export function boundNode(node: NodeState): number {
  const { grid, Pr, Pi, samples, count: s, weights, weighted, allowed, lim, t2, tBuf, need, load } = node;
  const m = allowed.length;
  // t for every sample and allowed candidate, the least weight needed per sample, and the sample with
  // the fewest helpful candidates to branch on.
  let branchAt = -1;
  let branchHelpful = Infinity;
  let sumNeed = 0;
  let largestNeed = 0;
  for (let j = 0; j < s; j++) {
    const k = samples[j];
    const pr = Pr[k];
    const pi = Pi[k];
    const base = k * m;
    let least = Infinity;
    let helpful = 0;
    for (let i = 0; i < m; i++) {
      const at = j * m + i;
      if (allowed[i] === 0) {
        tBuf[at] = Infinity;
        continue;
      }
      // Whatever is added includes at least one whole placement, hence max(1, t) (see planner.ts).
      const t = Math.max(1, reachMultiplier(pr, pi, grid.tRe[base + i], grid.tIm[base + i], t2));
      tBuf[at] = t;
      const w = weighted ? weights[i] * t : t;
      if (w < least) least = w;
      if (w <= lim) helpful++;
    }
    if (helpful === 0) return -1;
    need[j] = least;
    if (helpful < branchHelpful || (helpful === branchHelpful && least > need[branchAt])) {
      branchAt = j;
      branchHelpful = helpful;
    }
    sumNeed += least;
    if (least > largestNeed) largestNeed = least;
  }

  // Dual bound of the covering relaxation (any λ ≥ 0 with Σ_j λ_j/τ_ij ≤ unit_i for every allowed i
  // bounds the weight still needed): λ_j = α·need_j with α as large as those constraints allow.
  load.fill(0);
  for (let j = 0; j < s; j++) {
    const row = j * m;
    const nj = need[j];
    for (let i = 0; i < m; i++) load[i] += nj / tBuf[row + i];
  }
  let alpha = Infinity;
  for (let i = 0; i < m; i++) {
    if (allowed[i] === 0 || !(load[i] > 0)) continue;
    const a = (weighted ? weights[i] : 1) / load[i];
    if (a < alpha) alpha = a;
  }
  let bound = Math.max(largestNeed, Number.isFinite(alpha) ? alpha * sumNeed : 0);
  if (!weighted) bound = Math.ceil(bound - SLACK);
  if (bound > lim) return -1;
  return branchAt;
}

/** Sort `items` by ascending `keys` (parallel arrays), ties by item; insertion sort: the lists are short. */
export function sortByKey(items: number[], keys: number[]): void {
  for (let a = 1; a < items.length; a++) {
    const item = items[a];
    const key = keys[a];
    let b = a - 1;
    while (b >= 0 && (keys[b] > key || (keys[b] === key && items[b] > item))) {
      items[b + 1] = items[b];
      keys[b + 1] = keys[b];
      b--;
    }
    items[b + 1] = item;
    keys[b + 1] = key;
  }
}
