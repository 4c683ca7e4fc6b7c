import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { simplifyPolyline } from '../../src/charts/simplify.js';

/** Distance from point p to the polyline through the kept points (independent of the implementation). */
function distanceToPolyline(px: number, py: number, xs: number[], ys: number[]): number {
  let best = Infinity;
  for (let i = 1; i < xs.length; i++) {
    const dx = xs[i] - xs[i - 1];
    const dy = ys[i] - ys[i - 1];
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - xs[i - 1]) * dx + (py - ys[i - 1]) * dy) / len2));
    best = Math.min(best, Math.hypot(px - xs[i - 1] - t * dx, py - ys[i - 1] - t * dy));
  }
  return xs.length === 1 ? Math.hypot(px - xs[0], py - ys[0]) : best;
}

describe('screen-space down-sampling', () => {
  it('reduces a straight line to its two ends', () => {
    const xs = Array.from({ length: 801 }, (_, i) => i * 0.7);
    const ys = xs.map((x) => 3 + 0.5 * x);
    expect(simplifyPolyline(xs, ys, 0.15)).toEqual([0, 800]);
  });

  it('keeps every point the caller marks, and the ends of each defined run', () => {
    const xs = Array.from({ length: 11 }, (_, i) => i);
    const ys = xs.map(() => 1);
    ys[5] = NaN; // a gap: two runs, 0..4 and 6..10
    expect(simplifyPolyline(xs, ys, 0.15, (i) => i === 2)).toEqual([0, 2, 4, 6, 10]);
  });

  it('keeps a sharp dip between sweep points', () => {
    const xs = [0, 1, 2, 3, 4];
    const ys = [10, 10, 90, 10, 10];
    expect(simplifyPolyline(xs, ys, 0.15)).toEqual([0, 1, 2, 3, 4]);
  });

  it('never moves the drawn line more than the tolerance from any dropped point (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -200, max: 200, noNaN: true }), { minLength: 2, maxLength: 300 }), fc.double({ min: 0.05, max: 2, noNaN: true }), (ys, tol) => {
        const xs = ys.map((_, i) => i * 0.7);
        const kept = simplifyPolyline(xs, ys, tol);
        const kx = kept.map((i) => xs[i]);
        const ky = kept.map((i) => ys[i]);
        expect(kept[0]).toBe(0);
        expect(kept[kept.length - 1]).toBe(ys.length - 1);
        for (let i = 0; i < ys.length; i++) expect(distanceToPolyline(xs[i], ys[i], kx, ky)).toBeLessThanOrEqual(tol + 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('handles a sweep of 100,000 points without recursion trouble', () => {
    const xs = Array.from({ length: 100_000 }, (_, i) => i / 100);
    const ys = xs.map((x) => 100 * Math.sin(x / 40));
    const kept = simplifyPolyline(xs, ys, 0.15);
    expect(kept.length).toBeGreaterThan(10);
    expect(kept.length).toBeLessThan(2000);
  });
});
