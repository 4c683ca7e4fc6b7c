// A part's headline extrema, refined rather than read off the sweep: the greatest |Z| (a bead's peak) and
// the greatest Q = |X|/R with the reactance of the part's own kind (an inductor's figure of merit).

import type { Element } from '../circuit/element.js';
import { impedanceAt } from '../circuit/impedance.js';
import { EXTREMUM_TOLERANCE, goldenSectionMinimum, type ImpedancePoint } from './extremum.js';
import { impedancePeaks } from './peaks.js';
import { treeAdmittanceSlope } from './resonance.js';
import type { ResolvedSweep } from './resolved-sweep.js';
import { hypot } from '../circuit/hypot.js';

export interface QualityPeak {
  frequencyHz: number;
  q: number;
}

/** The greatest |Z| over the sweep: at an end, or at a refined interior maximum. */
export function peakImpedance(element: Element, { frequencies, z }: ResolvedSweep): ImpedancePoint & { atSweepEnd: boolean } {
  const n = frequencies.length;
  const magnitude = new Float64Array(n);
  for (let i = 0; i < n; i++) magnitude[i] = hypot(z.re[i], z.im[i]);
  let best = { frequencyHz: frequencies[0], impedanceOhm: magnitude[0], atSweepEnd: true };
  if (magnitude[n - 1] > best.impedanceOhm) best = { frequencyHz: frequencies[n - 1], impedanceOhm: magnitude[n - 1], atSweepEnd: true };
  for (const peak of impedancePeaks(frequencies, magnitude, treeAdmittanceSlope(element))) {
    if (peak.impedanceOhm > best.impedanceOhm) best = { frequencyHz: peak.frequencyHz, impedanceOhm: peak.impedanceOhm, atSweepEnd: false };
  }
  return best;
}

/**
 * The greatest Q = |X|/R where X has the sign `sign` (+1 inductive, −1 capacitive) and R > 0, refined by
 * golden-section search between the neighbours of the best sample; undefined when no sample qualifies.
 */
export function peakQuality(element: Element, { frequencies, z }: ResolvedSweep, sign: 1 | -1): QualityPeak | undefined {
  const qOf = (re: number, im: number) => (Math.sign(im) === sign && re > 0 ? Math.abs(im) / re : -Infinity);
  let best = -1;
  for (let i = 0; i < frequencies.length; i++) {
    const q = qOf(z.re[i], z.im[i]);
    if (q > -Infinity && (best < 0 || q > qOf(z.re[best], z.im[best]))) best = i;
  }
  if (best < 0) return undefined;
  const sampled = { frequencyHz: frequencies[best], q: qOf(z.re[best], z.im[best]) };
  if (!Number.isFinite(sampled.q)) return undefined;
  if (best === 0 || best === frequencies.length - 1) return sampled;
  const qAt = (u: number) => {
    const [re, im] = impedanceAt(element, Math.exp(u));
    return qOf(re, im);
  };
  const u = goldenSectionMinimum((x) => -qAt(x), Math.log(frequencies[best - 1]), Math.log(frequencies[best + 1]), EXTREMUM_TOLERANCE);
  const q = qAt(u);
  return Number.isFinite(q) && q >= sampled.q ? { frequencyHz: Math.exp(u), q } : sampled;
}
