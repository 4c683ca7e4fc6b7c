import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Complex } from 'complex.js';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { impedanceAt, impedanceSweep, impedanceSweepWithValuesInto, leafValues, leavesOf } from '../../src/circuit/impedance.js';
import { logSweep } from '../../src/circuit/sweep.js';

// Closed forms: Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §9.4–9.7 (element
// impedances, series and parallel combination).
const TWO_PI = 2 * Math.PI;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('ideal elements', () => {
  const f = 1.234e6;
  const w = TWO_PI * f;
  it('Z_R = R', () => {
    expect(impedanceAt(resistor(47), f)).toEqual([47, 0]);
  });
  it('Z_L = jωL', () => {
    const [re, im] = impedanceAt(inductor(2.2e-6), f);
    expect(re).toBe(0);
    expect(rel(im, w * 2.2e-6)).toBeLessThan(1e-15);
  });
  it('Z_C = −j/(ωC)', () => {
    const [re, im] = impedanceAt(capacitor(4.7e-9), f);
    expect(re).toBe(0);
    expect(rel(im, -1 / (w * 4.7e-9))).toBeLessThan(1e-15);
  });
  it('series adds impedances: R + jωL − j/(ωC)', () => {
    const [re, im] = impedanceAt(series(resistor(0.02), inductor(1e-9), capacitor(1e-6)), f);
    expect(re).toBeCloseTo(0.02, 15);
    expect(rel(im, w * 1e-9 - 1 / (w * 1e-6))).toBeLessThan(1e-14);
  });
  it('parallel adds admittances: R ‖ C = R/(1 + jωRC)', () => {
    const r = 1e3;
    const c = 1e-9;
    const [re, im] = impedanceAt(parallel(resistor(r), capacitor(c)), f);
    const d = 1 + (w * r * c) ** 2;
    expect(rel(re, r / d)).toBeLessThan(1e-14);
    expect(rel(im, (-w * r * r * c) / d)).toBeLessThan(1e-14);
  });
  it('two equal resistors in parallel halve', () => {
    expect(impedanceAt(parallel(resistor(100), resistor(100)), f)[0]).toBeCloseTo(50, 12);
  });
});

describe('sweep and single-frequency evaluation agree bit for bit', () => {
  it('for a nested tree', () => {
    const tree = series(resistor(5e-3), inductor(1.1e-9), parallel(capacitor(10e-6), resistor(50e6), series(inductor(1e-6), capacitor(1e-12))));
    const freqs = logSweep({ fromHz: 1, toHz: 1e10, perDecade: 10 });
    const z = impedanceSweep(tree, freqs);
    freqs.forEach((f, i) => {
      const [re, im] = impedanceAt(tree, f);
      expect(z.re[i]).toBe(re);
      expect(z.im[i]).toBe(im);
    });
  });
});

// Reference: complex.js (a general-purpose complex-number library from the npm registry), evaluating the
// same tree by the textbook rules with its own arithmetic.
function reference(element: Element, w: number): Complex {
  switch (element.type) {
    case 'R':
      return new Complex(element.ohms, 0);
    case 'L':
      return new Complex(0, w * element.henries);
    case 'C':
      return new Complex(0, w * element.farads).inverse();
    case 'series':
      return element.parts.reduce((sum, p) => sum.add(reference(p, w)), new Complex(0, 0));
    case 'parallel':
      return element.parts.reduce((sum, p) => sum.add(reference(p, w).inverse()), new Complex(0, 0)).inverse();
  }
}

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);
const leaf: fc.Arbitrary<Element> = fc.oneof(
  logUniform(1e-6, 1e12).map(resistor),
  logUniform(1e-12, 1).map(inductor),
  logUniform(1e-15, 1).map(capacitor),
);
const { tree } = fc.letrec<{ tree: Element }>((tie) => ({
  tree: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf,
    fc.array(tie('tree'), { minLength: 2, maxLength: 4 }).map((parts) => series(...parts)),
    fc.array(tie('tree'), { minLength: 2, maxLength: 4 }).map((parts) => parallel(...parts)),
  ),
}));

describe('random element trees against complex.js', () => {
  it('agree to 1e-12 relative from 1 mHz to 1 THz', () => {
    fc.assert(
      fc.property(tree, logUniform(1e-3, 1e12), (t, f) => {
        const w = TWO_PI * f;
        const expected = reference(t, w);
        const [re, im] = impedanceAt(t, f);
        const scale = expected.abs();
        // Relative to |Z|: both evaluate the same sums, and each step of either is correctly rounded.
        return Math.hypot(re - expected.re, im - expected.im) <= 1e-12 * scale;
      }),
      { numRuns: 3000, seed: 20261201 },
    );
  });
});

describe('extreme values stay finite and correct', () => {
  const cases: [string, Element, (w: number) => [number, number]][] = [
    ['1 fF', capacitor(1e-15), (w) => [0, -1 / (w * 1e-15)]],
    ['1 F', capacitor(1), (w) => [0, -1 / w]],
    ['1 pH', inductor(1e-12), (w) => [0, w * 1e-12]],
    ['1 H', inductor(1), (w) => [0, w]],
    ['1 µΩ', resistor(1e-6), () => [1e-6, 0]],
    ['1 TΩ', resistor(1e12), () => [1e12, 0]],
  ];
  const freqs = logSweep({ fromHz: 1e-3, toHz: 1e12, perDecade: 5 });
  it.each(cases)('%s from 1 mHz to 1 THz', (_name, element, closed) => {
    const z = impedanceSweep(element, freqs);
    freqs.forEach((f, i) => {
      const [re, im] = closed(TWO_PI * f);
      expect(Number.isFinite(z.re[i]) && Number.isFinite(z.im[i])).toBe(true);
      expect(Math.abs(z.re[i] - re)).toBeLessThanOrEqual(1e-15 * Math.abs(re));
      expect(Math.abs(z.im[i] - im)).toBeLessThanOrEqual(1e-15 * Math.abs(im));
    });
  });
  it('a 1 fF ‖ 1 TΩ with 1 pH and 1 µΩ in series, at both sweep ends', () => {
    const t = series(resistor(1e-6), inductor(1e-12), parallel(capacitor(1e-15), resistor(1e12)));
    for (const f of [1e-3, 1e12]) {
      const w = TWO_PI * f;
      const expected = reference(t, w);
      const [re, im] = impedanceAt(t, f);
      expect(Math.hypot(re - expected.re, im - expected.im)).toBeLessThanOrEqual(1e-12 * expected.abs());
    }
  });
});

describe('log sweep', () => {
  it('has per-decade points per decade, both ends exact', () => {
    const f = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 100 });
    expect(f.length).toBe(801);
    expect(f[0]).toBe(100);
    expect(f[800]).toBe(1e10);
    expect(rel(f[100], 1000)).toBeLessThan(1e-14);
  });
  it('rejects an empty range', () => {
    expect(() => logSweep({ fromHz: 10, toHz: 10, perDecade: 10 })).toThrow(RangeError);
  });
});

describe('exact shorts and opens inside a tree', () => {
  // A lossless series LC at its resonance is a short (Z = 0), and a lossless parallel LC an open (Y = 0):
  // the parallel law 1/Z must not turn them into 0/0.
  it('a shorted branch makes its parallel group 0 Ω, never NaN (L = C = 1 at ω = 1 rad/s)', () => {
    const tree = parallel(series(inductor(1), capacitor(1)), resistor(1));
    const near = Array.from({ length: 4001 }, (_, i) => (1 / (2 * Math.PI)) * (1 + (i - 2000) * 1e-16));
    for (const f of near) {
      const [re, im] = impedanceAt(tree, f);
      expect(Number.isNaN(re) || Number.isNaN(im)).toBe(false);
    }
    const shorted = near.map((f) => impedanceAt(tree, f)).filter(([re, im]) => re === 0 && im === 0);
    expect(shorted.length).toBeGreaterThan(0);
  });
  it('a lossless parallel LC is an open at its resonance: |Z| = ∞, never NaN', () => {
    const tree = series(resistor(1), parallel(series(inductor(1), resistor(0)), capacitor(1)));
    const near = Array.from({ length: 4001 }, (_, i) => (1 / (2 * Math.PI)) * (1 + (i - 2000) * 1e-16));
    for (const f of near) {
      const [re, im] = impedanceAt(tree, f);
      expect(Number.isNaN(re) || Number.isNaN(im)).toBe(false);
    }
  });
});

describe('a tree with other leaf values (impedanceSweepWithValuesInto)', () => {
  // The tree rebuilt with each leaf's value in the given order (depth first, parts in order).
  const rebuilt = (t: Element, values: readonly number[], at = { i: 0 }): Element => {
    switch (t.type) {
      case 'R':
        return { ...t, ohms: values[at.i++] };
      case 'L':
        return { ...t, henries: values[at.i++] };
      case 'C':
        return { ...t, farads: values[at.i++] };
      default:
        return { type: t.type, parts: t.parts.map((p) => rebuilt(p, values, at)) };
    }
  };
  const ownValue = (l: ReturnType<typeof leavesOf>[number]) => (l.type === 'R' ? l.ohms : l.type === 'L' ? l.henries : l.farads);

  it('lists each leaf once, in the order leafValues gives their values', () => {
    fc.assert(
      fc.property(tree, (t) => {
        const values = leafValues(t);
        const leaves = leavesOf(t);
        return leaves.length === values.length && leaves.every((l, i) => Object.is(ownValue(l), values[i]));
      }),
      { numRuns: 500, seed: 20261203 },
    );
  });

  it('gives the same bits as the tree built with those values, which agrees with complex.js', () => {
    const frequencies = logSweep({ fromHz: 1e-2, toHz: 1e11, perDecade: 7 });
    fc.assert(
      fc.property(tree, fc.array(logUniform(0.25, 4), { minLength: 64, maxLength: 64 }), (t, factors) => {
        const values = leafValues(t).map((v, i) => v * factors[i % factors.length]);
        const re = new Float64Array(frequencies.length);
        const im = new Float64Array(frequencies.length);
        impedanceSweepWithValuesInto(t, values, frequencies, re, im);
        const other = rebuilt(t, [...values]);
        const z = impedanceSweep(other, frequencies);
        for (let i = 0; i < frequencies.length; i++) {
          if (!Object.is(re[i], z.re[i]) || !Object.is(im[i], z.im[i])) return false;
          const expected = reference(other, TWO_PI * frequencies[i]);
          if (Math.hypot(re[i] - expected.re, im[i] - expected.im) > 1e-12 * expected.abs()) return false;
        }
        return true;
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });

  it('refuses a value that is not finite, or the wrong number of them', () => {
    const t = series(resistor(1), capacitor(1e-6));
    const f = Float64Array.of(1e3);
    const out = () => [new Float64Array(1), new Float64Array(1)] as const;
    expect(() => impedanceSweepWithValuesInto(t, Float64Array.of(1, Infinity), f, ...out())).toThrow(RangeError);
    expect(() => impedanceSweepWithValuesInto(t, Float64Array.of(1), f, ...out())).toThrow(RangeError);
  });
});
