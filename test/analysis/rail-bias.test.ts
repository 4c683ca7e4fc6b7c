// A capacitor placed on a rail at its DC voltage: the capacitance its DC-bias table leaves it and its mounted
// model (src/analysis/dc-bias.ts itself is tested in dc-bias.test.ts).

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { placedModel } from '../../src/analysis/plan-figures.js';
import { loadLibrary } from '../../src/model/library.js';

describe('the 10 µF X7R part at 0.9 V (demo library, invented part)', () => {
  // Its table starts at 12 V (78 %). At 0.9 V the capacitance lies on the line from 100 % at 0 V:
  // 1 − 0.22 · 0.9/12 = 98.35 %, 9.835 µF — not 78 %, the 12 V value.
  const { library } = loadLibrary(fileURLToPath(new URL('../..', import.meta.url)));
  it('keeps 98.35 % of its nominal value, from its table, not extrapolated', () => {
    const placed = placedModel(library!.partsById.get('ORV-C-1210-10U-X7R')!, 0.9, 0.3e-9);
    expect(placed.bias.fraction).toBeCloseTo(1 - (0.22 * 0.9) / 12, 14);
    expect(placed.bias).toMatchObject({ fromTable: true, extrapolated: false });
    expect(placed.capacitanceF).toBeCloseTo(9.835e-6, 17);
  });
});

describe('placed parts from the fixture library (invented parts)', () => {
  const { library } = loadLibrary(fileURLToPath(new URL('../fixtures/rail-library', import.meta.url)));
  it('loads', () => {
    expect(library).toBeDefined();
  });
  const part = (id: string) => library!.partsById.get(id)!;

  it('RT-C-22U at 1 V keeps 90 % of 22 µF (its table point) and mounts in series with the mounting L', () => {
    const placed = placedModel(part('RT-C-22U'), 1, 0.3e-9);
    expect(placed.bias).toEqual({ fraction: 0.9, fromTable: true, extrapolated: false, tableEndV: 6.3 });
    expect(placed.capacitanceF).toBeCloseTo(19.8e-6, 18);
    expect(placed.element.type).toBe('series');
  });
  it('RT-C-4U7 at 1 V: between 0.5 V (96 %) and 2 V (80 %), a third of the way → 90.67 %', () => {
    expect(placedModel(part('RT-C-4U7'), 1, 0).bias.fraction).toBeCloseTo(0.96 - 0.16 / 3, 14);
  });
  it('a part without a table keeps its nominal value', () => {
    const placed = placedModel(part('RT-C-1U'), 1, 0.3e-9);
    expect(placed.bias.fromTable).toBe(false);
    expect(placed.capacitanceF).toBe(1e-6);
  });
  it('the same part, bias and mounting give the same element (kernels are shared between analyses)', () => {
    expect(placedModel(part('RT-C-22U'), 1, 0.3e-9).element).toBe(placedModel(part('RT-C-22U'), 1, 0.3e-9).element);
  });
});
