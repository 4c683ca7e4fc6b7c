import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { railTransient, riseForBandwidth, transientCurves, type TransientBranch } from '../../src/analysis/transient.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const range = { fromHz: 1e3, toHz: 1e8 };

/** Times spread over [0, end], the ramp's corner included. */
const timesUpTo = (end: number, n = 400) => Array.from({ length: n + 1 }, (_, i) => (end * i) / n);

/** The largest |a − b| over two curves, relative to the largest |b|. */
function curveError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let worst = 0;
  let size = 0;
  for (let i = 0; i < b.length; i++) {
    worst = Math.max(worst, Math.abs(a[i] - b[i]));
    size = Math.max(size, Math.abs(b[i]));
  }
  return worst / size;
}

describe('the regulator and one capacitor: a series RLC loop', () => {
  // KCL at the rail: C·dv/dt + i_L = −i(t); the regulator's L·di_L/dt + R·i_L = v. So
  // LC·i_L″ + RC·i_L′ + i_L = −i(t): the series RLC circuit's equation (Alexander & Sadiku, Fundamentals of
  // Electric Circuits, 6th ed., §8.5–8.6, step response of a series RLC circuit), underdamped for
  // α = R/2L < ω0 = 1/√(LC). For a current step I: i_L = −I·[1 − e^{−αt}(cos ωd·t + (α/ωd)·sin ωd·t)],
  // i_L′ = −I·(ω0²/ωd)·e^{−αt}·sin ωd·t, and v = L·i_L′ + R·i_L.
  const R = 0.005;
  const L = 10e-9;
  const C = 10e-6;
  const I = 2;
  const alpha = R / (2 * L);
  const w0 = 1 / Math.sqrt(L * C);
  const wd = Math.sqrt(w0 * w0 - alpha * alpha);
  const stepV = (t: number) =>
    t <= 0 ? 0 : -I * (L * (w0 * w0 / wd) * Math.exp(-alpha * t) * Math.sin(wd * t) + R * (1 - Math.exp(-alpha * t) * (Math.cos(wd * t) + (alpha / wd) * Math.sin(wd * t))));
  // ∫0^t of the step response, from ∫e^{−ατ}sin ωτ dτ and ∫e^{−ατ}cos ωτ dτ (any table of integrals).
  const sinInt = (t: number) => (wd - Math.exp(-alpha * t) * (alpha * Math.sin(wd * t) + wd * Math.cos(wd * t))) / (w0 * w0);
  const cosInt = (t: number) => (alpha + Math.exp(-alpha * t) * (wd * Math.sin(wd * t) - alpha * Math.cos(wd * t))) / (w0 * w0);
  const stepIntegral = (t: number) => (t <= 0 ? 0 : -I * (L * (w0 * w0 / wd) * sinInt(t) + R * (t - cosInt(t) - (alpha / wd) * sinInt(t))));
  // A ramp over t_r is the step response averaged over the last t_r (superposition).
  const rampV = (t: number, tr: number) => (stepIntegral(t) - stepIntegral(t - tr)) / tr;
  const branches: TransientBranch[] = [
    { element: series(resistor(R), inductor(L)), count: 1 },
    { element: capacitor(C), count: 1 },
  ];

  it('is underdamped as built', () => expect(alpha).toBeLessThan(w0 / 10));

  it('a step (rise 1e-7 of the ringing period) follows the closed form to 1e-4 of the droop', () => {
    const tr = (2 * Math.PI) / wd / 1e7;
    const result = railTransient(branches, { stepA: I, riseS: tr, range });
    const times = timesUpTo(8 / alpha, 2000);
    const { voltage } = transientCurves(result, times);
    // The ramp's own effect is of order t_r/period = 1e-7, far below the tolerance.
    expect(curveError(voltage, times.map(stepV))).toBeLessThan(1e-4);
    // The droop: the first minimum of v, where v′ = 0 (found here by a dense sweep and golden section).
    const exact = goldenMinimum(stepV, 0, Math.PI / wd);
    expect(rel(result.droopV, -exact.value)).toBeLessThan(1e-4);
    expect(rel(result.droopAtS, exact.t)).toBeLessThan(1e-4);
  });

  it('a ramp follows the step response averaged over the rise time, to 1e-9', () => {
    const tr = 0.3 * (2 * Math.PI) / wd;
    const result = railTransient(branches, { stepA: I, riseS: tr, range });
    const times = timesUpTo(8 / alpha, 2000);
    const { voltage } = transientCurves(result, times);
    // Both are closed forms; what differs is rounding and the fit (its error is reported, 1e-12 or so).
    expect(curveError(voltage, times.map((t) => rampV(t, tr)))).toBeLessThan(1e-9);
    expect(result.fitError).toBeLessThan(1e-10);
    const exact = goldenMinimum((t) => rampV(t, tr), 0, tr + Math.PI / wd);
    expect(rel(result.droopV, -exact.value)).toBeLessThan(1e-9);
    expect(rel(result.droopAtS, exact.t)).toBeLessThan(1e-6);
  });

  it('settles at −R·ΔI; the settling time is the last time |v − v_final| leaves 10% of its largest value', () => {
    const tr = 1e-9;
    const result = railTransient(branches, { stepA: I, riseS: tr, range });
    expect(result.dcPath).toBe(true);
    expect(result.finalV).toBeCloseTo(-R * I, 15);
    // Reference: the same definition on a dense sweep of the closed form (to 1e-5 of the duration).
    const end = result.durationS;
    const n = 400_000;
    let largest = 0;
    for (let i = 0; i <= n; i++) largest = Math.max(largest, Math.abs(rampV((end * i) / n, tr) + R * I));
    let last = 0;
    for (let i = 0; i <= n; i++) if (Math.abs(rampV((end * i) / n, tr) + R * I) > 0.1 * largest) last = (end * i) / n;
    expect(Math.abs((result.settleS ?? NaN) - last)).toBeLessThan(2 * (end / n));
    // The default duration follows the loop's decay: seven time constants 1/α after the ramp.
    expect(rel(result.durationS, tr + 7 / alpha)).toBeLessThan(1e-6);
  });

  it('an overshoot above the DC value is reported beside the droop', () => {
    const result = railTransient(branches, { stepA: I, riseS: 1e-9, range });
    // The ringing swings back above 0 half a period after the droop (e^{−απ/ωd} of it, less R·I).
    const exact = goldenMinimum((t) => -rampV(t, 1e-9), Math.PI / wd, (2 * Math.PI) / wd);
    expect(rel(result.overshootV, -exact.value)).toBeLessThan(1e-6);
  });
});

describe('parallel RLC driven by a current step', () => {
  // Alexander & Sadiku, op. cit., §8.7 (step response of a parallel RLC circuit): with i_L(0) = v(0) = 0,
  // v(t) = (I/(C·ωd))·e^{−αt}·sin ωd·t, α = 1/(2RC); a load drawing I gives the negative of it.
  const R = 0.5;
  const L = 1e-9;
  const C = 1e-6;
  const I = 3;
  const alpha = 1 / (2 * R * C);
  const wd = Math.sqrt(1 / (L * C) - alpha * alpha);
  const stepV = (t: number) => (-I / (C * wd)) * Math.exp(-alpha * t) * Math.sin(wd * t);

  it('follows the closed form to 1e-4 and dips to its first minimum', () => {
    const tr = (2 * Math.PI) / wd / 1e7;
    const result = railTransient([{ element: parallel(resistor(R), inductor(L), capacitor(C)), count: 1 }], { stepA: I, riseS: tr, range });
    const times = timesUpTo(6 / alpha, 3000);
    expect(curveError(transientCurves(result, times).voltage, times.map(stepV))).toBeLessThan(1e-4);
    // v′ = 0 where tan ωd·t = ωd/α.
    const at = Math.atan2(wd, alpha) / wd;
    expect(rel(result.droopAtS, at)).toBeLessThan(1e-4);
    expect(rel(result.droopV, -stepV(at))).toBeLessThan(1e-4);
    expect(result.finalV).toBe(-0); // the inductor is a DC short
  });
});

describe('a capacitor alone with a ramp', () => {
  // v = −(ESR·i + ESL·di/dt + q/C) with q = ∫i: during the ramp q = I·t²/(2·t_r), so
  // v = −(ESR·I·t/t_r + ESL·I/t_r + I·t²/(2·t_r·C)); after it v = −(ESR·I + I·(t − t_r/2)/C). (The element laws
  // v = Ri, L·di/dt, q/C; any circuit-analysis text.)
  const [ESR, ESL, C, I, tr] = [0.01, 0.5e-9, 22e-6, 1.5, 20e-9];
  const exact = (t: number) => (t <= 0 ? 0 : t <= tr ? -(ESR * I * t / tr + ESL * I / tr + (I * t * t) / (2 * tr * C)) : -(ESR * I + (I * (t - tr / 2)) / C));
  const result = railTransient([{ element: series(resistor(ESR), inductor(ESL), capacitor(C)), count: 1 }], { stepA: I, riseS: tr, range });

  it('matches the closed form during and after the ramp', () => {
    const times = [...timesUpTo(tr, 50).slice(1), ...timesUpTo(50 * tr, 200).filter((t) => t > tr)];
    const { voltage } = transientCurves(result, times);
    times.forEach((t, i) => expect(Math.abs(voltage[i] - exact(t))).toBeLessThan(1e-9 * Math.abs(exact(t))));
  });

  it('has no DC path: it keeps falling, with no final value or settling time', () => {
    expect(result.dcPath).toBe(false);
    expect(result.finalV).toBeNull();
    expect(result.settleS).toBeNull();
    // v falls with t (apart from the ESL's step back up at the end of the ramp), so the deepest point is the
    // end of the ramp or the end of what is shown; here the ESL's ESL·I/t_r = 37.5 mV makes it the ramp's end.
    const candidates = [tr, result.durationS].map((t) => ({ t, v: exact(t) }));
    const deepest = candidates.reduce((a, b) => (b.v < a.v ? b : a));
    expect(deepest.t).toBe(tr);
    expect(result.droopAtS).toBe(tr);
    expect(rel(result.droopV, -deepest.v)).toBeLessThan(1e-9);
    const longer = railTransient([{ element: series(resistor(ESR), inductor(ESL), capacitor(C)), count: 1 }], { stepA: I, riseS: tr, range, durationS: 2000 * tr });
    expect(longer.droopAtS).toBeCloseTo(2000 * tr, 15);
    expect(rel(longer.droopV, -exact(2000 * tr))).toBeLessThan(1e-9);
  });

  it('N placements act as one with R/N, L/N and N·C', () => {
    const four = railTransient([{ element: series(resistor(ESR), inductor(ESL), capacitor(C)), count: 4 }], { stepA: 4 * I, riseS: tr, range, durationS: result.durationS });
    // Four in parallel carrying four times the current: the same voltage.
    expect(rel(four.droopV, result.droopV)).toBeLessThan(1e-9);
  });
});

describe('defaults and edge cases', () => {
  it('rise time 0.35/bandwidth (common practice)', () => expect(riseForBandwidth(40e6)).toBeCloseTo(8.75e-9, 20));

  it('a resistive regulator alone: v = −R·i(t), settled at 90% of the ramp', () => {
    const result = railTransient([{ element: resistor(0.002), count: 1 }], { stepA: 5, riseS: 1e-8, range });
    expect(result.droopV).toBeCloseTo(0.01, 15);
    expect(result.finalV).toBeCloseTo(-0.01, 15);
    expect(rel(result.settleS ?? NaN, 0.9e-8)).toBeLessThan(1e-9);
    // No poles: twenty rise times (the shortest default).
    expect(rel(result.durationS, 20e-8)).toBeLessThan(1e-12);
  });

  it('an inductive regulator alone: v = −L·ΔI/t_r during the ramp, 0 after', () => {
    const result = railTransient([{ element: inductor(20e-9), count: 1 }], { stepA: 2, riseS: 1e-8, range });
    expect(rel(result.droopV, (20e-9 * 2) / 1e-8)).toBeLessThan(1e-9);
    expect(result.droopAtS).toBeLessThanOrEqual(1e-8);
    expect(result.finalV).toBe(-0);
  });

  it('a given duration is kept', () => {
    const result = railTransient([{ element: resistor(0.002), count: 1 }], { stepA: 5, riseS: 1e-8, durationS: 3e-6, range });
    expect(result.durationS).toBe(3e-6);
    expect(result.durationGiven).toBe(true);
  });

  it('a final offset larger than the rail voltage counts as no DC path', () => {
    const result = railTransient([{ element: resistor(2), count: 1 }], { stepA: 1, riseS: 1e-8, range, collapseV: 1 });
    expect(result.dcPath).toBe(false);
    expect(result.finalV).toBeNull();
  });
});

/** Golden-section search for the minimum of f on [a, b] after a 2,000-point scan (the reference's own). */
function goldenMinimum(f: (t: number) => number, a: number, b: number): { t: number; value: number } {
  const n = 2000;
  let best = a;
  for (let i = 0; i <= n; i++) {
    const t = a + ((b - a) * i) / n;
    if (f(t) < f(best)) best = t;
  }
  let lo = Math.max(a, best - (b - a) / n);
  let hi = Math.min(b, best + (b - a) / n);
  const phi = (Math.sqrt(5) - 1) / 2;
  while (hi - lo > 1e-15 * hi) {
    const c = hi - phi * (hi - lo);
    const d = lo + phi * (hi - lo);
    if (f(c) < f(d)) hi = d;
    else lo = c;
  }
  const t = (lo + hi) / 2;
  return { t, value: f(t) };
}

describe('rails of realistic values (seeded, invented)', () => {
  it('are resolved: the partial fractions reproduce Z(jω) of complex.js at random frequencies to 1e-8', async () => {
    const { mulberry32 } = await import('../../bench/generate.js');
    const { partialFractionsAt } = await import('../../src/analysis/partial-fractions.js');
    const { referenceRailZ } = await import('../reference/impedance.js');
    const random = mulberry32(2026);
    const within = (a: number, b: number) => 10 ** (Math.log10(a) + random() * Math.log10(b / a));
    for (let n = 0; n < 25; n++) {
      // Regulator 0.1–10 mΩ and 1–100 nH, a plane of 1–100 nF, 1–12 capacitor branches of 1 nF–1 mF with
      // ESR 1–100 mΩ, ESL + mounting 0.1–3 nH, leakage 1 MΩ–10 GΩ, 1–32 placements (common practice ranges).
      const branches: TransientBranch[] = [{ element: series(resistor(within(1e-4, 1e-2)), inductor(within(1e-9, 1e-7))), count: 1 }];
      if (random() < 0.8) branches.push({ element: series(capacitor(within(1e-9, 1e-7)), resistor(within(5e-4, 5e-3))), count: 1 });
      const k = 1 + Math.floor(random() * 12);
      for (let j = 0; j < k; j++) {
        branches.push({ element: series(resistor(within(1e-3, 0.1)), inductor(within(1e-10, 3e-9)), parallel(capacitor(within(1e-9, 1e-3)), resistor(within(1e6, 1e10)))), count: 1 + Math.floor(random() * 32) });
      }
      const result = railTransient(branches, { stepA: 2, riseS: within(1e-9, 1e-7), range: { fromHz: 1e4, toHz: 1e8 } });
      expect(result.resolved).toBe(true);
      for (let m = 0; m < 20; m++) {
        const f = within(1, 1e10);
        const exact = referenceRailZ(branches, f);
        const [re, im] = partialFractionsAt(result.impedance, 2 * Math.PI * f);
        expect(Math.hypot(re - exact.re, im - exact.im) / exact.abs()).toBeLessThan(1e-8);
      }
    }
  });

  it('values too far apart for the poles to be found are not resolved, and say so', () => {
    // A 1 MH regulator beside a 1 F capacitor with 1 PΩ leakage and a 1 pF plane: far outside any rail.
    const result = railTransient(
      [
        { element: series(resistor(1e-9), inductor(1e6)), count: 1 },
        { element: series(resistor(1), inductor(1e-3), parallel(capacitor(1), resistor(1e15))), count: 7 },
        { element: series(capacitor(1e-12), resistor(1)), count: 1 },
      ],
      { stepA: 2, riseS: 3.5e-9, range: { fromHz: 1e3, toHz: 1e8 } },
    );
    expect(result.resolved).toBe(false);
  });
});
