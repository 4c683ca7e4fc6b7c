import { describe, expect, it } from 'vitest';
import { denseSweep, goldenMax, railMagnitude, worstOverBand, type RefBranch } from './rail-reference.js';

// The tests' own rail evaluator, checked against closed forms before it judges zfolio.
describe('the reference rail evaluator', () => {
  it('a series R-L-C branch has |Z| = R at 1/(2π√(LC)) (series resonance, any circuit-analysis text)', () => {
    const b: RefBranch = { r: 0.01, l: 1e-9, c: 1e-6, count: 1 };
    const f0 = 1 / (2 * Math.PI * Math.sqrt(1e-9 * 1e-6));
    expect(railMagnitude([b], f0)).toBeCloseTo(0.01, 12);
    // N in parallel: R/N.
    expect(railMagnitude([{ ...b, count: 4 }], f0)).toBeCloseTo(0.0025, 12);
  });

  it('an inductive and a capacitive branch peak near 1/(2π√(LC)) at about (L/C)/(R_L + R_C) (tank with series losses, Q = 50)', () => {
    const branches: RefBranch[] = [
      { r: 1e-3, l: 10e-9, c: 0, count: 1 },
      { r: 1e-3, l: 0, c: 1e-6, count: 1 },
    ];
    const f0 = 1 / (2 * Math.PI * Math.sqrt(10e-9 * 1e-6));
    const sweep = denseSweep(f0 / 10, f0 * 10, 1000);
    const sampled = Float64Array.from(sweep, (f) => railMagnitude(branches, f));
    const worst = worstOverBand(branches, sweep, sampled);
    // The closed forms hold to about 1/Q² = 4e-4.
    expect(Math.abs(worst.frequencyHz / f0 - 1)).toBeLessThan(1e-3);
    expect(Math.abs(worst.impedanceOhm / (10e-9 / 1e-6 / 2e-3) - 1)).toBeLessThan(1e-3);
    // Refinement only raises the sampled maximum, and lands on a point no neighbour beats.
    expect(worst.impedanceOhm).toBeGreaterThanOrEqual(Math.max(...sampled));
    expect(railMagnitude(branches, worst.frequencyHz * (1 + 1e-6))).toBeLessThanOrEqual(worst.impedanceOhm);
    expect(railMagnitude(branches, worst.frequencyHz * (1 - 1e-6))).toBeLessThanOrEqual(worst.impedanceOhm);
  });

  it('goldenMax finds the top of a parabola to 1e-6', () => {
    const { x, value } = goldenMax((u) => 3 - (u - 1.25) ** 2, 0, 4);
    expect(x).toBeCloseTo(1.25, 6);
    expect(value).toBeCloseTo(3, 12);
  });

  it('a dense sweep runs from one end to the other, log-spaced', () => {
    const s = denseSweep(1e5, 1e7, 10);
    expect(s[0]).toBe(1e5);
    expect(s[s.length - 1]).toBe(1e7);
    expect(s.length).toBe(21);
    expect(s[10]).toBeCloseTo(1e6, 3);
  });
});
