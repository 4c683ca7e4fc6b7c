// Logarithmic sweeps: points evenly spaced in log10 f, a fixed count a decade, both ends included
// (the usual log sweep of an impedance analyser; common practice).

import { describe, expect, it } from 'vitest';
import { logSweep, roundedSweep } from '../../src/circuit/sweep.js';

describe('logSweep', () => {
  it('100 Hz to 10 GHz at 100 a decade: 8 decades, 801 points, ends exact, each step 10^(1/100)', () => {
    const f = logSweep({ fromHz: 100, toHz: 10e9, perDecade: 100 });
    expect(f.length).toBe(801);
    expect(f[0]).toBe(100);
    expect(f[800]).toBe(10e9);
    const step = 10 ** (1 / 100);
    for (let i = 1; i < f.length; i++) expect(f[i] / f[i - 1]).toBeCloseTo(step, 12);
    // A whole decade lands on its power of ten (to rounding).
    expect(f[100]).toBeCloseTo(1000, 9);
    expect(f[400] / 1e6).toBeCloseTo(1, 12);
  });

  it('spreads a fraction of a decade over whole steps: 1 kHz to 5 kHz at 10 a decade', () => {
    const f = logSweep({ fromHz: 1e3, toHz: 5e3, perDecade: 10 });
    // log10(5) = 0.69897 decades → 7 steps (the count rounded up), 8 points.
    expect(f.length).toBe(8);
    expect(f[7]).toBe(5e3);
    const step = 5 ** (1 / 7);
    for (let i = 1; i < f.length; i++) expect(f[i] / f[i - 1]).toBeCloseTo(step, 12);
  });

  it('gives the same bits every time', () => {
    const spec = { fromHz: 12.5, toHz: 3.3e9, perDecade: 37 };
    expect(Array.from(logSweep(spec))).toEqual(Array.from(logSweep(spec)));
  });

  it.each([
    [{ fromHz: 0, toHz: 1e3, perDecade: 10 }],
    [{ fromHz: 1e3, toHz: 1e3, perDecade: 10 }],
    [{ fromHz: 1e3, toHz: 1e2, perDecade: 10 }],
    [{ fromHz: 1, toHz: 1e3, perDecade: 0 }],
    [{ fromHz: NaN, toHz: 1e3, perDecade: 10 }],
  ])('refuses %j', (spec) => {
    expect(() => logSweep(spec)).toThrow(RangeError);
  });
});

describe('roundedSweep', () => {
  it('is logSweep with each point rounded to the given significant digits (ECMA-262 toPrecision), the ends exact', () => {
    const spec = { fromHz: 100, toHz: 1e10, perDecade: 100 };
    const exact = logSweep(spec);
    const rounded = roundedSweep(spec, 6);
    expect(rounded).toHaveLength(exact.length);
    expect(rounded[0]).toBe(100);
    expect(rounded[rounded.length - 1]).toBe(1e10);
    // 10^(2 + 1/100) = 102.329299… (a calculator's value), written 102.329.
    expect(rounded[1]).toBe(102.329);
    rounded.forEach((f, i) => {
      // Half a unit in the 6th digit: at most 5e-6 of the value.
      expect(Math.abs(f - exact[i])).toBeLessThanOrEqual(5e-6 * exact[i]);
      expect(f.toPrecision(6)).toBe(exact[i].toPrecision(6));
      if (i > 0) expect(f).toBeGreaterThan(rounded[i - 1]);
    });
  });
});
