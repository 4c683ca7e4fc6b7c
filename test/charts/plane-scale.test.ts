// The complex plane's signed-log scale, s(v) = sign(v)·log10(1 + |v|/c): values worked by hand.

import { describe, expect, it } from 'vitest';
import { finiteExtent, partPlaneConstant, planeConstant, planeDomain } from '../../src/charts/plane-scale.js';
import { signedLog } from '../../src/charts/scales.js';
import { deriveFigures } from '../../src/circuit/quantities.js';

describe('the complex plane\'s scale', () => {
  it('picks the signed-log constant as the power of ten at or below the least |Z|', () => {
    expect(planeConstant([5, 0.018, 300])).toBe(0.01);
    expect(planeConstant([100, 1000])).toBe(100);
    expect(planeConstant([0, 1e-12, 1e6])).toBe(1e-3); // nearly lossless: held at 1e-9 of the largest
  });


  it('takes a part\'s constant from |Z| over its sweep', () => {
    // |3 + 4j| = 5, |30 − 40j| = 50: the least is 5, so c = 1.
    const z = { re: Float64Array.from([3, 30]), im: Float64Array.from([4, -40]) };
    expect(partPlaneConstant({ columns: deriveFigures(Float64Array.from([1, 10]), z) })).toBe(1);
  });

  it('spans the data out to the next ±c·10^k, never less than s(10c), with a margin of 0.12', () => {
    const c = 1;
    // 0 … 50 Ω: the edge is c·10^2 = 100 Ω, s(100) = log10(101).
    const [lo, hi] = planeDomain(0, 50, c);
    expect(lo).toBeCloseTo(-0.12, 12);
    expect(hi).toBeCloseTo(signedLog(100, c) + 0.12, 12);
    // A small path still shows the first decade: s(10c) = log10(11).
    expect(planeDomain(0, 2, c)[1]).toBeCloseTo(signedLog(10, c) + 0.12, 12);
    expect(planeDomain(-50, 0, c)[0]).toBeCloseTo(-signedLog(100, c) - 0.12, 12);
  });

  it('takes the extent of the finite values, with 0 always inside', () => {
    expect(finiteExtent([3, NaN, 7, Infinity])).toEqual([0, 7]);
    expect(finiteExtent([-2, -9])).toEqual([-9, 0]);
  });
});
