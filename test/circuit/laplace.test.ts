import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { laplaceImpedance } from '../../src/circuit/laplace.js';
import { referenceZ as zRef } from '../reference/impedance.js';

// Reference: test/reference/impedance.ts, the element laws in the Laplace domain evaluated with complex.js (a
// general complex-math library); dZ/ds by a central difference of that evaluator, the same in any direction
// because Z(s) is analytic away from its poles (Cauchy–Riemann equations).

const close = (actual: number, expected: number, scale: number, tol: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol * scale);

// Trees of the shapes part models reduce to (values invented): a capacitor with ESR and ESL, an inductor with
// winding resistance and a parallel winding capacitance, a bead with a lossy parallel section, and a nesting.
const trees: Record<string, Element> = {
  'series R-L-C capacitor': series(resistor(0.012, 'ESR'), inductor(0.6e-9, 'ESL'), capacitor(4.7e-6)),
  'inductor with Cp': parallel(series(resistor(0.08), inductor(2.2e-6)), capacitor(3.1e-12)),
  'bead': series(resistor(0.05), parallel(resistor(220), inductor(1.1e-6), capacitor(1.4e-12))),
  'nested': parallel(
    series(resistor(0.3), capacitor(1e-6), parallel(inductor(10e-9), resistor(2))),
    series(inductor(3e-9), capacitor(22e-9)),
  ),
};

// Complex frequencies off the jω axis: damped (σ < 0), growing (σ > 0), and a large ω.
const points: [number, number][] = [
  [-2.0e5, 3.0e6],
  [1.5e4, 8.0e5],
  [-7.0e7, 2.0e9],
  [-1.0e3, -4.0e6],
];

describe('laplaceImpedance: Z(s) against complex.js', () => {
  for (const [name, tree] of Object.entries(trees)) {
    it(name, () => {
      for (const [re, im] of points) {
        const [zr, zi] = laplaceImpedance(tree, re, im);
        const ref = zRef(tree, new Complex(re, im));
        const scale = ref.abs();
        close(zr, ref.re, scale, 1e-12);
        close(zi, ref.im, scale, 1e-12);
      }
    });
  }
  it('on the jω axis it is the sweep impedance: series R-L-C at ω gives R + j(ωL − 1/(ωC))', () => {
    const w = 2 * Math.PI * 1e6;
    const [zr, zi] = laplaceImpedance(trees['series R-L-C capacitor'], 0, w);
    expect(zr).toBeCloseTo(0.012, 15);
    close(zi, w * 0.6e-9 - 1 / (w * 4.7e-6), 1, 1e-12);
  });
});

describe('laplaceImpedance: dZ/ds against a central difference of complex.js', () => {
  for (const [name, tree] of Object.entries(trees)) {
    it(name, () => {
      for (const [re, im] of points) {
        const [, , dr, di] = laplaceImpedance(tree, re, im);
        const s = new Complex(re, im);
        const h = s.abs() * 1e-6;
        // Difference along the real axis and along the imaginary axis: both must agree for an analytic Z.
        const alongRe = zRef(tree, s.add(h, 0)).sub(zRef(tree, s.sub(h, 0))).div(2 * h);
        const alongIm = zRef(tree, s.add(0, h)).sub(zRef(tree, s.sub(0, h))).div(new Complex(0, 2 * h));
        const scale = alongRe.abs();
        close(dr, alongRe.re, scale, 1e-6);
        close(di, alongRe.im, scale, 1e-6);
        close(dr, alongIm.re, scale, 1e-6);
        close(di, alongIm.im, scale, 1e-6);
      }
    });
  }
  it('a lone capacitor: d/ds 1/(sC) = −1/(s²C)', () => {
    const c = 2.2e-9;
    const s = new Complex(-3e5, 1e6);
    const [, , dr, di] = laplaceImpedance(capacitor(c), s.re, s.im);
    const ref = s.mul(s).mul(c).inverse().neg();
    close(dr, ref.re, ref.abs(), 1e-13);
    close(di, ref.im, ref.abs(), 1e-13);
  });
});
