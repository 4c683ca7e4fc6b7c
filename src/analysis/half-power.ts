// The half-power frequencies of a series resonance: either side of it, where |X| = R, so |Y|² = G² + B² is
// half its peak 1/R² (a series R-L-C; any circuit-analysis text on resonance). In the admittance plane they
// are the top and bottom of the resonance circle, where |B| = G; their spacing gives the resonance's
// Q = f0/(f2 − f1).

import type { Element } from '../circuit/element.js';
import { impedanceAt } from '../circuit/impedance.js';

/** What the search reads: the sweep with its impedance, and the model when there is one. */
export interface HalfPowerInput {
  frequencies: ArrayLike<number>;
  z: { re: ArrayLike<number>; im: ArrayLike<number> };
  network?: Element;
}

/** Y = 1/Z at `f`: from the model where there is one, else from the last sweep point at or below `f`. */
export function admittanceAt(input: HalfPowerInput, f: number): [number, number] {
  let re: number;
  let im: number;
  if (input.network) [re, im] = impedanceAt(input.network, f);
  else {
    const fs = input.frequencies;
    let i = 0;
    while (i + 1 < fs.length && fs[i + 1] <= f) i++;
    re = input.z.re[i];
    im = input.z.im[i];
  }
  const d = re * re + im * im;
  return [re / d, -im / d];
}

/**
 * f1 < f0 < f2 where |B| = G nearest the series resonance at `f0`: walked out from f0 on the sweep, then
 * bisected in ln f to 1e-12 relative. Null when the sweep ends before either, or the resonance is so lossy
 * that |B| > G at f0 itself.
 */
export function halfPowerFrequencies(input: HalfPowerInput, f0: number): [number, number] | null {
  const excess = (f: number) => {
    const [g, b] = admittanceAt(input, f);
    return Math.abs(b) - g;
  };
  if (!(excess(f0) < 0)) return null;
  const fs = input.frequencies;
  const edge = (step: 1 | -1): number | null => {
    // The sweep point beyond which |B| first exceeds G, walking away from f0.
    let inside = f0;
    let i = 0;
    while (i < fs.length && fs[i] <= f0) i++;
    if (step < 0) i--;
    for (; i >= 0 && i < fs.length; i += step) {
      if (excess(fs[i]) > 0) {
        let a = Math.log(inside);
        let b = Math.log(fs[i]);
        for (let k = 0; k < 80 && Math.abs(b - a) > 1e-12; k++) {
          const mid = (a + b) / 2;
          if (excess(Math.exp(mid)) > 0) b = mid;
          else a = mid;
        }
        return Math.exp((a + b) / 2);
      }
      inside = fs[i];
    }
    return null;
  };
  const f1 = edge(-1);
  const f2 = edge(1);
  return f1 !== null && f2 !== null ? [f1, f2] : null;
}
