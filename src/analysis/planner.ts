// The decoupling planner: counts 0..N of candidate capacitors that keep a rail's |Z| at or under the target
// across the band, with the fewest placements (or the lowest total cost), proven optimal.
//
// The rail is linear in the counts as an admittance: Y(f) = Y_fixed(f) + Σ n_i·y_i(f), and |Z| ≤ Z_t is
// |Y| ≥ Y_t = 1/Z_t at every frequency. That constraint is not convex, and adding a capacitor can lower |Y|
// where its susceptance cancels the rest (an anti-resonance), so nothing here assumes that more is better.
// The search is branch and bound with bounds that hold without that assumption:
//
// * At a frequency where |P| < Y_t (P: the admittance placed so far), any completion adds z = Σ m_i·y_i.
//   Let t_i be the least t ≥ 0 with |P + t·y_i| ≥ Y_t (a quadratic in t). If Σ m_i/t_i < 1 then z is a
//   convex combination of 0 and the points t_i·y_i with weight on 0, and since |P + ·| is convex,
//   |P + z| < Y_t. So every completion satisfies the covering inequality Σ m_i/t_i ≥ 1 at every frequency.
//   (Convexity of the norm; any convex-analysis text, e.g. Boyd & Vandenberghe, Convex Optimization, 2004,
//   §3.1.) Counts are whole, so with τ_i = max(1, t_i) also Σ m_i/τ_i ≥ 1: either some used i has t_i ≤ 1
//   and m_i ≥ 1 alone covers it, or every used τ_i = t_i. Those inequalities are a linear relaxation; a
//   feasible solution of its dual (λ_k scaled so that Σ_k λ_k/τ_ik ≤ w_i for every i) bounds the weight
//   still needed from below (LP weak duality, ibid. §5.2).
// * Branching: at the violated frequency with the fewest helpful candidates (w_i·τ_i within the budget
//   left), some helpful candidate must be added (by the same convexity argument). Branch j adds candidate
//   h_j and excludes h_1..h_{j-1} from its subtree, so every count vector is reached at most once.
// * Feasibility is judged on the band's sweep plus "cuts": a set that passes the sweep is evaluated in full
//   (refined peaks, src/analysis/rail.ts); if a refined peak between sweep points breaks the target, that
//   frequency joins the sweep and the search restarts with the incumbent kept. Only fully evaluated sets
//   are ever reported as passing. With scenarios (planner-grid.ts: the candidates' models at other ends of
//   their spreads) every point stands once per scenario and a set is evaluated in full in each.
// * A greedy start (planner-start.ts) gives the first incumbent. The search has a node budget; when it
//   runs out the result says "unproven": the set returned passes, but a better one was not ruled out.
//   The relaxation is per frequency and cannot see that capacitors with different SRFs cancel each other
//   between their resonances, so on large candidate lists a proof by count can need more nodes than the
//   budget, while a proof by cost (where weights differ) usually fits.

import { buildGrid, scenariosOf, type PlannerProblem, type PlannerScenario } from './planner-grid.js';
import { boundNode, MAX_SAMPLES, SLACK, sortByKey, violatedSamples } from './planner-bound.js';
import { greedySet, improveSet } from './planner-start.js';
import { evaluateRail, type RailBranch, type RailEvaluation } from './rail.js';

export type { PlannerCandidate, PlannerProblem, PlannerScenario } from './planner-grid.js';

export type PlannerStatus = 'optimal' | 'unmeetable' | 'unproven';

export interface PlannerResult {
  /** optimal: the best set, proven; unmeetable: no set of counts 0..maxCount meets the target, proven;
   *  unproven: the search budget ran out; `counts`, if any, is the best set found and it passes, but a
   *  better one has not been ruled out (and without `counts`, neither has every set been ruled out). */
  status: PlannerStatus;
  counts: number[] | null;
  /** Σ count·weight of the chosen set. */
  objective: number | null;
  placements: number | null;
  /** Full evaluation of the chosen set (fixed branches first, then chosen candidates in candidate order). */
  evaluation: RailEvaluation | null;
  nodes: number;
  /** Frequencies between sweep points added to the search because a refined peak broke the target there. */
  cuts: number[];
}

/**
 * Search nodes before the planner stops and reports what it has. A node costs time in proportion to the
 * candidates it weighs, so the default budget shrinks as they grow: about 36,000 nodes for 200 candidates
 * (1–1.5 s measured on the development machine), 300,000 for a handful. Deterministic, unlike a time limit.
 */
export function defaultNodeLimit(candidates: number): number {
  return Math.floor(8e6 / (candidates + 20));
}
// The search holds |Y| ≥ Y_t·(1 + 1e-12) at its grid, a hair stricter than the full evaluation, so that
// rounding (~1e-15) never lets the grid accept what the full evaluation rejects at the same point.
const STRICT = 1 + 1e-12;
// Each pass adds at least one cut; a rail that needs more than this many is reported as not proven.
const MAX_PASSES = 200;

interface Incumbent {
  counts: number[];
  objective: number;
  evaluation: RailEvaluation;
}

/** Find the optimal counts. Deterministic: the same problem gives the same answer. */
export function planDecoupling(problem: PlannerProblem): PlannerResult {
  const m = problem.candidates.length;
  const N = problem.maxCount;
  const byCost = problem.objective === 'cost';
  const weights = problem.candidates.map((c) => (byCost ? c.weight : 1));
  const nodeLimit = problem.nodeLimit ?? defaultNodeLimit(m);
  const yt = STRICT / problem.targetOhm;
  const t2 = yt * yt;
  const cuts: number[] = [];
  let nodes = 0;
  let best: Incumbent | null = null;

  /** What a completion may still add: in `unit` per placement (1, or the weight), at most `budget`. */
  const budgetOf = (placed: number, objective: number, capacity: number): { budget: number; weighted: boolean } => {
    if (!byCost) return { budget: Math.min(capacity, best ? best.objective - 1 - placed : Infinity), weighted: false };
    if (!best) return { budget: capacity, weighted: false };
    // A cost within 1e-9 of the incumbent's is a tie, not an improvement.
    return { budget: best.objective * (1 - SLACK) - objective, weighted: true };
  };

  const scenarios = scenariosOf(problem);
  const evaluate = (counts: readonly number[], scenario: PlannerScenario = scenarios[0]): RailEvaluation => {
    const branches: RailBranch[] = [...scenario.fixed];
    counts.forEach((n, i) => {
      if (n > 0) branches.push({ kind: 'capacitor', label: problem.candidates[i].label, element: scenario.elements[i], count: n });
    });
    return evaluateRail(branches, problem.targetOhm, problem.frequencies, { branchCurves: false });
  };

  // One pass over the current grid. 'restart' when a cut was added, 'limit' when the node budget ran out.
  const search = (): 'done' | 'restart' | 'limit' => {
    const grid = buildGrid(problem, cuts);
    const F = grid.size;
    const stride = Math.max(1, Math.ceil(grid.sorted / MAX_SAMPLES));
    const pRe: Float64Array[] = [Float64Array.from(grid.aRe)];
    const pIm: Float64Array[] = [Float64Array.from(grid.aIm)];
    const counts = new Array<number>(m).fill(0);
    const excluded = new Uint8Array(m);
    const allowed = new Uint8Array(m);
    const load = new Float64Array(m);
    const rows: Float64Array[] = [];
    const maxSamples = MAX_SAMPLES * 2 + (F - grid.sorted) + 2;
    const samples = new Int32Array(maxSamples);
    const need = new Float64Array(maxSamples);
    const tBuf = new Float64Array(maxSamples * m);
    let outcome: 'done' | 'restart' | 'limit' = 'done';
    let capacity = m * N;

    // A first incumbent from the greedy start, so the search prunes from its first node. A search that
    // restarts with a cut keeps its incumbent and needs no new start.
    const start = best ? null : greedySet(grid, { weights, maxCount: N, t2 });
    if (start) {
      counts.splice(0, m, ...improveSet(grid, start, { weights, maxCount: N, t2 }));
      const objective = counts.reduce((sum, n, i) => sum + n * weights[i], 0);
      const kept = leaf(objective);
      counts.fill(0);
      if (!kept) return outcome;
    }

    // Returns false to stop the whole pass.
    const visit = (depth: number, placed: number, objective: number): boolean => {
      if (++nodes > nodeLimit) {
        outcome = 'limit';
        return false;
      }
      const Pr = pRe[depth];
      const Pi = pIm[depth];
      const s = violatedSamples(grid, Pr, Pi, t2, stride, samples);
      if (s === 0) return leaf(objective);

      let { budget, weighted } = budgetOf(placed, objective, capacity);
      if (budget < 0) return true;
      // Slack in favour of keeping a branch: t carries rounding; budgets by count are whole numbers.
      const limit = () => budget + (weighted && best ? best.objective * SLACK * 1e-3 : SLACK);
      const unit = (i: number) => (weighted ? weights[i] : 1);
      const lim = limit();
      for (let i = 0; i < m; i++) allowed[i] = excluded[i] || counts[i] >= N ? 0 : 1;

      const branchAt = boundNode({ grid, Pr, Pi, samples, count: s, weights, weighted, allowed, lim, t2, tBuf, need, load });
      if (branchAt < 0) return true;

      // Branch j adds the j-th most effective helpful candidate and excludes the ones before it.
      // (tBuf is shared by every depth: what the loop needs after recursing is copied out first.)
      const row = branchAt * m;
      if (!rows[depth]) rows.push(new Float64Array(m));
      const tAt = rows[depth];
      tAt.set(tBuf.subarray(row, row + m));
      const keys: number[] = [];
      const order: number[] = [];
      for (let i = 0; i < m; i++) {
        const key = unit(i) * tAt[i];
        if (key <= lim) {
          order.push(i);
          keys.push(key);
        }
      }
      sortByKey(order, keys);
      if (!pRe[depth + 1]) {
        pRe.push(new Float64Array(F));
        pIm.push(new Float64Array(F));
      }
      const Cr = pRe[depth + 1];
      const Ci = pIm[depth + 1];
      const excludedHere: number[] = [];
      let keepGoing = true;
      const weightedAtEntry = weighted;
      for (const i of order) {
        // A better incumbent found in an earlier branch shrinks the budget for the later ones. While the
        // criterion is the one `order` was sorted by, the first candidate over it ends the loop. The first
        // incumbent of a search by cost switches the criterion (from count to weight); the list then stays
        // as built and each child bounds itself.
        ({ budget, weighted } = budgetOf(placed, objective, capacity));
        if (weighted === weightedAtEntry) {
          if (!(unit(i) * tAt[i] <= limit())) break;
        } else if (!(weights[i] <= limit())) continue;
        const yr = grid.yRe[i];
        const yi = grid.yIm[i];
        for (let k = 0; k < F; k++) {
          Cr[k] = Pr[k] + yr[k];
          Ci[k] = Pi[k] + yi[k];
        }
        counts[i]++;
        capacity--;
        keepGoing = visit(depth + 1, placed + 1, objective + weights[i]);
        counts[i]--;
        capacity++;
        if (!keepGoing) break;
        excluded[i] = 1;
        capacity -= N - counts[i];
        excludedHere.push(i);
      }
      for (const i of excludedHere) {
        excluded[i] = 0;
        capacity += N - counts[i];
      }
      return keepGoing;
    };

    // Every sweep point and cut holds: evaluate in full. A pass is the new incumbent; a failure between
    // sweep points becomes a cut.
    function leaf(objective: number): boolean {
      if (best && !(objective <= best.objective * (1 - SLACK) && (byCost || objective < best.objective))) return true;
      const evaluation = evaluate(counts);
      // In every scenario too: the first that fails gives the cuts (a cut is a point in every scenario).
      const failed = evaluation.pass ? scenarios.slice(1).map((sc) => evaluate(counts, sc)).find((e) => !e.pass) : evaluation;
      if (!failed) {
        best = { counts: [...counts], objective, evaluation };
        return true;
      }
      const failing = [failed.worst.frequencyHz, ...failed.peaks.filter((p) => p.impedanceOhm > problem.targetOhm).map((p) => p.frequencyHz)];
      const fresh = [...new Set(failing)].filter((f) => !problem.frequencies.includes(f) && !cuts.includes(f));
      // A failure exactly at a point the grid already holds can only be rounding (the grid is stricter by
      // 1e-12); the set is rejected, and there is nothing to add.
      if (fresh.length === 0) return true;
      cuts.push(...fresh);
      outcome = 'restart';
      return false;
    }

    visit(0, 0, 0);
    return outcome;
  };

  let outcome: 'done' | 'restart' | 'limit';
  let passes = 0;
  do outcome = search();
  while (outcome === 'restart' && ++passes < MAX_PASSES);
  if (outcome === 'restart') outcome = 'limit';

  const found = best as Incumbent | null;
  return {
    status: outcome === 'limit' ? 'unproven' : found ? 'optimal' : 'unmeetable',
    counts: found?.counts ?? null,
    objective: found?.objective ?? null,
    placements: found ? found.counts.reduce((a, b) => a + b, 0) : null,
    evaluation: found?.evaluation ?? null,
    nodes,
    cuts: [...cuts],
  };
}
