// Usable band: the contiguous frequency range where a part still behaves as its nominal type.
//   capacitor: X < 0 and |C_eff/C − 1| ≤ within, C_eff = −1/(ωX)
//   inductor:  X > 0 and |L_eff/L − 1| ≤ within, L_eff = X/ω
//   resistor:  |Z − R|/R ≤ within
//   bead:      the absorbing band around the loss peak, where the resistance above DC is at least the
//              reactance, R − R_dc ≥ |X|; for the r ‖ l ‖ c core this is G ≥ |B|, the half-power band.
// Effective-value criteria are common practice; for the plain series capacitor model the upper edge is
// SRF·√(1 − 1/(1 + within)) (from C_eff = C/(1 − (f/SRF)²)).

import { impedanceAt, type ImpedanceArrays } from '../circuit/impedance.js';
import type { ResolvedSweep } from './resolved-sweep.js';
import type { Element } from '../circuit/element.js';
import { frequencyRoot } from './root.js';
import { hypot } from '../circuit/hypot.js';

export type BandRule =
  | { behavesAs: 'capacitor'; nominal: number; within: number }
  | { behavesAs: 'inductor'; nominal: number; within: number }
  | { behavesAs: 'resistor'; nominal: number; within: number }
  | { behavesAs: 'bead'; dcResistanceOhm: number };

export interface UsableBand {
  fromHz: number;
  toHz: number;
  /** The lower edge is the sweep's first frequency: the band may go on below it. */
  fromIsSweepEnd: boolean;
  /** The upper edge is the sweep's last frequency: the band may go on above it. */
  toIsSweepEnd: boolean;
}

/** Relative tolerance on band edges. */
export const BAND_EDGE_TOLERANCE = 1e-9;

/** Signed margin of the rule at one impedance: ≥ 0 inside the band. Continuous across each edge. */
export function bandMargin(rule: BandRule, frequencyHz: number, re: number, im: number): number {
  const omega = 2 * Math.PI * frequencyHz;
  switch (rule.behavesAs) {
    case 'capacitor':
      if (!(im < 0)) return -1;
      return rule.within - Math.abs(-1 / (omega * im) / rule.nominal - 1);
    case 'inductor':
      if (!(im > 0)) return -1;
      return rule.within - Math.abs(im / omega / rule.nominal - 1);
    case 'resistor':
      return rule.within - hypot(re - rule.nominal, im) / rule.nominal;
    case 'bead':
      return re - rule.dcResistanceOhm - Math.abs(im);
  }
}

/**
 * The usable band over a resolved sweep (every narrow feature sampled), edges refined by root finding; null
 * when no sample qualifies.
 */
export function usableBand(element: Element, rule: BandRule, { frequencies, z }: ResolvedSweep): UsableBand | null {
  const n = frequencies.length;
  const inside = new Uint8Array(n);
  for (let i = 0; i < n; i++) inside[i] = bandMargin(rule, frequencies[i], z.re[i], z.im[i]) >= 0 ? 1 : 0;

  const runs = insideRuns(inside);
  if (runs.length === 0) return null;
  const run = rule.behavesAs === 'bead' ? runAroundLossPeak(runs, rule.dcResistanceOhm, z) : widestRun(runs, frequencies);

  const margin = (f: number) => {
    const [re, im] = impedanceAt(element, f);
    return bandMargin(rule, f, re, im);
  };
  const [first, last] = run;
  const fromIsSweepEnd = first === 0;
  const toIsSweepEnd = last === n - 1;
  // Where the refined margin disagrees with the samples' (rounding at an edge), the inside sample is the edge.
  const edge = (low: number, inside: number) => {
    const f = frequencyRoot(margin, frequencies[low], frequencies[low + 1], BAND_EDGE_TOLERANCE);
    return Number.isFinite(f) ? f : frequencies[inside];
  };
  const fromHz = fromIsSweepEnd ? frequencies[0] : edge(first - 1, first);
  const toHz = toIsSweepEnd ? frequencies[n - 1] : edge(last, last);
  return { fromHz, toHz, fromIsSweepEnd, toIsSweepEnd };
}

/** Runs of consecutive inside points, as [first, last] index pairs. */
function insideRuns(inside: Uint8Array): [number, number][] {
  const runs: [number, number][] = [];
  let start = -1;
  for (let i = 0; i <= inside.length; i++) {
    const isIn = i < inside.length && inside[i] === 1;
    if (isIn && start < 0) start = i;
    if (!isIn && start >= 0) {
      runs.push([start, i - 1]);
      start = -1;
    }
  }
  return runs;
}

/** The run spanning the most decades; the lowest one on a tie. */
function widestRun(runs: [number, number][], frequencies: Float64Array): [number, number] {
  let best = runs[0];
  let bestWidth = -1;
  for (const run of runs) {
    const width = Math.log(frequencies[run[1]] / frequencies[run[0]]);
    if (width > bestWidth) {
      best = run;
      bestWidth = width;
    }
  }
  return best;
}

/** The run holding the sweep point of greatest resistance above DC (the bead's loss peak). */
function runAroundLossPeak(runs: [number, number][], dcResistanceOhm: number, z: ImpedanceArrays): [number, number] {
  let best = runs[0];
  let bestLoss = -Infinity;
  for (const run of runs) {
    for (let i = run[0]; i <= run[1]; i++) {
      const loss = z.re[i] - dcResistanceOhm;
      if (loss > bestLoss) {
        bestLoss = loss;
        best = run;
      }
    }
  }
  return best;
}
