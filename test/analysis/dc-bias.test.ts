// DC bias (src/analysis/dc-bias.ts): the fraction of nominal capacitance a part keeps at a DC voltage, read
// from its table, and its model with every capacitance scaled.

import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { biasFraction, scaleCapacitance } from '../../src/analysis/dc-bias.js';

// Linear interpolation between table points, through 100 % at 0 V where nominal capacitance is stated
// (common practice: nominal is measured without DC bias), the last fraction held above the last point;
// the arithmetic is checked by hand in each comment.
const table = [
  { voltageV: 1, fraction: 0.9 },
  { voltageV: 3.3, fraction: 0.6 },
  { voltageV: 6.3, fraction: 0.35 },
];

describe('biasFraction', () => {
  it('no table: nominal capacitance', () => {
    expect(biasFraction([], 5)).toEqual({ fraction: 1, fromTable: false, extrapolated: false, tableEndV: null });
  });
  it('on a table point: that point', () => {
    expect(biasFraction(table, 3.3)).toEqual({ fraction: 0.6, fromTable: true, extrapolated: false, tableEndV: 6.3 });
    expect(biasFraction(table, 1)).toEqual({ fraction: 0.9, fromTable: true, extrapolated: false, tableEndV: 6.3 });
  });
  it('between points: linear, 2.15 V is halfway from 1 V (90 %) to 3.3 V (60 %) → 75 %', () => {
    const b = biasFraction(table, 2.15);
    expect(b.fraction).toBeCloseTo(0.75, 14);
    expect(b.extrapolated).toBe(false);
  });
  it('4.8 V: half of the way from 3.3 V (60 %) to 6.3 V (35 %) → 47.5 %', () => {
    expect(biasFraction(table, 4.8).fraction).toBeCloseTo(0.475, 14);
  });
  it('below the first point: on the line from 100 % at 0 V, 0.5 V is halfway to 1 V (90 %) → 95 %', () => {
    const b = biasFraction(table, 0.5);
    expect(b.fraction).toBeCloseTo(0.95, 14);
    expect(b.extrapolated).toBe(false);
  });
  it('a 0 V point in the table is used as given: 0.5 V halfway from 0 V (98 %) to 1 V (90 %) → 94 %', () => {
    expect(biasFraction([{ voltageV: 0, fraction: 0.98 }, ...table], 0.5).fraction).toBeCloseTo(0.94, 14);
    expect(biasFraction([{ voltageV: 0, fraction: 0.98 }, ...table], 0).fraction).toBe(0.98);
  });
  it('above the last point: its fraction is held, marked extrapolated, with the table end', () => {
    expect(biasFraction(table, 10)).toEqual({ fraction: 0.35, fromTable: true, extrapolated: true, tableEndV: 6.3 });
  });
  it('a table of one point: 0 V to it linear, held above', () => {
    const one = [{ voltageV: 12, fraction: 0.78 }];
    // 6 V: halfway from 100 % at 0 V to 78 % at 12 V → 89 %
    expect(biasFraction(one, 6).fraction).toBeCloseTo(0.89, 14);
    expect(biasFraction(one, 24)).toMatchObject({ fraction: 0.78, extrapolated: true });
  });
});

describe('scaleCapacitance', () => {
  const collect = (e: Element, out: number[] = []): number[] => {
    if (e.type === 'C') out.push(e.farads);
    if (e.type === 'series' || e.type === 'parallel') e.parts.forEach((p) => collect(p, out));
    return out;
  };
  it('scales every capacitance of a tree and nothing else', () => {
    const tree = parallel(series(resistor(0.004), inductor(0.9e-9), capacitor(10e-6)), series(resistor(0.2), inductor(0.2e-9), capacitor(1e-9)));
    const scaled = scaleCapacitance(tree, 0.5);
    expect(collect(scaled)).toEqual([5e-6, 0.5e-9]);
    expect(JSON.stringify(scaled).replace(/"farads":[^,}]+/g, '')).toBe(JSON.stringify(tree).replace(/"farads":[^,}]+/g, ''));
  });
  it('returns the same tree when nothing changes, so its compiled kernel is reused', () => {
    const tree = series(resistor(0.01), capacitor(1e-6));
    expect(scaleCapacitance(tree, 1)).toBe(tree);
  });
});
