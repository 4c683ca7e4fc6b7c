// The Levenberg–Marquardt solver on problems with known minima: Rosenbrock's function as least squares,
// r = (10(x₂ − x₁²), 1 − x₁), minimum at (1, 1) (H. H. Rosenbrock, Computer J. 3, 1960; the standard
// start (−1.2, 1) of J. J. Moré, B. S. Garbow, K. E. Hillstrom, ACM TOMS 7, 1981); an exponential decay
// fitted to exact samples; and a box that holds the answer at its edge.

import { describe, expect, it } from 'vitest';
import { levenbergMarquardt, type LeastSquaresProblem } from '../../src/measure/levenberg-marquardt.js';

const open = (n: number) => ({ lower: new Float64Array(n).fill(-Infinity), upper: new Float64Array(n).fill(Infinity) });

const rosenbrock: LeastSquaresProblem = {
  parameters: 2,
  residuals: 2,
  ...open(2),
  evaluate(x, r, j) {
    r[0] = 10 * (x[1] - x[0] * x[0]);
    r[1] = 1 - x[0];
    if (j) {
      j[0] = -20 * x[0];
      j[1] = -1;
      j[2] = 10;
      j[3] = 0;
    }
  },
};

describe('levenbergMarquardt', () => {
  it('Rosenbrock from (−1.2, 1) reaches (1, 1)', () => {
    const s = levenbergMarquardt(rosenbrock, Float64Array.of(-1.2, 1));
    expect(Math.abs(s.x[0] - 1)).toBeLessThan(1e-10);
    expect(Math.abs(s.x[1] - 1)).toBeLessThan(1e-10);
    expect(s.cost).toBeLessThan(1e-20);
  });

  it('y = a·exp(−b·t) from exact samples gives a = 2.5, b = 0.7', () => {
    const t = Array.from({ length: 30 }, (_, i) => i / 5);
    const y = t.map((ti) => 2.5 * Math.exp(-0.7 * ti));
    const s = levenbergMarquardt(
      {
        parameters: 2,
        residuals: 30,
        ...open(2),
        evaluate(x, r, j) {
          t.forEach((ti, i) => {
            const e = Math.exp(-x[1] * ti);
            r[i] = x[0] * e - y[i];
            if (j) {
              j[i] = e;
              j[30 + i] = -x[0] * ti * e;
            }
          });
        },
      },
      Float64Array.of(1, 0.1),
    );
    expect(Math.abs(s.x[0] - 2.5)).toBeLessThan(1e-10);
    expect(Math.abs(s.x[1] - 0.7)).toBeLessThan(1e-10);
  });

  it('keeps parameters in their box: min (x − 3)² with x ≤ 2 ends at 2', () => {
    const s = levenbergMarquardt({ parameters: 1, residuals: 1, lower: Float64Array.of(-10), upper: Float64Array.of(2), evaluate: (x, r, j) => ((r[0] = x[0] - 3), j && (j[0] = 1)) }, Float64Array.of(0));
    expect(s.x[0]).toBe(2);
    expect(s.cost).toBeCloseTo(0.5, 12);
  });
});
