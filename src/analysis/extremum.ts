// Local extrema of |Z| between two frequencies, refined to 1e-9 relative in frequency.
//
// A maximum of |Z| is a minimum of |Y|² and a minimum of |Z| a maximum of |Y|², so each lies where
// d|Y|²/dω = 2·Re(conj(Y)·dY/dω) crosses zero. With the exact slope (src/circuit/slope.ts) that crossing is
// found by Brent's root finder in ln f (R. P. Brent, Algorithms for Minimization without Derivatives, 1973,
// ch. 4), which reaches 1e-9 where a search on |Z| values alone stalls near √ε (a smooth extremum is flat to
// second order). Where the slope does not change sign inside the bracket (a flat top at rounding level),
// golden-section search on |Y|² in ln f takes over (J. Kiefer, "Sequential minimax search for a maximum",
// Proc. AMS 4, 1953).

import type { ImpedanceSlope } from '../circuit/slope.js';
import { frequencyRoot } from './root.js';
import { hypot } from '../circuit/hypot.js';

/** Relative tolerance on the frequency of each extremum. */
export const EXTREMUM_TOLERANCE = 1e-9;

/** Y (S) and dY/dω (S·s) of a one-port at a frequency (Hz). */
export type AdmittanceSlopeAt = (frequencyHz: number) => ImpedanceSlope;

export type ExtremumKind = 'maximum' | 'minimum';

export interface ImpedancePoint {
  frequencyHz: number;
  /** |Z| there, Ω. */
  impedanceOhm: number;
}

/** Half of d|Y|²/dω: negative while |Z| rises, positive while it falls. */
export function magnitudeSlope(y: ImpedanceSlope): number {
  return y.re * y.dRe + y.im * y.dIm;
}

const magnitudeOf = (y: ImpedanceSlope) => 1 / hypot(y.re, y.im);

/** The maximum (or minimum) of |Z| between `lowHz` and `highHz`. */
export function refineExtremum(lowHz: number, highHz: number, admittanceAt: AdmittanceSlopeAt, kind: ExtremumKind = 'maximum'): ImpedancePoint | undefined {
  // For a maximum of |Z| the slope of |Y|² goes from negative to positive; for a minimum the other way.
  const sign = kind === 'maximum' ? 1 : -1;
  const slope = (f: number) => sign * magnitudeSlope(admittanceAt(f));
  let f = NaN;
  if (slope(lowHz) < 0 && slope(highHz) > 0) f = frequencyRoot(slope, lowHz, highHz, EXTREMUM_TOLERANCE);
  if (!Number.isFinite(f)) {
    const objective = (u: number) => sign * magnitudeOf(admittanceAt(Math.exp(u))) ** -2;
    f = Math.exp(goldenSectionMinimum(objective, Math.log(lowHz), Math.log(highHz), EXTREMUM_TOLERANCE));
  }
  if (!Number.isFinite(f)) return undefined;
  const impedanceOhm = magnitudeOf(admittanceAt(f));
  return Number.isFinite(impedanceOhm) ? { frequencyHz: f, impedanceOhm } : undefined;
}

/**
 * From sample `start`, walk `magnitude` uphill (maximum) or downhill (minimum) to the nearest local extremum
 * of the samples, and refine it between its neighbours. An extremum at an end of the samples is returned as
 * that sample, unrefined (the true one may lie beyond the sweep).
 */
export function nearestExtremum(
  frequencies: Float64Array,
  magnitude: (i: number) => number,
  start: number,
  admittanceAt: AdmittanceSlopeAt,
  kind: ExtremumKind,
): ImpedancePoint & { index: number; atSweepEnd: boolean } {
  const n = frequencies.length;
  const better = (a: number, b: number) => (kind === 'maximum' ? a > b : a < b);
  let i = start;
  for (;;) {
    if (i + 1 < n && better(magnitude(i + 1), magnitude(i))) i++;
    else if (i > 0 && better(magnitude(i - 1), magnitude(i))) i--;
    else break;
  }
  const sample = { frequencyHz: frequencies[i], impedanceOhm: magnitude(i), index: i };
  if (i === 0 || i === n - 1) return { ...sample, atSweepEnd: true };
  const refined = refineExtremum(frequencies[i - 1], frequencies[i + 1], admittanceAt, kind);
  // Refinement can only improve on the samples; keep the sample if rounding says otherwise.
  if (!refined || !(refined.impedanceOhm === sample.impedanceOhm || better(refined.impedanceOhm, sample.impedanceOhm))) return { ...sample, atSweepEnd: false };
  return { ...refined, index: refined.frequencyHz < frequencies[i] ? i - 1 : i, atSweepEnd: false };
}

const INVERSE_PHI = (Math.sqrt(5) - 1) / 2;

/** Golden-section search for a minimum of `fn` on [a, b], to absolute tolerance `tolerance`. */
export function goldenSectionMinimum(fn: (x: number) => number, a: number, b: number, tolerance: number): number {
  let c = b - INVERSE_PHI * (b - a);
  let d = a + INVERSE_PHI * (b - a);
  let fc = fn(c);
  let fd = fn(d);
  for (let i = 0; i < 200 && Math.abs(b - a) > tolerance; i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - INVERSE_PHI * (b - a);
      fc = fn(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + INVERSE_PHI * (b - a);
      fd = fn(d);
    }
  }
  return (a + b) / 2;
}
