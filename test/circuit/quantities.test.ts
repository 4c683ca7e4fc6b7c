// Figures derived point by point from Z = R + jX, against complex.js (|Z|, arg Z, 1/Z) and the closed
// forms of ideal elements (Z = 1/(jωC): C_eff = C; Z = jωL: L_eff = L; Q = |X|/R; e.g. Alexander & Sadiku,
// Fundamentals of Electric Circuits, ch. 9 and 14).

import { Complex } from 'complex.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { deriveFigures } from '../../src/circuit/quantities.js';

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(b));

describe('deriveFigures', () => {
  it('agrees with complex.js on |Z|, phase, G, B and |Y| for any R ≥ 0 and X', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (r, x) => {
        const d = deriveFigures(Float64Array.of(1e6), { re: Float64Array.of(r), im: Float64Array.of(x) });
        const z = new Complex(r, x);
        const y = z.inverse();
        return (
          close(d.magnitudeOhm[0], z.abs()) &&
          close(d.phaseDeg[0], (z.arg() * 180) / Math.PI) &&
          Math.abs(d.conductanceS[0] - y.re) <= 1e-12 * y.abs() &&
          Math.abs(d.susceptanceS[0] - y.im) <= 1e-12 * y.abs() &&
          close(d.admittanceMagnitudeS[0], y.abs()) &&
          close(d.q[0], Math.abs(x) / r)
        );
      }),
      { numRuns: 2_000 },
    );
  });

  it('reads an ideal capacitor back as its capacitance, and an ideal inductor as its inductance', () => {
    const f = Float64Array.of(1e3, 1e6, 1e9);
    const c = 100e-9;
    const l = 4.7e-6;
    const cap = deriveFigures(f, { re: Float64Array.of(1e-7, 1e-7, 1e-7), im: Float64Array.from(f, (fi) => -1 / (2 * Math.PI * fi * c)) });
    const ind = deriveFigures(f, { re: Float64Array.of(1e-7, 1e-7, 1e-7), im: Float64Array.from(f, (fi) => 2 * Math.PI * fi * l) });
    for (let i = 0; i < f.length; i++) {
      expect(cap.effectiveCapacitanceF[i]).toBeCloseTo(c, 20);
      expect(Number.isNaN(cap.effectiveInductanceH[i])).toBe(true);
      expect(ind.effectiveInductanceH[i] / l).toBeCloseTo(1, 12);
      expect(Number.isNaN(ind.effectiveCapacitanceF[i])).toBe(true);
      // Phase of a capacitor with a little series R (0.1 µΩ) is just above −90°, of an inductor just below +90°.
      expect(cap.phaseDeg[i]).toBeGreaterThan(-90);
      expect(cap.phaseDeg[i]).toBeLessThan(-89);
      expect(ind.phaseDeg[i]).toBeLessThan(90);
      expect(ind.phaseDeg[i]).toBeGreaterThan(89);
    }
  });

  it('gives Q = Infinity where R = 0, and keeps R and X as given', () => {
    const re = Float64Array.of(0, 2);
    const im = Float64Array.of(5, -3);
    const d = deriveFigures(Float64Array.of(10, 20), { re, im });
    expect(d.q[0]).toBe(Infinity);
    expect(d.q[1]).toBe(1.5);
    expect(d.resistanceOhm).toBe(re);
    expect(d.reactanceOhm).toBe(im);
  });
});
