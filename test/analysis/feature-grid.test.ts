import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor } from '../../src/circuit/element.js';
import { featureGrid, sweepIndices, sweepRange } from '../../src/analysis/feature-grid.js';
import { referenceZAt } from '../reference/impedance.js';

// A lightly damped parallel R-L-C tank (values invented): |Z| peaks at exactly R at f0 = 1/(2π√(LC)), and its
// poles are p = −α ± jω_d with α = 1/(2RC), ω_d = √(1/(LC) − α²) (Alexander & Sadiku, Fundamentals of
// Electric Circuits, 6th ed., §8.5 and §14.7). |Z| is evaluated with complex.js (test/reference/impedance.ts).
const R = 2000;
const L = 10e-9;
const C = 1e-6;
const tank = parallel(resistor(R), inductor(L), capacitor(C));
const alpha = 1 / (2 * R * C);
const omegaD = Math.sqrt(1 / (L * C) - alpha * alpha);
const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
const roots = [{ re: -alpha, im: omegaD }];

/** A log sweep, 10 points a decade from 1 kHz to 1 GHz, as parts and rails are swept. */
const sweep = Float64Array.from({ length: 61 }, (_, i) => 1e3 * 10 ** (i / 10));
const peakOf = (f: Float64Array) => Math.max(...Array.from(f, (x) => referenceZAt(tank, x).abs()));

describe('featureGrid', () => {
  it('the sweep alone misses the peak; the grid finds it within 0.1 %', () => {
    // Q = R·√(C/L) = 20,000: the peak is about 80 Hz wide at 1.6 MHz, between two sweep points.
    expect(peakOf(sweep)).toBeLessThan(0.01 * R);
    const grid = featureGrid(sweep, roots);
    expect(peakOf(grid)).toBeGreaterThan(0.999 * R);
    expect(peakOf(grid)).toBeLessThanOrEqual(R * (1 + 1e-12));
    expect(Math.abs(Math.log(f0 / (omegaD / (2 * Math.PI))))).toBeLessThan(1e-6);
  });
  it('keeps every sweep point bit for bit, ascending without repeats', () => {
    const grid = featureGrid(sweep, roots);
    expect(grid.length).toBeGreaterThan(sweep.length);
    const at = sweepIndices(grid, sweep);
    expect(Array.from(at, (j) => grid[j])).toEqual(Array.from(sweep));
    expect(grid.filter((x, i) => i > 0 && !(x > grid[i - 1])).length).toBe(0);
  });
  it('each gap of the ladder is no wider than its nearer end’s distance to the pole (α/4 at the centre) nor the sweep step', () => {
    // The ladder's rule: points at f_d ± (α/4)·2^k, so the spacing grows with the distance to the pole.
    const grid = featureGrid(sweep, roots);
    const fd = omegaD / (2 * Math.PI);
    const halfWidth = alpha / (2 * Math.PI);
    const j = sweep.findIndex((x) => x > fd);
    const step = sweep[j] - sweep[j - 1];
    let checked = 0;
    for (let k = 1; k < grid.length; k++) {
      const nearest = Math.min(Math.abs(grid[k] - fd), Math.abs(grid[k - 1] - fd));
      if (grid[k] > sweep[j] || grid[k - 1] < sweep[j - 1]) continue;
      expect(grid[k] - grid[k - 1]).toBeLessThanOrEqual(Math.min(step, Math.max(nearest, halfWidth / 4)) * (1 + 1e-9));
      checked++;
    }
    // From α/4 ≈ 20 Hz up to the 260 kHz step: about 14 doublings on each side.
    expect(checked).toBeGreaterThan(25);
  });
  it('adds nothing for a pole outside the sweep or one broader than the sweep step', () => {
    expect(featureGrid(sweep, [{ re: -1e3, im: 2 * Math.PI * 5e9 }])).toBe(sweep);
    // Heavily damped (α four times ω): α/4 at 1 MHz is wider than the sweep step there (about 260 kHz).
    expect(featureGrid(sweep, [{ re: -2 * Math.PI * 4e6, im: 2 * Math.PI * 1e6 }])).toBe(sweep);
    expect(featureGrid(sweep, [])).toBe(sweep);
  });
  it('sweepRange gives the ends', () => {
    expect(sweepRange(sweep)).toEqual({ fromHz: 1e3, toHz: sweep[60] });
  });
});
