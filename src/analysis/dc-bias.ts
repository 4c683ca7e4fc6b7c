// DC bias: the capacitance a part keeps at a rail's DC voltage, and its model with that capacitance.
// Class 2 ceramics lose a large part of their capacitance under DC bias (common practice: makers publish a
// table of retained capacitance against voltage); between the table's points we interpolate linearly.

import { parallel, series, type Element } from '../circuit/element.js';

/** A table point: the fraction of nominal capacitance kept at a DC voltage. Voltages increase. */
export interface BiasTablePoint {
  voltageV: number;
  fraction: number;
}

export interface BiasedCapacitance {
  /** Fraction of nominal kept at the voltage (1 when there is no table). */
  fraction: number;
  /** Whether a DC-bias table was used (false: nominal capacitance, no table). */
  fromTable: boolean;
  /** The voltage lies outside the table and the nearest end point was used. */
  clamped: boolean;
}

/**
 * The fraction of nominal capacitance at `voltageV`: linear interpolation between the table's points,
 * clamped to the first and last points outside the table; 1 when the table is empty.
 */
export function biasFraction(table: readonly BiasTablePoint[], voltageV: number): BiasedCapacitance {
  if (table.length === 0) return { fraction: 1, fromTable: false, clamped: false };
  const first = table[0];
  const last = table[table.length - 1];
  if (voltageV <= first.voltageV) return { fraction: first.fraction, fromTable: true, clamped: voltageV < first.voltageV };
  if (voltageV >= last.voltageV) return { fraction: last.fraction, fromTable: true, clamped: voltageV > last.voltageV };
  let i = 1;
  while (table[i].voltageV < voltageV) i++;
  const a = table[i - 1];
  const b = table[i];
  const t = (voltageV - a.voltageV) / (b.voltageV - a.voltageV);
  return { fraction: a.fraction + t * (b.fraction - a.fraction), fromTable: true, clamped: false };
}

/**
 * The same tree with every capacitance multiplied by `factor`. For a capacitor model there is one C; for a
 * network that behaves as a capacitor every C scales alike, so the whole retains `factor` of its value.
 * Returns the tree itself when the factor is 1, so compiled kernels are shared.
 */
export function scaleCapacitance(element: Element, factor: number): Element {
  if (factor === 1) return element;
  switch (element.type) {
    case 'C':
      // Spread keeps whatever else the leaf carries (its role name in the part model).
      return { ...element, farads: element.farads * factor };
    case 'R':
    case 'L':
      return element;
    case 'series':
      return series(...element.parts.map((p) => scaleCapacitance(p, factor)));
    case 'parallel':
      return parallel(...element.parts.map((p) => scaleCapacitance(p, factor)));
  }
}
