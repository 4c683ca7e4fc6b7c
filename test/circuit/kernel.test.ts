// The one kernel generator: a sweep kernel and a slope kernel of the same tree agree on Z to the bit, and the
// slope matches a central difference of complex.js's own evaluation (reference in test/reference).

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { impedanceAt, impedanceSweep, kernelSource } from '../../src/circuit/impedance.js';
import { kernelLines, shapeKernel } from '../../src/circuit/kernel.js';
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

describe('one compiled kernel per tree shape', () => {
  // The capacitor model of TREES[0] with other values: the same shape.
  const other = series(resistor(0.005), inductor(1.1e-9), parallel(capacitor(10e-6), resistor(5e7)));
  const omega = Float64Array.from({ length: 57 }, (_, i) => 2 * Math.PI * 10 ** (3 + i / 8));

  it('writes no element value into the code, so trees of one shape share a body and a function', () => {
    expect(kernelSource(other)).toBe(kernelSource(TREES[0]));
    expect(kernelSource(TREES[1])).not.toBe(kernelSource(TREES[0]));
    expect(kernelSource(TREES[0])).not.toMatch(/\d\.\d|e-\d/);
    const a = shapeKernel(['omega', 're', 'im'], kernelSource(TREES[0]));
    expect(shapeKernel(['omega', 're', 'im'], kernelSource(other))).toBe(a);
    expect(shapeKernel(['w', 'out'], kernelSource(other))).not.toBe(a);
  });

  it.each([...TREES, other].map((t, i) => [i, t] as const))('tree %i: values read from the constants give the bits the values written as literals give, and complex.js\'s Z within 1e-12', (_, tree) => {
    const { constants } = kernelLines(tree, false);
    const literal = new Function('omega', 're', 'im', kernelSource(tree).replace(/k\[(\d+)\]/g, (_, i: string) => `(${String(constants[Number(i)])})`)) as (o: Float64Array, re: Float64Array, im: Float64Array) => void;
    const want = { re: new Float64Array(omega.length), im: new Float64Array(omega.length) };
    literal(omega, want.re, want.im);
    const got = impedanceSweep(tree, omega.map((w) => w / (2 * Math.PI)));
    for (let i = 0; i < omega.length; i++) {
      const z = referenceZ(tree, new Complex(0, omega[i]));
      expect(Math.abs(got.re[i] - z.re) + Math.abs(got.im[i] - z.im)).toBeLessThanOrEqual(1e-12 * z.abs());
    }
    // The sweep's own ω is 2π·f again: compared with the literal kernel at that same ω, bit for bit.
    const own = omega.map((w) => 2 * Math.PI * (w / (2 * Math.PI)));
    literal(own, want.re, want.im);
    expect(Array.from(got.re)).toEqual(Array.from(want.re));
    expect(Array.from(got.im)).toEqual(Array.from(want.im));
  });
});
