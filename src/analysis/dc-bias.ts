// DC bias: the capacitance a part keeps at a rail's DC voltage, and its model with that capacitance.
// Class 2 ceramics lose a large part of their capacitance under DC bias (common practice: makers publish a
// table of retained capacitance against voltage). Nominal capacitance is stated without DC bias (common
// practice: it is measured at 0 V DC), so the curve starts at 100 % at 0 V unless the table gives its own
// 0 V point; between points it is linear. Above the table's last point nothing is known: the last fraction
// is held and the result says so, since class 2 ceramics keep losing capacitance as the voltage rises.

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
  /** The voltage lies above the table's last point, whose fraction was held: an extrapolation. */
  extrapolated: boolean;
  /** The table's last voltage, V (null without a table). */
  tableEndV: number | null;
}

/**
 * The fraction of nominal capacitance at `voltageV`: linear between the table's points, through 100 % at
 * 0 V unless the table has a 0 V point, the last fraction held (and `extrapolated`) above the last point;
 * 1 when the table is empty.
 */
export function biasFraction(table: readonly BiasTablePoint[], voltageV: number): BiasedCapacitance {
  if (table.length === 0) return { fraction: 1, fromTable: false, extrapolated: false, tableEndV: null };
  const points = table[0].voltageV > 0 ? [{ voltageV: 0, fraction: 1 }, ...table] : table;
  const last = points[points.length - 1];
  const at = (fraction: number, extrapolated = false) => ({ fraction, fromTable: true, extrapolated, tableEndV: last.voltageV });
  if (voltageV <= points[0].voltageV) return at(points[0].fraction);
  if (voltageV > last.voltageV) return at(last.fraction, true);
  let i = 1;
  while (points[i].voltageV < voltageV) i++;
  const a = points[i - 1];
  const b = points[i];
  if (voltageV === b.voltageV) return at(b.fraction);
  const t = (voltageV - a.voltageV) / (b.voltageV - a.voltageV);
  return at(a.fraction + t * (b.fraction - a.fraction));
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
