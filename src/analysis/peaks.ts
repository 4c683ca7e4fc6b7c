// Impedance peaks: local maxima of |Z| over a set of samples, each refined to 1e-9 relative in frequency
// (extremum.ts). The samples must resolve the impedance's features (a resolved sweep, feature-grid.ts):
// a peak that no sample shows is not searched for here.

import { EXTREMUM_TOLERANCE, magnitudeSlope, refineExtremum, type AdmittanceSlopeAt } from './extremum.js';

/** Relative tolerance on each peak frequency. */
export const PEAK_TOLERANCE = EXTREMUM_TOLERANCE;

export interface ImpedancePeak {
  frequencyHz: number;
  /** |Z| at the peak, Ω. */
  impedanceOhm: number;
  /** Index of the sample nearest below or at the peak. */
  index: number;
}

/**
 * Every interior local maximum of `magnitude` (|Z| at `frequencies`), refined between its neighbouring
 * samples. A maximum at either end of the samples is not a peak (|Z| may still be highest there).
 */
export function impedancePeaks(frequencies: Float64Array, magnitude: Float64Array, admittanceAt: AdmittanceSlopeAt): ImpedancePeak[] {
  const peaks: ImpedancePeak[] = [];
  const n = frequencies.length;
  const slopeAt = (i: number) => magnitudeSlope(admittanceAt(frequencies[i]));
  // A peak inside the first or last step shows on no interior sample; the slopes at the step's ends
  // tell: |Z| rising at the left end and falling at the right.
  const endStep = (i: number) => {
    if (n < 2 || !(slopeAt(i) < 0 && slopeAt(i + 1) > 0)) return;
    const refined = refineExtremum(frequencies[i], frequencies[i + 1], admittanceAt);
    if (refined && refined.impedanceOhm > Math.max(magnitude[i], magnitude[i + 1])) peaks.push({ ...refined, index: i });
  };
  if (!(n > 2 && magnitude[1] > magnitude[0] && magnitude[1] >= magnitude[2])) endStep(0);
  for (let i = 1; i < n - 1; i++) {
    if (!(magnitude[i] > magnitude[i - 1] && magnitude[i] >= magnitude[i + 1])) continue;
    const refined = refineExtremum(frequencies[i - 1], frequencies[i + 1], admittanceAt);
    // Refinement can only raise the value found on the samples; keep the sample if rounding says otherwise.
    const peak = refined && refined.impedanceOhm >= magnitude[i] ? refined : { frequencyHz: frequencies[i], impedanceOhm: magnitude[i] };
    const index = peak.frequencyHz < frequencies[i] ? i - 1 : i;
    peaks.push({ ...peak, index });
  }
  if (n > 2 && !(magnitude[n - 2] > magnitude[n - 3] && magnitude[n - 2] >= magnitude[n - 1])) endStep(n - 2);
  return peaks;
}
