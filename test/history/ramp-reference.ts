// A rail's response to a load step, written for the tests and independent of zfolio's partial-fraction
// solver: the circuit's own differential equations integrated by the classical fourth-order Runge–Kutta
// method (any numerical-methods text). The regulator is V0 behind R + L; each capacitor branch is
// R + L + C (the count folded in: R/n, L/n, n·C); the load draws a current rising linearly to ΔI over the
// rise time and holding there. Node voltage from KCL differentiated once (all branches are inductive):
//   v·(1/L_r + Σ 1/L_k) = (V0 − R_r·i_r)/L_r + Σ (R_k·i_k + vc_k)/L_k − di_load/dt.

export interface RampCase {
  v0: number;
  regulator: { r: number; l: number };
  branches: { r: number; l: number; c: number; count: number }[];
  stepA: number;
  riseS: number;
  untilS: number;
  dtS: number;
}

/** Deepest dip below V0 and highest rise above it, V. */
export function rampResponse(c: RampCase): { droopV: number; overshootV: number } {
  const b = c.branches.map((x) => ({ r: x.r / x.count, l: x.l / x.count, c: x.c * x.count }));
  const slope = (t: number) => (t < c.riseS ? c.stepA / c.riseS : 0);
  const invL = 1 / c.regulator.l + b.reduce((s, x) => s + 1 / x.l, 0);
  // State: [i_r, i_1, vc_1, i_2, vc_2, ...], steady state before the step.
  const nodeV = (s: number[], t: number) => {
    let sum = (c.v0 - c.regulator.r * s[0]) / c.regulator.l - slope(t);
    b.forEach((x, k) => (sum += (x.r * s[1 + 2 * k] + s[2 + 2 * k]) / x.l));
    return sum / invL;
  };
  const derivative = (s: number[], t: number) => {
    const v = nodeV(s, t);
    const d = [(c.v0 - v - c.regulator.r * s[0]) / c.regulator.l];
    b.forEach((x, k) => d.push((v - x.r * s[1 + 2 * k] - s[2 + 2 * k]) / x.l, s[1 + 2 * k] / x.c));
    return d;
  };
  let s = [0, ...b.flatMap(() => [0, c.v0])];
  let droop = 0;
  let over = 0;
  for (let t = 0; t < c.untilS; t += c.dtS) {
    const h = c.dtS;
    const k1 = derivative(s, t);
    const k2 = derivative(s.map((x, i) => x + (h / 2) * k1[i]), t + h / 2);
    const k3 = derivative(s.map((x, i) => x + (h / 2) * k2[i]), t + h / 2);
    const k4 = derivative(s.map((x, i) => x + h * k3[i]), t + h);
    s = s.map((x, i) => x + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
    const v = nodeV(s, t + h);
    droop = Math.max(droop, c.v0 - v);
    over = Math.max(over, v - c.v0);
  }
  return { droopV: droop, overshootV: over };
}
