// Impedance peaks of a parallel R-L-C tank, against its closed form: Y = 1/R + jωC + 1/(jωL), so |Z| is
// highest where ωC = 1/(ωL), at f0 = 1/(2π√(LC)), and there |Z| = R (any circuits text, e.g. Alexander &
// Sadiku, Fundamentals of Electric Circuits, §14.6). dY/dω = j(C + 1/(ω²L)) in closed form too.

import { describe, expect, it } from 'vitest';
import { impedancePeaks, PEAK_TOLERANCE } from '../../src/analysis/peaks.js';
import type { AdmittanceSlopeAt } from '../../src/analysis/extremum.js';

function tank(r: number, l: number, c: number): { admittanceAt: AdmittanceSlopeAt; magnitude: (f: number) => number; f0: number } {
  const admittanceAt = (f: number) => {
    const w = 2 * Math.PI * f;
    return { re: 1 / r, im: w * c - 1 / (w * l), dRe: 0, dIm: c + 1 / (w * w * l) };
  };
  const magnitude = (f: number) => {
    const y = admittanceAt(f);
    return 1 / Math.hypot(y.re, y.im);
  };
  return { admittanceAt, magnitude, f0: 1 / (2 * Math.PI * Math.sqrt(l * c)) };
}

const logSamples = (from: number, to: number, n: number) => Float64Array.from({ length: n }, (_, i) => from * (to / from) ** (i / (n - 1)));

describe('impedancePeaks', () => {
  it('finds a tank\'s one peak at f0 to its tolerance, with |Z| = R', () => {
    // 10 nH ∥ 100 nF ∥ 50 Ω: f0 = 5.0329 MHz.
    const t = tank(50, 10e-9, 100e-9);
    const f = logSamples(1e5, 1e9, 41);
    const peaks = impedancePeaks(f, Float64Array.from(f, t.magnitude), t.admittanceAt);
    expect(peaks).toHaveLength(1);
    expect(Math.abs(peaks[0].frequencyHz / t.f0 - 1)).toBeLessThanOrEqual(10 * PEAK_TOLERANCE);
    expect(peaks[0].impedanceOhm).toBeCloseTo(50, 9);
    expect(f[peaks[0].index]).toBeLessThanOrEqual(peaks[0].frequencyHz);
    expect(f[peaks[0].index + 1]).toBeGreaterThan(peaks[0].frequencyHz);
  });

  it('finds a peak that falls inside the first step, where no interior sample shows it', () => {
    const t = tank(1e3, 1e-6, 1e-9); // f0 = 5.0329 MHz
    const f = Float64Array.of(4e6, 8e6, 2e7, 5e7);
    const peaks = impedancePeaks(f, Float64Array.from(f, t.magnitude), t.admittanceAt);
    expect(peaks).toHaveLength(1);
    expect(Math.abs(peaks[0].frequencyHz / t.f0 - 1)).toBeLessThanOrEqual(10 * PEAK_TOLERANCE);
    expect(peaks[0].index).toBe(0);
  });

  it('finds no peak where |Z| only falls (the samples all above f0) or only rises (all below)', () => {
    const t = tank(50, 10e-9, 100e-9);
    for (const f of [logSamples(1e7, 1e9, 30), logSamples(1e3, 1e6, 30)]) {
      expect(impedancePeaks(f, Float64Array.from(f, t.magnitude), t.admittanceAt)).toEqual([]);
    }
  });
});
