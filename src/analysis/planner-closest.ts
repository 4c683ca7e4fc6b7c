// When no set of counts meets the target: the set that comes closest, so a designer sees how far off the
// rail is and with what. Found on the planner's grid by local moves (set one candidate's count, or swap one
// placement for another) that raise the smallest |Y| over the band, from the empty set. Every set the search settles on
// is evaluated in full (refined peaks); a peak between sweep points that the grid missed joins the grid and
// the search goes on, as in the planner. The answer is the best of those full evaluations (the empty set
// included): the best set *found*, not one proven the best possible.

import { buildGrid, type Grid, type PlannerProblem } from './planner-grid.js';
import { evaluateRail, type RailBranch, type RailEvaluation } from './rail.js';

const MAX_ROUNDS = 16;
const SWAP_PASSES = 4;

/** The full evaluation of `counts` on the problem's rail. */
export function evaluateCounts(problem: PlannerProblem, counts: readonly number[]): RailEvaluation {
  const branches: RailBranch[] = [...problem.fixed];
  counts.forEach((n, i) => {
    if (n > 0) branches.push({ kind: 'capacitor', label: problem.candidates[i].label, element: problem.candidates[i].element, count: n });
  });
  return evaluateRail(branches, problem.targetOhm, problem.frequencies, { branchCurves: false });
}

interface Score {
  /** min over grid points of |Y|² (the worst point; larger is better). */
  worst: number;
  /** Σ over grid points of max(0, Y_t − |Y|): breaks ties between sets with the same worst point. */
  shortfall: number;
}

const better = (a: Score, b: Score): boolean => a.worst > b.worst * (1 + 1e-12) || (a.worst >= b.worst * (1 - 1e-12) && a.shortfall < b.shortfall * (1 - 1e-12));

/** Counts 0..maxCount per candidate with the best worst margin found, and that set's full evaluation. */
export function closestSet(problem: PlannerProblem): { counts: number[]; evaluation: RailEvaluation } {
  const m = problem.candidates.length;
  let counts = new Array<number>(m).fill(0);
  let best = { counts: [...counts], evaluation: evaluateCounts(problem, counts) };
  const cuts: number[] = [];
  const consider = (next: number[]) => {
    counts = next;
    const evaluation = evaluateCounts(problem, counts);
    if (evaluation.worst.impedanceOhm < best.evaluation.worst.impedanceOhm) best = { counts: [...counts], evaluation };
    return evaluation;
  };
  // A search over the grid, until the grid holds every peak the full evaluation finds. Swaps cost placed ×
  // candidates trials a pass, so each round tries a few.
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const f = consider(improveOnGrid(problem, buildGrid(problem, cuts), counts, SWAP_PASSES)).worst.frequencyHz;
    if (problem.frequencies.includes(f) || cuts.includes(f)) break;
    cuts.push(f);
  }
  return best;
}

/**
 * Local search on the grid from `start`, accepting a move only when it raises the worst grid point (ties:
 * lowers the total shortfall). A pass sets each candidate in turn to its best count 0..maxCount; a pass that
 * changes nothing is followed by the best swap of one placement for one of another part.
 */
function improveOnGrid(problem: PlannerProblem, grid: Grid, start: readonly number[], swapPasses: number, maxPasses = 48): number[] {
  const m = problem.candidates.length;
  const N = problem.maxCount;
  const F = grid.size;
  const yt = 1 / problem.targetOhm;
  const counts = [...start];
  const re = Float64Array.from(grid.aRe);
  const im = Float64Array.from(grid.aIm);
  const shift = (i: number, by: number) => {
    counts[i] += by;
    const yr = grid.yRe[i];
    const yi = grid.yIm[i];
    for (let k = 0; k < F; k++) {
      re[k] += by * yr[k];
      im[k] += by * yi[k];
    }
  };
  counts.forEach((n, i) => {
    counts[i] = 0;
    if (n > 0) shift(i, n);
  });

  /** The score with `a` changed by `da` and `b` by `db` (b = −1: none). */
  const scoreWith = (a: number, da: number, b: number, db: number): Score => {
    const ar = grid.yRe[a];
    const ai = grid.yIm[a];
    const br = b >= 0 ? grid.yRe[b] : null;
    const bi = b >= 0 ? grid.yIm[b] : null;
    let worst = Infinity;
    let shortfall = 0;
    for (let k = 0; k < F; k++) {
      let r = re[k] + da * ar[k];
      let x = im[k] + da * ai[k];
      if (br && bi) {
        r += db * br[k];
        x += db * bi[k];
      }
      const y2 = r * r + x * x;
      if (y2 < worst) worst = y2;
      const y = Math.sqrt(y2);
      if (y < yt) shortfall += yt - y;
    }
    return { worst, shortfall };
  };
  const baseline = (): Score => {
    let worst = Infinity;
    let shortfall = 0;
    for (let k = 0; k < F; k++) {
      const y2 = re[k] * re[k] + im[k] * im[k];
      if (y2 < worst) worst = y2;
      const y = Math.sqrt(y2);
      if (y < yt) shortfall += yt - y;
    }
    return { worst, shortfall };
  };

  let current = baseline();
  for (let pass = 0; pass < maxPasses; pass++) {
    // Candidate by candidate, each set to its best count while the others stay (coordinate ascent).
    let moved = false;
    for (let i = 0; i < m; i++) {
      let bestV = counts[i];
      let bestScore = current;
      for (let v = 0; v <= N; v++) {
        if (v === counts[i]) continue;
        const score = scoreWith(i, v - counts[i], -1, 0);
        if (better(score, bestScore)) {
          bestScore = score;
          bestV = v;
        }
      }
      if (bestV !== counts[i]) {
        shift(i, bestV - counts[i]);
        current = bestScore;
        moved = true;
      }
    }
    if (moved) continue;
    if (swapPasses-- <= 0) break;
    // No single count helps: the best swap of one placement for one of another part, if any.
    let swap: [number, number] | null = null;
    let bestScore = current;
    for (let a = 0; a < m; a++) {
      if (counts[a] === 0) continue;
      for (let b = 0; b < m; b++) {
        if (b === a || counts[b] >= N) continue;
        const score = scoreWith(a, -1, b, 1);
        if (better(score, bestScore)) {
          bestScore = score;
          swap = [a, b];
        }
      }
    }
    if (!swap) break;
    shift(swap[0], -1);
    shift(swap[1], 1);
    current = bestScore;
  }
  return counts;
}
