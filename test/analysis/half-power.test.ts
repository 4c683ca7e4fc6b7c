import { describe, expect, it } from 'vitest';
import { halfPowerFrequencies } from '../../src/analysis/half-power.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';

// Series R-L-C: f0 = 1/(2π√(LC)), Q = √(L/C)/R, and the half-power frequencies
// f1,2 = f0·(√(1 + 1/(4Q²)) ∓ 1/(2Q)) (any circuit-analysis text on series resonance, e.g. Alexander &
// Sadiku, Fundamentals of Electric Circuits, ch. 14).
function closedForm(r: number, l: number, c: number) {
  const f0 = 1 / (2 * Math.PI * Math.sqrt(l * c));
  const q = Math.sqrt(l / c) / r;
  const root = Math.sqrt(1 + 1 / (4 * q * q));
  return { f0, q, f1: f0 * (root - 1 / (2 * q)), f2: f0 * (root + 1 / (2 * q)) };
}

describe('half-power frequencies of a series resonance', () => {
  it.each([
    [0.018, 0.45e-9, 100e-9],
    [0.4, 0.4e-9, 22e-12],
    [0.05, 2e-9, 470e-6],
    [2, 1e-9, 1e-9],
  ])('R %s Ω, L %s H, C %s F: f1 and f2 as the closed form gives, to 1e-9', (r, l, c) => {
    const network = series(resistor(r), inductor(l), capacitor(c));
    const want = closedForm(r, l, c);
    const frequencies = logSweep({ fromHz: want.f0 / 1e4, toHz: want.f0 * 1e4, perDecade: 20 });
    const z = impedanceSweep(network, frequencies);
    const got = halfPowerFrequencies({ frequencies, z, network }, want.f0)!;
    expect(got[0] / want.f1 - 1).toBeCloseTo(0, 9);
    expect(got[1] / want.f2 - 1).toBeCloseTo(0, 9);
    expect(want.f0 / (got[1] - got[0]) / want.q - 1).toBeCloseTo(0, 8);
  });

  it('is null when the sweep ends before an edge', () => {
    const network = series(resistor(0.05), inductor(1e-9), capacitor(1e-6));
    const { f0, f2 } = closedForm(0.05, 1e-9, 1e-6);
    const frequencies = logSweep({ fromHz: f0 / 100, toHz: (f0 + f2) / 2, perDecade: 50 });
    expect(halfPowerFrequencies({ frequencies, z: impedanceSweep(network, frequencies), network }, f0)).toBeNull();
  });
});
