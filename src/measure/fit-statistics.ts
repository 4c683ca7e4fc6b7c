// What a fit's Jacobian says about each parameter: how strongly it shapes Z anywhere in the range (the
// largest |∂ln Z/∂ln p| over the points), and how well the data pin it down: the standard error of ln p,
// √(σ²·[(JᵀJ)⁻¹]_jj) with σ² = ‖r‖²/(m − n), the usual linearised estimate (e.g. Press et al., Numerical
// Recipes, 3rd ed., 2007, §15.5 and §15.6).

import type { LeastSquaresSolution } from './levenberg-marquardt.js';

export interface ParameterStatistics {
  influence: Float64Array;
  standardError: Float64Array;
  strongest: ('low-end' | 'high-end' | 'inside')[];
}

/**
 * For a residual laid out as [real parts of `points` complex residuals, then their imaginary parts] and
 * `n` parameters (the Jacobian's columns, column-major).
 */
export function parameterStatistics(solution: LeastSquaresSolution, points: number, n: number): ParameterStatistics {
  const m = 2 * points;
  const jac = solution.jacobian;
  const influence = new Float64Array(n);
  const strongest: ParameterStatistics['strongest'] = [];
  for (let j = 0; j < n; j++) {
    let largest = 0;
    let at = 0;
    for (let i = 0; i < points; i++) {
      const size = Math.hypot(jac[j * m + i], jac[j * m + points + i]);
      if (size > largest) {
        largest = size;
        at = i;
      }
    }
    influence[j] = largest;
    // Within a hair of the end counts as the end: a quantity still growing there would grow beyond it.
    strongest.push(at <= 0 ? 'low-end' : at >= points - 1 ? 'high-end' : 'inside');
  }
  const normal = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      let sum = 0;
      for (let i = 0; i < m; i++) sum += jac[a * m + i] * jac[b * m + i];
      normal[a * n + b] = sum;
      normal[b * n + a] = sum;
    }
  }
  const inverse = invertSymmetric(normal, n);
  const variance = m > n ? (2 * solution.cost) / (m - n) : Infinity;
  const standardError = Float64Array.from({ length: n }, (_, j) => {
    const v = inverse ? inverse[j * n + j] : Infinity;
    return v >= 0 ? Math.sqrt(variance * v) : Infinity;
  });
  return { influence, standardError, strongest };
}

/**
 * Inverse of a symmetric positive semi-definite matrix by Gauss–Jordan elimination with partial pivoting,
 * after scaling to a unit diagonal (so columns of very different size invert as well as they can);
 * undefined when it is singular.
 */
export function invertSymmetric(matrix: Float64Array, n: number): Float64Array | undefined {
  const scale = Float64Array.from({ length: n }, (_, i) => (matrix[i * n + i] > 0 ? 1 / Math.sqrt(matrix[i * n + i]) : 0));
  if (scale.some((s) => s === 0)) return undefined;
  const a = Float64Array.from(matrix, (v, k) => v * scale[Math.floor(k / n)] * scale[k % n]);
  const inv = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inv[i * n + i] = 1;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(a[row * n + col]) > Math.abs(a[pivot * n + col])) pivot = row;
    if (!(Math.abs(a[pivot * n + col]) > 1e-14)) return undefined;
    if (pivot !== col) {
      for (let k = 0; k < n; k++) {
        [a[col * n + k], a[pivot * n + k]] = [a[pivot * n + k], a[col * n + k]];
        [inv[col * n + k], inv[pivot * n + k]] = [inv[pivot * n + k], inv[col * n + k]];
      }
    }
    const p = a[col * n + col];
    for (let k = 0; k < n; k++) {
      a[col * n + k] /= p;
      inv[col * n + k] /= p;
    }
    for (let row = 0; row < n; row++) {
      if (row === col) continue;
      const factor = a[row * n + col];
      if (factor === 0) continue;
      for (let k = 0; k < n; k++) {
        a[row * n + k] -= factor * a[col * n + k];
        inv[row * n + k] -= factor * inv[col * n + k];
      }
    }
  }
  return Float64Array.from(inv, (v, k) => v * scale[Math.floor(k / n)] * scale[k % n]);
}
