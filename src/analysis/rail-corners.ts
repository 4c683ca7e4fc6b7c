// A rail at the corners of its parts' spreads: every combination of each moving quantity's low and high
// extreme (2^k evaluations for k quantities, at most MAX_ENUMERATED), else a seeded random sample of
// SAMPLED_CORNERS combinations plus the all-low and all-high corners. Each corner gets the same exact peak
// search as the nominal verdict (rail.ts): |Z| sampled on the sweep refined around the rail's zeros, each
// local maximum refined on the exact slope. A corner judged on plain sweep values could pass a rail whose
// narrow anti-resonance breaks the target between two points.
//
// What does not change between corners is computed once: the grid is the sweep refined around the zeros of
// every branch at every extreme (a finer grid than any one corner needs only samples more, and the
// guarantee of rail.ts holds for each corner on it), and each branch's admittance on it at each of its
// extremes. A corner is then a sum of precomputed admittances and its own peak refinement.

import type { Element } from '../circuit/element.js';
import { impedanceSweepInto } from '../circuit/impedance.js';
import { featureGrid, sweepIndices, sweepRange } from './feature-grid.js';
import { impedancePeaks } from './peaks.js';
import { marginDb, railSlopeAt, railZeros, type RailBranch } from './rail.js';
import { hypot } from '../circuit/hypot.js';

/** Up to this many moving quantities every corner is evaluated (2^10 = 1,024). */
export const MAX_ENUMERATED = 10;
/** Random corners evaluated above that, besides the all-low and all-high ones. */
export const SAMPLED_CORNERS = 2000;

/** One moving quantity of one placed part. */
export interface CornerFactor {
  partId: string;
  /** 'value' or a parameter name (esr, esl, …). */
  quantity: string;
  low: number;
  high: number;
}

/** A distinct placed part: its factors, and each of its placements' element at a combination of them. */
export interface CornerPart {
  partId: string;
  factors: { quantity: string; low: number; high: number }[];
  placements: { count: number; element: (high: readonly boolean[]) => Element }[];
}

export interface RailCornerProblem {
  /** Branches that do not move (regulator, plane, parts without spread). */
  fixed: readonly RailBranch[];
  parts: readonly CornerPart[];
  targetOhm: number;
  /** The band's sweep. */
  frequencies: Float64Array;
  /** Seed of the random sample (used only above MAX_ENUMERATED quantities). */
  seed: number;
}

export interface RailCorners {
  /** 'all': every combination; 'sample': a seeded sample plus all-low and all-high. */
  method: 'all' | 'sample';
  factors: CornerFactor[];
  /** Combinations evaluated (distinct). */
  evaluated: number;
  /** Combinations there are: 2^k. */
  possible: number;
  seed: number | null;
  /** Every evaluated corner keeps |Z| at or under the target over the band (refined peaks included). */
  pass: boolean;
  worst: { frequencyHz: number; impedanceOhm: number; marginDb: number };
  /** The worst corner: each factor high (true) or low (false), in `factors` order. */
  worstCorner: boolean[];
  /** How many evaluated corners miss the target. */
  failing: number;
  /** Least and greatest |Z| over the evaluated corners at each sweep point. */
  envelope: { min: Float64Array; max: Float64Array };
}

/** A small, fast, seedable generator (mulberry32; public domain), so a sample is the same on every build. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A seed from a name (FNV-1a, 32 bits), so each rail's sample is its own and stable. */
export function seedOf(name: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < name.length; i++) h = Math.imul(h ^ name.charCodeAt(i), 0x01000193) >>> 0;
  return h;
}

/** The combinations to evaluate, each a list of k booleans (true: that factor at its high extreme). */
export function cornerCombinations(k: number, seed: number): { method: 'all' | 'sample'; corners: boolean[][] } {
  if (k <= MAX_ENUMERATED) {
    return { method: 'all', corners: Array.from({ length: 2 ** k }, (_, c) => Array.from({ length: k }, (_, i) => ((c >> i) & 1) === 1)) };
  }
  const random = seededRandom(seed);
  const seen = new Set<string>();
  const corners: boolean[][] = [];
  const add = (corner: boolean[]) => {
    const key = corner.map((h) => (h ? '1' : '0')).join('');
    if (seen.has(key)) return;
    seen.add(key);
    corners.push(corner);
  };
  add(new Array<boolean>(k).fill(false));
  add(new Array<boolean>(k).fill(true));
  for (let i = 0; i < SAMPLED_CORNERS; i++) add(Array.from({ length: k }, () => random() < 0.5));
  return { method: 'sample', corners };
}

interface Variant {
  branches: RailBranch[];
  g: Float64Array;
  b: Float64Array;
}

/** Evaluate the rail at its corners. Needs at least one part with a moving quantity. */
export function evaluateCorners(problem: RailCornerProblem): RailCorners {
  const { fixed, parts, targetOhm, frequencies } = problem;
  const factors: CornerFactor[] = parts.flatMap((p) => p.factors.map((f) => ({ partId: p.partId, ...f })));
  const k = factors.length;

  // Every part's placements at every combination of its own factors.
  const variants: Variant[][] = parts.map((p) =>
    Array.from({ length: 2 ** p.factors.length }, (_, c) => {
      const high = p.factors.map((_, i) => ((c >> i) & 1) === 1);
      return { branches: p.placements.map((pl) => ({ kind: 'capacitor' as const, label: p.partId, element: pl.element(high), count: pl.count })), g: new Float64Array(0), b: new Float64Array(0) };
    }),
  );
  const range = sweepRange(frequencies);
  const everyBranch = [...fixed, ...variants.flat().flatMap((v) => v.branches)];
  const grid = featureGrid(frequencies, railZeros(everyBranch, range));
  const onSweep = grid === frequencies ? null : sweepIndices(grid, frequencies);
  const m = grid.length;
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  const admittance = (branches: readonly RailBranch[]) => {
    const g = new Float64Array(m);
    const b = new Float64Array(m);
    for (const branch of branches) {
      impedanceSweepInto(branch.element, grid, re, im);
      for (let i = 0; i < m; i++) {
        const d = re[i] * re[i] + im[i] * im[i];
        g[i] += (branch.count * re[i]) / d;
        b[i] -= (branch.count * im[i]) / d;
      }
    }
    return { g, b };
  };
  const base = admittance(fixed);
  for (const list of variants) for (const v of list) Object.assign(v, admittance(v.branches));

  const { method, corners } = cornerCombinations(k, problem.seed);
  const n = frequencies.length;
  const envelope = { min: new Float64Array(n).fill(Infinity), max: new Float64Array(n).fill(0) };
  const g = new Float64Array(m);
  const b = new Float64Array(m);
  const magnitude = new Float64Array(m);
  let worst = { frequencyHz: frequencies[0], impedanceOhm: -Infinity };
  let worstCorner: boolean[] = corners[0];
  let failing = 0;
  for (const corner of corners) {
    g.set(base.g);
    b.set(base.b);
    const branches: RailBranch[] = [...fixed];
    let offset = 0;
    parts.forEach((p, j) => {
      let c = 0;
      for (let i = 0; i < p.factors.length; i++) if (corner[offset + i]) c |= 1 << i;
      offset += p.factors.length;
      const v = variants[j][c];
      for (let i = 0; i < m; i++) {
        g[i] += v.g[i];
        b[i] += v.b[i];
      }
      branches.push(...v.branches);
    });
    for (let i = 0; i < m; i++) magnitude[i] = 1 / hypot(g[i], b[i]);
    for (let i = 0; i < n; i++) {
      const z = magnitude[onSweep ? onSweep[i] : i];
      if (z < envelope.min[i]) envelope.min[i] = z;
      if (z > envelope.max[i]) envelope.max[i] = z;
    }
    // As evaluateRail: the band's ends and every refined interior maximum.
    let own = { frequencyHz: frequencies[0], impedanceOhm: magnitude[onSweep ? onSweep[0] : 0] };
    const last = magnitude[onSweep ? onSweep[n - 1] : n - 1];
    if (last > own.impedanceOhm) own = { frequencyHz: frequencies[n - 1], impedanceOhm: last };
    for (const peak of impedancePeaks(grid, magnitude, (f) => railSlopeAt(branches, f))) {
      if (peak.impedanceOhm > own.impedanceOhm) own = { frequencyHz: peak.frequencyHz, impedanceOhm: peak.impedanceOhm };
    }
    if (own.impedanceOhm > targetOhm) failing++;
    if (own.impedanceOhm > worst.impedanceOhm) {
      worst = own;
      worstCorner = corner;
    }
  }
  return {
    method,
    factors,
    evaluated: corners.length,
    possible: 2 ** k,
    seed: method === 'sample' ? problem.seed : null,
    pass: failing === 0,
    worst: { ...worst, marginDb: marginDb(targetOhm, worst.impedanceOhm) },
    worstCorner: [...worstCorner],
    failing,
    envelope,
  };
}
