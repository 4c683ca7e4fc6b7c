import { describe, expect, it } from 'vitest';
import { brentRoot, frequencyRoot } from '../../src/analysis/root.js';

describe("Brent's method", () => {
  it('finds √2 as the root of x² − 2 on [0, 2] to the asked tolerance', () => {
    expect(Math.abs(brentRoot((x) => x * x - 2, 0, 2, 1e-14) - Math.SQRT2)).toBeLessThan(1e-14);
  });
  it('finds the root of cos x − x (Dottie number 0.739085133215160…, from memory) in few steps', () => {
    let calls = 0;
    const x = brentRoot((t) => (calls++, Math.cos(t) - t), 0, 1, 1e-15);
    expect(Math.abs(x - 0.73908513321516)).toBeLessThan(1e-13);
    expect(calls).toBeLessThan(20);
  });
  it('returns NaN without a sign change', () => {
    expect(brentRoot((x) => x * x + 1, -1, 1, 1e-9)).toBeNaN();
  });
  it('converges on a step (a pole) by staying in the bracket', () => {
    const x = brentRoot((t) => (t < 0.3 ? -1 : 1), 0, 1, 1e-12);
    expect(Math.abs(x - 0.3)).toBeLessThan(1e-11);
  });
  it('frequencyRoot works in ln f for a relative tolerance', () => {
    const f = frequencyRoot((hz) => hz - 12345.678, 1e3, 1e5, 1e-12);
    expect(Math.abs(f / 12345.678 - 1)).toBeLessThan(1e-11);
  });
});
