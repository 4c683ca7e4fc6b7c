import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { phiFunctions, type ComplexPair } from '../../src/analysis/phi-functions.js';

// Reference: φ1(z) = (e^z − 1)/z and φ2(z) = (e^z − 1 − z)/z² with complex.js, where the plain formulas are
// accurate (|z| ≥ 1); below that, their Taylor series Σ z^k/(k+1)! and Σ z^k/(k+2)! summed here in full.
function reference(z: Complex): { phi1: Complex; phi2: Complex } {
  if (z.abs() >= 1) return { phi1: z.exp().sub(1).div(z), phi2: z.exp().sub(1).sub(z).div(z.mul(z)) };
  let phi1 = new Complex(0, 0);
  let phi2 = new Complex(0, 0);
  let power = new Complex(1, 0);
  let factorial = 1;
  for (let k = 0; k < 40; k++) {
    phi1 = phi1.add(power.div(factorial * (k + 1)));
    phi2 = phi2.add(power.div(factorial * (k + 1) * (k + 2)));
    power = power.mul(z);
    factorial *= k + 1;
  }
  return { phi1, phi2 };
}

describe('φ1 and φ2', () => {
  const e: ComplexPair = [0, 0];
  const p1: ComplexPair = [0, 0];
  const p2: ComplexPair = [0, 0];
  const cases: [number, number][] = [
    [0, 0],
    [1e-12, 0],
    [-1e-9, 3e-9],
    [0.3, -0.2],
    [-0.49, 0.01],
    [0.5, 0],
    [-0.7, 2],
    [-5, 40],
    [-30, 0],
    [-1e6, 3e7],
    [2, 1],
  ];
  for (const [re, im] of cases) {
    it(`at z = ${re} + ${im}j agree with the reference to 1e-14`, () => {
      phiFunctions(re, im, e, p1, p2);
      const ref = reference(new Complex(re, im));
      expect(new Complex(p1[0], p1[1]).sub(ref.phi1).abs() / ref.phi1.abs()).toBeLessThan(1e-14);
      expect(new Complex(p2[0], p2[1]).sub(ref.phi2).abs() / ref.phi2.abs()).toBeLessThan(1e-14);
      expect(new Complex(e[0], e[1]).sub(new Complex(re, im).exp()).abs()).toBeLessThanOrEqual(1e-15 * Math.max(1, Math.exp(re)));
    });
  }
  it('φ1(0) = 1 and φ2(0) = 1/2: a step gives t, a ramp t²/2', () => {
    phiFunctions(0, 0, e, p1, p2);
    expect(p1).toEqual([1, 0]);
    expect(p2).toEqual([0.5, 0]);
  });
});
