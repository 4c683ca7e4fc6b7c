// Y = 1/Z, checked against complex.js's own reciprocal (a general-purpose complex-number library), and its
// slope −Z′·Y² against the closed form by hand.

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { addAdmittance, addAdmittanceSlope, admittanceInto } from '../../src/circuit/admittance.js';

const Z = [new Complex(3, 4), new Complex(0.02, -1.6e3), new Complex(50, 0), new Complex(1e-3, 2e-3)];
const re = Float64Array.from(Z, (z) => z.re);
const im = Float64Array.from(Z, (z) => z.im);
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('admittance', () => {
  it('is the reciprocal at every point', () => {
    const g = new Float64Array(Z.length);
    const b = new Float64Array(Z.length);
    admittanceInto(re, im, g, b);
    Z.forEach((z, i) => {
      const y = z.inverse();
      expect(rel(g[i], y.re)).toBeLessThan(1e-15);
      expect(Math.abs(b[i] - y.im)).toBeLessThanOrEqual(1e-15 * y.abs());
    });
  });

  it('adds N identical branches as N times one admittance', () => {
    const g = new Float64Array(Z.length).fill(1);
    const b = new Float64Array(Z.length).fill(-1);
    addAdmittance(re, im, 3, g, b);
    Z.forEach((z, i) => {
      const y = z.inverse().mul(3).add(new Complex(1, -1));
      expect(rel(g[i], y.re)).toBeLessThan(1e-14);
      expect(rel(b[i], y.im)).toBeLessThan(1e-14);
    });
  });

  it('gives dY/dω = −Z′·Y²: for Z = 3 + 4j, Z′ = 2j, Y² = (3 − 4j)²/625 = (−7 − 24j)/625', () => {
    const acc = new Float64Array(4);
    addAdmittanceSlope(3, 4, 0, 2, 2, acc);
    // Y = (3 − 4j)/25; −2j·(−7 − 24j)/625 = (−48 + 14j)/625; two branches.
    expect(acc[0]).toBeCloseTo((2 * 3) / 25, 15);
    expect(acc[1]).toBeCloseTo((2 * -4) / 25, 15);
    expect(acc[2]).toBeCloseTo((2 * -48) / 625, 15);
    expect(acc[3]).toBeCloseTo((2 * 14) / 625, 15);
  });
});
