// The planner's working grid: the fixed admittance and each candidate's admittance at every point the
// search checks (the band's sweep, then any cuts), and the arithmetic the search and its starting set share.
// With scenarios (the parts at other ends of their spreads, plan-suggest-corners.ts), every frequency is a
// point once per scenario: a set must hold the target in each, and each point's inequality stays linear in
// the counts, so the search's bounds hold unchanged.

import type { Element } from '../circuit/element.js';
import { addAdmittance, admittanceInto } from '../circuit/admittance.js';
import { impedanceSweep } from '../circuit/impedance.js';
import type { RailBranch } from './rail.js';

export interface PlannerCandidate {
  label: string;
  /** One placement's model (part at its biased capacitance, plus its mounting inductance). */
  element: Element;
  /** Cost of one placement (used when the objective is cost). */
  weight: number;
}

export interface PlannerProblem {
  /** Branches present whatever is chosen (regulator, plane, placements kept as they are). */
  fixed: readonly RailBranch[];
  candidates: readonly PlannerCandidate[];
  targetOhm: number;
  /** The band's sweep, as evaluateRail uses it. */
  frequencies: Float64Array;
  /** Each candidate is placed 0..maxCount times. */
  maxCount: number;
  /** Fewest placements (weights ignored), or lowest Σ count·weight. */
  objective: 'count' | 'cost';
  /** Search nodes before giving up on a proof (deterministic, unlike a time limit). */
  nodeLimit?: number;
  /** Other sets of models the chosen counts must also hold the target with (besides `fixed`/`candidates`). */
  scenarios?: readonly PlannerScenario[];
}

/** The fixed branches and every candidate's model (in candidate order) as they are in one scenario. */
export interface PlannerScenario {
  fixed: readonly RailBranch[];
  elements: readonly Element[];
}

/** Every scenario the counts are judged in: the problem's own models first. */
export function scenariosOf(problem: PlannerProblem): PlannerScenario[] {
  return [{ fixed: problem.fixed, elements: problem.candidates.map((c) => c.element) }, ...(problem.scenarios ?? [])];
}

export interface Grid {
  size: number;
  /** Fixed admittance per point. */
  aRe: Float64Array;
  aIm: Float64Array;
  /** Per candidate, admittance of one placement per point. */
  yRe: Float64Array[];
  yIm: Float64Array[];
  /** The same, point-major (index k·m + i), for loops over candidates at one point. */
  tRe: Float64Array;
  tIm: Float64Array;
  /** Points are in sweep order up to `sorted` (one sweep after another with scenarios); cuts follow. */
  sorted: number;
}

export function buildGrid(problem: PlannerProblem, cuts: readonly number[]): Grid {
  const scenarios = scenariosOf(problem);
  const S = scenarios.length;
  const n = problem.frequencies.length;
  const f = new Float64Array(n + cuts.length);
  f.set(problem.frequencies);
  f.set(cuts, n);
  const per = f.length;
  // Points: each scenario's sweep in turn, then each scenario's cuts.
  const size = per * S;
  const aRe = new Float64Array(size);
  const aIm = new Float64Array(size);
  const m = problem.candidates.length;
  const yRe = Array.from({ length: m }, () => new Float64Array(size));
  const yIm = Array.from({ length: m }, () => new Float64Array(size));
  // Scenario s's points: its sweep at s·n, its cuts at S·n + s·(cuts).
  const c = cuts.length;
  const parts = (s: number) => [
    { from: 0, to: n, at: s * n },
    { from: n, to: per, at: S * n + s * c },
  ];
  scenarios.forEach((scenario, s) => {
    for (const b of scenario.fixed) {
      const z = impedanceSweep(b.element, f);
      for (const p of parts(s)) addAdmittance(z.re.subarray(p.from, p.to), z.im.subarray(p.from, p.to), b.count, aRe.subarray(p.at), aIm.subarray(p.at));
    }
    scenario.elements.forEach((element, i) => {
      const z = impedanceSweep(element, f);
      for (const p of parts(s)) admittanceInto(z.re.subarray(p.from, p.to), z.im.subarray(p.from, p.to), yRe[i].subarray(p.at), yIm[i].subarray(p.at));
    });
  });
  const tRe = new Float64Array(size * m);
  const tIm = new Float64Array(size * m);
  for (let i = 0; i < m; i++) {
    for (let k = 0; k < size; k++) {
      tRe[k * m + i] = yRe[i][k];
      tIm[k * m + i] = yIm[i][k];
    }
  }
  return { size, aRe, aIm, yRe, yIm, tRe, tIm, sorted: n * S };
}

/** Least t ≥ 0 with |P + t·y|² ≥ T², for |P| < T: the positive root of |y|²t² + 2Re(P̄y)t + |P|² − T² (stable form). */
export function reachMultiplier(pRe: number, pIm: number, yRe: number, yIm: number, t2: number): number {
  const a = yRe * yRe + yIm * yIm;
  const b = pRe * yRe + pIm * yIm;
  const c = pRe * pRe + pIm * pIm - t2;
  const root = Math.sqrt(b * b - a * c);
  return b >= 0 ? -c / (b + root) : (root - b) / a;
}
