// The headline figures of a part as a plain, JSON-ready object: what `zfolio figures --json` prints and
// what datasheet pages show. All values in SI base units.

import type { PartAnalysis } from './part-figures.js';
import type { Resonance } from './resonance.js';
import type { UsableBand } from './band.js';
import { DIMENSIONS, NOMINAL_DIMENSION } from '../units/quantity.js';

export interface PartSummary {
  id: string;
  kind: string;
  behavesAs: string | null;
  title: string;
  /** Nominal value in SI base units (F, H or Ω), or null. */
  nominal: number | null;
  /** Unit symbol of `nominal`. */
  unit: string | null;
  resonances: Resonance[];
  /** The self-resonant frequency (see PartAnalysis.selfResonance), or null when none is in the sweep. */
  selfResonanceHz: number | null;
  usableBand: UsableBand | null;
  /** Usable-band criterion, when the rule has one. */
  within: number | null;
  /** The greatest |Z| over the sweep, refined (a bead's peak). */
  peakImpedance: { frequencyHz: number; impedanceOhm: number; atSweepEnd: boolean };
  /** The greatest Q = |X|/R with the reactance of the part's kind (capacitors and inductors), refined. */
  peakQuality: { frequencyHz: number; q: number } | null;
  sweep: { fromHz: number; toHz: number; perDecade: number };
  source: { file: string; hash: string };
}

export function partSummary(a: PartAnalysis): PartSummary {
  const { part } = a;
  return {
    id: part.id,
    kind: part.kind,
    behavesAs: part.behavesAs ?? null,
    title: part.title,
    nominal: part.nominal ?? null,
    unit: part.behavesAs && part.nominal !== undefined ? DIMENSIONS[NOMINAL_DIMENSION[part.behavesAs]].symbol : null,
    resonances: a.resonances.map((r) => ({ frequencyHz: r.frequencyHz, type: r.type, impedanceOhm: r.impedanceOhm, extremum: { ...r.extremum } })),
    selfResonanceHz: a.selfResonance?.frequencyHz ?? null,
    usableBand: a.usableBand ? { ...a.usableBand } : null,
    within: a.within ?? null,
    peakImpedance: { ...a.peakImpedance },
    peakQuality: a.peakQuality ? { ...a.peakQuality } : null,
    sweep: { ...a.sweep },
    source: { file: part.source.path, hash: part.source.hash },
  };
}
