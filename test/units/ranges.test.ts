// The value ranges zfolio computes with (src/units/ranges.ts), against their stated purpose: at every corner
// of the ranges, each element's impedance and the usual combinations stay finite and far from the
// subnormal numbers, both as complex.js computes them (a reference outside zfolio) and in zfolio's kernel.

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceAt } from '../../src/circuit/impedance.js';
import { inRange, rangeText, VALUE_RANGES } from '../../src/units/ranges.js';

// IEEE 754 binary64: largest finite 1.8e308, smallest normal 2.2e-308 (IEEE 754-2008, table 3.5).
const SMALLEST_NORMAL = 2.2250738585072014e-308;
const normal = (x: number) => Number.isFinite(x) && (x === 0 || Math.abs(x) >= SMALLEST_NORMAL);

const R = VALUE_RANGES.resistance!;
const L = VALUE_RANGES.inductance!;
const C = VALUE_RANGES.capacitance!;
const F = VALUE_RANGES.frequency!;
const corners = <T>(a: T[], b: T[], c: T[], d: T[]) => a.flatMap((x) => b.flatMap((y) => c.flatMap((z) => d.map((w) => [x, y, z, w] as const))));

describe('value ranges', () => {
  it('say what they are in engineering notation', () => {
    expect(rangeText('frequency')).toBe('from 1 mHz to 1 THz');
    expect(rangeText('inductance')).toBe('from 1 fH to 1 MH');
    expect(inRange(5e-324, 'capacitance')).toBe(false);
    expect(inRange(1e300, 'inductance')).toBe(false);
    expect(inRange(100e-9, 'capacitance')).toBe(true);
  });

  it('keep Z_R = R, Z_L = jωL, Z_C = 1/(jωC) and |Z|² between 1e-40 and 1e42 at every corner (closed form)', () => {
    for (const f of [F.min, F.max]) {
      const w = 2 * Math.PI * f;
      for (const z of [R.min, R.max, w * L.min, w * L.max, 1 / (w * C.min), 1 / (w * C.max)]) {
        expect(z * z).toBeGreaterThan(1e-40);
        expect(z * z).toBeLessThan(1e42);
      }
    }
  });

  it('give finite, normal impedances for R + L + C in series and in parallel at every corner: complex.js and the kernel agree', () => {
    for (const [r, l, c, f] of corners([R.min, R.max], [L.min, L.max], [C.min, C.max], [F.min, F.max])) {
      const w = 2 * Math.PI * f;
      const zr = new Complex(r, 0);
      const zl = new Complex(0, w * l);
      const zc = new Complex(0, -1 / (w * c));
      const refSeries = zr.add(zl).add(zc);
      const refParallel = new Complex(1, 0).div(zr.inverse().add(zl.inverse()).add(zc.inverse()));
      const [sr, sx] = impedanceAt(series(resistor(r), inductor(l), capacitor(c)), f);
      const [pr, px] = impedanceAt(parallel(resistor(r), inductor(l), capacitor(c)), f);
      for (const v of [refSeries.re, refSeries.im, refParallel.re, refParallel.im, sr, sx, pr, px]) expect(normal(v)).toBe(true);
      // Relative agreement of |Z|: double rounding on a few operations (1e-12 is far above it).
      expect(Math.hypot(sr, sx) / refSeries.abs()).toBeCloseTo(1, 12);
      expect(Math.hypot(pr, px) / refParallel.abs()).toBeCloseTo(1, 12);
    }
  });
});
