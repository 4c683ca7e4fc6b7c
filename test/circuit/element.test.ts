// Element trees: the constructors, and a tree's resistance at DC checked as the limit of its impedance at a
// small real s = σ (Laplace domain), evaluated with complex.js by the test's own tree evaluator
// (test/reference/impedance.ts: Z_R = R, Z_L = sL, Z_C = 1/(sC)), on 400 random trees from a seeded generator.

import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, dcResistance, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { referenceZ } from '../reference/impedance.js';
import { seededNormal } from '../measure/synthetic.js';

describe('constructors', () => {
  it('keep a role name only when one is given', () => {
    expect(resistor(5, 'ESR')).toEqual({ type: 'R', ohms: 5, name: 'ESR' });
    expect(resistor(5)).toEqual({ type: 'R', ohms: 5 });
    expect(inductor(1e-9)).not.toHaveProperty('name');
    expect(capacitor(1e-6, 'C')).toEqual({ type: 'C', farads: 1e-6, name: 'C' });
  });
  it('a series or parallel connection of one part is that part', () => {
    const r = resistor(1);
    expect(series(r)).toBe(r);
    expect(parallel(r)).toBe(r);
    expect(series(r, r)).toEqual({ type: 'series', parts: [r, r] });
  });
});

describe('dcResistance: the limit of Z(σ) as σ → 0', () => {
  const normal = seededNormal(20261202);
  const uniform = () => 0.5 + 0.5 * Math.tanh(normal());
  /** A random tree up to `depth` levels, values spread over several decades. */
  function tree(depth: number): Element {
    const u = uniform();
    if (depth === 0 || u < 0.45) {
      const pick = Math.floor(uniform() * 3);
      const value = 10 ** (uniform() * 4 - 2);
      return pick === 0 ? resistor(value) : pick === 1 ? inductor(value * 1e-6) : capacitor(value * 1e-6);
    }
    const n = 2 + Math.floor(uniform() * 3);
    const parts = Array.from({ length: n }, () => tree(depth - 1));
    return u < 0.72 ? series(...parts) : parallel(...parts);
  }

  it('over 400 random trees: 0 (a short), ∞ (an open) or the resistance of the resistors that stay', () => {
    const seen = { short: 0, open: 0, finite: 0 };
    for (let k = 0; k < 400; k++) {
      const e = tree(3);
      const r = dcResistance(e);
      // Two small values of σ: the limit holds for both, so the answer is not the value at one point.
      for (const sigma of [1e-7, 1e-9]) {
        const z = referenceZ(e, new Complex(sigma, 0));
        if (r === 0) expect(z.abs(), JSON.stringify(e)).toBeLessThan(1e-3);
        else if (r === Infinity) expect(z.abs(), JSON.stringify(e)).toBeGreaterThan(1e3);
        else expect(Math.abs(z.abs() / r - 1), JSON.stringify(e)).toBeLessThan(1e-3);
      }
      seen[r === 0 ? 'short' : r === Infinity ? 'open' : 'finite']++;
    }
    // Every kind of answer is exercised.
    expect(seen.short).toBeGreaterThan(20);
    expect(seen.open).toBeGreaterThan(20);
    expect(seen.finite).toBeGreaterThan(20);
  });

  it('closed forms: a capacitor with a leak, a bead, an inductor with its winding resistance', () => {
    expect(dcResistance(series(resistor(5e-3), inductor(1e-9), parallel(capacitor(1e-6), resistor(1e6))))).toBeCloseTo(1e6 + 5e-3, 6);
    expect(dcResistance(series(resistor(0.05), parallel(resistor(300), inductor(1e-6), capacitor(1e-12))))).toBe(0.05);
    expect(dcResistance(parallel(series(resistor(0.02), inductor(4.7e-6)), capacitor(2e-12), resistor(1e4)))).toBeCloseTo(1 / (1 / 0.02 + 1 / 1e4), 15);
    expect(dcResistance(series(resistor(1), capacitor(1e-6)))).toBe(Infinity);
  });
});
