import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { impedanceAt } from '../../src/circuit/impedance.js';
import { admittanceSlope, impedanceSlopeAt } from '../../src/circuit/slope.js';

// Derivatives of the element laws in closed form (Alexander & Sadiku, Fundamentals of Electric Circuits,
// 6th ed., ch. 9, differentiated by hand). Tolerance 1e-12 relative: a few roundings of double arithmetic.
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('impedanceSlopeAt', () => {
  it('series R + L + C: Z = R + j(ωL − 1/(ωC)), dZ/dω = j(L + 1/(ω²C))', () => {
    const [R, L, C, w] = [0.02, 0.5e-9, 1e-6, 2 * Math.PI * 3.3e6];
    const z = impedanceSlopeAt(series(resistor(R), inductor(L), capacitor(C)), w);
    expect(z.re).toBe(R);
    expect(rel(z.im, w * L - 1 / (w * C))).toBeLessThan(1e-12);
    expect(z.dRe).toBe(0);
    expect(rel(z.dIm, L + 1 / (w * w * C))).toBeLessThan(1e-12);
  });

  it('R ‖ C: Z = R/(1 + jωRC), dZ/dω = −jR²C/(1 + jωRC)²', () => {
    const [R, C, w] = [1e3, 1e-9, 2 * Math.PI * 1e5];
    const z = impedanceSlopeAt(parallel(resistor(R), capacitor(C)), w);
    // 1 + jωRC = 1 + ja; Z = R(1 − ja)/(1 + a²); (1 + ja)² = 1 − a² + 2ja.
    const a = w * R * C;
    expect(rel(z.re, R / (1 + a * a))).toBeLessThan(1e-12);
    expect(rel(z.im, (-R * a) / (1 + a * a))).toBeLessThan(1e-12);
    const d = (1 - a * a) ** 2 + (2 * a) ** 2;
    // −jR²C·(1 − a² − 2ja)/d = (−2aR²C − j(1 − a²)R²C)/d
    expect(rel(z.dRe, (-2 * a * R * R * C) / d)).toBeLessThan(1e-12);
    expect(rel(z.dIm, (-(1 - a * a) * R * R * C) / d)).toBeLessThan(1e-12);
  });

  it('agrees with the compiled sweep kernel on Z and with a central difference on dZ/dω for a nested tree', () => {
    const tree = parallel(series(resistor(0.004), inductor(0.9e-9), capacitor(10e-6)), series(resistor(0.2), inductor(0.2e-9), capacitor(1e-9)), resistor(50));
    const f = 7.7e6;
    const w = 2 * Math.PI * f;
    const z = impedanceSlopeAt(tree, w);
    const [re, im] = impedanceAt(tree, f);
    expect(rel(z.re, re)).toBeLessThan(1e-12);
    expect(rel(z.im, im)).toBeLessThan(1e-12);
    // Central difference: error O(h²) ≈ 1e-10 relative with h = 1e-5·ω (truncation), well inside 1e-6.
    const h = 1e-5 * w;
    const up = impedanceSlopeAt(tree, w + h);
    const down = impedanceSlopeAt(tree, w - h);
    expect(rel(z.dRe, (up.re - down.re) / (2 * h))).toBeLessThan(1e-6);
    expect(rel(z.dIm, (up.im - down.im) / (2 * h))).toBeLessThan(1e-6);
  });

  it('admittanceSlope inverts: Y = 1/Z and Y′ = −Z′/Z², and applied twice gives back Z and Z′', () => {
    const z = { re: 0.3, im: -0.4, dRe: 1e-9, dIm: 2e-9 };
    const y = admittanceSlope(z);
    expect(rel(y.re, 0.3 / 0.25)).toBeLessThan(1e-14);
    expect(rel(y.im, 0.4 / 0.25)).toBeLessThan(1e-14);
    const back = admittanceSlope(y);
    for (const k of ['re', 'im', 'dRe', 'dIm'] as const) expect(rel(back[k], z[k])).toBeLessThan(1e-12);
  });
});
