// Round trips: a model's impedance, computed here with complex.js from its element tree (Z_R = R,
// Z_L = jωL, Z_C = 1/(jωC), series sums, parallel reciprocal sums; Alexander & Sadiku, Fundamentals of
// Electric Circuits, 6th ed., ch. 9), written as a Touchstone file in every combination of version,
// frequency unit, parameter and format, read back, and turned into Z again: it must equal the model to
// 1e-9 relative. One-port S is Γ = (Z − Z0)/(Z + Z0), Y = 1/Z (Pozar, Microwave Engineering, 4th ed., §2.3).

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceFromNetwork } from '../../src/measure/fixtures.js';
import type { DataFormat, FrequencyUnit, NetworkParameter } from '../../src/measure/network-data.js';
import { readTouchstone } from '../../src/measure/touchstone-read.js';
import { writeTouchstone } from '../../src/measure/touchstone-write.js';
import { referenceZAt } from '../reference/impedance.js';

// A capacitor model: ESR + ESL + (C ‖ EPR), from below to far above its resonance.
const model = series(resistor(0.018), inductor(0.45e-9), parallel(capacitor(100e-9), resistor(1e9)));
const frequencies = Float64Array.from({ length: 61 }, (_, i) => 1e3 * 10 ** (i / 10));
const z = Array.from(frequencies, (f) => referenceZAt(model, f));

const VERSIONS = [1, 2] as const;
const UNITS: FrequencyUnit[] = ['Hz', 'kHz', 'MHz', 'GHz'];
const PARAMETERS: NetworkParameter[] = ['S', 'Y', 'Z'];
const FORMATS: DataFormat[] = ['MA', 'DB', 'RI'];
const combos = VERSIONS.flatMap((v) => UNITS.flatMap((u) => PARAMETERS.flatMap((p) => FORMATS.map((f) => [v, u, p, f] as const))));

function onePortValues(parameter: NetworkParameter, z0: number): { re: Float64Array; im: Float64Array } {
  const values = z.map((zk) => (parameter === 'Z' ? zk : parameter === 'Y' ? zk.inverse() : zk.sub(z0).div(zk.add(z0))));
  return { re: Float64Array.from(values, (v) => v.re), im: Float64Array.from(values, (v) => v.im) };
}

describe('model → Touchstone → reader → Z', () => {
  it.each(combos)('version %s, %s, %s, %s', (version, unit, parameter, format) => {
    for (const z0 of [50, 75]) {
      const text = writeTouchstone({ version, ports: 1, parameter, format, unit, reference: z0, frequencies, ...onePortValues(parameter, z0), comments: ['round trip'] });
      const read = readTouchstone(text, version === 1 ? 'model.s1p' : 'model.ts');
      expect(read.ok).toBe(true);
      if (!read.ok) return;
      expect(read.data.version).toBe(version);
      expect(read.data.reference).toEqual([z0]);
      const got = impedanceFromNetwork(read.data, 'reflection');
      expect(got.ok).toBe(true);
      if (!got.ok) return;
      for (let k = 0; k < frequencies.length; k++) {
        expect(Math.abs(got.impedance.frequencies[k] / frequencies[k] - 1)).toBeLessThan(1e-14);
        expect(new Complex(got.impedance.re[k], got.impedance.im[k]).sub(z[k]).abs() / z[k].abs()).toBeLessThan(1e-9);
      }
    }
  });

  it.each([
    [1, '21_12'],
    [2, '21_12'],
    [2, '12_21'],
  ] as const)('a two-port shunt-thru file, version %s, order %s', (version, order) => {
    // The shunt two-port's S matrix: S11 = S22 = −Z0/(2Z + Z0), S21 = S12 = 2Z/(2Z + Z0) (Pozar, table 4.2).
    const re = new Float64Array(4 * z.length);
    const im = new Float64Array(4 * z.length);
    z.forEach((zk, k) => {
      const d = zk.mul(2).add(50);
      const s11 = new Complex(-50, 0).div(d);
      const s21 = zk.mul(2).div(d);
      [s11, s21, s21, s11].forEach((v, i) => ((re[4 * k + i] = v.re), (im[4 * k + i] = v.im)));
    });
    // An asymmetric twist so the order matters: S12 differs from S21 (the formula reads S21 alone).
    for (let k = 0; k < z.length; k++) re[4 * k + 1] += 0.5;
    const text = writeTouchstone({ version, ports: 2, parameter: 'S', format: 'RI', unit: 'MHz', reference: 50, frequencies, re, im, twoPortOrder: order });
    const read = readTouchstone(text, version === 1 ? 'shunt.s2p' : 'shunt.ts');
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const got = impedanceFromNetwork(read.data, 'shunt-thru');
    expect(got.ok).toBe(true);
    if (!got.ok) return;
    for (let k = 0; k < z.length; k++) expect(new Complex(got.impedance.re[k], got.impedance.im[k]).sub(z[k]).abs() / z[k].abs()).toBeLessThan(1e-9);
  });
});
