import { resolvedSweep } from '../../src/analysis/resolved-sweep.js';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { selfResonances } from '../../src/analysis/resonance.js';
import { referenceMaxima, referenceReactanceCrossings, referenceZAt } from '../reference/impedance.js';

// Series and parallel RLC closed forms: Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed.,
// §14.5 (series resonance: ω0 = 1/√(LC), Z(ω0) = R, Q = (1/R)√(L/C)) and §14.6 (parallel resonance).
const sweep = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 20 });
const run = (tree: Parameters<typeof impedanceSweep>[0]) => selfResonances(tree, resolvedSweep(tree, sweep));

describe('series RLC', () => {
  const R = 0.018;
  const L = 0.45e-9;
  const C = 100e-9;
  const srf = 1 / (2 * Math.PI * Math.sqrt(L * C));
  const found = run(series(resistor(R), inductor(L), capacitor(C)));

  it('has one series resonance at 1/(2π√(LC)), to 1e-9 relative', () => {
    expect(found).toHaveLength(1);
    expect(found[0].type).toBe('series');
    expect(Math.abs(found[0].frequencyHz / srf - 1)).toBeLessThan(1e-9);
  });
  it('|Z(SRF)| = R', () => {
    expect(Math.abs(found[0].impedanceOhm / R - 1)).toBeLessThan(1e-9);
  });
});

describe('parallel resonance', () => {
  it('an ideal inductor with parallel C and R resonates at 1/(2π√(LC)) with |Z| = R', () => {
    const L = 10e-6;
    const C = 2e-12;
    const Rp = 40e3;
    const found = run(parallel(inductor(L), capacitor(C), resistor(Rp)));
    expect(found).toHaveLength(1);
    expect(found[0].type).toBe('parallel');
    expect(Math.abs(found[0].frequencyHz * 2 * Math.PI * Math.sqrt(L * C) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(found[0].impedanceOhm / Rp - 1)).toBeLessThan(1e-9);
  });

  it('(R + jωL) ‖ C resonates where X = 0: ω² = 1/(LC) − (R/L)² (Alexander & Sadiku, problem form of §14.6)', () => {
    const R = 2;
    const L = 1e-6;
    const C = 1e-9;
    const w0 = Math.sqrt(1 / (L * C) - (R / L) ** 2);
    const found = run(parallel(series(resistor(R), inductor(L)), capacitor(C)));
    expect(found).toHaveLength(1);
    expect(found[0].type).toBe('parallel');
    expect(Math.abs((found[0].frequencyHz * 2 * Math.PI) / w0 - 1)).toBeLessThan(1e-9);
    // At the X = 0 frequency Z = L/(RC) (the same section's dynamic resistance).
    expect(Math.abs(found[0].impedanceOhm / (L / (R * C)) - 1)).toBeLessThan(1e-6);
  });
});

describe('a capacitor with two series LC branches in parallel', () => {
  it('shows series, parallel, series resonances in order', () => {
    const a = series(resistor(0.01), inductor(1e-9), capacitor(1e-6));
    const b = series(resistor(0.01), inductor(1e-9), capacitor(1e-9));
    const found = run(parallel(a, b));
    expect(found.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    const srfA = 1 / (2 * Math.PI * Math.sqrt(1e-9 * 1e-6));
    const srfB = 1 / (2 * Math.PI * Math.sqrt(1e-9 * 1e-9));
    expect(found[0].frequencyHz).toBeGreaterThan(srfA * 0.9);
    expect(found[0].frequencyHz).toBeLessThan(srfA * 1.1);
    expect(found[2].frequencyHz).toBeGreaterThan(srfB * 0.9);
  });
});

describe('no resonance', () => {
  it('a pure resistor has none', () => {
    expect(run(resistor(50))).toEqual([]);
  });
  it('an ideal capacitor has none', () => {
    expect(run(capacitor(1e-9))).toEqual([]);
  });
});

describe('reactance that is rounding noise is no resonance', () => {
  it('(R + Ls) ‖ Cp with L = R²C has X < 0 everywhere: no resonance, no "SRF 102 Hz"', () => {
    // X = −ω³L²C/|D|² for L = R²C (expand (R + jωL)/(1 − ω²LC + jωRC)); it never changes sign.
    expect(run(parallel(series(resistor(100), inductor(1e-9)), capacitor(0.1e-12)))).toEqual([]);
  });
  it('the constant-resistance network (R + L) ‖ (R + C) with L = R²C has X ≡ 0: none', () => {
    // Z = R at every frequency when L/R = RC (a classic constant-resistance network; any filter text).
    expect(run(parallel(series(resistor(50), inductor(25e-9)), series(resistor(50), capacitor(10e-12))))).toEqual([]);
  });
});

describe('resonances closer together than one sweep step', () => {
  // Two 10 µF branches with 1 nH and 1.05 nH: series at 1/(2π√(LC)) of each, a parallel one between.
  const tree = parallel(series(capacitor(10e-6), inductor(1e-9), resistor(1e-6)), series(capacitor(10e-6), inductor(1.05e-9), resistor(1e-6)));
  const found = run(tree);
  const reference = referenceReactanceCrossings(tree, 1e6, 3e6, 400_000);

  it('are all listed, in order: series, parallel, series (dense complex.js sweep as the reference)', () => {
    expect(reference.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    expect(found.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    found.forEach((r, i) => {
      expect(r.frequencyHz).toBeGreaterThanOrEqual(reference[i].lowHz);
      expect(r.frequencyHz).toBeLessThanOrEqual(reference[i].highHz);
    });
  });
  it('the series ones sit at 1/(2π√(LC)) of each branch, to 1e-6 (their coupling is through 1 µΩ only)', () => {
    expect(Math.abs(found[0].frequencyHz * 2 * Math.PI * Math.sqrt(1.05e-9 * 10e-6) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(found[2].frequencyHz * 2 * Math.PI * Math.sqrt(1e-9 * 10e-6) - 1)).toBeLessThan(1e-6);
  });
});

describe('each resonance names its |Z| extremum as well as its X = 0 point', () => {
  it('a lossy parallel resonance peaks below its X = 0 frequency (dense complex.js sweep as the reference)', () => {
    // The demo's wideband 22 µF model: X = 0 near 108 MHz with 1.12 Ω, the true maximum 1.34 Ω near 95 MHz.
    const tree = parallel(series(resistor(3e-3), inductor(1e-9), capacitor(22e-6)), series(resistor(0.3), inductor(0.25e-9), capacitor(2.2e-9)));
    const parallelOne = run(tree).find((r) => r.type === 'parallel')!;
    const [peak] = referenceMaxima((f) => referenceZAt(tree, f).abs(), 50e6, 150e6, 20_000);
    expect(parallelOne.frequencyHz / 1e6).toBeCloseTo(108.1, 1);
    expect(parallelOne.impedanceOhm).toBeCloseTo(1.12, 2);
    expect(Math.abs(parallelOne.extremum.frequencyHz / peak.frequencyHz - 1)).toBeLessThan(1e-6);
    expect(Math.abs(parallelOne.extremum.impedanceOhm / peak.value - 1)).toBeLessThan(1e-9);
    expect(peak.value).toBeCloseTo(1.34, 2);
  });
  it('a series RLC: the minimum is the X = 0 point, |Z| = R', () => {
    const [r] = run(series(resistor(0.018), inductor(0.45e-9), capacitor(100e-9)));
    expect(Math.abs(r.extremum.frequencyHz / r.frequencyHz - 1)).toBeLessThan(1e-6);
    expect(Math.abs(r.extremum.impedanceOhm / 0.018 - 1)).toBeLessThan(1e-9);
  });
});
