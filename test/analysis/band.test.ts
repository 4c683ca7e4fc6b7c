import { resolvedSweep } from '../../src/analysis/resolved-sweep.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';
import { logSweep, type SweepSpec } from '../../src/circuit/sweep.js';
import { usableBand, type BandRule } from '../../src/analysis/band.js';

const spec: SweepSpec = { fromHz: 100, toHz: 1e10, perDecade: 50 };
const freqs = logSweep(spec);
const band = (tree: Element, rule: BandRule, f = freqs) => usableBand(tree, rule, resolvedSweep(tree, f));
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('capacitor band', () => {
  const L = 0.45e-9;
  const C = 100e-9;
  const srf = 1 / (2 * Math.PI * Math.sqrt(L * C));

  it('for the series model ends at SRF·√(1 − 1/1.1) with within = 10% (from C_eff = C/(1 − (f/SRF)²))', () => {
    const b = band(series(resistor(0.018), inductor(L), capacitor(C)), { behavesAs: 'capacitor', nominal: C, within: 0.1 })!;
    expect(b.fromIsSweepEnd).toBe(true);
    expect(b.fromHz).toBe(100);
    expect(b.toIsSweepEnd).toBe(false);
    expect(rel(b.toHz, srf * Math.sqrt(1 - 1 / 1.1))).toBeLessThan(1e-9);
  });

  it('with leakage starts where C_eff = C + 1/(ω²C·Rp²) reaches C(1 + within): ω = 1/(C·Rp·√within)', () => {
    // C ‖ Rp: Z = Rp/(1 + jωCRp), so −1/(ωX) = C + 1/(ω²CRp²) (closed form from the parallel law).
    const Rp = 1e4; // puts the edge near 500 Hz, inside the sweep
    const tree = series(inductor(L), parallel(capacitor(C), resistor(Rp)));
    const b = band(tree, { behavesAs: 'capacitor', nominal: C, within: 0.1 })!;
    const expected = 1 / (2 * Math.PI * C * Rp * Math.sqrt(0.1));
    expect(b.fromIsSweepEnd).toBe(false);
    expect(rel(b.fromHz, expected)).toBeLessThan(1e-6);
  });

  it('says when the band reaches the sweep end', () => {
    const b = band(capacitor(1e-9), { behavesAs: 'capacitor', nominal: 1e-9, within: 0.1 })!;
    expect(b).toEqual({ fromHz: 100, toHz: 1e10, fromIsSweepEnd: true, toIsSweepEnd: true });
  });

  it('is null when the part is never within its tolerance', () => {
    expect(band(capacitor(1e-9), { behavesAs: 'capacitor', nominal: 2e-9, within: 0.1 })).toBeNull();
  });
});

describe('inductor band', () => {
  it('L ‖ Cp ends at SRF·√(1 − 1/1.1) too (L_eff = L/(1 − (f/SRF)²))', () => {
    const L = 10e-6;
    const Cp = 3e-12;
    const srf = 1 / (2 * Math.PI * Math.sqrt(L * Cp));
    const b = band(parallel(inductor(L), capacitor(Cp)), { behavesAs: 'inductor', nominal: L, within: 0.1 })!;
    expect(rel(b.toHz, srf * Math.sqrt(1 - 1 / 1.1))).toBeLessThan(1e-9);
  });
});

describe('resistor band', () => {
  it('R + jωL stays within 1% while ωL ≤ 0.01·R... exactly |jωL|/R = within', () => {
    const R = 100;
    const L = 1e-9;
    const b = band(series(resistor(R), inductor(L)), { behavesAs: 'resistor', nominal: R, within: 0.01 })!;
    expect(rel(b.toHz, (0.01 * R) / (2 * Math.PI * L))).toBeLessThan(1e-9);
  });
});

describe('bead band', () => {
  it('r ‖ l ‖ c is resistive where |ωc − 1/(ωl)| ≤ 1/r: the half-power band of a parallel RLC', () => {
    // G ≥ |B| with G = 1/r, B = ωc − 1/(ωl). Edges solve c·ω² ∓ ω/r − 1/l = 0 (Alexander & Sadiku §14.6:
    // ω1,2 = ∓1/(2rc) + √(1/(2rc)² + 1/(lc)), bandwidth 1/(rc)).
    const r = 600;
    const l = 1.5e-6;
    const c = 1.2e-12;
    const rdc = 0.15;
    const half = 1 / (2 * r * c);
    const w1 = -half + Math.sqrt(half ** 2 + 1 / (l * c));
    const w2 = half + Math.sqrt(half ** 2 + 1 / (l * c));
    const tree = series(resistor(rdc), parallel(resistor(r), inductor(l), capacitor(c)));
    const b = band(tree, { behavesAs: 'bead', dcResistanceOhm: rdc })!;
    expect(rel(b.fromHz * 2 * Math.PI, w1)).toBeLessThan(1e-8);
    expect(rel(b.toHz * 2 * Math.PI, w2)).toBeLessThan(1e-8);
  });
});

describe('a high-Q bead: the absorbing band narrower than a sweep step', () => {
  // rdc + (r ‖ l ‖ c): R − Rdc ≥ |X| ⇔ G ≥ |B| for the core, so the edges solve ωc − 1/(ωl) = ±1/r, i.e.
  // ω = (±1/r + √(1/r² + 4c/l))/(2c) (the half-power band of a parallel resonator; Alexander & Sadiku §14.6).
  const [rdc, r, l, c] = [0.1, 1e6, 1e-6, 1e-12];
  const tree = series(resistor(rdc), parallel(resistor(r), inductor(l), capacitor(c)));
  const edge = (sign: 1 | -1) => (sign / r + Math.sqrt(1 / r ** 2 + (4 * c) / l)) / (2 * c) / (2 * Math.PI);

  it('is found at 159.075–159.235 MHz, to 1e-9 relative, on a 50-point-per-decade sweep', () => {
    const b = band(tree, { behavesAs: 'bead', dcResistanceOhm: rdc })!;
    expect(b).not.toBeNull();
    expect(rel(b.fromHz, edge(-1))).toBeLessThan(1e-9);
    expect(rel(b.toHz, edge(1))).toBeLessThan(1e-9);
    expect(b.fromHz / 1e6).toBeCloseTo(159.075, 3);
    expect(b.toHz / 1e6).toBeCloseTo(159.235, 3);
  });
});
