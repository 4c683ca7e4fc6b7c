import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, scaledImpedance, series } from '../../src/circuit/element.js';
import { referenceRailZ, referenceZAt } from '../reference/impedance.js';

describe('scaledImpedance', () => {
  const tree = series(resistor(0.01, 'ESR'), inductor(0.5e-9, 'ESL'), parallel(capacitor(1e-6), resistor(1e8, 'EPR')));
  it('with 1/N is N identical copies in parallel, at every frequency (complex.js reference)', () => {
    const four = scaledImpedance(tree, 1 / 4);
    for (const f of [1, 1e3, 1e6, 7.1e6, 1e9]) {
      const expected = referenceRailZ([{ element: tree, count: 4 }], f);
      const got: Complex = referenceZAt(four, f);
      expect(got.sub(expected).abs() / expected.abs()).toBeLessThan(1e-13);
    }
  });
  it('keeps the names of the leaves and returns the tree itself for a factor of 1', () => {
    expect(scaledImpedance(tree, 1)).toBe(tree);
    expect(scaledImpedance(tree, 2)).toMatchObject({ type: 'series', parts: [{ type: 'R', ohms: 0.02, name: 'ESR' }, { type: 'L', henries: 1e-9, name: 'ESL' }, {}] });
  });
});
