// Everything zfolio states about one part: its impedance over the sweep, resonances, usable band and the
// headline figures a datasheet page or `zfolio figures` prints.

import { dcResistance } from '../circuit/element.js';
import { impedanceAt, impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import { logSweep, type SweepSpec } from '../circuit/sweep.js';
import type { Part } from '../model/part.js';
import { usableBand, type BandRule, type UsableBand } from './band.js';
import type { ImpedancePoint } from './extremum.js';
import { peakImpedance, peakQuality, type QualityPeak } from './part-peaks.js';
import { resolvedSweep, type ResolvedSweep } from './resolved-sweep.js';
import { selfResonances, type Resonance } from './resonance.js';
import { partCorners, type PartCorners } from './part-corners.js';
import type { TemperatureRange } from '../model/spread.js';

export interface PartAnalysis {
  part: Part;
  sweep: SweepSpec;
  frequencies: Float64Array;
  z: ImpedanceArrays;
  /** The sweep with ladders of points around every natural frequency: where features are searched. */
  resolved: ResolvedSweep;
  resonances: Resonance[];
  /** The self-resonant frequency: a capacitor's first series resonance, an inductor's or bead's first parallel one. */
  selfResonance?: Resonance;
  bandRule?: BandRule;
  usableBand: UsableBand | null;
  /** The criterion used for the band (|value_eff/nominal − 1| ≤ within), when the rule has one. */
  within?: number;
  /** The greatest |Z| over the sweep, refined. */
  peakImpedance: ImpedancePoint & { atSweepEnd: boolean };
  /** The greatest Q with the reactance of the part's kind (inductors, capacitors), refined. */
  peakQuality?: QualityPeak;
  /** The part at the corners of its spread (part-corners.ts); null when nothing moves or no range was given. */
  corners: PartCorners | null;
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

/**
 * Analyse a part over a sweep; `defaultWithin` applies when the part sets no band criterion. With the
 * operating temperatures, also at the corners of its spread.
 */
export function analysePart(part: Part, sweep: SweepSpec, defaultWithin: number, operating?: TemperatureRange): PartAnalysis {
  const frequencies = logSweep(sweep);
  const z = impedanceSweep(part.network, frequencies);
  const resolved = resolvedSweep(part.network, frequencies, z);
  const resonances = selfResonances(part.network, resolved);
  const within = part.within ?? defaultWithin;
  const bandRule = bandRuleOf(part, within);
  const band = bandRule ? usableBand(part.network, bandRule, resolved) : null;
  const reactanceSign = part.behavesAs === 'capacitor' ? -1 : part.behavesAs === 'inductor' ? 1 : undefined;
  const wanted = part.behavesAs === 'capacitor' ? 'series' : part.behavesAs === 'inductor' || part.behavesAs === 'bead' ? 'parallel' : undefined;
  const selfResonance = wanted ? resonances.find((r) => r.type === wanted) : resonances[0];
  return {
    part,
    sweep,
    frequencies,
    z,
    resolved,
    resonances,
    selfResonance,
    bandRule,
    usableBand: band,
    within: bandRule && bandRule.behavesAs !== 'bead' ? within : undefined,
    peakImpedance: peakImpedance(part.network, resolved),
    peakQuality: reactanceSign ? peakQuality(part.network, resolved, reactanceSign) : undefined,
    corners: operating ? partCorners(part, operating, frequencies, bandRule, wanted) : null,
  };
}

/** Impedance at a chosen frequency, for tables at round frequencies. */
export function impedanceOfPart(part: Part, frequencyHz: number): { re: number; im: number } {
  const [re, im] = impedanceAt(part.network, frequencyHz);
  return { re, im };
}
