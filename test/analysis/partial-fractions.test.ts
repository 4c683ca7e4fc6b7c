import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { naturalFrequencies } from '../../src/circuit/natural-frequencies.js';
import { distinctPoles, fitPartialFractions, partialFractionsAt, partialFractionsAtZero } from '../../src/analysis/partial-fractions.js';
import { referenceZ } from '../reference/impedance.js';

/** Z(jω) of a tree by complex.js (test/reference), on a log grid. */
function sampled(tree: Element, fromHz: number, toHz: number, n: number) {
  const omega = Float64Array.from({ length: n }, (_, i) => 2 * Math.PI * fromHz * (toHz / fromHz) ** (i / (n - 1)));
  const z = Array.from(omega, (w) => referenceZ(tree, new Complex(0, w)));
  return { omega, re: Float64Array.from(z, (c) => c.re), im: Float64Array.from(z, (c) => c.im), weights: Float64Array.from(z, (c) => 1 / c.abs()) };
}

describe('residues on known poles', () => {
  it('series R + L + C: Z = R + sL + (1/C)/s, so D0 = R, D1 = L and the residue at 0 is 1/C', () => {
    // Alexander & Sadiku, Fundamentals of Electric Circuits, ch. 15 (partial fractions of a rational function).
    const [R, L, C] = [0.02, 1e-9, 1e-6];
    const s = sampled(series(resistor(R), inductor(L), capacitor(C)), 1e3, 1e10, 200);
    const [f] = fitPartialFractions([{ re: 0, im: 0 }], s.omega, [s], { proportional: true, weights: s.weights });
    expect(Math.abs(f.constant / R - 1)).toBeLessThan(1e-10);
    expect(Math.abs(f.proportional / L - 1)).toBeLessThan(1e-10);
    expect(Math.abs(f.residues[0].re * C - 1)).toBeLessThan(1e-10);
    expect(partialFractionsAtZero(f)).toBe(Infinity);
  });

  it('parallel R ‖ L ‖ C: Z = (s/C)/(s² + s/RC + 1/LC), residue (1/C)·p/(p − p̄) at p', () => {
    // ibid.: the residue of a simple pole p of N/D is N(p)/D′(p).
    const [R, L, C] = [40, 10e-9, 2e-9];
    const tree = parallel(resistor(R), inductor(L), capacitor(C));
    const { poles } = naturalFrequencies(tree, { fromHz: 1e6, toHz: 1e9 });
    const s = sampled(tree, 1e5, 1e10, 300);
    const [f] = fitPartialFractions(poles, s.omega, [s], { proportional: true, weights: s.weights });
    const p = new Complex(poles[0].re, poles[0].im);
    const expected = p.div(p.sub(p.conjugate())).div(C);
    expect(new Complex(f.residues[0].re, f.residues[0].im).sub(expected).abs() / expected.abs()).toBeLessThan(1e-9);
    expect(Math.abs(f.constant)).toBeLessThan(1e-9 * R);
    expect(partialFractionsAtZero(f)).toBeLessThan(1e-9 * R);
  });

  it('reproduces a six-state rail between its samples to 1e-10 (every pole present)', () => {
    const tree = parallel(
      series(resistor(1e-3), inductor(15e-9)),
      series(resistor(5e-3), inductor(1e-9), capacitor(220e-6)),
      series(resistor(3e-3), inductor(0.3e-9), capacitor(10e-6)),
      series(capacitor(15e-9), resistor(2e-3)),
    );
    const { poles } = naturalFrequencies(tree, { fromHz: 1e5, toHz: 1e8 });
    const s = sampled(tree, 1e2, 1e11, 400);
    const [f] = fitPartialFractions(poles, s.omega, [s], { proportional: true, weights: s.weights });
    for (let i = 0; i < 399; i++) {
      const w = Math.sqrt(s.omega[i] * s.omega[i + 1]);
      const exact = referenceZ(tree, new Complex(0, w));
      const [re, im] = partialFractionsAt(f, w);
      expect(new Complex(re, im).sub(exact).abs() / exact.abs()).toBeLessThan(1e-10);
    }
    // Z(0) is the regulator's resistance (the capacitors block DC).
    expect(Math.abs(partialFractionsAtZero(f) / 1e-3 - 1)).toBeLessThan(1e-9);
  });

  it('repeated poles count once', () => {
    expect(distinctPoles([{ re: -1, im: 5 }, { re: -1 * (1 + 1e-13), im: 5 }, { re: -2, im: 0 }])).toHaveLength(2);
  });
});
