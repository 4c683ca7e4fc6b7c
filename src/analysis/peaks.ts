// Impedance peaks: local maxima of |Z| over a sweep, each refined to 1e-9 relative in frequency.
//
// A maximum of |Z| is a minimum of |Y|², so it lies where d|Y|²/dω = 2·Re(conj(Y)·dY/dω) crosses zero from
// below. With the exact slope (src/circuit/slope.ts) that crossing is found by Brent's root finder in ln f
// (R. P. Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4), which reaches 1e-9 where a
// search on |Z| values alone stalls near √ε (a smooth peak is flat to second order). Where the slope does
// not change sign inside the bracket (two extrema closer than a sweep step, or a flat top at rounding
// level), golden-section search on |Y|² in ln f takes over (J. Kiefer, "Sequential minimax search for a
// maximum", Proc. AMS 4, 1953).

import type { ImpedanceSlope } from '../circuit/slope.js';
import { frequencyRoot } from './root.js';

/** Relative tolerance on each peak frequency. */
export const PEAK_TOLERANCE = 1e-9;

/** Y (S) and dY/dω (S·s) of a one-port at a frequency (Hz). */
export type AdmittanceSlopeAt = (frequencyHz: number) => ImpedanceSlope;

export interface ImpedancePeak {
  frequencyHz: number;
  /** |Z| at the peak, Ω. */
  impedanceOhm: number;
  /** Index of the sweep point nearest below or at the peak. */
  index: number;
}

/** Half of d|Y|²/dω: negative while |Z| rises, positive once it falls. */
function magnitudeSlope(y: ImpedanceSlope): number {
  return y.re * y.dRe + y.im * y.dIm;
}

const magnitudeOf = (y: ImpedanceSlope) => 1 / Math.hypot(y.re, y.im);

/**
 * Every interior local maximum of `magnitude` (|Z| at `frequencies`), refined between its neighbouring
 * sweep points. A maximum at either end of the sweep is not a peak (|Z| may still be highest there).
 */
export function impedancePeaks(frequencies: Float64Array, magnitude: Float64Array, admittanceAt: AdmittanceSlopeAt): ImpedancePeak[] {
  const peaks: ImpedancePeak[] = [];
  const n = frequencies.length;
  const slopeAt = (i: number) => magnitudeSlope(admittanceAt(frequencies[i]));
  // A peak inside the first or last step shows on no interior sweep point; the slopes at the step's ends
  // tell: |Z| rising at the left end and falling at the right.
  const endStep = (i: number) => {
    if (n < 2 || !(slopeAt(i) < 0 && slopeAt(i + 1) > 0)) return;
    const refined = refinePeak(frequencies[i], frequencies[i + 1], admittanceAt);
    if (refined && refined.impedanceOhm > Math.max(magnitude[i], magnitude[i + 1])) peaks.push({ ...refined, index: i });
  };
  if (!(n > 2 && magnitude[1] > magnitude[0] && magnitude[1] >= magnitude[2])) endStep(0);
  for (let i = 1; i < n - 1; i++) {
    if (!(magnitude[i] > magnitude[i - 1] && magnitude[i] >= magnitude[i + 1])) continue;
    const refined = refinePeak(frequencies[i - 1], frequencies[i + 1], admittanceAt);
    // Refinement can only raise the value found on the grid; keep the grid point if rounding says otherwise.
    const peak = refined && refined.impedanceOhm >= magnitude[i] ? refined : { frequencyHz: frequencies[i], impedanceOhm: magnitude[i] };
    const index = peak.frequencyHz < frequencies[i] ? i - 1 : i;
    peaks.push({ ...peak, index });
  }
  if (n > 2 && !(magnitude[n - 2] > magnitude[n - 3] && magnitude[n - 2] >= magnitude[n - 1])) endStep(n - 2);
  return peaks;
}

/** The maximum of |Z| between `lowHz` and `highHz`, to PEAK_TOLERANCE relative. */
export function refinePeak(lowHz: number, highHz: number, admittanceAt: AdmittanceSlopeAt): { frequencyHz: number; impedanceOhm: number } | undefined {
  const slope = (f: number) => magnitudeSlope(admittanceAt(f));
  let f = NaN;
  if (slope(lowHz) < 0 && slope(highHz) > 0) f = frequencyRoot(slope, lowHz, highHz, PEAK_TOLERANCE);
  if (!Number.isFinite(f)) {
    const squaredAdmittance = (u: number) => magnitudeOf(admittanceAt(Math.exp(u))) ** -2;
    f = Math.exp(goldenSectionMinimum(squaredAdmittance, Math.log(lowHz), Math.log(highHz), PEAK_TOLERANCE));
  }
  if (!Number.isFinite(f)) return undefined;
  return { frequencyHz: f, impedanceOhm: magnitudeOf(admittanceAt(f)) };
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
