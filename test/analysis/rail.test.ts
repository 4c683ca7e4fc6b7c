import { describe, expect, it } from 'vitest';
import { capacitor, inductor, resistor, series, type Element } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { evaluateRail, marginDb, placementElement, railAdmittanceAt, targetImpedance, type RailBranch } from '../../src/analysis/rail.js';
import { PEAK_TOLERANCE } from '../../src/analysis/peaks.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const branch = (element: Element, count = 1, label = 'b'): RailBranch => ({ kind: 'capacitor', label, element, count });
const magnitudeAt = (branches: RailBranch[], f: number) => {
  const y = railAdmittanceAt(branches, f).total;
  return 1 / Math.hypot(y.re, y.im);
};

describe('target impedance', () => {
  it('Z_t = V·ripple/ΔI: 0.9 V, 3 %, 6 A gives 4.5 mΩ (Smith et al., IEEE Trans. Adv. Packaging, 1999)', () => {
    expect(rel(targetImpedance(0.9, 0.03, 6), 4.5e-3)).toBeLessThan(1e-15);
  });
  it('margin is 20·log10(Z_t/|Z|): half the target is +6.02 dB (20·log10 2)', () => {
    expect(marginDb(0.01, 0.005)).toBeCloseTo(20 * Math.log10(2), 12);
    expect(marginDb(0.01, 0.02)).toBeCloseTo(-20 * Math.log10(2), 12);
  });
});

describe('N identical capacitors', () => {
  // Closed form: N equal series-RLC branches in parallel are one branch with R/N, L/N, N·C, so at their
  // common SRF 1/(2π√(LC)) the reactances cancel and |Z| = ESR/N.
  const [esr, esl, c, n] = [0.012, 0.45e-9, 1e-6, 8];
  it('|Z| at their SRF is ESR/N', () => {
    const srf = 1 / (2 * Math.PI * Math.sqrt(esl * c));
    const branches = [branch(series(resistor(esr), inductor(esl), capacitor(c)), n)];
    expect(rel(magnitudeAt(branches, srf), esr / n)).toBeLessThan(1e-9);
  });
  it('with a mounting inductance Lm the SRF moves to 1/(2π√((ESL + Lm)C)) and |Z| there is still ESR/N', () => {
    const lm = 0.3e-9;
    const srf = 1 / (2 * Math.PI * Math.sqrt((esl + lm) * c));
    const branches = [branch(placementElement(series(resistor(esr), inductor(esl), capacitor(c)), lm), n)];
    expect(rel(magnitudeAt(branches, srf), esr / n)).toBeLessThan(1e-9);
    // and the sweep's minimum is within one grid step of it
    const f = logSweep({ fromHz: 1e5, toHz: 1e8, perDecade: 100 });
    const rail = evaluateRail(branches, 1, f);
    const k = rail.magnitude.indexOf(Math.min(...rail.magnitude));
    expect(Math.abs(Math.log10(f[k] / srf))).toBeLessThanOrEqual(0.5 / 100 + 1e-12);
  });
});

describe('anti-resonance of two capacitors', () => {
  // Two lossless branches L1–C1 and L2–C2 in parallel: |Z| → ∞ where X1 = −X2, i.e.
  // ω²(L1 + L2) = (C1 + C2)/(C1C2), f = 1/(2π√((L1 + L2)·C1C2/(C1 + C2))) (closed form from X1 = −X2).
  const [l1, c1, l2, c2] = [1e-9, 10e-6, 0.5e-9, 100e-9];
  const expected = 1 / (2 * Math.PI * Math.sqrt((l1 + l2) * ((c1 * c2) / (c1 + c2))));
  const f = logSweep({ fromHz: 1e5, toHz: 1e9, perDecade: 50 });

  it('is found once, refined to 1e-9 relative', () => {
    const rail = evaluateRail([branch(series(inductor(l1), capacitor(c1)), 1, 'big'), branch(series(inductor(l2), capacitor(c2)), 1, 'small')], 1, f);
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, expected)).toBeLessThan(1e-9);
    expect(rail.pass).toBe(false);
  });

  it('with loss, the peak is shared by the two branches: the small one capacitive, the big one inductive, each carrying more current than the load', () => {
    const rail = evaluateRail([branch(series(resistor(0.005), inductor(l1), capacitor(c1)), 1, 'big'), branch(series(resistor(0.02), inductor(l2), capacitor(c2)), 1, 'small')], 1, f);
    expect(rail.peaks).toHaveLength(1);
    const [peak] = rail.peaks;
    expect(peak.capacitiveBranch).toBe(1);
    expect(peak.inductiveBranch).toBe(0);
    expect(peak.currentRatio[0]).toBeGreaterThan(1);
    expect(peak.currentRatio[1]).toBeGreaterThan(1);
    // Near the lossless frequency: the losses shift it by far less than a percent here.
    expect(rel(peak.frequencyHz, expected)).toBeLessThan(0.01);
  });
});

describe('peak refinement on lossy resonances (to PEAK_TOLERANCE = 1e-9)', () => {
  it('R ‖ L ‖ C peaks at exactly 1/(2π√(LC)) with |Z| = R (Alexander & Sadiku, 6th ed., §14.6)', () => {
    const [R, L, C] = [0.8, 2e-9, 3e-6];
    const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
    const rail = evaluateRail([branch(resistor(R)), branch(inductor(L)), branch(capacitor(C))], 1, logSweep({ fromHz: 1e4, toHz: 1e9, perDecade: 20 }));
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, f0)).toBeLessThan(PEAK_TOLERANCE);
    expect(rel(rail.peaks[0].impedanceOhm, R)).toBeLessThan(1e-12);
  });

  it('(R + jωL) ‖ C peaks where d|Z|²/dω = 0: ω² = √(1 + 2CR²/L)/(LC) − R²/L², not at X = 0', () => {
    // Derived from |Z|² = (R² + ω²L²)/((1 − ω²LC)² + ω²R²C²), the tank of Alexander & Sadiku §14.6, by
    // setting the derivative in x = ω² to zero: L⁴C²x² + 2L²C²R²x − (L² + 2LCR² − R⁴C²) = 0.
    const [R, L, C] = [0.05, 10e-9, 1e-6];
    const wm = Math.sqrt(Math.sqrt(1 + (2 * C * R * R) / L) / (L * C) - (R * R) / (L * L));
    const fm = wm / (2 * Math.PI);
    const zm = Math.sqrt((R * R + wm * wm * L * L) / ((1 - wm * wm * L * C) ** 2 + (wm * R * C) ** 2));
    const rail = evaluateRail([branch(series(resistor(R), inductor(L)), 1, 'regulator'), branch(capacitor(C), 1, 'bulk')], 1, logSweep({ fromHz: 1e4, toHz: 1e9, perDecade: 20 }));
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, fm)).toBeLessThan(PEAK_TOLERANCE);
    expect(rel(rail.peaks[0].impedanceOhm, zm)).toBeLessThan(1e-12);
    // The X = 0 frequency, ω² = 1/(LC) − R²/L², is 1 % away: a root on X would not be this peak.
    expect(rel(Math.sqrt(1 / (L * C) - (R * R) / (L * L)) / (2 * Math.PI), fm)).toBeGreaterThan(0.005);
  });

  it('finds a peak that lies inside the last sweep step, where no interior point shows it', () => {
    const [R, L] = [2, 1e-9];
    const C = 1 / ((2 * Math.PI * 7e6) ** 2 * L); // resonance at 7 MHz
    const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
    const sweep = new Float64Array([1e5, 1e6, 1e7]);
    const rail = evaluateRail([branch(resistor(R)), branch(inductor(L)), branch(capacitor(C))], 1, sweep);
    // |Z| rises through 1 MHz to 10 MHz, so the middle point is no local maximum.
    expect(rail.magnitude[1]).toBeLessThan(rail.magnitude[2]);
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, f0)).toBeLessThan(PEAK_TOLERANCE);
    expect(rail.worst.frequencyHz).toBe(rail.peaks[0].frequencyHz);
  });
});

describe('worst margin and pass/fail', () => {
  const f = logSweep({ fromHz: 1e5, toHz: 1e8, perDecade: 30 });
  it('a flat 5 mΩ rail against 10 mΩ passes with +6.02 dB; against 2.5 mΩ it fails with −6.02 dB', () => {
    const rail = [branch(resistor(0.005))];
    const ok = evaluateRail(rail, 0.01, f);
    expect(ok.pass).toBe(true);
    expect(ok.worst.marginDb).toBeCloseTo(20 * Math.log10(2), 10);
    const bad = evaluateRail(rail, 0.0025, f);
    expect(bad.pass).toBe(false);
    expect(bad.worst.marginDb).toBeCloseTo(-20 * Math.log10(2), 10);
  });
  it('the worst point of a rising rail is the band end; branch curves are |Z| of all placements of a branch', () => {
    const l = 1e-9;
    const rail = evaluateRail([branch(inductor(l), 4)], 1, f);
    expect(rail.worst.frequencyHz).toBe(f[f.length - 1]);
    expect(rel(rail.worst.impedanceOhm, (2 * Math.PI * f[f.length - 1] * l) / 4)).toBeLessThan(1e-12);
    expect(rel(rail.branchMagnitude[0][0], (2 * Math.PI * f[0] * l) / 4)).toBeLessThan(1e-12);
  });
});

describe('regulator and plane', () => {
  it('a regulator (R + L) with a plane capacitance anti-resonate like the tank they form', () => {
    const [R, L, C] = [1e-3, 20e-9, 8e-9];
    const f = logSweep({ fromHz: 1e5, toHz: 1e9, perDecade: 100 });
    const rail = evaluateRail([branch(series(resistor(R), inductor(L)), 1, 'regulator'), branch(capacitor(C), 1, 'plane')], 1, f);
    const wm = Math.sqrt(Math.sqrt(1 + (2 * C * R * R) / L) / (L * C) - (R * R) / (L * L));
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, wm / (2 * Math.PI))).toBeLessThan(PEAK_TOLERANCE);
    expect(rail.peaks[0].capacitiveBranch).toBe(1);
    expect(rail.peaks[0].inductiveBranch).toBe(0);
  });
});
