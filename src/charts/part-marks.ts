// What every chart of a part marks besides its curves: the usable band, shaded with its caption in the key,
// and the resonances, the self-resonance first, each labelled beside its point.

import type { ImpedanceArrays } from '../circuit/impedance.js';
import type { ImpedanceFigures } from '../circuit/quantities.js';
import type { Element } from '../circuit/element.js';
import type { UsableBand } from '../analysis/band.js';
import { isSelfResonance, type Resonance } from '../analysis/resonance.js';
import { bandCaption, bandRange } from '../present/band-words.js';
import { resonanceLabel, resonanceShortLabel } from '../present/resonance-words.js';
import type { KeyItem } from './key.js';
import type { Obstacle, Placement } from './labels.js';
import type { AxisMap } from './scales.js';
import type { MarkLabel } from './mark-labels.js';
import type { Row } from './render.js';

/** The columns of ImpedanceFigures a part's charts read (no other: a chart job is copied to a worker). */
export type ChartColumns = Pick<ImpedanceFigures, 'resistanceOhm' | 'reactanceOhm' | 'magnitudeOhm' | 'phaseDeg' | 'conductanceS' | 'susceptanceS'>;

/** The part facts the charts use; `PartAnalysis` (src/analysis/part-figures.ts) is one. */
export interface PartChartInput {
  /** `nominal` and `ratedAtHz`: a bead's rated impedance and where it is rated. */
  part: { id: string; title: string; kind: string; behavesAs?: string; network?: Element; nominal?: number; ratedAtHz?: number };
  frequencies: Float64Array;
  z: ImpedanceArrays;
  /** The columns derived from `z` that the charts draw and describe, at `frequencies`. */
  columns: ChartColumns;
  resonances: readonly Resonance[];
  selfResonance?: Resonance;
  usableBand: UsableBand | null;
  within?: number;
  /** The least and greatest |Z| over the part's spread (src/analysis/part-corners.ts), on the plain sweep; absent without one. */
  spread?: { frequencies: Float64Array; min: Float64Array; max: Float64Array; corners: number } | null;
}

/** Resonances ordered for labelling: the self-resonance first, then by frequency. */
export function resonancesByImportance(input: Pick<PartChartInput, 'resonances' | 'selfResonance'>): Resonance[] {
  const self = input.resonances.filter((r) => isSelfResonance(r, input.selfResonance));
  const rest = input.resonances.filter((r) => !isSelfResonance(r, input.selfResonance));
  return [...self, ...rest];
}

/**
 * A label for each resonance, the self-resonance first (and never dropped): `place` gives the point's data
 * row and its px, `candidates` the positions to try for its type (a dip's label below, a peak's above).
 */
export function resonanceLabels(
  input: Pick<PartChartInput, 'resonances' | 'selfResonance'>,
  place: (r: Resonance) => { at: Row; x: number; y: number },
  candidates?: (r: Resonance) => Placement[],
): MarkLabel[] {
  return resonancesByImportance(input).map((r) => ({
    ...place(r),
    text: resonanceLabel(r, input.selfResonance),
    // The self-resonance keeps its name wherever it goes; another may drop its type where it has no room.
    ...(isSelfResonance(r, input.selfResonance) ? {} : { shortText: resonanceShortLabel(r) }),
    required: isSelfResonance(r, input.selfResonance),
    ...(candidates ? { candidates: candidates(r) } : {}),
  }));
}

export interface BandData {
  band: Row[];
  bandEdges: Row[];
  key: KeyItem | null;
}

/** The usable band's tint, its edges inside the sweep, and its key entry. */
export function bandData(input: Pick<PartChartInput, 'usableBand' | 'within'> & { part: { behavesAs?: string } }): BandData {
  const b = input.usableBand;
  if (!b) return { band: [], bandEdges: [], key: null };
  const edges: Row[] = [];
  if (!b.fromIsSweepEnd) edges.push({ f: b.fromHz });
  if (!b.toIsSweepEnd) edges.push({ f: b.toHz });
  return { band: [{ f: b.fromHz, f2: b.toHz }], bandEdges: edges, key: { kind: 'band', text: `${bandCaption(input.part.behavesAs, input.within)}: ${bandRange(b)}` } };
}

/**
 * The band's edges as labels see them: vertical rules across the plot, which a label must not straddle (an
 * SRF label centred under its dip sat across a capacitor's band edge, which lies a factor of about 3 below).
 */
export function bandEdgeObstacles(band: Pick<BandData, 'bandEdges'>, xMap: AxisMap, height: number): Obstacle[] {
  return band.bandEdges.map((e) => {
    const x = xMap.toPx(e.f as number);
    return { xs: [x, x], ys: [0, height] };
  });
}

/**
 * The band when it is narrower than the axis `[fromHz, toHz]`; null when it covers the whole axis (a rail
 * chart drawn over exactly its band), where shading would tint the whole plot and say nothing.
 */
export function bandWithin(band: { fromHz: number; toHz: number } | null | undefined, fromHz: number, toHz: number): { fromHz: number; toHz: number } | null {
  if (!band) return null;
  const inside = band.fromHz > fromHz * (1 + 1e-6) || band.toHz < toHz * (1 - 1e-6);
  return inside ? band : null;
}

/** A frequency band drawn in full, both edges marked (a rail's band). */
export function rangeBand(band: { fromHz: number; toHz: number } | null | undefined): { band: Row[]; bandEdges: Row[] } {
  return band ? { band: [{ f: band.fromHz, f2: band.toHz }], bandEdges: [{ f: band.fromHz }, { f: band.toHz }] } : { band: [], bandEdges: [] };
}
