import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { selfResonances } from '../../src/analysis/resonance.js';

// Series and parallel RLC closed forms: Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed.,
// §14.5 (series resonance: ω0 = 1/√(LC), Z(ω0) = R, Q = (1/R)√(L/C)) and §14.6 (parallel resonance).
const sweep = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 20 });
const run = (tree: Parameters<typeof impedanceSweep>[0]) => selfResonances(tree, sweep, impedanceSweep(tree, sweep));

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
