// A part at the corners of its spread: the model evaluated at every combination of each factor's low and
// high extreme (2^q models for q moving quantities), each analysed like the nominal part (resolved sweep,
// refined SRF and band edges); the figures report the least and greatest of each over those corners.
// For a model whose figures move monotonically with each quantity — the SRF 1/(2π√(L·C)) of a series RLC,
// the band edges that follow it — the extremes over the whole spread lie at its corners; for others the
// corners are what zfolio evaluates, and pages say so.
//
// The usable band at a corner is judged against that corner's own value (its effective value within
// `within` of C_nom·k), so it shows how far the band moves, not whether the value is off nominal.
//
// The |Z| envelope is not taken at the corners alone: near a resonance |Z| is least for a value between
// them (a series RLC reaches its ESR at every frequency between the corners' SRFs). So each quantity is
// also stepped across its range with the others at their ends, and the nominal model is included; along
// those edges of the box L·C takes every value between its extremes, so a series resonance anywhere in the
// spread shows in the envelope, to within the step.

import { impedanceSweep, impedanceSweepInto, impedanceSweepWithValuesInto, leafValues, leavesOf } from '../circuit/impedance.js';
import type { Part } from '../model/part.js';
import type { TemperatureRange } from '../model/spread.js';
import { usableBand, type BandRule } from './band.js';
import { resolvedSweep } from './resolved-sweep.js';
import { selfResonances } from './resonance.js';
import type { Element } from '../circuit/element.js';
import { leafFactors, spreadFactors, spreadModel, valueSpread, type SpreadFactor, type ValueSpread } from './part-spread.js';
import { hypot } from '../circuit/hypot.js';

/** At most this many moving quantities a part (2^4 = 16 corners): value and three parasitics is every model. */
export const MAX_PART_FACTORS = 5;

export interface Range {
  min: number;
  max: number;
}

export interface PartCorners {
  /** The temperatures the change was taken over, °C. */
  operating: TemperatureRange;
  factors: SpreadFactor[];
  value: ValueSpread | null;
  /** How many models were evaluated: 2^factors. */
  corners: number;
  /** The part's value (F, H or Ω; a bead's rated |Z|) at its extremes; null without a value spread or a nominal. */
  nominalValue: Range | null;
  /** The self-resonant frequency over the corners; null when a corner has none in the sweep. */
  srfHz: Range | null;
  /** Each band edge over the corners; null when a corner has no band. */
  usableBand: { fromHz: Range; toHz: Range } | null;
  /** Least and greatest |Z| over the spread at each sweep point (for the chart's envelope): the corners, the
   *  nominal model, and each quantity stepped across its range with the others at their ends. */
  envelope: { min: Float64Array; max: Float64Array };
}

const range = (values: readonly number[]): Range | null => (values.length === 0 ? null : { min: Math.min(...values), max: Math.max(...values) });

/** Points each quantity is stepped through for the envelope, its ends included (geometric steps). */
export const ENVELOPE_STEPS = 25;

/** Widen `min`/`max` by |Z| at every sweep point, evaluated into `re` and `im` (of the sweep's length). */
function widen(frequencies: Float64Array, min: Float64Array, max: Float64Array, re: Float64Array, im: Float64Array): void {
  for (let i = 0; i < frequencies.length; i++) {
    const m = hypot(re[i], im[i]);
    if (m < min[i]) min[i] = m;
    if (m > max[i]) max[i] = m;
  }
}

/** The envelope's points between the corners: the nominal model and every edge of the box, stepped. */
function widenBetweenCorners(part: Part, factors: readonly SpreadFactor[], frequencies: Float64Array, min: Float64Array, max: Float64Array): void {
  // One pair of arrays for every model stepped: a new sweep each was most of what a part's corners allocated.
  const re = new Float64Array(frequencies.length);
  const im = new Float64Array(frequencies.length);
  impedanceSweepInto(part.network, frequencies, re, im);
  widen(frequencies, min, max, re, im);
  // Each stepped model is the part's tree with other leaf values (what scaledModel builds, multiplied the same
  // way), evaluated by the part's own kernel: building each tree and its kernel was most of the steps' cost.
  const leaves = leavesOf(part.network);
  const nominal = leafValues(part.network);
  const values = new Float64Array(nominal.length);
  const q = factors.length;
  factors.forEach((f, i) => {
    for (const others of allCorners(q - 1)) {
      for (let s = 1; s < ENVELOPE_STEPS - 1; s++) {
        const multipliers = others.map((high, j) => {
          const g = factors[j < i ? j : j + 1];
          return high ? g.high : g.low;
        });
        multipliers.splice(i, 0, f.low * (f.high / f.low) ** (s / (ENVELOPE_STEPS - 1)));
        const factorOf = leafFactors(part, factors, multipliers);
        for (let j = 0; j < leaves.length; j++) values[j] = nominal[j] * factorOf(leaves[j]);
        impedanceSweepWithValuesInto(part.network, values, frequencies, re, im);
        widen(frequencies, min, max, re, im);
      }
    }
  });
}

/** Every corner's high/low assignment, in binary order: corner c has factor i high when bit i of c is set. */
export function allCorners(count: number): boolean[][] {
  return Array.from({ length: 2 ** count }, (_, c) => Array.from({ length: count }, (_, i) => ((c >> i) & 1) === 1));
}

/**
 * The part's figures at every corner of its spread over `frequencies`, with the band rule of its kind
 * (`rule`, as the nominal analysis uses it); null when nothing about the part moves.
 */
export function partCorners(part: Part, operating: TemperatureRange, frequencies: Float64Array, rule: BandRule | undefined, wantedResonance: 'series' | 'parallel' | undefined): PartCorners | null {
  const factors = spreadFactors(part, operating).slice(0, MAX_PART_FACTORS);
  if (factors.length === 0) return null;
  const value = valueSpread(part, operating);
  const n = frequencies.length;
  const min = new Float64Array(n).fill(Infinity);
  const max = new Float64Array(n).fill(0);
  const srf: number[] = [];
  const from: number[] = [];
  const to: number[] = [];
  let everySrf = true;
  let everyBand = true;
  const valueIndex = factors.findIndex((f) => f.quantity === 'value');
  for (const high of allCorners(factors.length)) {
    const element = spreadModel(part, factors, high);
    const z = impedanceSweep(element, frequencies);
    for (let i = 0; i < n; i++) {
      const m = hypot(z.re[i], z.im[i]);
      if (m < min[i]) min[i] = m;
      if (m > max[i]) max[i] = m;
    }
    const resolved = resolvedSweep(element, frequencies, z);
    const resonances = selfResonances(element, resolved);
    const self = wantedResonance ? resonances.find((r) => r.type === wantedResonance) : resonances[0];
    if (self) srf.push(self.frequencyHz);
    else everySrf = false;
    if (rule) {
      const k = valueIndex < 0 ? 1 : high[valueIndex] ? factors[valueIndex].high : factors[valueIndex].low;
      const own: BandRule = rule.behavesAs === 'bead' ? rule : { ...rule, nominal: rule.nominal * k };
      const band = usableBand(element, own, resolved);
      if (band) {
        from.push(band.fromHz);
        to.push(band.toHz);
      } else everyBand = false;
    }
  }
  widenBetweenCorners(part, factors, frequencies, min, max);
  const nominal = part.nominal;
  return {
    operating,
    factors,
    value,
    corners: 2 ** factors.length,
    nominalValue: value && nominal !== undefined ? { min: nominal * value.low, max: nominal * value.high } : null,
    srfHz: everySrf ? range(srf) : null,
    usableBand: rule && everyBand && from.length > 0 ? { fromHz: range(from)!, toHz: range(to)! } : null,
    envelope: { min, max },
  };
}
