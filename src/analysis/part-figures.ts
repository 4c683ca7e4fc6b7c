// Everything zfolio states about one part: its impedance over the sweep, resonances, usable band and the
// headline figures a datasheet page or `zfolio figures` prints.

import { dcResistance } from '../circuit/element.js';
import { impedanceAt, impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import { logSweep, type SweepSpec } from '../circuit/sweep.js';
import type { Part } from '../model/part.js';
import { usableBand, type BandRule, type UsableBand } from './band.js';
import { selfResonances, type Resonance } from './resonance.js';

export interface PartAnalysis {
  part: Part;
  sweep: SweepSpec;
  frequencies: Float64Array;
  z: ImpedanceArrays;
  resonances: Resonance[];
  /** The self-resonant frequency: a capacitor's first series resonance, an inductor's or bead's first parallel one. */
  selfResonance?: Resonance;
  bandRule?: BandRule;
  usableBand: UsableBand | null;
  /** The criterion used for the band (|value_eff/nominal − 1| ≤ within), when the rule has one. */
  within?: number;
}

export function bandRuleOf(part: Part, within: number): BandRule | undefined {
  switch (part.behavesAs) {
    case 'capacitor':
    case 'inductor':
    case 'resistor':
      return part.nominal === undefined ? undefined : { behavesAs: part.behavesAs, nominal: part.nominal, within };
    case 'bead':
      return { behavesAs: 'bead', dcResistanceOhm: dcResistance(part.network) };
    default:
      return undefined;
  }
}

/** Analyse a part over a sweep; `defaultWithin` applies when the part sets no band criterion. */
export function analysePart(part: Part, sweep: SweepSpec, defaultWithin: number): PartAnalysis {
  const frequencies = logSweep(sweep);
  const z = impedanceSweep(part.network, frequencies);
  const resonances = selfResonances(part.network, frequencies, z);
  const within = part.within ?? defaultWithin;
  const bandRule = bandRuleOf(part, within);
  const band = bandRule ? usableBand(part.network, bandRule, frequencies, z) : null;
  const wanted = part.behavesAs === 'capacitor' ? 'series' : part.behavesAs === 'inductor' || part.behavesAs === 'bead' ? 'parallel' : undefined;
  const selfResonance = wanted ? resonances.find((r) => r.type === wanted) : resonances[0];
  return {
    part,
    sweep,
    frequencies,
    z,
    resonances,
    selfResonance,
    bandRule,
    usableBand: band,
    within: bandRule && bandRule.behavesAs !== 'bead' ? within : undefined,
  };
}

/** Impedance at a chosen frequency, for tables at round frequencies. */
export function impedanceOfPart(part: Part, frequencyHz: number): { re: number; im: number } {
  const [re, im] = impedanceAt(part.network, frequencyHz);
  return { re, im };
}
