// Impedance from a measurement: the fixture formulas against the closed forms of a shunt and a series
// impedance between two ports. The test builds each two-port's S, Z or Y matrix itself with complex.js from
// its ABCD matrix (shunt Z: A = 1, B = 0, C = 1/Z, D = 1; series Z: A = 1, B = Z, C = 0, D = 1) and the
// ABCD-to-S conversion S11 = (A + B/Z0 − C·Z0 − D)/Δ, S12 = 2(AD − BC)/Δ, S21 = 2/Δ,
// S22 = (−A + B/Z0 − C·Z0 + D)/Δ, Δ = A + B/Z0 + C·Z0 + D (D. M. Pozar, Microwave Engineering, 4th ed.,
// 2012, §4.4, table 4.2), then checks that the fixture formula gives Z back.

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { impedanceFromNetwork, type Fixture } from '../../src/measure/fixtures.js';
import type { NetworkData, NetworkParameter } from '../../src/measure/network-data.js';

type Matrix = [Complex, Complex, Complex, Complex]; // 11, 12, 21, 22

function sFromAbcd([a, b, c, d]: Matrix, z0: number): Matrix {
  const delta = a.add(b.div(z0)).add(c.mul(z0)).add(d);
  return [
    a.add(b.div(z0)).sub(c.mul(z0)).sub(d).div(delta),
    a.mul(d).sub(b.mul(c)).mul(2).div(delta),
    new Complex(2, 0).div(delta),
    a.neg().add(b.div(z0)).sub(c.mul(z0)).add(d).div(delta),
  ];
}

const ONE = new Complex(1, 0);
const ZERO = new Complex(0, 0);
const shuntAbcd = (z: Complex): Matrix => [ONE, ZERO, z.inverse(), ONE];
const seriesAbcd = (z: Complex): Matrix => [ONE, z, ZERO, ONE];

function network(ports: number, parameter: NetworkParameter, matrices: Complex[][], frequencies: number[], reference = [50, 50]): NetworkData {
  const n2 = ports * ports;
  const re = new Float64Array(frequencies.length * n2);
  const im = new Float64Array(frequencies.length * n2);
  matrices.forEach((m, k) => m.forEach((v, i) => ((re[k * n2 + i] = v.re), (im[k * n2 + i] = v.im))));
  const at = { file: 'test.s2p', line: 1, column: 1 };
  return { file: 'test.s2p', version: 1, ports, parameter, format: 'RI', frequencyUnit: 'Hz', reference: reference.slice(0, ports), frequencies: Float64Array.from(frequencies), re, im, lines: Int32Array.from(frequencies.map((_, k) => k + 2)), at: { ports: at, reference: at } };
}

// Impedances from a few milliohms (a capacitor at resonance) to kilohms (a bead at its peak), any phase.
const IMPEDANCES = [new Complex(0.004, -0.02), new Complex(0.05, 0), new Complex(2, 30), new Complex(600, -150), new Complex(12e3, 4e3), new Complex(30, -1e3)];
const FREQS = IMPEDANCES.map((_, k) => 1e6 * (k + 1));

function expectImpedances(data: NetworkData, fixture: Fixture): void {
  const result = impedanceFromNetwork(data, fixture);
  expect(result.ok).toBe(true);
  if (!result.ok) return;
  IMPEDANCES.forEach((z, k) => {
    const got = new Complex(result.impedance.re[k], result.impedance.im[k]);
    // Rounding in the conversion and its inverse: a few ulps of |S| spread over |Z|/Z0; 1e-9 relative is ample.
    expect(got.sub(z).abs() / z.abs()).toBeLessThan(1e-9);
  });
}

describe('impedance from a two-port fixture', () => {
  it('shunt-thru from S21: Z = (Z0/2)·S21/(1 − S21)', () => {
    expectImpedances(network(2, 'S', IMPEDANCES.map((z) => sFromAbcd(shuntAbcd(z), 50)), FREQS), 'shunt-thru');
  });

  it('series-thru from S21: Z = 2·Z0·(1 − S21)/S21', () => {
    expectImpedances(network(2, 'S', IMPEDANCES.map((z) => sFromAbcd(seriesAbcd(z), 50)), FREQS), 'series-thru');
  });

  it('the closed forms themselves: shunt S21 = 2Z/(2Z + Z0), series S21 = 2Z0/(2Z0 + Z)', () => {
    for (const z of IMPEDANCES) {
      expect(sFromAbcd(shuntAbcd(z), 50)[2].sub(z.mul(2).div(z.mul(2).add(50))).abs()).toBeLessThan(1e-12);
      expect(sFromAbcd(seriesAbcd(z), 50)[2].sub(new Complex(100, 0).div(z.add(100))).abs()).toBeLessThan(1e-12);
    }
  });

  it('the reference impedance comes from the file (75 Ω here)', () => {
    expectImpedances(network(2, 'S', IMPEDANCES.map((z) => sFromAbcd(shuntAbcd(z), 75)), FREQS, [75, 75]), 'shunt-thru');
  });

  it('shunt-thru from Z parameters: a shunt impedance has Z11 = Z12 = Z21 = Z22 = Z', () => {
    expectImpedances(network(2, 'Z', IMPEDANCES.map((z) => [z, z, z, z]), FREQS), 'shunt-thru');
  });

  it('series-thru from Y parameters: a series impedance has Y11 = Y22 = 1/Z, Y12 = Y21 = −1/Z', () => {
    expectImpedances(network(2, 'Y', IMPEDANCES.map((z) => [z.inverse(), z.inverse().neg(), z.inverse().neg(), z.inverse()]), FREQS), 'series-thru');
  });
});

describe('impedance from a one-port reflection', () => {
  it('S11: Z = Z0·(1 + Γ)/(1 − Γ), with Γ = (Z − Z0)/(Z + Z0)', () => {
    expectImpedances(network(1, 'S', IMPEDANCES.map((z) => [z.sub(50).div(z.add(50))]), FREQS), 'reflection');
  });
  it('Z11 is the impedance, 1/Y11 too', () => {
    expectImpedances(network(1, 'Z', IMPEDANCES.map((z) => [z]), FREQS), 'reflection');
    expectImpedances(network(1, 'Y', IMPEDANCES.map((z) => [z.inverse()]), FREQS), 'reflection');
  });
});

describe('what a fixture refuses', () => {
  it('a two-port formula on a one-port file, and the reverse, located at the port count', () => {
    const one = impedanceFromNetwork(network(1, 'S', [[ZERO]], [1e6]), 'shunt-thru');
    expect(one.ok).toBe(false);
    if (!one.ok) expect(one.error.message).toBe('a shunt-thru measurement needs a 2-port file, found 1 port; a one-port file is a reflection measurement');
    const two = impedanceFromNetwork(network(2, 'S', [[ZERO, ONE, ONE, ZERO]], [1e6]), 'reflection');
    expect(two.ok).toBe(false);
  });
  it('ports of different reference impedance', () => {
    const r = impedanceFromNetwork(network(2, 'S', [sFromAbcd(shuntAbcd(ONE), 50)], [1e6], [50, 25]), 'shunt-thru');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toContain('50 Ω and 25 Ω');
  });
  it('S21 = 1 in a shunt-thru (an open) is located at its line', () => {
    const r = impedanceFromNetwork(network(2, 'S', [sFromAbcd(shuntAbcd(ONE), 50), [ZERO, ONE, ONE, ZERO]], [1e6, 2e6]), 'shunt-thru');
    expect(r.ok).toBe(false);
    if (!r.ok) expect([r.error.line, r.error.message]).toEqual([3, 'the shunt-thru formula gives no finite impedance here (S21 = 1, an open); leave this frequency out or check the fixture']);
  });
});
