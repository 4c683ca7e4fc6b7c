// A good first set for the planner's search: greedy additions, then local improvement. It only has to be
// good, not optimal; a tight first incumbent lets the exact search prune from its first node. Every set it
// proposes is still judged by the full evaluation before it counts.

import type { Grid } from './planner-grid.js';

export interface StartOptions {
  /** Per placement: 1 when minimising the count, the cost otherwise. */
  weights: readonly number[];
  maxCount: number;
  /** (Y_t)², with the search's strictness. */
  t2: number;
}

/** Whether fixed + Σ counts·y keeps |Y|² ≥ t2 at every grid point. */
export function gridFeasible(grid: Grid, counts: readonly number[], t2: number, re = new Float64Array(grid.size), im = new Float64Array(grid.size)): boolean {
  re.set(grid.aRe);
  im.set(grid.aIm);
  counts.forEach((n, i) => {
    if (n === 0) return;
    const yr = grid.yRe[i];
    const yi = grid.yIm[i];
    for (let k = 0; k < grid.size; k++) {
      re[k] += n * yr[k];
      im[k] += n * yi[k];
    }
  });
  for (let k = 0; k < grid.size; k++) if (re[k] * re[k] + im[k] * im[k] < t2) return false;
  return true;
}

/** Σ over grid points of the relative shortfall max(0, 1 − |Y|/Y_t): zero exactly when the grid holds. */
function shortfall(re: Float64Array, im: Float64Array, yr: Float64Array | null, yi: Float64Array | null, yt: number, size: number, stopAbove: number): number {
  let sum = 0;
  for (let k = 0; k < size; k++) {
    const r = yr ? re[k] + yr[k] : re[k];
    const x = yi ? im[k] + yi[k] : im[k];
    const magnitude = Math.sqrt(r * r + x * x);
    if (magnitude < yt) {
      sum += 1 - magnitude / yt;
      if (sum > stopAbove) return sum;
    }
  }
  return sum;
}

/**
 * Greedy: add the placement that removes the most shortfall (per unit of weight), until the grid holds or
 * nothing can be added. Returns the counts, or null when the greedy path does not reach a feasible set.
 */
export function greedySet(grid: Grid, options: StartOptions): number[] | null {
  const { weights, maxCount, t2 } = options;
  const m = weights.length;
  const yt = Math.sqrt(t2);
  const counts = new Array<number>(m).fill(0);
  const re = Float64Array.from(grid.aRe);
  const im = Float64Array.from(grid.aIm);
  let current = shortfall(re, im, null, null, yt, grid.size, Infinity);
  for (let step = 0; step < m * maxCount && current > 0; step++) {
    let pick = -1;
    let pickScore = -Infinity;
    let pickShortfall = Infinity;
    for (let i = 0; i < m; i++) {
      if (counts[i] >= maxCount) continue;
      const after = shortfall(re, im, grid.yRe[i], grid.yIm[i], yt, grid.size, current);
      const score = (current - after) / Math.max(weights[i], 1e-300);
      if (score > pickScore || (score === pickScore && after < pickShortfall)) {
        pick = i;
        pickScore = score;
        pickShortfall = after;
      }
    }
    if (pick < 0 || !(pickShortfall < current)) return null;
    counts[pick]++;
    for (let k = 0; k < grid.size; k++) {
      re[k] += grid.yRe[pick][k];
      im[k] += grid.yIm[pick][k];
    }
    current = pickShortfall;
  }
  return current === 0 ? prune(grid, counts, options) : null;
}

/** Remove placements, heaviest first, while the grid still holds. */
function prune(grid: Grid, counts: number[], options: StartOptions): number[] {
  const order = counts.map((_, i) => i).sort((a, b) => options.weights[b] - options.weights[a] || a - b);
  const re = new Float64Array(grid.size);
  const im = new Float64Array(grid.size);
  for (const i of order) {
    while (counts[i] > 0) {
      counts[i]--;
      if (gridFeasible(grid, counts, options.t2, re, im)) continue;
      counts[i]++;
      break;
    }
  }
  return counts;
}

/**
 * Local improvement of a feasible set: replace two placements by one, or one by a lighter one, while the
 * grid holds and the weight falls. Stops when no such move is left (or after `maxMoves`).
 */
export function improveSet(grid: Grid, start: readonly number[], options: StartOptions, maxMoves = 64, maxPointChecks = 2e7): number[] {
  const { weights, maxCount, t2 } = options;
  const m = weights.length;
  const counts = [...start];
  // Moves are tried pair by pair; on a set of many distinct parts that is placed² × candidates trials, so
  // the grid points checked are budgeted (deterministically, unlike a time limit): the start only has to be good.
  let checks = 0;
  // The current set's admittance; a move is judged by adding and removing columns on the fly, and
  // rejected at the first grid point that fails.
  const re = new Float64Array(grid.size);
  const im = new Float64Array(grid.size);
  gridFeasible(grid, counts, t2, re, im);
  const holds = (a: number, b: number, add: number): boolean => {
    const { yRe, yIm } = grid;
    for (let k = 0; k < grid.size; k++) {
      checks++;
      let r = re[k] - yRe[a][k] + yRe[add][k];
      let x = im[k] - yIm[a][k] + yIm[add][k];
      if (b >= 0) {
        r -= yRe[b][k];
        x -= yIm[b][k];
      }
      if (r * r + x * x < t2) return false;
    }
    return true;
  };
  const apply = (remove: number[], add: number) => {
    for (const i of remove) counts[i]--;
    counts[add]++;
    gridFeasible(grid, counts, t2, re, im);
  };
  for (let moves = 0; moves < maxMoves; moves++) {
    let moved = false;
    const placed = counts.flatMap((n, i) => (n > 0 ? [i] : []));
    outer: for (let a = 0; a < placed.length; a++) {
      const ia = placed[a];
      for (let b = a; b < placed.length; b++) {
        const ib = placed[b];
        if (a === b && counts[ia] < 2) continue;
        if (checks > maxPointChecks) break outer;
        for (let add = 0; add < m; add++) {
          if (!(weights[add] < weights[ia] + weights[ib]) || counts[add] >= maxCount + (add === ia ? 1 : 0) + (add === ib ? 1 : 0)) continue;
          if (holds(ia, ib, add)) {
            apply([ia, ib], add);
            moved = true;
            break outer;
          }
        }
      }
      for (let add = 0; add < m; add++) {
        if (!(weights[add] < weights[ia]) || counts[add] >= maxCount) continue;
        if (holds(ia, -1, add)) {
          apply([ia], add);
          moved = true;
          break outer;
        }
      }
    }
    if (!moved) break;
  }
  return prune(grid, counts, options);
}
