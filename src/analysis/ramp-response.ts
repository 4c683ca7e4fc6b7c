// The response of a network function in partial fractions to a load current that ramps from 0 to ΔI over
// the rise time t_r and then holds: i(t) = ΔI·min(t/t_r, 1). In closed form, exact at any t, so features
// nanoseconds wide and settling over milliseconds cost the same.
//
// y = F ∗ i (convolution, i.e. Y(s) = F(s)·I(s) with I(s) = ΔI·(1 − e^{−s·t_r})/(t_r·s²)), term by term:
//   D0          → (ΔI/t_r)·D0·ρ(t),       ρ(t) = t while ramping, t_r after;
//   D1·s        → (ΔI/t_r)·D1 while ramping, 0 after (the steps of L·di/dt at both corners);
//   r/(s − p)   → (ΔI/t_r)·r·g(t),        g(t) = (e^{pt} − 1 − pt)/p² = t²·φ2(pt) while ramping,
//                 and after it g(t) − g(t − t_r) = t_r·[(t − t_r)·φ1(p(t − t_r)) + e^{p(t−t_r)}·t_r·φ2(p·t_r)],
//                 a form that stays exact as p → 0 (where it is t_r·(t − t_r/2), the charge of a capacitor).
// g′ = t·φ1(pt) while ramping, e^{p(t−t_r)}·t_r·φ1(p·t_r) after. A conjugate pair gives 2·Re(r·g).
// (The Laplace pairs are those of any circuit-analysis text, e.g. Alexander & Sadiku, Fundamentals of
// Electric Circuits, ch. 15; φ1, φ2 in phi-functions.ts.)

import type { PartialFractions } from './partial-fractions.js';
import { phiFunctions, type ComplexPair } from './phi-functions.js';
import type { ComplexFrequency } from '../circuit/natural-frequencies.js';

export interface RampLoad {
  /** ΔI, A. */
  stepA: number;
  /** t_r, s (> 0). */
  riseS: number;
}

/** g_k(t) and g_k′(t) of every pole at one time: the shared part of every expansion on those poles. */
export class RampBasis {
  readonly poles: readonly ComplexFrequency[];
  readonly riseS: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
  readonly slopeRe: Float64Array;
  readonly slopeIm: Float64Array;
  /** t_r·φ2(p·t_r) and t_r·φ1(p·t_r) per pole. */
  private readonly endPhi2: Float64Array;
  private readonly endPhi1: Float64Array;
  private readonly e: ComplexPair = [0, 0];
  private readonly p1: ComplexPair = [0, 0];
  private readonly p2: ComplexPair = [0, 0];
  /** 1/p per pole (0 for p = 0). */
  private readonly inverse: Float64Array;
  // Evenly spaced times after the ramp: e^{p·u} advanced by one multiplication by e^{p·Δ} a step, and
  // computed afresh every SYNC steps (so rounding cannot build up) or whenever the step changes.
  private lastU = NaN;
  private lastStep = NaN;
  private stepsSinceSync = 0;
  private readonly current: Float64Array;
  private readonly stepFactor: Float64Array;

  constructor(poles: readonly ComplexFrequency[], riseS: number) {
    if (!(riseS > 0)) throw new RangeError(`rise time ${riseS} s: expected a positive time`);
    this.poles = poles;
    this.riseS = riseS;
    const n = poles.length;
    this.re = new Float64Array(n);
    this.im = new Float64Array(n);
    this.slopeRe = new Float64Array(n);
    this.slopeIm = new Float64Array(n);
    this.endPhi2 = new Float64Array(2 * n);
    this.endPhi1 = new Float64Array(2 * n);
    this.inverse = new Float64Array(2 * n);
    this.current = new Float64Array(2 * n);
    this.stepFactor = new Float64Array(2 * n);
    poles.forEach((p, k) => {
      phiFunctions(p.re * riseS, p.im * riseS, this.e, this.p1, this.p2);
      this.endPhi2[2 * k] = riseS * this.p2[0];
      this.endPhi2[2 * k + 1] = riseS * this.p2[1];
      this.endPhi1[2 * k] = riseS * this.p1[0];
      this.endPhi1[2 * k + 1] = riseS * this.p1[1];
      const d = p.re * p.re + p.im * p.im;
      this.inverse[2 * k] = d > 0 ? p.re / d : 0;
      this.inverse[2 * k + 1] = d > 0 ? -p.im / d : 0;
    });
  }

  /** Fill re/im (and slopeRe/slopeIm) with g_k(t) and g_k′(t). */
  evaluate(t: number): void {
    const tr = this.riseS;
    if (t > tr) {
      this.after(t - tr);
      return;
    }
    this.lastU = NaN;
    const { e, p1, p2 } = this;
    for (let k = 0; k < this.poles.length; k++) {
      const p = this.poles[k];
      if (t <= 0) {
        this.re[k] = this.im[k] = this.slopeRe[k] = this.slopeIm[k] = 0;
      } else if (t <= tr) {
        phiFunctions(p.re * t, p.im * t, e, p1, p2);
        this.re[k] = t * t * p2[0];
        this.im[k] = t * t * p2[1];
        this.slopeRe[k] = t * p1[0];
        this.slopeIm[k] = t * p1[1];
      } else {
        const u = t - tr;
        phiFunctions(p.re * u, p.im * u, e, p1, p2);
        const er = e[0];
        const ei = e[1];
        const ar = this.endPhi2[2 * k];
        const ai = this.endPhi2[2 * k + 1];
        // t_r·[u·φ1(pu) + e^{pu}·t_r·φ2(p t_r)]
        this.re[k] = tr * (u * p1[0] + (er * ar - ei * ai));
        this.im[k] = tr * (u * p1[1] + (er * ai + ei * ar));
        const br = this.endPhi1[2 * k];
        const bi = this.endPhi1[2 * k + 1];
        this.slopeRe[k] = er * br - ei * bi;
        this.slopeIm[k] = er * bi + ei * br;
      }
    }
  }

  /** g_k and g_k′ at u = t − t_r > 0: t_r·[(e^{pu} − 1)/p + e^{pu}·t_r·φ2(p t_r)] and e^{pu}·t_r·φ1(p t_r). */
  private after(u: number): void {
    const step = u - this.lastU;
    const sameStep = step > 0 && Math.abs(step - this.lastStep) <= 1e-13 * step;
    const advance = sameStep && this.stepsSinceSync < SYNC;
    if (advance) this.stepsSinceSync++;
    else {
      this.stepsSinceSync = 0;
      if (!sameStep) {
        // A new step: its factors e^{p·Δ}, for the steps that follow (or none, going backwards).
        this.lastStep = step > 0 ? step : NaN;
        if (step > 0) {
          for (let k = 0; k < this.poles.length; k++) {
            const p = this.poles[k];
            const m = Math.exp(p.re * step);
            this.stepFactor[2 * k] = p.im === 0 ? m : m * Math.cos(p.im * step);
            this.stepFactor[2 * k + 1] = p.im === 0 ? 0 : m * Math.sin(p.im * step);
          }
        }
      }
    }
    this.lastU = u;
    const tr = this.riseS;
    const { e, p1, p2, current, stepFactor, inverse } = this;
    for (let k = 0; k < this.poles.length; k++) {
      const p = this.poles[k];
      let er: number;
      let ei: number;
      const zr = p.re * u;
      const zi = p.im * u;
      if (advance) {
        const cr = current[2 * k];
        const ci = current[2 * k + 1];
        er = cr * stepFactor[2 * k] - ci * stepFactor[2 * k + 1];
        ei = cr * stepFactor[2 * k + 1] + ci * stepFactor[2 * k];
      } else {
        const m = Math.exp(zr);
        er = zi === 0 ? m : m * Math.cos(zi);
        ei = zi === 0 ? 0 : m * Math.sin(zi);
      }
      current[2 * k] = er;
      current[2 * k + 1] = ei;
      // u·φ1(pu) = (e^{pu} − 1)/p, by the series near 0 where that difference cancels.
      let qr: number;
      let qi: number;
      if (zr * zr + zi * zi < 0.25) {
        phiFunctions(zr, zi, e, p1, p2);
        qr = u * p1[0];
        qi = u * p1[1];
      } else {
        const ar = er - 1;
        qr = ar * inverse[2 * k] - ei * inverse[2 * k + 1];
        qi = ar * inverse[2 * k + 1] + ei * inverse[2 * k];
      }
      const ar = this.endPhi2[2 * k];
      const ai = this.endPhi2[2 * k + 1];
      this.re[k] = tr * (qr + (er * ar - ei * ai));
      this.im[k] = tr * (qi + (er * ai + ei * ar));
      const br = this.endPhi1[2 * k];
      const bi = this.endPhi1[2 * k + 1];
      this.slopeRe[k] = er * br - ei * bi;
      this.slopeIm[k] = er * bi + ei * br;
    }
  }
}

/** Steps advanced by multiplication before e^{p·u} is computed afresh. */
const SYNC = 64;

/** An expansion's residues as flat arrays, a conjugate pair's doubled: Σ Re(c_k·g_k) is the pole part. */
export class RampCombination {
  readonly cr: Float64Array;
  readonly ci: Float64Array;
  readonly constant: number;
  readonly proportional: number;
  constructor(f: PartialFractions) {
    const n = f.poles.length;
    this.cr = new Float64Array(n);
    this.ci = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const twice = f.poles[k].im === 0 ? 1 : 2;
      this.cr[k] = twice * f.residues[k].re;
      this.ci[k] = twice * f.residues[k].im;
    }
    this.constant = f.constant;
    this.proportional = f.proportional;
  }

  /** (F ∗ i)(t) from a basis already evaluated at t. */
  value(basis: RampBasis, t: number, stepA: number): number {
    if (t <= 0) return 0;
    const tr = basis.riseS;
    let sum = this.constant * Math.min(t, tr) + (t <= tr ? this.proportional : 0);
    const { cr, ci } = this;
    const { re, im } = basis;
    for (let k = 0; k < cr.length; k++) sum += cr[k] * re[k] - ci[k] * im[k];
    return (stepA / tr) * sum;
  }

  /** d/dt (F ∗ i)(t) from a basis already evaluated at t (the steps of the D1 term left out). */
  slope(basis: RampBasis, t: number, stepA: number): number {
    if (t <= 0) return 0;
    const tr = basis.riseS;
    let sum = t <= tr ? this.constant : 0;
    const { cr, ci } = this;
    const { slopeRe, slopeIm } = basis;
    for (let k = 0; k < cr.length; k++) sum += cr[k] * slopeRe[k] - ci[k] * slopeIm[k];
    return (stepA / tr) * sum;
  }
}

/**
 * (F ∗ i)(t) of each expansion (all on the poles of `basis`) at every time: one evaluation of the basis per
 * time serves them all (the rail's voltage and every branch's current).
 */
export function rampResponses(expansions: readonly PartialFractions[], basis: RampBasis, stepA: number, times: ArrayLike<number>): Float64Array[] {
  const combinations = expansions.map((f) => new RampCombination(f));
  const out = expansions.map(() => new Float64Array(times.length));
  for (let i = 0; i < times.length; i++) {
    const t = times[i];
    basis.evaluate(t);
    for (let j = 0; j < combinations.length; j++) out[j][i] = combinations[j].value(basis, t, stepA);
  }
  return out;
}
