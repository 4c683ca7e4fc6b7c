import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { defaultDuration, poleWeights, transientSearchTimes } from '../../src/analysis/transient-times.js';
import type { PartialFractions } from '../../src/analysis/partial-fractions.js';

// A rail of two sections in series, driven by a current ramp of rise time t_r (values invented):
// - a parallel R-L-C tank: Z = (s/C)/(s² + s/(RC) + 1/(LC)), poles p = −α ± jω_d, α = 1/(2RC), residue at p
//   (p/C)/(p − p̄). Its step response is v = I·e^{−αt}·sin(ω_d t)/(C·ω_d) (underdamped parallel RLC,
//   Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §8.7); the ramp is the step's integral
//   over t_r, so after the ramp v = (ΔI/(t_r·C·ω_d))·Im[e^{p(t−t_r)}·(e^{p·t_r} − 1)/p]: an oscillation of
//   starting amplitude A_tank = ΔI·|e^{p·t_r} − 1|/(t_r·C·ω_d·|p|).
// - an R-C section: Z = R/(1 + sRC), pole −1/τ (τ = RC), residue 1/C. The same integration of its step
//   response I·R·(1 − e^{−t/τ}) gives, after the ramp, v − ΔI·R = −ΔI·R·(τ/t_r)·(1 − e^{−t_r/τ})·e^{−(t−t_r)/τ}.
// The shares are those starting amplitudes over their sum; the complex exponentials are complex.js's.
const tank = { R: 50, L: 1e-6, C: 1e-6 };
const rc = { R: 0.01, C: 100e-6 };
const riseS = 1e-6;
const alpha = 1 / (2 * tank.R * tank.C);
const omegaD = Math.sqrt(1 / (tank.L * tank.C) - alpha * alpha);
const p = new Complex(-alpha, omegaD);
const tau = rc.R * rc.C;

const residue = p.div(tank.C).div(p.sub(p.conjugate()));
const fractions: PartialFractions = {
  poles: [
    { re: p.re, im: p.im },
    { re: -1 / tau, im: 0 },
  ],
  residues: [
    { re: residue.re, im: residue.im },
    { re: 1 / rc.C, im: 0 },
  ],
  constant: 0,
  proportional: 0,
};

const aTank = p.mul(riseS).exp().sub(1).abs() / (riseS * tank.C * omegaD * p.abs());
const aRc = ((rc.R * tau) / riseS) * (1 - Math.exp(-riseS / tau));

describe('poleWeights: each pole’s share of the transient after the ramp', () => {
  it('equals the starting amplitudes of the closed-form ramp responses, over their sum', () => {
    const w = poleWeights(fractions, riseS, -1);
    expect(w[0]).toBeCloseTo(aTank / (aTank + aRc), 12);
    expect(w[1]).toBeCloseTo(aRc / (aTank + aRc), 12);
  });
  it('the integrator pole carries nothing; the rest share the whole', () => {
    const w = poleWeights(fractions, riseS, 1);
    expect(w[1]).toBe(0);
    expect(w[0]).toBe(1);
  });
  it('a pole at s = 0 carries nothing', () => {
    const withZero: PartialFractions = { ...fractions, poles: [fractions.poles[0], { re: 0, im: 0 }] };
    expect(Array.from(poleWeights(withZero, riseS, -1))).toEqual([1, 0]);
  });
});

describe('defaultDuration', () => {
  const w = poleWeights(fractions, riseS, -1);
  it('follows the slowest significant pole: the tank for min(7/α, 100 periods) after the ramp', () => {
    // 7/α = 700 µs; 100 periods = 100·2π/ω_d ≈ 628 µs, the shorter.
    const expected = riseS + Math.min(7 / alpha, (100 * 2 * Math.PI) / omegaD);
    expect(defaultDuration(fractions.poles, w, riseS)).toBeCloseTo(expected, 15);
    expect(expected).toBeCloseTo(riseS + 628.3e-6, 7);
    // e^−7 ≈ 0.09 %: what a significant pole has left after seven time constants.
    expect(Math.exp(-7)).toBeLessThan(1e-3);
  });
  it('ignores a pole below 0.1 % of the transient, and lasts at least 20 rise times', () => {
    const tiny = Float64Array.from([0.5e-3, 1 - 0.5e-3]);
    // Only the R-C pole counts: t_r + 7τ = 8 µs, under 20·t_r = 20 µs.
    expect(defaultDuration(fractions.poles, tiny, riseS)).toBeCloseTo(20 * riseS, 18);
    const slowRc = [{ re: -1 / 10e-6, im: 0 }];
    expect(defaultDuration(slowRc, Float64Array.from([1]), riseS)).toBeCloseTo(riseS + 70e-6, 18);
  });
});

describe('transientSearchTimes', () => {
  const w = poleWeights(fractions, riseS, -1);
  const duration = defaultDuration(fractions.poles, w, riseS);
  const t = transientSearchTimes(fractions.poles, w, riseS, duration);
  it('runs strictly upward from 0 to the duration and holds the end of the ramp exactly', () => {
    expect(t[0]).toBe(0);
    expect(t[t.length - 1]).toBe(duration);
    const descents = t.filter((x, i) => i > 0 && !(x > t[i - 1]));
    expect(descents.length).toBe(0);
    expect(t.includes(riseS)).toBe(true);
    expect(t.some((x) => x !== riseS && Math.abs(x - riseS) <= 1e-9 * riseS)).toBe(false);
  });
  it('samples the ringing at 16 points a period or finer while it lasts (8 time constants or the duration)', () => {
    const period = (2 * Math.PI) / omegaD;
    const lasts = Math.min(duration, 8 / alpha);
    let widest = 0;
    for (let i = 1; i < t.length && t[i] <= lasts; i++) widest = Math.max(widest, t[i] - t[i - 1]);
    expect(widest).toBeLessThanOrEqual(period / 16 + 1e-18);
  });
  it('samples the ramp evenly at t_r/64 or finer', () => {
    let widest = 0;
    for (let i = 1; i < t.length && t[i] <= riseS; i++) widest = Math.max(widest, t[i] - t[i - 1]);
    expect(widest).toBeLessThanOrEqual(riseS / 64 + 1e-21);
  });
  it('without a significant oscillation the grid is the ramp, the decades after it and an even spread', () => {
    const onlyRc = transientSearchTimes([fractions.poles[1]], Float64Array.from([1]), riseS, 20 * riseS);
    // 64 on the ramp; ceil(log10(20)·100) = 131 log steps, the last at 20 µs; 1000 even, one of them t_r,
    // and the last also at 20 µs; plus 0.
    expect(onlyRc.length).toBeLessThanOrEqual(1 + 64 + 131 + 1000);
    expect(onlyRc.length).toBeGreaterThan(1000);
    let widest = 0;
    for (let i = 1; i < onlyRc.length; i++) widest = Math.max(widest, onlyRc[i] - onlyRc[i - 1]);
    expect(widest).toBeLessThanOrEqual((20 * riseS) / 1000 + 1e-20);
  });
});
