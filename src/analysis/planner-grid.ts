// The planner's working grid: the fixed admittance and each candidate's admittance at every frequency the
// search checks (the band's sweep, then any cuts), and the arithmetic the search and its starting set share.

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
  /** Points are in sweep order up to `sorted`; cuts follow. */
  sorted: number;
}

export function buildGrid(problem: PlannerProblem, cuts: readonly number[]): Grid {
  const f = new Float64Array(problem.frequencies.length + cuts.length);
  f.set(problem.frequencies);
  f.set(cuts, problem.frequencies.length);
  const size = f.length;
  const aRe = new Float64Array(size);
  const aIm = new Float64Array(size);
  for (const b of problem.fixed) {
    const z = impedanceSweep(b.element, f);
    addAdmittance(z.re, z.im, b.count, aRe, aIm);
  }
  const yRe: Float64Array[] = [];
  const yIm: Float64Array[] = [];
  for (const c of problem.candidates) {
    const z = impedanceSweep(c.element, f);
    const re = new Float64Array(size);
    const im = new Float64Array(size);
    admittanceInto(z.re, z.im, re, im);
    yRe.push(re);
    yIm.push(im);
  }
  const m = problem.candidates.length;
  const tRe = new Float64Array(size * m);
  const tIm = new Float64Array(size * m);
  for (let i = 0; i < m; i++) {
    for (let k = 0; k < size; k++) {
      tRe[k * m + i] = yRe[i][k];
      tIm[k * m + i] = yIm[i][k];
    }
  }
  return { size, aRe, aIm, yRe, yIm, tRe, tIm, sorted: problem.frequencies.length };
}

/** Least t ≥ 0 with |P + t·y|² ≥ T², for |P| < T: the positive root of |y|²t² + 2Re(P̄y)t + |P|² − T² (stable form). */
export function reachMultiplier(pRe: number, pIm: number, yRe: number, yIm: number, t2: number): number {
  const a = yRe * yRe + yIm * yIm;
  const b = pRe * yRe + pIm * yIm;
  const c = pRe * pRe + pIm * pIm - t2;
  const root = Math.sqrt(b * b - a * c);
  return b >= 0 ? -c / (b + root) : (root - b) / a;
}
