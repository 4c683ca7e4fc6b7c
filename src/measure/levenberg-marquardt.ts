// Nonlinear least squares, min ½‖r(x)‖², by the Levenberg–Marquardt method (K. Levenberg, Quart. Appl.
// Math. 2, 1944; D. W. Marquardt, J. SIAM 11, 1963) with the damping update of K. Madsen, H. B. Nielsen,
// O. Tingleff, "Methods for Non-Linear Least Squares Problems", 2nd ed., 2004, §3.2, and Moré's scaling by
// the largest column norms seen (J. J. Moré, "The Levenberg–Marquardt algorithm: implementation and
// theory", in G. A. Watson (ed.), Numerical Analysis, Springer LNM 630, 1978). Each step solves the damped problem
// min ‖J·h + r‖² + μ·Σ d_j·h_j² without forming JᵀJ, so the step keeps the accuracy of J itself: J = QR
// once per accepted point, then each damping tried is a small least-squares problem [R; √(μ·d)]·h ≈ [−Qᵀr; 0]
// (the arrangement of MINPACK's lmpar). Parameters are kept inside a box.

import { leastSquares } from '../analysis/least-squares.js';

export interface LeastSquaresProblem {
  parameters: number;
  residuals: number;
  /** r(x) into `r`; and, when `jacobian` is given, ∂r_i/∂x_j at index j·residuals + i. */
  evaluate(x: Float64Array, r: Float64Array, jacobian: Float64Array | null): void;
  lower: Float64Array;
  upper: Float64Array;
}

export interface LeastSquaresSolution {
  x: Float64Array;
  /** ½‖r‖² at x. */
  cost: number;
  residual: Float64Array;
  jacobian: Float64Array;
  iterations: number;
}

export interface LmOptions {
  maxIterations?: number;
  /** Stop when no parameter moves more than this (absolute; the parameters here are logarithms). */
  stepTolerance?: number;
}

export function levenbergMarquardt(problem: LeastSquaresProblem, start: Float64Array, options: LmOptions = {}): LeastSquaresSolution {
  const n = problem.parameters;
  const m = problem.residuals;
  const maxIterations = options.maxIterations ?? 200;
  const stepTolerance = options.stepTolerance ?? 1e-12;
  const clamp = (v: number, j: number) => Math.min(problem.upper[j], Math.max(problem.lower[j], v));

  let x = Float64Array.from(start, clamp);
  let r = new Float64Array(m);
  let jac = new Float64Array(m * n);
  problem.evaluate(x, r, jac);
  let cost = halfSquare(r);
  if (!Number.isFinite(cost)) throw new RangeError('the model cannot be evaluated at the starting values');

  const scale = new Float64Array(n);
  updateScale(scale, jac, m, n);
  let mu = 1e-3 * Math.max(...scale);
  let nu = 2;
  const work = new Float64Array(m * n);
  let factor = thinQr(jac, r, m, n, work);
  let trialR = new Float64Array(m);
  let trialJ = new Float64Array(m * n);
  const trialX = new Float64Array(n);
  const step = new Float64Array(n);
  let iterations = 0;

  while (iterations < maxIterations && cost > 0) {
    iterations++;
    // The damped step from the small system [R; √(μ·d)]·h ≈ [−Qᵀr; 0].
    const small = new Float64Array(2 * n * n);
    const rhs = new Float64Array(2 * n);
    for (let j = 0; j < n; j++) {
      for (let i = 0; i <= j; i++) small[j * 2 * n + i] = factor.r[i * n + j];
      small[j * 2 * n + n + j] = Math.sqrt(mu * scale[j]);
      rhs[j] = -factor.qtr[j];
    }
    const [h] = leastSquares(small, 2 * n, n, [rhs]);
    let largestStep = 0;
    for (let j = 0; j < n; j++) {
      trialX[j] = clamp(x[j] + h[j], j);
      step[j] = trialX[j] - x[j];
      largestStep = Math.max(largestStep, Math.abs(step[j]));
    }
    if (largestStep <= stepTolerance) break;
    // Predicted cost at the (clamped) step: ½‖r + J·h‖² = ½(‖r‖² − ‖Qᵀr‖² + ‖Qᵀr + R·h‖²).
    let before = 0;
    let after = 0;
    for (let i = 0; i < n; i++) {
      let rh = 0;
      for (let j = i; j < n; j++) rh += factor.r[i * n + j] * step[j];
      before += factor.qtr[i] * factor.qtr[i];
      after += (factor.qtr[i] + rh) ** 2;
    }
    const gain = (before - after) / 2;
    // No step can lower the cost by more than rounding: the minimum is reached.
    if (!(gain > 1e-15 * cost)) break;
    problem.evaluate(trialX, trialR, trialJ);
    const trialCost = halfSquare(trialR);
    const rho = Number.isFinite(trialCost) && gain > 0 ? (cost - trialCost) / gain : -1;
    if (rho > 0) {
      // An accepted step that no longer lowers the cost measurably: the minimum is reached.
      const settled = cost - trialCost <= 1e-14 * cost;
      x = Float64Array.from(trialX);
      [r, trialR] = [trialR, r];
      [jac, trialJ] = [trialJ, jac];
      cost = trialCost;
      updateScale(scale, jac, m, n);
      factor = thinQr(jac, r, m, n, work);
      mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      if (settled) break;
    } else {
      mu *= nu;
      nu *= 2;
      // The damping has grown past any use: no step downhill is left at this precision.
      if (nu > 2 ** 60) break;
    }
  }
  return { x, cost, residual: r, jacobian: jac, iterations };
}

/**
 * J = Q·R by Householder reflections (Golub & Van Loan, Matrix Computations, 4th ed., §5.2), keeping R
 * (n×n, row-major upper triangle) and Qᵀr; J is copied into `work` and left as it was.
 */
function thinQr(jac: Float64Array, r: Float64Array, m: number, n: number, work: Float64Array): { r: Float64Array; qtr: Float64Array } {
  work.set(jac);
  const b = Float64Array.from(r);
  const upper = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const col = k * m;
    let norm = 0;
    for (let i = k; i < m; i++) norm += work[col + i] * work[col + i];
    norm = Math.sqrt(norm);
    if (norm === 0) continue;
    const alpha = work[col + k] >= 0 ? -norm : norm;
    work[col + k] -= alpha;
    let vv = 0;
    for (let i = k; i < m; i++) vv += work[col + i] * work[col + i];
    upper[k * n + k] = alpha;
    for (let j = k + 1; j < n; j++) {
      const other = j * m;
      let dot = 0;
      for (let i = k; i < m; i++) dot += work[col + i] * work[other + i];
      const f = (2 * dot) / vv;
      for (let i = k; i < m; i++) work[other + i] -= f * work[col + i];
      upper[k * n + j] = work[other + k];
    }
    let dot = 0;
    for (let i = k; i < m; i++) dot += work[col + i] * b[i];
    const f = (2 * dot) / vv;
    for (let i = k; i < m; i++) b[i] -= f * work[col + i];
  }
  return { r: upper, qtr: b.slice(0, n) };
}

function halfSquare(r: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < r.length; i++) sum += r[i] * r[i];
  return sum / 2;
}

/** d_j = the largest squared column norm of J seen so far (Moré), never zero. */
function updateScale(scale: Float64Array, jac: Float64Array, m: number, n: number): void {
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let i = 0; i < m; i++) sum += jac[j * m + i] * jac[j * m + i];
    scale[j] = Math.max(scale[j], sum, 1e-300);
  }
}
