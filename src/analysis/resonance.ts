// Self-resonances: frequencies where the reactance X crosses zero. A crossing from capacitive (X < 0) to
// inductive (X > 0) is a series resonance, |Z| near a minimum; from inductive to capacitive is a parallel
// (anti-)resonance, |Z| near a maximum (Foster's reactance theorem: dX/dω > 0 for a lossless one-port, so
// the downward steps of X are poles; e.g. Pozar, Microwave Engineering, 4th ed., §4.1 and §6.1).

import { impedanceAt, type ImpedanceArrays } from '../circuit/impedance.js';
import type { Element } from '../circuit/element.js';
import { frequencyRoot } from './root.js';

export type ResonanceType = 'series' | 'parallel';

export interface Resonance {
  frequencyHz: number;
  type: ResonanceType;
  /** |Z| at the resonance, Ω (the resistance there, since X = 0). */
  impedanceOhm: number;
}

/** Relative tolerance on each resonance frequency. */
export const RESONANCE_TOLERANCE = 1e-9;

/**
 * Every X = 0 crossing between sweep points, refined by root finding on X(f) to 1e-9 relative.
 * Two crossings closer together than one sweep step are not resolved; the sweep density sets that limit.
 */
export function selfResonances(element: Element, frequencies: Float64Array, z: ImpedanceArrays): Resonance[] {
  const found: Resonance[] = [];
  const reactance = (f: number) => impedanceAt(element, f)[1];
  let lastIndex = -1;
  let lastSign = 0;
  for (let i = 0; i < frequencies.length; i++) {
    const sign = Math.sign(z.im[i]);
    if (sign === 0 || Number.isNaN(sign)) continue;
    if (lastSign !== 0 && sign !== lastSign) {
      const f = frequencyRoot(reactance, frequencies[lastIndex], frequencies[i], RESONANCE_TOLERANCE);
      if (Number.isFinite(f)) {
        const [re, im] = impedanceAt(element, f);
        found.push({ frequencyHz: f, type: sign > 0 ? 'series' : 'parallel', impedanceOhm: Math.hypot(re, im) });
      }
    }
    lastIndex = i;
    lastSign = sign;
  }
  return found;
}
