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
  /** The figures over the part's spread (its corners), or null when nothing about it moves. */
  spread: SpreadSummary | null;
  source: { file: string; hash: string };
}

export interface SpreadSummary {
  /** How the extremes were found: every combination of each quantity's low and high extreme. */
  method: 'corners';
  corners: number;
  /** The operating temperatures the change was taken over, °C. */
  temperature: { fromC: number; toC: number };
  /** Each moving quantity ('value' or a parameter name) with its low and high multiplier of nominal. */
  factors: { quantity: string; low: number; high: number }[];
  /** Where the value's spread comes from: tolerance (fractions below and above) and temperature change. */
  tolerance: { minus: number; plus: number } | null;
  temperatureChange: { low: number; high: number } | null;
  nominalValue: { min: number; max: number } | null;
  srfHz: { min: number; max: number } | null;
  usableBand: { fromHz: { min: number; max: number }; toHz: { min: number; max: number } } | null;
}

export function spreadSummary(a: PartAnalysis): SpreadSummary | null {
  const c = a.corners;
  if (!c) return null;
  return {
    method: 'corners',
    corners: c.corners,
    temperature: { ...c.operating },
    factors: c.factors.map((f) => ({ ...f })),
    tolerance: c.value?.tolerance ? { ...c.value.tolerance } : null,
    temperatureChange: c.value?.temperature ? { ...c.value.temperature } : null,
    nominalValue: c.nominalValue ? { ...c.nominalValue } : null,
    srfHz: c.srfHz ? { ...c.srfHz } : null,
    usableBand: c.usableBand ? { fromHz: { ...c.usableBand.fromHz }, toHz: { ...c.usableBand.toHz } } : null,
  };
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
    spread: spreadSummary(a),
    source: { file: part.source.path, hash: part.source.hash },
  };
}
