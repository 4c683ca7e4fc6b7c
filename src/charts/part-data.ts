// What the four charts of a part share: the input they read (a PartAnalysis fits it), the frequency axis,
// the usable band, the resonance labels, and curves with their resonances inserted exactly and then
// down-sampled in screen space.

import type { ImpedanceArrays } from '../circuit/impedance.js';
import type { Element } from '../circuit/element.js';
import type { UsableBand } from '../analysis/band.js';
import { isSelfResonance, type Resonance } from '../analysis/resonance.js';
import { bandCaption, bandRange } from '../present/band-words.js';
import type { KeyItem } from './key.js';
import type { Row } from './render.js';
import { logAxis, logTicks, type AxisMap } from './scales.js';
import { simplifyPolyline } from './simplify.js';
import { axisBinding } from './spec-parts.js';

/** The part facts the charts use; `PartAnalysis` (src/analysis/part-figures.ts) is one. */
export interface PartChartInput {
  /** `nominal` and `ratedAtHz`: a bead's rated impedance and where it is rated. */
  part: { id: string; title: string; kind: string; behavesAs?: string; network?: Element; nominal?: number; ratedAtHz?: number };
  frequencies: Float64Array;
  z: ImpedanceArrays;
  resonances: readonly Resonance[];
  selfResonance?: Resonance;
  usableBand: UsableBand | null;
  within?: number;
  /** The least and greatest |Z| over the corners of the part's spread, on the plain sweep; absent without one. */
  spread?: { frequencies: Float64Array; min: Float64Array; max: Float64Array; corners: number } | null;
}

/** Rows of an envelope (min and max at each frequency, rows {f, v, v2, i}) with both ends on the plot. */
export function envelopeRows(frequencies: ArrayLike<number>, min: ArrayLike<number>, max: ArrayLike<number>): Row[] {
  const rows: Row[] = [];
  for (let i = 0; i < frequencies.length; i++) {
    if (min[i] > 0 && Number.isFinite(max[i])) rows.push({ f: frequencies[i], v: min[i], v2: max[i], i });
  }
  return rows;
}

/** Minimum distance between labelled ticks, px: about two label widths on x, one line on y. */
export const X_TICK_SPACING = 58;
export const Y_TICK_SPACING = 22;

export interface FrequencyAxis {
  map: AxisMap;
  params: Record<string, unknown>;
  datasets: Record<string, Row[]>;
}

/** The frequency axis "f" over `[from, to]` exactly, with decade ticks. */
export function frequencyAxis(fromHz: number, toHz: number, plotWidth: number): FrequencyAxis {
  const domain: [number, number] = [fromHz, toHz];
  const ticks = logTicks(domain, plotWidth, 'Hz', X_TICK_SPACING);
  return { map: logAxis(domain, plotWidth), ...axisBinding('f', domain, ticks) };
}

/** The frequency axis of a sweep. */
export function sweepAxis(frequencies: Float64Array, plotWidth: number): FrequencyAxis {
  return frequencyAxis(frequencies[0], frequencies[frequencies.length - 1], plotWidth);
}

/** Resonances ordered for labelling: the self-resonance first, then by frequency. */
export function resonancesByImportance(input: PartChartInput): Resonance[] {
  const self = input.resonances.filter((r) => isSelfResonance(r, input.selfResonance));
  const rest = input.resonances.filter((r) => !isSelfResonance(r, input.selfResonance));
  return [...self, ...rest];
}

export interface BandData {
  band: Row[];
  bandEdges: Row[];
  key: KeyItem | null;
}

export function bandData(input: PartChartInput): BandData {
  const b = input.usableBand;
  if (!b) return { band: [], bandEdges: [], key: null };
  const edges: Row[] = [];
  if (!b.fromIsSweepEnd) edges.push({ f: b.fromHz });
  if (!b.toIsSweepEnd) edges.push({ f: b.toHz });
  return { band: [{ f: b.fromHz, f2: b.toHz }], bandEdges: edges, key: { kind: 'band', text: `${bandCaption(input.part.behavesAs, input.within)}: ${bandRange(b)}` } };
}

/** A curve over frequency with some exact points inserted; `keep` marks points down-sampling must keep. */
export interface Curve {
  f: number[];
  v: number[];
  keep: boolean[];
}

/**
 * The sweep values `valueAt(i)` with extra exact points (e.g. resonances) merged in frequency order.
 * Non-finite values (or ≤ 0 on a log axis, when `positive`) become gaps.
 */
export function mergeCurve(frequencies: Float64Array, valueAt: (i: number) => number, extra: readonly { f: number; v: number }[], positive: boolean): Curve {
  const pts = extra.filter((e) => e.f >= frequencies[0] && e.f <= frequencies[frequencies.length - 1]).sort((a, b) => a.f - b.f);
  const out: Curve = { f: [], v: [], keep: [] };
  const push = (f: number, v: number, keep: boolean) => {
    out.f.push(f);
    out.v.push(Number.isFinite(v) && (!positive || v > 0) ? v : NaN);
    out.keep.push(keep);
  };
  let k = 0;
  for (let i = 0; i < frequencies.length; i++) {
    while (k < pts.length && pts[k].f < frequencies[i]) push(pts[k].f, pts[k++].v, true);
    if (k < pts.length && pts[k].f === frequencies[i]) {
      push(pts[k].f, pts[k++].v, true);
      continue;
    }
    push(frequencies[i], valueAt(i), i === 0 || i === frequencies.length - 1);
  }
  while (k < pts.length) push(pts[k].f, pts[k++].v, true);
  return out;
}

/** Rows {f, v, s, i} of a curve, down-sampled on the chart's axes; gaps are kept as null values. */
export function curveRows(curve: Curve, xMap: AxisMap, yMap: AxisMap, s: string, extra: Row = {}): Row[] {
  const xs = curve.f.map((f) => xMap.toPx(f));
  const ys = curve.v.map((v) => (Number.isFinite(v) ? yMap.toPx(v) : NaN));
  const kept = simplifyPolyline(xs, ys, undefined, (i) => curve.keep[i]);
  const rows: Row[] = [];
  let previous = -1;
  for (const i of kept) {
    // A gap between two kept points: one null row breaks the line there.
    if (previous >= 0 && i - previous > 1 && hasGap(curve.v, previous, i)) rows.push({ f: curve.f[previous + 1], v: null, s, i: rows.length, ...extra });
    rows.push({ f: curve.f[i], v: curve.v[i], s, i: rows.length, ...extra });
    previous = i;
  }
  return rows;
}

function hasGap(v: number[], a: number, b: number): boolean {
  for (let i = a + 1; i < b; i++) if (!Number.isFinite(v[i])) return true;
  return false;
}

/** The plot-area pixel of a point (y measured down from the top). */
export function toPlot(xMap: AxisMap, yMap: AxisMap, x: number, y: number): { x: number; y: number } {
  return { x: xMap.toPx(x), y: yMap.rangePx - yMap.toPx(y) };
}
