// hypot(a, b) against the engine's own Math.hypot (ECMAScript's Math.hypot, ECMA-262 §21.3.2.18), bit for
// bit: every pair of special values, and random pairs whose exponents span the whole double range (subnormals
// included) or lie close together, as a real and imaginary part of an impedance do.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hypot } from '../../src/circuit/hypot.js';

const SPECIAL = [0, -0, 1, -1, 3, 4, Infinity, -Infinity, NaN, Number.MIN_VALUE, -Number.MIN_VALUE, Number.MAX_VALUE, 2.2250738585072014e-308, 1e-300, 1e300, 0.1, 1 / 3];

describe('hypot', () => {
  it('is Math.hypot on every pair of special values, signed zeros, infinities and NaN included', () => {
    for (const a of SPECIAL) for (const b of SPECIAL) expect(Object.is(hypot(a, b), Math.hypot(a, b)), `${a}, ${b}`).toBe(true);
  });

  it('gives 5 for 3 and 4, and is not fooled by overflow of the squares (closed form)', () => {
    expect(hypot(3, 4)).toBe(5);
    expect(hypot(3e300, 4e300)).toBe(5e300);
    expect(hypot(3e-310, 4e-310)).toBeCloseTo(5e-310, 320);
  });

  it('is Math.hypot bit for bit on any two doubles', () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), (a, b) => Object.is(hypot(a, b), Math.hypot(a, b))),
      { numRuns: 200_000 },
    );
  });

  it('is Math.hypot bit for bit on pairs of nearby magnitude', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-15, max: 1e15, noNaN: true }), fc.double({ min: -1e3, max: 1e3, noNaN: true }), (a, ratio) => Object.is(hypot(a, a * ratio), Math.hypot(a, a * ratio))),
      { numRuns: 200_000 },
    );
  });
});
