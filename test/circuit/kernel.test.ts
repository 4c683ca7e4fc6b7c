// The one kernel generator: a sweep kernel and a slope kernel of the same tree agree on Z to the bit, and the
// slope matches a central difference of complex.js's own evaluation (reference in test/reference).

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { impedanceAt } from '../../src/circuit/impedance.js';
import { kernelLines } from '../../src/circuit/kernel.js';
import { impedanceSlopeAt } from '../../src/circuit/slope.js';
import { referenceZ } from '../reference/impedance.js';

// Invented trees: a capacitor model, a bead core, and a nested network with both kinds of group.
const TREES: Element[] = [
  series(resistor(0.018), inductor(0.45e-9), parallel(capacitor(100e-9), resistor(1e9))),
  series(resistor(0.03), parallel(resistor(600), inductor(1e-6), capacitor(1.5e-12))),
  parallel(series(resistor(0.004), inductor(1.1e-9), capacitor(10e-6)), series(resistor(0.03), inductor(0.4e-9), parallel(capacitor(100e-9), series(resistor(5), inductor(2e-9))))),
];

describe('kernelLines', () => {
  it('writes the slope lines only when asked, and one walk gives both', () => {
    const tree = TREES[2];
    const plain = kernelLines(tree, false);
    const withSlope = kernelLines(tree, true);
    expect(plain.result[2]).toBe('0');
    expect(withSlope.result[2]).not.toBe('0');
    expect(withSlope.lines.length).toBeGreaterThan(plain.lines.length);
  });

  it.each(TREES.map((t, i) => [i, t] as const))('tree %i: the slope kernel\'s Z is the sweep kernel\'s, bit for bit, from 1 kHz to 10 GHz', (_, tree) => {
    for (let e = 3; e <= 10; e += 0.25) {
      const f = 10 ** e;
      const [re, im] = impedanceAt(tree, f);
      const s = impedanceSlopeAt(tree, 2 * Math.PI * f);
      expect(s.re).toBe(re);
      expect(s.im).toBe(im);
    }
  });

  it.each(TREES.map((t, i) => [i, t] as const))('tree %i: dZ/dω matches a central difference of complex.js within 1e-6 relative', (_, tree) => {
    for (const f of [1e4, 3.3e6, 2.37e7, 4.1e8]) {
      const w = 2 * Math.PI * f;
      // h = 1e-5·ω: truncation ~h², rounding ~ε/h, both far below the tolerance for these smooth points.
      const h = w * 1e-5;
      const dz = referenceZ(tree, new Complex(0, w + h)).sub(referenceZ(tree, new Complex(0, w - h))).div(2 * h);
      const s = impedanceSlopeAt(tree, w);
      const scale = dz.abs();
      expect(Math.abs(s.dRe - dz.re) / scale).toBeLessThan(1e-6);
      expect(Math.abs(s.dIm - dz.im) / scale).toBeLessThan(1e-6);
    }
  });
});
