// When no set of counts meets the target: the set that comes closest, so a designer sees how far off the
// rail is and with what. Found on the planner's grid by local moves (add one, remove one, swap one for
// another) that raise the smallest |Y| over the band, from the empty set. Every set the search settles on
// is evaluated in full (refined peaks); a peak between sweep points that the grid missed joins the grid and
// the search goes on, as in the planner. The answer is the best of those full evaluations (the empty set
// included): the best set *found*, not one proven the best possible.

import { buildGrid, type Grid, type PlannerProblem } from './planner-grid.js';
import { evaluateRail, type RailBranch, type RailEvaluation } from './rail.js';

const MAX_ROUNDS = 16;

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
  for (let round = 0; round < MAX_ROUNDS; round++) {
    counts = improveOnGrid(problem, buildGrid(problem, cuts), counts);
    const evaluation = evaluateCounts(problem, counts);
    if (evaluation.worst.impedanceOhm < best.evaluation.worst.impedanceOhm) best = { counts: [...counts], evaluation };
    const f = evaluation.worst.frequencyHz;
    if (problem.frequencies.includes(f) || cuts.includes(f)) break;
    cuts.push(f);
  }
  return best;
}

/** Local search on the grid from `start`: the best single move each pass while one raises the worst point. */
function improveOnGrid(problem: PlannerProblem, grid: Grid, start: readonly number[], maxPasses = 256): number[] {
  const m = problem.candidates.length;
  const F = grid.size;
  const yt = 1 / problem.targetOhm;
  const counts = [...start];
  const re = Float64Array.from(grid.aRe);
  const im = Float64Array.from(grid.aIm);
  counts.forEach((n, i) => {
    for (let k = 0; k < F; k++) {
      re[k] += n * grid.yRe[i][k];
      im[k] += n * grid.yIm[i][k];
    }
  });

  /** The score of the current set with `add` placed once more and `remove` once less (−1: none). */
  const scoreWith = (add: number, remove: number): Score => {
    let worst = Infinity;
    let shortfall = 0;
    const ar = add >= 0 ? grid.yRe[add] : null;
    const ai = add >= 0 ? grid.yIm[add] : null;
    const rr = remove >= 0 ? grid.yRe[remove] : null;
    const ri = remove >= 0 ? grid.yIm[remove] : null;
    for (let k = 0; k < F; k++) {
      let r = re[k];
      let x = im[k];
      if (ar && ai) {
        r += ar[k];
        x += ai[k];
      }
      if (rr && ri) {
        r -= rr[k];
        x -= ri[k];
      }
      const y2 = r * r + x * x;
      if (y2 < worst) worst = y2;
      const y = Math.sqrt(y2);
      if (y < yt) shortfall += yt - y;
    }
    return { worst, shortfall };
  };
  const apply = (add: number, remove: number) => {
    if (add >= 0) {
      counts[add]++;
      for (let k = 0; k < F; k++) {
        re[k] += grid.yRe[add][k];
        im[k] += grid.yIm[add][k];
      }
    }
    if (remove >= 0) {
      counts[remove]--;
      for (let k = 0; k < F; k++) {
        re[k] -= grid.yRe[remove][k];
        im[k] -= grid.yIm[remove][k];
      }
    }
  };

  let current = scoreWith(-1, -1);
  // Each pass takes the best single move: add one, remove one, or swap one placement for another.
  for (let pass = 0; pass < maxPasses; pass++) {
    let bestMove: [number, number] | null = null;
    let bestScore = current;
    for (let add = -1; add < m; add++) {
      if (add >= 0 && counts[add] >= problem.maxCount) continue;
      for (let remove = -1; remove < m; remove++) {
        if (remove === add || (remove >= 0 && counts[remove] === 0) || (add < 0 && remove < 0)) continue;
        const score = scoreWith(add, remove);
        if (better(score, bestScore)) {
          bestScore = score;
          bestMove = [add, remove];
        }
      }
    }
    if (!bestMove) break;
    apply(bestMove[0], bestMove[1]);
    current = bestScore;
  }
  return counts;
}
