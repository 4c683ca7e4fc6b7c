// Linear least squares by Householder QR, against closed forms: the straight-line fit's textbook formulas
// (slope = Sxy/Sxx, intercept = ȳ − slope·x̄; e.g. Montgomery & Runger, Applied Statistics and Probability
// for Engineers, §11.2), an exactly determined system solved by hand, and a column with nothing left.

import { describe, expect, it } from 'vitest';
import { leastSquares } from '../../src/analysis/least-squares.js';

/** Column-major A from rows. */
const columnMajor = (rows: number[][]) => Float64Array.from(rows[0].flatMap((_, j) => rows.map((r) => r[j])));

describe('leastSquares', () => {
  it('fits a straight line as the textbook formulas do', () => {
    const xs = [0, 1, 2, 3, 4, 5, 6, 7];
    const ys = [1.1, 2.9, 5.2, 7.1, 8.8, 11.2, 13.1, 14.8];
    const n = xs.length;
    const mx = xs.reduce((a, b) => a + b) / n;
    const my = ys.reduce((a, b) => a + b) / n;
    const sxy = xs.reduce((s, x, i) => s + (x - mx) * (ys[i] - my), 0);
    const sxx = xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    const slope = sxy / sxx;
    const intercept = my - slope * mx;
    const [x] = leastSquares(columnMajor(xs.map((v) => [1, v])), n, 2, [Float64Array.from(ys)]);
    // Agreement to rounding: both are exact arithmetic on eight points.
    expect(x[0]).toBeCloseTo(intercept, 12);
    expect(x[1]).toBeCloseTo(slope, 12);
  });

  it('solves an exactly determined system, for several right-hand sides at once', () => {
    // 2a + b = 5, a + 3b = 10  →  a = 1, b = 3;  with right side (4, 7): a = 1, b = 2 (by hand).
    const [first, second] = leastSquares(columnMajor([[2, 1], [1, 3]]), 2, 2, [Float64Array.of(5, 10), Float64Array.of(4, 7)]);
    expect(Array.from(first)).toEqual([expect.closeTo(1, 13), expect.closeTo(3, 13)]);
    expect(Array.from(second)).toEqual([expect.closeTo(1, 13), expect.closeTo(2, 13)]);
  });

  it('gives 0 for a column with no component left after the ones before it, rather than dividing by zero', () => {
    // Second column = 2 × first: the first column carries the fit of y = 2x alone.
    const [x] = leastSquares(columnMajor([[1, 2], [2, 4], [3, 6]]), 3, 2, [Float64Array.of(2, 4, 6)]);
    expect(Number.isFinite(x[0]) && Number.isFinite(x[1])).toBe(true);
    expect(x[0] + 2 * x[1]).toBeCloseTo(2, 12);
    expect(x[1]).toBe(0);
  });

  it('refuses fewer equations than unknowns', () => {
    expect(() => leastSquares(new Float64Array(6), 2, 3, [new Float64Array(2)])).toThrow(RangeError);
  });
});
