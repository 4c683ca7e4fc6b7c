// A sweep that sees every feature of one impedance: the library's sweep plus ladders of points around
// the natural frequencies of the tree (feature-grid.ts), with Z evaluated on all of them. Resonances,
// extrema and band edges are searched on this, never on the plain sweep.

import { impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import type { Element } from '../circuit/element.js';
import { naturalFrequencies } from '../circuit/natural-frequencies.js';
import { featureGrid, sweepRange } from './feature-grid.js';

export interface ResolvedSweep {
  /** Ascending frequencies, Hz: the sweep's own points and the ladders. */
  frequencies: Float64Array;
  z: ImpedanceArrays;
}

/** The sweep refined around every pole and zero of the tree's impedance, with Z there. */
export function resolvedSweep(element: Element, sweep: Float64Array, z?: ImpedanceArrays): ResolvedSweep {
  const { poles, zeros } = naturalFrequencies(element, sweepRange(sweep));
  const frequencies = featureGrid(sweep, [...poles, ...zeros]);
  if (frequencies === sweep) return { frequencies, z: z ?? impedanceSweep(element, sweep) };
  return { frequencies, z: impedanceSweep(element, frequencies) };
}
