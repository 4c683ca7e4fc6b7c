// Parameter statistics of a fit: the inverse of a symmetric matrix against its closed form, and the
// standard errors of a straight-line fit against the textbook formulas σ_a² = σ²·Σt²/(nΣt² − (Σt)²),
// σ_b² = σ²·n/(nΣt² − (Σt)²) (Press et al., Numerical Recipes, 3rd ed., 2007, §15.2).

import { describe, expect, it } from 'vitest';
import { invertSymmetric, parameterStatistics } from '../../src/measure/fit-statistics.js';

describe('invertSymmetric', () => {
  it('the inverse of [[4, 2], [2, 3]] is [[3, −2], [−2, 4]]/8', () => {
    const inv = invertSymmetric(Float64Array.of(4, 2, 2, 3), 2)!;
    [3 / 8, -2 / 8, -2 / 8, 4 / 8].forEach((v, i) => expect(inv[i]).toBeCloseTo(v, 14));
  });
  it('a singular matrix has none', () => {
    expect(invertSymmetric(Float64Array.of(1, 1, 1, 1), 2)).toBeUndefined();
    expect(invertSymmetric(Float64Array.of(0, 0, 0, 1), 2)).toBeUndefined();
  });
  it('columns of very different size: diag(1e-20, 1e20)', () => {
    const inv = invertSymmetric(Float64Array.of(1e-20, 0, 0, 1e20), 2)!;
    expect(inv[0]).toBeCloseTo(1e20, -6);
    expect(inv[3]).toBeCloseTo(1e-20, 34);
  });
});

describe('parameterStatistics', () => {
  it('a straight line y = a + b·t: standard errors as the closed form, influence the largest |∂r|', () => {
    // Residuals laid out as complex pairs: real parts are the line's residuals, imaginary parts zero.
    const t = [0, 1, 2, 3, 4, 5];
    const noise = [0.1, -0.2, 0.05, 0.15, -0.1, 0.0];
    const n = t.length;
    const m = 2 * n;
    const jacobian = new Float64Array(m * 2);
    const residual = new Float64Array(m);
    t.forEach((ti, i) => {
      jacobian[i] = 1;
      jacobian[m + i] = ti;
      residual[i] = noise[i];
    });
    const cost = noise.reduce((s, e) => s + e * e, 0) / 2;
    const stats = parameterStatistics({ x: new Float64Array(2), cost, residual, jacobian, iterations: 0 }, n, 2);
    const sigma2 = (2 * cost) / (m - 2);
    const st = t.reduce((s, v) => s + v, 0);
    const stt = t.reduce((s, v) => s + v * v, 0);
    const det = n * stt - st * st;
    expect(stats.standardError[0]).toBeCloseTo(Math.sqrt((sigma2 * stt) / det), 14);
    expect(stats.standardError[1]).toBeCloseTo(Math.sqrt((sigma2 * n) / det), 14);
    expect(Array.from(stats.influence)).toEqual([1, 5]);
    expect(stats.strongest).toEqual(['low-end', 'high-end']);
  });
});
