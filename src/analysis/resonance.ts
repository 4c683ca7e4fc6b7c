// Self-resonances: frequencies where the reactance X crosses zero. A crossing from capacitive (X < 0) to
// inductive (X > 0) is a series resonance, |Z| near a minimum; from inductive to capacitive is a parallel
// (anti-)resonance, |Z| near a maximum (Foster's reactance theorem: dX/dω > 0 for a lossless one-port, so
// the downward steps of X are poles; e.g. Pozar, Microwave Engineering, 4th ed., §4.1 and §6.1).
//
// With losses the |Z| extremum is not where X = 0 (a lossy parallel resonance peaks below its X = 0
// frequency), so each resonance names both: the X = 0 frequency and the nearest minimum (series) or
// maximum (parallel) of |Z|.

import type { Element } from '../circuit/element.js';
import { impedanceAt } from '../circuit/impedance.js';
import { admittanceSlope, impedanceSlopeAt } from '../circuit/slope.js';
import { nearestExtremum, type AdmittanceSlopeAt, type ImpedancePoint } from './extremum.js';
import type { ResolvedSweep } from './resolved-sweep.js';
import { frequencyRoot } from './root.js';
import { hypot } from '../circuit/hypot.js';

export type ResonanceType = 'series' | 'parallel';

export interface Resonance {
  /** Where X = 0, Hz. */
  frequencyHz: number;
  type: ResonanceType;
  /** |Z| where X = 0, Ω (the resistance there). */
  impedanceOhm: number;
  /** The nearest minimum of |Z| (series) or maximum (parallel); at a sweep end when it lies beyond. */
  extremum: ImpedancePoint & { atSweepEnd: boolean };
}

/** Relative tolerance on each resonance frequency. */
export const RESONANCE_TOLERANCE = 1e-9;

/**
 * Reactance this small against |Z| is rounding noise, not a sign: evaluating a tree makes errors of a few
 * ulps of |Z| (ε ≈ 2.2e-16), and a network whose X is zero or nearly cancels at every frequency would
 * otherwise show sign changes, "resonances", wherever the noise flips. 1e-12 is about 4,500 ulps.
 */
export const REACTANCE_NOISE = 1e-12;

/** The sign of X at one impedance: 0 when X is within rounding noise of zero. */
export function reactanceSign(re: number, im: number): number {
  if (!(Math.abs(im) > REACTANCE_NOISE * hypot(re, im))) return 0;
  return Math.sign(im);
}

/**
 * Is `r` the self-resonance? Compared by value, not identity: an analysis copied between threads or read
 * back from JSON holds equal, not identical, objects.
 */
export function isSelfResonance(r: Resonance, self: Resonance | undefined): boolean {
  return self !== undefined && r.frequencyHz === self.frequencyHz && r.type === self.type;
}

/** Y and dY/dω of a tree at a frequency (Hz), for extremum searches. */
export function treeAdmittanceSlope(element: Element): AdmittanceSlopeAt {
  return (f) => admittanceSlope(impedanceSlopeAt(element, 2 * Math.PI * f));
}

/**
 * Every X = 0 crossing between the samples of a resolved sweep, refined by root finding on X(f) to 1e-9
 * relative. The resolved sweep samples every lightly damped pole and zero closely enough that resonances
 * closer together than the library's sweep step are told apart.
 */
export function selfResonances(element: Element, sweep: ResolvedSweep): Resonance[] {
  const { frequencies, z } = sweep;
  const found: Resonance[] = [];
  const reactance = (f: number) => {
    const [re, im] = impedanceAt(element, f);
    return reactanceSign(re, im) === 0 ? 0 : im;
  };
  const magnitude = (i: number) => hypot(z.re[i], z.im[i]);
  const admittanceAt = treeAdmittanceSlope(element);
  let lastIndex = -1;
  let lastSign = 0;
  for (let i = 0; i < frequencies.length; i++) {
    const sign = reactanceSign(z.re[i], z.im[i]);
    if (sign === 0) continue;
    if (lastSign !== 0 && sign !== lastSign) {
      const f = frequencyRoot(reactance, frequencies[lastIndex], frequencies[i], RESONANCE_TOLERANCE);
      if (Number.isFinite(f)) {
        const [re, im] = impedanceAt(element, f);
        const type = sign > 0 ? 'series' : 'parallel';
        // Start from the bracketing sample on the extremum's side and walk to the nearest extremum.
        const start = (type === 'series') === magnitude(lastIndex) < magnitude(i) ? lastIndex : i;
        const { index: _, ...extremum } = nearestExtremum(frequencies, magnitude, start, admittanceAt, type === 'series' ? 'minimum' : 'maximum');
        found.push({ frequencyHz: f, type, impedanceOhm: hypot(re, im), extremum });
      }
    }
    lastIndex = i;
    lastSign = sign;
  }
  return found;
}
