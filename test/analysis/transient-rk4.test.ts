// A rail of four branches (regulator R + L, two capacitors ESR + ESL + C, the plane C + R) against an
// independent simulation written here: its state equations stepped by the classical fourth-order
// Runge–Kutta method (any numerical-analysis text, e.g. E. Hairer, S. P. Nørsett, G. Wanner, Solving
// Ordinary Differential Equations I, §II.1), and the energy the load step puts into each branch.
import { beforeAll, describe, expect, it } from 'vitest';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { railTransient, transientCurves, type RailTransient, type TransientBranch } from '../../src/analysis/transient.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

const reg = { r: 3e-3, l: 8e-9 };
const bulk = { esr: 8e-3, esl: 1.2e-9, c: 22e-6, count: 2 };
const small = { esr: 25e-3, esl: 0.6e-9, c: 1e-6, count: 1 };
const plane = { c: 10e-9, r: 4e-3 };
const I = 2;
const tr = 5e-9;

const branches: TransientBranch[] = [
  { element: series(resistor(reg.r), inductor(reg.l)), count: 1 },
  { element: series(resistor(bulk.esr), inductor(bulk.esl), capacitor(bulk.c)), count: bulk.count },
  { element: series(resistor(small.esr), inductor(small.esl), capacitor(small.c)), count: small.count },
  { element: series(capacitor(plane.c), resistor(plane.r)), count: 1 },
];

const load = (t: number) => (t <= 0 ? 0 : t < tr ? (I * t) / tr : I);

// N identical placements carry equal currents: one branch of R/N, L/N and N·C (Kirchhoff's laws).
const A = { r: bulk.esr / bulk.count, l: bulk.esl / bulk.count, c: bulk.c * bulk.count };
const B = { r: small.esr / small.count, l: small.esl / small.count, c: small.c * small.count };

/**
 * States y = [j_reg, j_A, u_A, j_B, u_B, u_P]: inductor currents (node into branch) and capacitor voltages.
 * The plane has no inductor, so the rail voltage is algebraic: KCL gives the plane's current
 * j_P = −i(t) − j_reg − j_A − j_B, and v = u_P + R_P·j_P.
 */
function railVoltage(y: Float64Array, t: number): number {
  return y[5] + plane.r * (-load(t) - y[0] - y[1] - y[3]);
}
function derivative(y: Float64Array, t: number, out: Float64Array): void {
  const v = railVoltage(y, t);
  out[0] = (v - reg.r * y[0]) / reg.l;
  out[1] = (v - A.r * y[1] - y[2]) / A.l;
  out[2] = y[1] / A.c;
  out[3] = (v - B.r * y[3] - y[4]) / B.l;
  out[4] = y[3] / B.c;
  out[5] = (-load(t) - y[0] - y[1] - y[3]) / plane.c;
}

/** RK4 with step h (t_r a whole number of steps, so the load's corner falls on a step); v every `every` steps. */
function simulate(h: number, end: number, every: number): { t: number[]; v: number[]; y: Float64Array[] } {
  const y = new Float64Array(6);
  const k1 = new Float64Array(6);
  const k2 = new Float64Array(6);
  const k3 = new Float64Array(6);
  const k4 = new Float64Array(6);
  const tmp = new Float64Array(6);
  const out = { t: [0], v: [0], y: [Float64Array.from(y)] };
  const steps = Math.round(end / h);
  for (let n = 0; n < steps; n++) {
    const t = n * h;
    derivative(y, t, k1);
    for (let i = 0; i < 6; i++) tmp[i] = y[i] + (h / 2) * k1[i];
    derivative(tmp, t + h / 2, k2);
    for (let i = 0; i < 6; i++) tmp[i] = y[i] + (h / 2) * k2[i];
    derivative(tmp, t + h / 2, k3);
    for (let i = 0; i < 6; i++) tmp[i] = y[i] + h * k3[i];
    derivative(tmp, t + h, k4);
    for (let i = 0; i < 6; i++) y[i] += (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
    if ((n + 1) % every === 0) {
      out.t.push((n + 1) * h);
      out.v.push(railVoltage(y, (n + 1) * h));
      out.y.push(Float64Array.from(y));
    }
  }
  return out;
}

/** The sampled minimum refined by the parabola through it and its neighbours. */
function sampledMinimum(t: number[], v: number[]): { t: number; v: number } {
  let i = 1;
  for (let k = 1; k < v.length - 1; k++) if (v[k] < v[i]) i = k;
  const [a, b, c] = [v[i - 1], v[i], v[i + 1]];
  const h = t[i + 1] - t[i];
  const d = (a - c) / (2 * (a - 2 * b + c));
  return { t: t[i] + d * h, v: b - ((a - c) * d) / 4 };
}

describe('four branches against RK4 on the state equations', () => {
  let result: RailTransient;
  let fine: ReturnType<typeof simulate>;
  let coarse: ReturnType<typeof simulate>;
  const end = 4e-6;
  beforeAll(() => {
    result = railTransient(branches, { stepA: I, riseS: tr, range: { fromHz: 1e5, toHz: 1e8 } });
    // Steps of t_r/200 and t_r/400 (25 and 12.5 ps, against ~5 ns for the fastest ringing).
    coarse = simulate(tr / 200, end, 4);
    fine = simulate(tr / 400, end, 8);
  });

  it('the simulation has converged to 1e-6 (halving the step changes the droop less than that)', () => {
    const a = sampledMinimum(coarse.t, coarse.v);
    const b = sampledMinimum(fine.t, fine.v);
    expect(rel(a.v, b.v)).toBeLessThan(1e-6);
  });

  it('the droop and its time agree with the simulation to 1e-6 (the issue asks 1e-3)', () => {
    const m = sampledMinimum(fine.t, fine.v);
    expect(rel(result.droopV, -m.v)).toBeLessThan(1e-6);
    // The parabola's time is good to a small fraction of the 50 ps sampling.
    expect(Math.abs(result.droopAtS - m.t)).toBeLessThan(5e-12);
  });

  it('v(t) and every branch current follow the simulation over the first 4 µs', () => {
    const { voltage, shares } = transientCurves(result, fine.t);
    let worstV = 0;
    let worstI = 0;
    fine.t.forEach((t, n) => {
      worstV = Math.max(worstV, Math.abs(voltage[n] - fine.v[n]));
      const y = fine.y[n];
      // Branch currents: three states, the plane's by KCL.
      const simulated = [y[0], y[1], y[3], -load(t) - y[0] - y[1] - y[3]];
      // A share is the current a branch delivers to the rail per ampere of load: minus its current into the branch.
      simulated.forEach((j, b) => (worstI = Math.max(worstI, Math.abs(-shares[b][n] * I - j))));
    });
    expect(worstV / result.droopV).toBeLessThan(1e-6);
    expect(worstI / I).toBeLessThan(1e-6);
  });

  it('the shares add up to the load current at every time', () => {
    const { shares } = transientCurves(result, fine.t);
    let worst = 0;
    fine.t.forEach((t, n) => (worst = Math.max(worst, Math.abs(shares.reduce((s, h) => s + h[n], 0) - load(t) / I))));
    expect(worst).toBeLessThan(1e-9);
  });
});

describe('energy balance', () => {
  // Over [0, T] the energy the load step puts into the rail, ∫ −v·i dt, equals what its branches take,
  // Σ ∫ v·j_b dt (Tellegen's theorem), and each branch's share is what its elements store and burn:
  // ½·L·j(T)² + ½·q(T)²/C + ∫ R·j² dt, with q = ∫ j dt (the element laws; any circuit-analysis text).
  // Integrals by 8-point Gauss–Legendre on segments (tables in Abramowitz & Stegun, Handbook of
  // Mathematical Functions, Table 25.4), checked by halving the segments.
  const T = 20e-6;
  let result: RailTransient;
  beforeAll(() => {
    result = railTransient(branches, { stepA: I, riseS: tr, durationS: T, range: { fromHz: 1e5, toHz: 1e8 } });
  });

  function energies(segment: number) {
    const edges = [0];
    for (let i = 1; i <= 8; i++) edges.push((tr * i) / 8);
    while (edges[edges.length - 1] < T) {
      const t = edges[edges.length - 1];
      edges.push(Math.min(T, t + (t < 2e-6 ? segment : 20 * segment)));
    }
    const times: number[] = [];
    const weights: number[] = [];
    for (let s = 0; s + 1 < edges.length; s++) {
      const [a, b] = [edges[s], edges[s + 1]];
      GAUSS_8.forEach(([x, w]) => {
        times.push((a + b) / 2 + ((b - a) / 2) * x);
        weights.push(((b - a) / 2) * w);
      });
    }
    const { voltage, shares } = transientCurves(result, times);
    const j = shares.map((h) => h.map((x) => -x * I)); // into each branch
    const delivered = times.reduce((sum, t, n) => sum - weights[n] * voltage[n] * load(t), 0);
    const taken = j.map((jb) => jb.reduce((sum, x, n) => sum + weights[n] * voltage[n] * x, 0));
    const atEnd = transientCurves(result, [T]).shares.map((h) => -h[0] * I);
    const charge = (jb: Float64Array) => jb.reduce((sum, x, n) => sum + weights[n] * x, 0);
    const burnt = (jb: Float64Array, r: number) => jb.reduce((sum, x, n) => sum + weights[n] * r * x * x, 0);
    const physics = [
      0.5 * reg.l * atEnd[0] ** 2 + burnt(j[0], reg.r),
      0.5 * A.l * atEnd[1] ** 2 + (0.5 * charge(j[1]) ** 2) / A.c + burnt(j[1], A.r),
      0.5 * B.l * atEnd[2] ** 2 + (0.5 * charge(j[2]) ** 2) / B.c + burnt(j[2], B.r),
      (0.5 * charge(j[3]) ** 2) / plane.c + burnt(j[3], plane.r),
    ];
    return { delivered, taken, physics };
  }

  it('the branches take the energy delivered, and each stores and burns what it takes, to 1e-6', () => {
    const a = energies(0.5e-9);
    const b = energies(0.25e-9);
    // The quadrature itself has converged far below the tolerance.
    expect(rel(a.delivered, b.delivered)).toBeLessThan(1e-9);
    const total = b.taken.reduce((s, x) => s + x, 0);
    expect(rel(total, b.delivered)).toBeLessThan(1e-6);
    b.taken.forEach((e, k) => expect(Math.abs(e - b.physics[k]) / b.delivered).toBeLessThan(1e-6));
    expect(b.delivered).toBeGreaterThan(0);
  });
});

/** Nodes and weights of 8-point Gauss–Legendre quadrature on [−1, 1] (Abramowitz & Stegun, Table 25.4). */
const GAUSS_8: [number, number][] = [
  [-0.960289856497536, 0.101228536290376],
  [-0.796666477413627, 0.222381034453374],
  [-0.525532409916329, 0.313706645877887],
  [-0.18343464249565, 0.362683783378362],
  [0.18343464249565, 0.362683783378362],
  [0.525532409916329, 0.313706645877887],
  [0.796666477413627, 0.222381034453374],
  [0.960289856497536, 0.101228536290376],
];
