// Everything zfolio states about one part, computed once: its impedance over the sweep and every column
// derived from it (R, X, |Z|, phase, G, B, |Y|, Q, effective C and L), the same over the resolved sweep the
// charts draw and at each decade the datasheet tabulates, resonances, usable band and the headline figures.
// Pages, charts, downloads and the command line read this record; none of them computes a figure again.

import { dcResistance } from '../circuit/element.js';
import { impedanceAt, impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import { deriveFigures, type ImpedanceFigures } from '../circuit/quantities.js';
import { logSweep, type SweepSpec } from '../circuit/sweep.js';
import type { Part } from '../model/part.js';
import { usableBand, type BandRule, type UsableBand } from './band.js';
import type { ImpedancePoint } from './extremum.js';
import { peakImpedance, peakQuality, type QualityPeak } from './part-peaks.js';
import { resolvedSweep, type ResolvedSweep } from './resolved-sweep.js';
import { selfResonances, type Resonance } from './resonance.js';
import { partCorners, type PartCorners } from './part-corners.js';
import type { TemperatureRange } from '../model/spread.js';
import { hypot } from '../circuit/hypot.js';

export interface PartAnalysis {
  part: Part;
  sweep: SweepSpec;
  frequencies: Float64Array;
  z: ImpedanceArrays;
  /** Every column over the sweep (what `zfolio sweep` gives), made when first read. */
  columns: ImpedanceFigures;
  /** The sweep with ladders of points around every natural frequency: where features are searched. */
  resolved: ResolvedSweep;
  /** Every column over the resolved sweep (what the charts draw). */
  resolvedColumns: ImpedanceFigures;
  /** Every column at each decade of frequency inside the sweep (the datasheet's table). */
  decades: ImpedanceFigures;
  /** At each decade, the value in the part's own terms: C_eff (F) of a capacitor where X < 0, L_eff (H) of an
   *  inductor where X > 0, |Z|/R − 1 of a resistor; NaN where it has no meaning. */
  decadeEffective: Float64Array;
  /** A bead's |Z| at its rated frequency, Ω, when it states one. */
  ratedImpedanceOhm?: number;
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
  const frequencies = sweepFrequencies(sweep);
  const z = impedanceSweep(part.network, frequencies);
  const resolved = resolvedSweep(part.network, frequencies, z);
  const resonances = selfResonances(part.network, resolved);
  const within = part.within ?? defaultWithin;
  const bandRule = bandRuleOf(part, within);
  const band = bandRule ? usableBand(part.network, bandRule, resolved) : null;
  const reactanceSign = part.behavesAs === 'capacitor' ? -1 : part.behavesAs === 'inductor' ? 1 : undefined;
  const wanted = part.behavesAs === 'capacitor' ? 'series' : part.behavesAs === 'inductor' || part.behavesAs === 'bead' ? 'parallel' : undefined;
  const selfResonance = wanted ? resonances.find((r) => r.type === wanted) : resonances[0];
  const decades = Float64Array.from(decadeFrequencies(sweep.fromHz, sweep.toHz));
  const decadeFigures = deriveFigures(decades, impedanceSweep(part.network, decades));
  let columns: ImpedanceFigures | undefined;
  return {
    part,
    sweep,
    frequencies,
    z,
    // Made when first read: only `zfolio sweep` reads it, a build never does (the downloads evaluate their own
    // frequencies, the charts draw the resolved sweep).
    get columns() {
      return (columns ??= deriveFigures(frequencies, z));
    },
    resolved,
    resolvedColumns: deriveFigures(resolved.frequencies, resolved.z),
    decades: decadeFigures,
    decadeEffective: effectiveValues(part, decadeFigures),
    ...(part.behavesAs === 'bead' && part.ratedAtHz !== undefined ? { ratedImpedanceOhm: hypot(...impedanceAt(part.network, part.ratedAtHz)) } : {}),
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

/**
 * The sweep's frequencies, made once for the last sweep asked for: every part of a library has the same, and
 * sharing the array also shares its ω = 2πf (impedance.ts). Never written to: every record reads it.
 */
let lastSweep: { spec: SweepSpec; frequencies: Float64Array } | undefined;
function sweepFrequencies(spec: SweepSpec): Float64Array {
  const last = lastSweep;
  if (last && last.spec.fromHz === spec.fromHz && last.spec.toHz === spec.toHz && last.spec.perDecade === spec.perDecade) return last.frequencies;
  const frequencies = logSweep(spec);
  lastSweep = { spec: { fromHz: spec.fromHz, toHz: spec.toHz, perDecade: spec.perDecade }, frequencies };
  return frequencies;
}

/** The value of a part in its own terms at each point (see PartAnalysis.decadeEffective). */
export function effectiveValues(part: Part, f: ImpedanceFigures): Float64Array {
  const out = new Float64Array(f.frequencyHz.length).fill(NaN);
  for (let i = 0; i < out.length; i++) {
    if (part.behavesAs === 'capacitor') out[i] = f.effectiveCapacitanceF[i];
    else if (part.behavesAs === 'inductor') out[i] = f.effectiveInductanceH[i];
    else if (part.behavesAs === 'resistor' && part.nominal !== undefined) out[i] = f.magnitudeOhm[i] / part.nominal - 1;
  }
  return out;
}

/** Each decade (1, 10, 100 ... Hz) inside the sweep. */
export function decadeFrequencies(fromHz: number, toHz: number): number[] {
  const out: number[] = [];
  for (let e = Math.ceil(Math.log10(fromHz) - 1e-9); 10 ** e <= toHz * (1 + 1e-9); e++) out.push(Number(`1e${e}`));
  return out;
}

/** Impedance at a chosen frequency, for tables at round frequencies. */
export function impedanceOfPart(part: Part, frequencyHz: number): { re: number; im: number } {
  const [re, im] = impedanceAt(part.network, frequencyHz);
  return { re, im };
}
