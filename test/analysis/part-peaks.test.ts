import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { peakImpedance, peakQuality } from '../../src/analysis/part-peaks.js';
import { resolvedSweep } from '../../src/analysis/resolved-sweep.js';
import { referenceZAt } from '../reference/impedance.js';

// Closed forms (values invented), each derived from the element laws (Alexander & Sadiku, Fundamentals of
// Electric Circuits, 6th ed., ch. 9 and 14):
// - a bead as R_s + (R_p ‖ L ‖ C): the tank is Z = R_p/(1 + ju) with u = R_p(ωC − 1/(ωL)), so
//   |R_s + Z|² = R_s² + (2R_sR_p + R_p²)/(1 + u²) is greatest at u = 0: |Z|max = R_s + R_p at f0 = 1/(2π√(LC));
// - an inductor as (R + jωL) ‖ C: Z = (R + jωL)/(1 − ω²LC + jωRC), whose real part is R/|D|² and imaginary
//   part [ωL(1 − ω²LC) − ωR²C]/|D|², so Q = X/R = ω(L − R²C)/R − ω³L²C/R, greatest at
//   ω² = (L − R²C)/(3L²C), where Q = (2/3)·ω·(L − R²C)/R.
const sweep = logSweep({ fromHz: 1e4, toHz: 1e10, perDecade: 10 });

describe('peakImpedance', () => {
  const Rs = 0.05;
  const Rp = 600;
  const L = 1.2e-6;
  const C = 0.9e-12;
  const bead = series(resistor(Rs), parallel(resistor(Rp), inductor(L), capacitor(C)));
  it('a bead’s peak: R_s + R_p at 1/(2π√(LC)), refined between sweep points', () => {
    const p = peakImpedance(bead, resolvedSweep(bead, sweep));
    expect(p.atSweepEnd).toBe(false);
    expect(p.impedanceOhm).toBeCloseTo(Rs + Rp, 6);
    expect(p.frequencyHz / (1 / (2 * Math.PI * Math.sqrt(L * C)))).toBeCloseTo(1, 6);
    // complex.js at the reported frequency gives the same |Z|.
    expect(referenceZAt(bead, p.frequencyHz).abs() / p.impedanceOhm).toBeCloseTo(1, 12);
  });
  it('a capacitor’s |Z| is greatest at an end of the sweep: 1/(ωC) at the low end, ωL at the high end', () => {
    const cap = series(resistor(0.01), inductor(0.5e-9), capacitor(1e-6));
    // 10 kHz: 15.9 Ω; 1 GHz: 3.1 Ω; 10 GHz: 31.4 Ω.
    const low = peakImpedance(cap, resolvedSweep(cap, sweep.filter((f) => f <= 1e9)));
    expect(low).toMatchObject({ atSweepEnd: true, frequencyHz: 1e4 });
    expect(low.impedanceOhm / referenceZAt(cap, 1e4).abs()).toBeCloseTo(1, 12);
    const high = peakImpedance(cap, resolvedSweep(cap, sweep));
    expect(high).toMatchObject({ atSweepEnd: true, frequencyHz: 1e10 });
  });
});

describe('peakQuality', () => {
  const R = 0.15;
  const L = 4.7e-6;
  const C = 2.5e-12;
  const coil = parallel(series(resistor(R), inductor(L)), capacitor(C));
  const w = Math.sqrt((L - R * R * C) / (3 * L * L * C));
  const qMax = ((2 / 3) * w * (L - R * R * C)) / R;
  it('an inductor’s greatest Q and where, as the closed form gives them', () => {
    const q = peakQuality(coil, resolvedSweep(coil, sweep), 1);
    expect(q).toBeDefined();
    expect(q!.q / qMax).toBeCloseTo(1, 9);
    expect(q!.frequencyHz / (w / (2 * Math.PI))).toBeCloseTo(1, 4);
  });
  it('Q with capacitive reactance: none where the part never is capacitive with R > 0', () => {
    const ideal = series(resistor(0.2), inductor(1e-6));
    expect(peakQuality(ideal, { frequencies: sweep, z: impedanceSweep(ideal, sweep) }, -1)).toBeUndefined();
  });
  it('a capacitor’s Q = 1/(ωCR) is greatest at the sweep’s low end, unrefined', () => {
    const cap = series(resistor(0.01), inductor(0.5e-9), capacitor(1e-6));
    const q = peakQuality(cap, { frequencies: sweep, z: impedanceSweep(cap, sweep) }, -1);
    const atLow = 1 / (2 * Math.PI * 1e4 * 1e-6 * 0.01) - 2 * Math.PI * 1e4 * 0.5e-9 / 0.01;
    expect(q!.frequencyHz).toBe(1e4);
    expect(q!.q / atLow).toBeCloseTo(1, 12);
  });
});
