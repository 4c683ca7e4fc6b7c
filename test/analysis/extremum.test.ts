// Extrema of |Z| against closed forms: a parallel R-L-C tank has its highest |Z| = R at f0 = 1/(2π√(LC)),
// and a series R-L-C its lowest |Z| = R at the same f0 (any circuits text, e.g. Alexander & Sadiku,
// Fundamentals of Electric Circuits, §14.5 and §14.6). Y and dY/dω are written here with complex.js, not
// with zfolio's kernels: tank Y = 1/R + jωC + 1/(jωL), dY/dω = j(C + 1/(ω²L)); series Z = R + jωL + 1/(jωC),
// dZ/dω = j(L + 1/(ω²C)), Y = 1/Z and dY/dω = −(dZ/dω)/Z² (the quotient rule).

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { EXTREMUM_TOLERANCE, goldenSectionMinimum, magnitudeSlope, nearestExtremum, refineExtremum, type AdmittanceSlopeAt } from '../../src/analysis/extremum.js';

const slopeOf = (y: Complex, dy: Complex) => ({ re: y.re, im: y.im, dRe: dy.re, dIm: dy.im });

function tank(r: number, l: number, c: number): AdmittanceSlopeAt {
  return (f) => {
    const w = 2 * Math.PI * f;
    const y = new Complex(1 / r, 0).add(new Complex(0, w * c)).add(new Complex(0, w * l).inverse());
    return slopeOf(y, new Complex(0, c + 1 / (w * w * l)));
  };
}

function series(r: number, l: number, c: number): AdmittanceSlopeAt {
  return (f) => {
    const w = 2 * Math.PI * f;
    const z = new Complex(r, w * l).add(new Complex(0, w * c).inverse());
    const dz = new Complex(0, l + 1 / (w * w * c));
    return slopeOf(z.inverse(), dz.neg().div(z.mul(z)));
  };
}

const f0 = (l: number, c: number) => 1 / (2 * Math.PI * Math.sqrt(l * c));
const magnitudeAt = (at: AdmittanceSlopeAt) => (f: number) => 1 / Math.hypot(at(f).re, at(f).im);
const logSamples = (from: number, to: number, n: number) => Float64Array.from({ length: n }, (_, i) => from * (to / from) ** (i / (n - 1)));

describe('refineExtremum', () => {
  it('finds a tank\'s maximum at f0 to its tolerance, with |Z| = R', () => {
    // 50 Ω ∥ 10 nH ∥ 100 nF: f0 = 5.0329 MHz.
    const peak = refineExtremum(1e6, 2e7, tank(50, 10e-9, 100e-9), 'maximum')!;
    expect(Math.abs(peak.frequencyHz / f0(10e-9, 100e-9) - 1)).toBeLessThanOrEqual(10 * EXTREMUM_TOLERANCE);
    expect(peak.impedanceOhm).toBeCloseTo(50, 9);
  });

  it('finds a series circuit\'s minimum at f0, with |Z| = R', () => {
    // 20 mΩ, 0.5 nH, 100 nF (a small capacitor's series model): f0 = 22.508 MHz.
    const dip = refineExtremum(5e6, 1e8, series(0.02, 0.5e-9, 100e-9), 'minimum')!;
    expect(Math.abs(dip.frequencyHz / f0(0.5e-9, 100e-9) - 1)).toBeLessThanOrEqual(10 * EXTREMUM_TOLERANCE);
    expect(dip.impedanceOhm).toBeCloseTo(0.02, 12);
  });

  it('gives the bracket\'s higher end where |Z| only rises across it (no maximum inside)', () => {
    // A tank below f0 is inductive: |Z| rises all the way to f0.
    const at = tank(50, 10e-9, 100e-9);
    const edge = refineExtremum(1e5, 1e6, at, 'maximum')!;
    expect(Math.abs(edge.frequencyHz / 1e6 - 1)).toBeLessThan(1e-6);
    expect(edge.impedanceOhm).toBeCloseTo(magnitudeAt(at)(1e6), 9);
  });
});

describe('magnitudeSlope', () => {
  it('is negative while |Z| rises and positive while it falls, by a finite difference of |Z|', () => {
    const at = tank(50, 10e-9, 100e-9);
    const z = magnitudeAt(at);
    for (const f of [1e5, 1e6, 4e6, 6e6, 1e7, 1e8]) {
      const rising = z(f * 1.0001) > z(f / 1.0001);
      expect(Math.sign(magnitudeSlope(at(f))), `${f} Hz`).toBe(rising ? -1 : 1);
    }
  });
});

describe('nearestExtremum', () => {
  const at = tank(50, 10e-9, 100e-9);
  const frequencies = logSamples(1e5, 1e9, 41);
  const z = magnitudeAt(at);
  const magnitude = (i: number) => z(frequencies[i]);

  it('walks uphill from either side to the sample nearest the peak and refines it', () => {
    for (const start of [0, 12, 30, 40]) {
      const peak = nearestExtremum(frequencies, magnitude, start, at, 'maximum');
      expect(peak.atSweepEnd).toBe(false);
      expect(Math.abs(peak.frequencyHz / f0(10e-9, 100e-9) - 1)).toBeLessThanOrEqual(10 * EXTREMUM_TOLERANCE);
      expect(peak.impedanceOhm).toBeCloseTo(50, 9);
      // The index is the sample at or below the peak.
      expect(frequencies[peak.index]).toBeLessThanOrEqual(peak.frequencyHz);
      expect(frequencies[peak.index + 1]).toBeGreaterThan(peak.frequencyHz);
    }
  });

  it('returns an end sample, unrefined, when the extremum lies beyond the sweep', () => {
    // Downhill from f0 a tank's |Z| falls to both ends: the lower end is the nearer minimum from below.
    const low = nearestExtremum(frequencies, magnitude, 5, at, 'minimum');
    expect(low).toEqual({ frequencyHz: frequencies[0], impedanceOhm: magnitude(0), index: 0, atSweepEnd: true });
    const high = nearestExtremum(frequencies, magnitude, 35, at, 'minimum');
    expect(high).toEqual({ frequencyHz: frequencies[40], impedanceOhm: magnitude(40), index: 40, atSweepEnd: true });
  });
});

describe('goldenSectionMinimum', () => {
  it('finds the vertex of a parabola, and of |x − a| (no derivative), to its tolerance', () => {
    expect(Math.abs(goldenSectionMinimum((x) => (x - 2.25) ** 2, 0, 5, 1e-10) - 2.25)).toBeLessThan(1e-9);
    expect(Math.abs(goldenSectionMinimum((x) => Math.abs(x + 0.7), -3, 1, 1e-10) + 0.7)).toBeLessThan(1e-9);
  });
});
