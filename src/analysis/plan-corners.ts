// A plan's rail at the corners of its parts' spreads, as JSON-ready figures: the parts placed with their
// moving quantities (value from tolerance, temperature and the DC bias at the rail voltage; parasitics with
// a spread), evaluated by rail-corners.ts, and the worst corner named part by part.

import type { Element } from '../circuit/element.js';
import type { Part } from '../model/part.js';
import type { Placement, Plan } from '../model/plan.js';
import type { TemperatureRange } from '../model/spread.js';
import { biasFraction, scaleCapacitance } from './dc-bias.js';
import { spreadFactors, spreadModel } from './part-spread.js';
import { evaluateCorners, seedOf, type RailCorners } from './rail-corners.js';
import { placementElement, type RailBranch, type RailEvaluation } from './rail.js';
import { fixedBranches } from './plan-figures.js';

export type Extreme = 'low' | 'high';

export interface CornerFigures {
  /** 'all': every combination of extremes; 'sample': a seeded sample plus all-low and all-high; 'none': no placed part states a spread. */
  method: 'all' | 'sample' | 'none';
  /** Corners evaluated, and how many combinations there are (2^k). */
  evaluated: number;
  possible: number;
  /** Seed of the sample (method 'sample'), else null. */
  seed: number | null;
  /** The operating temperatures of the corners, °C: the plan's own, else the library's. */
  temperature: { fromC: number; toC: number };
  /** The moving quantities: each part's value and each parasitic with a spread, as multipliers of nominal. */
  factors: { partId: string; quantity: string; low: number; high: number }[];
  pass: boolean;
  worstMarginDb: number;
  worstFrequencyHz: number;
  worstImpedanceOhm: number;
  /** Corners that miss the target. */
  failing: number;
  /** At the worst corner: each placed part's value at its low or high extreme. */
  extremes: Record<string, Extreme>;
  /** At the worst corner: each parasitic spread's extreme, by part. */
  parasiticExtremes: Record<string, Record<string, Extreme>>;
  /** Least and greatest |Z| over the corners and the nominal rail at each sweep point, Ω (for the chart; not in plan --json). */
  envelope: { minOhm: number[]; maxOhm: number[] } | null;
}

const placed = new WeakMap<Element, Map<string, Element>>();

/** A spread model as placed: at the rail's bias fraction and in series with its mounting; cached. */
function placedElement(model: Element, fraction: number, mountingH: number): Element {
  let byKey = placed.get(model);
  if (!byKey) {
    byKey = new Map();
    placed.set(model, byKey);
  }
  const key = `${fraction}/${mountingH}`;
  let element = byKey.get(key);
  if (!element) {
    element = placementElement(scaleCapacitance(model, fraction), mountingH);
    byKey.set(key, element);
  }
  return element;
}

/** A part as a rail's corner places it: its factors (spreadFactors) at the ends `high` gives, at the rail's DC bias, with its mounting. */
export function cornerElement(part: Part, factors: ReturnType<typeof spreadFactors>, high: readonly boolean[], voltageV: number, mountingH: number): Element {
  const fraction = biasFraction(part.dcBias, voltageV).fraction;
  return placedElement(factors.length === 0 ? part.network : spreadModel(part, factors, high), fraction, mountingH);
}

/** The rail of `plan` with `placements` at its corners; `nominal` is its nominal evaluation. */
export function cornerFigures(plan: Plan, placements: readonly Placement[], operating: TemperatureRange, targetOhm: number, frequencies: Float64Array, nominal: RailEvaluation): CornerFigures {
  const temperature = plan.temperature ?? operating;
  const fixed: RailBranch[] = fixedBranches(plan);
  const byPart = new Map<string, { partId: string; factors: ReturnType<typeof spreadFactors>; placements: { count: number; element: (high: readonly boolean[]) => Element }[] }>();
  for (const p of placements) {
    const factors = spreadFactors(p.part, temperature);
    const fraction = biasFraction(p.part.dcBias, plan.voltageV).fraction;
    if (factors.length === 0) {
      fixed.push({ kind: 'capacitor', label: p.part.id, element: placedElement(p.part.network, fraction, p.mountingH), count: p.count });
      continue;
    }
    let entry = byPart.get(p.part.id);
    if (!entry) {
      entry = { partId: p.part.id, factors, placements: [] };
      byPart.set(p.part.id, entry);
    }
    const part = p.part;
    entry.placements.push({ count: p.count, element: (high) => placedElement(spreadModel(part, factors, high), fraction, p.mountingH) });
  }
  const common = { temperature: { ...temperature } };
  if (byPart.size === 0) {
    return {
      method: 'none',
      evaluated: 0,
      possible: 1,
      seed: null,
      ...common,
      factors: [],
      pass: nominal.pass,
      worstMarginDb: nominal.worst.marginDb,
      worstFrequencyHz: nominal.worst.frequencyHz,
      worstImpedanceOhm: nominal.worst.impedanceOhm,
      failing: nominal.pass ? 0 : 1,
      extremes: {},
      parasiticExtremes: {},
      envelope: null,
    };
  }
  const result: RailCorners = evaluateCorners({ fixed, parts: [...byPart.values()], targetOhm, frequencies, seed: seedOf(plan.rail) });
  const extremes: Record<string, Extreme> = {};
  const parasiticExtremes: Record<string, Record<string, Extreme>> = {};
  result.factors.forEach((f, i) => {
    const side: Extreme = result.worstCorner[i] ? 'high' : 'low';
    if (f.quantity === 'value') extremes[f.partId] = side;
    else (parasiticExtremes[f.partId] ??= {})[f.quantity] = side;
  });
  return {
    method: result.method,
    evaluated: result.evaluated,
    possible: result.possible,
    seed: result.seed,
    ...common,
    factors: result.factors.map((f) => ({ ...f })),
    pass: result.pass,
    worstMarginDb: result.worst.marginDb,
    worstFrequencyHz: result.worst.frequencyHz,
    worstImpedanceOhm: result.worst.impedanceOhm,
    failing: result.failing,
    extremes,
    parasiticExtremes,
    // The nominal rail is drawn inside its envelope (between corners |Z| need not be monotone).
    envelope: { minOhm: Array.from(result.envelope.min, (z, i) => Math.min(z, nominal.magnitude[i])), maxOhm: Array.from(result.envelope.max, (z, i) => Math.max(z, nominal.magnitude[i])) },
  };
}
