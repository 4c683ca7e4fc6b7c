// The fit models against complex.js evaluations of the same topologies written as element trees (the part
// format's models; element laws as in Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed.,
// ch. 9), and their derivatives against central differences of those evaluations in ln p.

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { FIT_PARAMETERS, MODELS, type FitKind } from '../../src/measure/fit-models.js';
import { referenceZAt } from '../reference/impedance.js';

/** The tree of each kind with the parameters that are on, written here from the README's model list. */
function tree(kind: FitKind, v: number[], on: boolean[]): Element {
  const opt = (i: number, e: Element) => (on[i] ? [e] : []);
  switch (kind) {
    case 'capacitor':
      return series(...opt(1, resistor(v[1])), ...opt(2, inductor(v[2])), parallel(capacitor(v[0]), ...opt(3, resistor(v[3]))));
    case 'inductor':
      return parallel(series(...opt(1, resistor(v[1])), inductor(v[0])), ...opt(2, capacitor(v[2])), ...opt(3, resistor(v[3])));
    case 'resistor':
      return parallel(series(resistor(v[0]), ...opt(1, inductor(v[1]))), ...opt(2, capacitor(v[2])));
    case 'bead':
      return series(...opt(0, resistor(v[0])), parallel(resistor(v[1]), inductor(v[2]), ...opt(3, capacitor(v[3]))));
  }
}

const VALUES: Record<FitKind, number[]> = {
  capacitor: [100e-9, 0.018, 0.45e-9, 2e6],
  inductor: [10e-6, 0.05, 5e-12, 20e3],
  resistor: [1e3, 1e-9, 0.2e-12],
  bead: [0.05, 600, 1.2e-6, 1.5e-12],
};
const FREQUENCIES = [10, 1e3, 1e5, 3.3e6, 2.2e7, 1e8, 4.7e8, 3e9];

const KINDS = Object.keys(VALUES) as FitKind[];
const subsets = (n: number) => Array.from({ length: 2 ** n }, (_, mask) => Array.from({ length: n }, (_, i) => Boolean(mask & (1 << i))));

describe.each(KINDS)('%s model', (kind) => {
  const specs = FIT_PARAMETERS[kind];
  const v = VALUES[kind];
  // Every combination of the optional parameters being present or absent; required ones always present.
  const combos = subsets(specs.length).filter((on) => on.every((o, i) => o || specs[i].absence !== 'required'));

  it('Z equals the element tree at every frequency, for every set of parameters present', () => {
    const z = new Float64Array(2);
    for (const on of combos) {
      for (const f of FREQUENCIES) {
        MODELS[kind](2 * Math.PI * f, Float64Array.from(v), on, z, null);
        const ref = referenceZAt(tree(kind, v, on), f);
        expect(new Complex(z[0], z[1]).sub(ref).abs() / ref.abs()).toBeLessThan(1e-12);
      }
    }
  });

  // Richardson's extrapolation of central differences at steps h and h/2 (error O(h⁴)); near a sharp
  // resonance the derivatives of Z grow like powers of Q, so the error is taken relative to |Z| + |∂Z|.
  it('∂Z/∂ln p equals an extrapolated central difference of the tree in ln p', () => {
    const z = new Float64Array(2);
    const dz = new Float64Array(2 * specs.length);
    const h = 1e-4;
    for (const on of combos) {
      for (const f of FREQUENCIES) {
        MODELS[kind](2 * Math.PI * f, Float64Array.from(v), on, z, dz);
        const size = Math.hypot(z[0], z[1]);
        specs.forEach((_, j) => {
          const central = (step: number) => {
            const up = v.slice();
            const down = v.slice();
            up[j] *= Math.exp(step);
            down[j] *= Math.exp(-step);
            return referenceZAt(tree(kind, up, on), f).sub(referenceZAt(tree(kind, down, on), f)).div(2 * step);
          };
          const diff = central(h / 2).mul(4).sub(central(h)).div(3);
          const expected = on[j] ? diff : new Complex(0, 0);
          const got = new Complex(dz[2 * j], dz[2 * j + 1]);
          expect(got.sub(expected).abs() / (size + got.abs())).toBeLessThan(1e-9);
        });
      }
    }
  });
});
