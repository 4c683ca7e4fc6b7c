// A part's spread as factors: each quantity that may move (its value, and each parasitic given a spread),
// with the multipliers of its low and high extreme, and the part's model at any combination of extremes.
//
// The value's extremes combine multiplicatively, each factor at its own extreme:
//   low  = (1 − tolerance below) · (1 + the most negative temperature change)
//   high = (1 + tolerance above) · (1 + the most positive temperature change)
// A DC-bias fraction, where a rail applies one, multiplies both (src/analysis/dc-bias.ts).
// Temperature: an EIA class 2 code or a `temperature` block states the largest change over its own range,
// and that change is taken whole whatever part of the range the operating temperatures cover (the code says
// no more). A coefficient α (class 1 code, `tc`) changes the value by α·(T − 25 °C), bilinear in α and T,
// so its extremes lie at the ends of both ranges.

import type { Element } from '../circuit/element.js';
import type { Part } from '../model/part.js';
import type { Bounds, TemperatureCharacteristic, TemperatureRange } from '../model/spread.js';

/** The reference temperature of tolerances and temperature characteristics (common practice: 25 °C). */
export const REFERENCE_C = 25;

/** One quantity of one part that moves between two extremes, as multipliers of its nominal. */
export interface SpreadFactor {
  /** 'value', or a parameter name: esr, esl, epr, dcr, cp, rp, ls; rdc, r, l, c for a bead. */
  quantity: string;
  low: number;
  high: number;
}

export interface ValueSpread {
  tolerance: Bounds | null;
  /** The temperature change of the value, as fractions (low ≤ 0 ≤ high for most parts), or null. */
  temperature: { low: number; high: number } | null;
  low: number;
  high: number;
}

/** The value's change with temperature over `operating`, as fractions of its value at 25 °C. */
export function temperatureChange(characteristic: TemperatureCharacteristic, operating: TemperatureRange): { low: number; high: number } {
  if (characteristic.kind === 'range') return { low: -characteristic.minus, high: characteristic.plus };
  const ends = [operating.fromC - REFERENCE_C, operating.toC - REFERENCE_C];
  const products = ends.flatMap((dt) => [characteristic.lowPerK * dt, characteristic.highPerK * dt]);
  // The product is 0 at 25 °C, inside or outside the range; −0 prints as 0.
  return { low: Math.min(...products) + 0, high: Math.max(...products) + 0 };
}

/** The value's extremes from tolerance and temperature; null when the part states neither. */
export function valueSpread(part: Part, operating: TemperatureRange): ValueSpread | null {
  const tolerance = part.spread.tolerance ?? null;
  const temperature = part.spread.temperature ? temperatureChange(part.spread.temperature, operating) : null;
  if (!tolerance && !temperature) return null;
  const low = (1 - (tolerance?.minus ?? 0)) * (1 + (temperature?.low ?? 0));
  const high = (1 + (tolerance?.plus ?? 0)) * (1 + (temperature?.high ?? 0));
  return { tolerance, temperature, low, high };
}

/** Every quantity of the part that moves: its value first, then its parasitics in the order the model lists them. */
export function spreadFactors(part: Part, operating: TemperatureRange): SpreadFactor[] {
  const out: SpreadFactor[] = [];
  const value = valueSpread(part, operating);
  // A value whose extremes coincide (a 0 ppm/K coefficient alone) does not move.
  if (value && (value.low !== 1 || value.high !== 1)) out.push({ quantity: 'value', low: value.low, high: value.high });
  for (const name of Object.keys(part.parameters ?? {})) {
    const b = Object.hasOwn(part.spread.parasitics, name) ? part.spread.parasitics[name] : undefined;
    if (b && (b.minus > 0 || b.plus > 0)) out.push({ quantity: name, low: 1 - b.minus, high: 1 + b.plus });
  }
  return out;
}

/** Element names of the parameters in the part models (src/model/part.ts). */
const LEAF_OF_PARAMETER: Readonly<Record<string, string>> = { esr: 'ESR', esl: 'ESL', epr: 'EPR', dcr: 'DCR', cp: 'Cp', rp: 'Rp', ls: 'Ls', rdc: 'Rdc', r: 'R', l: 'L', c: 'C' };

type Leaf = Extract<Element, { type: 'R' | 'L' | 'C' }>;

/** The tree with each leaf's value multiplied by `factorOf(leaf)`; the tree itself when every factor is 1. */
export function scaleLeaves(element: Element, factorOf: (leaf: Leaf) => number): Element {
  switch (element.type) {
    case 'R':
    case 'L':
    case 'C': {
      const k = factorOf(element);
      if (k === 1) return element;
      if (element.type === 'R') return { ...element, ohms: element.ohms * k };
      if (element.type === 'L') return { ...element, henries: element.henries * k };
      return { ...element, farads: element.farads * k };
    }
    case 'series':
    case 'parallel': {
      const parts = element.parts.map((p) => scaleLeaves(p, factorOf));
      return parts.every((p, i) => p === element.parts[i]) ? element : { type: element.type, parts };
    }
  }
}

/**
 * How the value's multiplier k acts on a leaf: a capacitor (or a network behaving as one) scales every C,
 * an inductor every L, a resistor every R; a bead's rated impedance scales its core r ‖ l ‖ c (R·k, L·k,
 * C/k: |Z| times k at every frequency, the resonance unchanged), not its DC resistance.
 */
function valueFactorOf(part: Part, leaf: Leaf, k: number): number {
  switch (part.behavesAs) {
    case 'capacitor':
      return leaf.type === 'C' ? k : 1;
    case 'inductor':
      return leaf.type === 'L' ? k : 1;
    case 'resistor':
      return leaf.type === 'R' ? k : 1;
    case 'bead':
      if (leaf.name === 'Rdc') return 1;
      return leaf.type === 'C' ? 1 / k : k;
    default:
      return 1;
  }
}

const models = new WeakMap<Element, Map<string, Element>>();

/**
 * The part's model with each factor at its low (false) or high (true) extreme. Cached per part model and
 * combination, so corner evaluations share compiled kernels and natural frequencies.
 */
export function spreadModel(part: Part, factors: readonly SpreadFactor[], high: readonly boolean[]): Element {
  let byKey = models.get(part.network);
  if (!byKey) {
    byKey = new Map();
    models.set(part.network, byKey);
  }
  const multipliers = factors.map((f, i) => (high[i] ? f.high : f.low));
  const key = factors.map((f, i) => `${f.quantity}=${multipliers[i]}`).join(',');
  let element = byKey.get(key);
  if (!element) {
    element = scaledModel(part, factors, multipliers);
    byKey.set(key, element);
  }
  return element;
}

/** The part's model with each factor's quantity at the multiplier given for it (anywhere in its range); not cached. */
export function scaledModel(part: Part, factors: readonly SpreadFactor[], multipliers: readonly number[]): Element {
  return scaleLeaves(part.network, leafFactors(part, factors, multipliers));
}

/** What scaledModel multiplies each leaf's value by, for the same multipliers. */
export function leafFactors(part: Part, factors: readonly SpreadFactor[], multipliers: readonly number[]): (leaf: Leaf) => number {
  const byLeaf = new Map<string, number>();
  let value = 1;
  factors.forEach((f, i) => {
    if (f.quantity === 'value') value = multipliers[i];
    else byLeaf.set(LEAF_OF_PARAMETER[f.quantity], multipliers[i]);
  });
  return (leaf) => valueFactorOf(part, leaf, value) * (leaf.name !== undefined ? (byLeaf.get(leaf.name) ?? 1) : 1);
}
