// A rail evaluator written for the tests, independent of zfolio's engine: element impedances with
// complex.js (a general-purpose library from the npm registry), Z_R = R, Z_L = jωL, Z_C = 1/(jωC), series
// impedances and parallel admittances adding (Alexander & Sadiku, Fundamentals of Electric Circuits,
// ch. 9), the maximum of |Z| over a band from a dense logarithmic sweep, each local maximum refined by
// golden-section search (Kiefer, 1953; any numerical-methods text) in log f.

import { Complex } from 'complex.js';

/** One branch as the test describes it: series R, L and C (any may be absent), `count` in parallel. */
export interface RefBranch {
  r: number;
  l: number;
  /** Capacitance, F; 0 for none (a regulator is R + L). */
  c: number;
  count: number;
}

export function branchAdmittance(b: RefBranch, f: number): Complex {
  const w = 2 * Math.PI * f;
  let z = new Complex(b.r, w * b.l);
  if (b.c > 0) z = z.add(new Complex(0, -1 / (w * b.c)));
  return z.inverse().mul(b.count);
}

/** |Z| of branches in parallel at f. */
export function railMagnitude(branches: readonly RefBranch[], f: number): number {
  let y = new Complex(0, 0);
  for (const b of branches) if (b.count > 0) y = y.add(branchAdmittance(b, f));
  return y.inverse().abs();
}

export function denseSweep(fromHz: number, toHz: number, perDecade: number): Float64Array {
  const n = Math.ceil(Math.log10(toHz / fromHz) * perDecade);
  const out = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) out[i] = fromHz * (toHz / fromHz) ** (i / n);
  out[n] = toHz;
  return out;
}

/** The largest of f(x) on [a, b] for a unimodal f, by golden-section search to a relative width of 1e-12. */
export function goldenMax(fn: (x: number) => number, a: number, b: number): { x: number; value: number } {
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = fn(c);
  let fd = fn(d);
  for (let i = 0; i < 200 && b - a > 1e-12 * Math.abs(b); i++) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = fn(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = fn(d);
    }
  }
  return fc > fd ? { x: c, value: fc } : { x: d, value: fd };
}

/**
 * The worst (largest) |Z| over the band: the sweep points, the band ends, and every local maximum of the
 * sampled curve refined by golden section between its neighbours. `sampled` is |Z| at `sweep` (given, so a
 * caller can sum precomputed admittances); refinement evaluates the branches afresh.
 */
export function worstOverBand(branches: readonly RefBranch[], sweep: Float64Array, sampled: Float64Array, refineAbove = 0): { frequencyHz: number; impedanceOhm: number } {
  let worst = { frequencyHz: sweep[0], impedanceOhm: sampled[0] };
  for (let k = 0; k < sweep.length; k++) if (sampled[k] > worst.impedanceOhm) worst = { frequencyHz: sweep[k], impedanceOhm: sampled[k] };
  for (let k = 1; k < sweep.length - 1; k++) {
    if (!(sampled[k] >= sampled[k - 1] && sampled[k] >= sampled[k + 1]) || sampled[k] < refineAbove) continue;
    const peak = goldenMax((u) => railMagnitude(branches, Math.exp(u)), Math.log(sweep[k - 1]), Math.log(sweep[k + 1]));
    if (peak.value > worst.impedanceOhm) worst = { frequencyHz: Math.exp(peak.x), impedanceOhm: peak.value };
  }
  return worst;
}

/** A branch's admittance at every point of a sweep, real and imaginary parts apart. */
export interface AdmittanceTable {
  re: Float64Array;
  im: Float64Array;
}

export function admittanceTable(b: RefBranch, sweep: Float64Array): AdmittanceTable {
  const re = new Float64Array(sweep.length);
  const im = new Float64Array(sweep.length);
  sweep.forEach((f, k) => {
    const y = branchAdmittance(b, f);
    re[k] = y.re;
    im[k] = y.im;
  });
  return { re, im };
}

/** A branch with its admittance tabulated on the judge's sweep. */
export interface TabulatedBranch {
  branch: RefBranch;
  y: AdmittanceTable;
}

/**
 * The worst |Z| over the band of the `fixed` branches in parallel with counts[i] of each candidate, for
 * judging many count vectors: every branch's admittance is tabulated once on `sweep`, a count vector's |Z| at
 * each point is the sum of the tables (fixed branches first, then the candidates in order), and
 * `worstOverBand` refines its maxima.
 */
export function countJudge(sweep: Float64Array, fixed: readonly RefBranch[]) {
  const fixedY = fixed.map((b) => admittanceTable(b, sweep));
  const sampled = new Float64Array(sweep.length);
  return (candidates: readonly TabulatedBranch[], counts: readonly number[], refineAbove = 0): { frequencyHz: number; impedanceOhm: number } => {
    for (let k = 0; k < sweep.length; k++) {
      let re = 0;
      let im = 0;
      for (const y of fixedY) {
        re += y.re[k];
        im += y.im[k];
      }
      counts.forEach((n, i) => {
        re += n * candidates[i].y.re[k];
        im += n * candidates[i].y.im[k];
      });
      sampled[k] = 1 / Math.hypot(re, im);
    }
    return worstOverBand([...fixed, ...candidates.map((c, i) => ({ ...c.branch, count: counts[i] }))], sweep, sampled, refineAbove);
  };
}

/** Calls `visit` with every count vector of `m` counts from 0 to `maxCount` (one array, rewritten each time). */
export function everyCountVector(m: number, maxCount: number, visit: (counts: readonly number[]) => void): void {
  const counts = new Array<number>(m).fill(0);
  for (let code = 0; code < (maxCount + 1) ** m; code++) {
    let rest = code;
    for (let i = 0; i < m; i++) {
      counts[i] = rest % (maxCount + 1);
      rest = Math.floor(rest / (maxCount + 1));
    }
    visit(counts);
  }
}
