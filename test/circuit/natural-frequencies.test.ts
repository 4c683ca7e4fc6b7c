import { Complex } from 'complex.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { naturalFrequencies } from '../../src/circuit/natural-frequencies.js';
import { referenceZ } from '../reference/impedance.js';

const around = (hz: number) => ({ fromHz: hz / 1e4, toHz: hz * 1e4 });
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('closed forms', () => {
  it('series RLC: Z = R + sL + 1/(sC) has zeros at −R/2L ± j√(1/LC − (R/2L)²) and a pole at 0', () => {
    // Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §8.5 (the characteristic roots of the
    // series RLC circuit) — the zeros of its impedance.
    const R = 0.02;
    const L = 1e-9;
    const C = 1e-6;
    const { poles, zeros } = naturalFrequencies(series(resistor(R), inductor(L), capacitor(C)), around(1e6));
    const alpha = R / (2 * L);
    const wd = Math.sqrt(1 / (L * C) - alpha * alpha);
    expect(zeros).toHaveLength(1);
    expect(rel(zeros[0].re, -alpha)).toBeLessThan(1e-9);
    expect(rel(zeros[0].im, wd)).toBeLessThan(1e-12);
    expect(poles).toHaveLength(1);
    expect(Math.abs(poles[0].re)).toBeLessThan(1e-6);
  });

  it('parallel RLC: poles at −1/2RC ± j√(1/LC − (1/2RC)²) (ibid. §8.7)', () => {
    const R = 40e3;
    const L = 10e-6;
    const C = 2e-12;
    const { poles } = naturalFrequencies(parallel(resistor(R), inductor(L), capacitor(C)), around(20e6));
    const alpha = 1 / (2 * R * C);
    const wd = Math.sqrt(1 / (L * C) - alpha * alpha);
    expect(poles).toHaveLength(1);
    expect(rel(poles[0].re, -alpha)).toBeLessThan(1e-8);
    expect(rel(poles[0].im, wd)).toBeLessThan(1e-12);
  });

  it('two capacitors in parallel anti-resonate near 1/√((L1+L2)·C1C2/(C1+C2)), shifted only by the losses', () => {
    // The lossless form: the loop L1–C1–C2–L2 resonates with series L and series C (any circuit-analysis text).
    const [C1, C2, L1, L2, R] = [1e-6, 100e-9, 1e-9, 0.5e-9, 1e-4];
    const tree = parallel(series(resistor(R), inductor(L1), capacitor(C1)), series(resistor(R), inductor(L2), capacitor(C2)));
    const { poles } = naturalFrequencies(tree, around(10e6));
    const lossless = 1 / Math.sqrt((L1 + L2) * ((C1 * C2) / (C1 + C2)));
    const oscillating = poles.filter((p) => p.im > 0);
    expect(oscillating).toHaveLength(1);
    // Loss shifts a pole's frequency by about α²/(2ω) with α = ΣR/(2ΣL).
    const alpha = (2 * R) / (2 * (L1 + L2));
    expect(rel(oscillating[0].im, lossless)).toBeLessThan((alpha / lossless) ** 2 + 1e-12);
    expect(rel(oscillating[0].re, -alpha)).toBeLessThan(1e-6);
  });

  it('a resistor, an ideal inductor and an ideal capacitor alone', () => {
    expect(naturalFrequencies(resistor(50), around(1e6))).toEqual({ poles: [], zeros: [] });
    // Z = sL: a zero at 0 (a pole at infinity only).
    const l = naturalFrequencies(inductor(1e-9), around(1e6));
    expect(l.poles).toEqual([]);
    expect(l.zeros).toHaveLength(1);
    expect(Math.hypot(l.zeros[0].re, l.zeros[0].im)).toBeLessThan(1e-3);
    // Z = 1/(sC): a pole at 0.
    const c = naturalFrequencies(capacitor(1e-9), around(1e6));
    expect(c.zeros).toEqual([]);
    expect(c.poles).toHaveLength(1);
  });
});

// Random trees of R, L, C: at each pole, |Y(s)| = 1/|Z(s)| vanishes, and at each zero |Z(s)| does, measured
// against its value a little way off (complex.js evaluation of the tree at the complex frequency). "A little
// way" is a twentieth of the root's distance to the jω axis (or 1e-8 of its size for a lossless one): the
// scale on which it shapes |Z(jω)|, so a root placed within it puts the sweep's ladder in the right place.
const leaf = fc.oneof(
  fc.double({ min: 1e-3, max: 1e3, noNaN: true }).map((v) => resistor(v)),
  fc.double({ min: 1e-10, max: 1e-6, noNaN: true }).map((v) => inductor(v)),
  fc.double({ min: 1e-12, max: 1e-5, noNaN: true }).map((v) => capacitor(v)),
);
const tree: fc.Arbitrary<Element> = fc.letrec<{ node: Element }>((tie) => ({
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf,
    fc.array(tie('node'), { minLength: 2, maxLength: 3 }).map((parts) => series(...parts)),
    fc.array(tie('node'), { minLength: 2, maxLength: 3 }).map((parts) => parallel(...parts)),
  ),
})).node;

describe('random trees, against complex.js', () => {
  it('Z is singular at every pole and vanishes at every zero', () => {
    fc.assert(
      fc.property(tree, (t) => {
        const { poles, zeros } = naturalFrequencies(t, around(10e6));
        const relative = (s: { re: number; im: number }, invert: boolean) => {
          const at = (x: Complex) => (invert ? referenceZ(t, x).inverse() : referenceZ(t, x)).abs();
          const size = Math.hypot(s.re, s.im);
          const off = new Complex(s.re + Math.max(Math.abs(s.re) / 20, size * 1e-8), s.im);
          return at(new Complex(s.re, s.im)) / at(off);
        };
        // A pole and a zero that (nearly) cancel leave no trace in Z, and nothing to measure a root against.
        const cancelled = (s: { re: number; im: number }, others: { re: number; im: number }[]) =>
          others.some((o) => Math.hypot(o.re - s.re, o.im - s.im) < 1e-6 * Math.hypot(s.re, s.im));
        for (const p of poles) if (Math.hypot(p.re, p.im) > 1 && !cancelled(p, zeros)) expect(relative(p, true)).toBeLessThan(0.1);
        for (const z of zeros) if (Math.hypot(z.re, z.im) > 1 && !cancelled(z, poles)) expect(relative(z, false)).toBeLessThan(0.1);
      }),
      { numRuns: 300, seed: 8 },
    );
  });
});
