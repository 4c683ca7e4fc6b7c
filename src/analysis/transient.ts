// A load step on a rail: the voltage deviation v(t) when the load's current ramps from 0 to ΔI over t_r,
// its largest dip (droop) and when, its final offset and how long it takes to settle, and the current each
// branch carries over time.
//
// Method. The rail is linear, so v = −Z ∗ i. Z(s) of the whole rail (one tree: every branch with its
// impedance divided by its count) is written in partial fractions on its poles — the generalised
// eigenvalues of the tree's nodal pencil (natural-frequencies.ts) — with residues fitted on Z(jω) sampled
// over every decade the poles span and around each resonance (partial-fractions.ts); the fit is checked
// against the exact Z(jω) between the samples and its error reported. The ramp response is then a closed
// form per pole (ramp-response.ts), exact at every t. Each branch's current is H_b ∗ i with H_b = Y_b·Z on
// the same poles; Σ H_b = 1.

import { dcResistance, parallel, scaledImpedance, type Element } from '../circuit/element.js';
import { addAdmittance, admittanceInto } from '../circuit/admittance.js';
import { impedanceSweepInto } from '../circuit/impedance.js';
import { naturalFrequencies, type ComplexFrequency, type FrequencyRange } from '../circuit/natural-frequencies.js';
import { logSweep } from '../circuit/sweep.js';
import { featureGrid } from './feature-grid.js';
import { distinctPoles, fitError, fitPartialFractions, type PartialFractions } from './partial-fractions.js';
import { RampBasis, RampCombination, rampResponses } from './ramp-response.js';
import { brentRoot } from './root.js';
import { transientSearchTimes, defaultDuration, poleWeights } from './transient-times.js';
import { hypot } from '../circuit/hypot.js';

export interface TransientBranch {
  element: Element;
  count: number;
}

export interface LoadStepRequest {
  /** ΔI, A. */
  stepA: number;
  /** Rise time t_r of the current's ramp, s. */
  riseS: number;
  /** How long to follow the rail, s; default from its slowest significant pole (transient-times.ts). */
  durationS?: number;
  /** Where the rail's features lie (the plan's band): the range naturalFrequencies looks in. */
  range: FrequencyRange;
  /** A final offset R_dc·ΔI this large (e.g. the rail voltage) counts as no DC path: the rail collapses. */
  collapseV?: number;
}

export interface RailTransient {
  stepA: number;
  riseS: number;
  durationS: number;
  /** The duration was given (else it follows from the poles). */
  durationGiven: boolean;
  /** Depth of the largest dip below the rail's DC value, V (≥ 0). */
  droopV: number;
  /** When the dip is deepest, s. */
  droopAtS: number;
  /** Highest rise above the DC value, V (0 when v never goes above it). */
  overshootV: number;
  overshootAtS: number | null;
  /** The rail has a DC path (a regulator): it settles at finalV. */
  dcPath: boolean;
  /** Final deviation −R_dc·ΔI, V (negative; null without a DC path). */
  finalV: number | null;
  /** The last time |v − finalV| exceeds 10% of the largest |v − finalV| (null: not settled in the duration). */
  settleS: number | null;
  /** Largest relative error of the fitted Z(jω) against the exact one, between the fit's samples. */
  fitError: number;
  /** Largest error of a fitted branch share H_b(jω), per ampere. */
  shareFitError: number;
  /**
   * The partial fractions reproduce Z(jω) and every share to FIT_TOLERANCE, no pole lies in the right
   * half-plane (a passive network has none; one found is a failure of the eigenvalue solver on extreme
   * values) and every figure is finite. When false, the figures above are not to be trusted.
   */
  resolved: boolean;
  impedance: PartialFractions;
  /** Each branch's share of the load current, H_b = Y_b·Z, in branch order. */
  shares: PartialFractions[];
}

/** The largest fit error (relative for Z, per ampere for the shares) a resolved response may have. */
export const FIT_TOLERANCE = 1e-6;

/** The part of the deviation that counts as settled: within 10% of the largest (common practice). */
export const SETTLE_FRACTION = 0.1;

/** The rail as one tree: every branch's N placements as one element, all in parallel. */
export function railTree(branches: readonly TransientBranch[]): Element {
  return parallel(...branches.map((b) => scaledImpedance(b.element, 1 / b.count)));
}

/** The rise time implied by a bandwidth: t_r = 0.35/f (common practice, for a single-pole edge). */
export function riseForBandwidth(hz: number): number {
  return 0.35 / hz;
}

export function railTransient(branches: readonly TransientBranch[], request: LoadStepRequest): RailTransient {
  if (branches.length === 0) throw new RangeError('a rail with no branches has no load-step response');
  const { stepA, riseS } = request;
  const tree = railTree(branches);
  const dcOhm = dcResistance(tree);
  const dcPath = Number.isFinite(dcOhm) && !(request.collapseV !== undefined && dcOhm * stepA >= request.collapseV);
  const range = { fromHz: request.range.fromHz, toHz: Math.max(request.range.toHz, 1 / riseS) };
  const poles = distinctPoles(naturalFrequencies(tree, range).poles).map((p) => ({ ...p }));
  // Without any DC path Z has a pole at exactly 0 (the rail's capacitance integrating the load current);
  // the eigenvalue solver returns it within rounding.
  let integrator = -1;
  if (!dcPath) integrator = slowestRealPole(poles);
  if (!Number.isFinite(dcOhm) && integrator >= 0) poles[integrator] = { re: 0, im: 0 };

  const { fit, check } = samples(branches, poles, range);
  const proportional = { proportional: true, weights: fit.weights };
  const [impedance] = fitPartialFractions(poles, fit.omega, [fit.z], proportional);
  const shares = fitPartialFractions(poles, fit.omega, fit.shares, { proportional: false });
  const impedanceError = fitError(impedance, { omega: check.omega, ...check.z });
  const shareError = Math.max(0, ...shares.map((h, b) => fitError(h, { omega: check.omega, ...check.shares[b] }, 1)));

  const weights = poleWeights(impedance, riseS, integrator);
  const durationS = request.durationS ?? defaultDuration(impedance.poles, weights, riseS);
  const basis = new RampBasis(impedance.poles, riseS);
  const z = new RampCombination(impedance);
  const voltageAt = (t: number) => {
    basis.evaluate(t);
    return -z.value(basis, t, stepA);
  };
  const slopeAt = (t: number) => {
    basis.evaluate(t);
    return -z.slope(basis, t, stepA);
  };
  const times = transientSearchTimes(impedance.poles, weights, riseS, durationS);
  const [v] = rampResponses([impedance], basis, -stepA, times);

  const droop = refinedExtremum(times, v, -1, voltageAt, slopeAt);
  const peak = refinedExtremum(times, v, 1, voltageAt, slopeAt);
  const finalV = dcPath ? -dcOhm * stepA : null;
  const growing = impedance.poles.some((p) => p.re > 1e-9 * hypot(p.re, p.im));
  const resolved = impedanceError <= FIT_TOLERANCE && shareError <= FIT_TOLERANCE && !growing && [droop.value, peak.value, droop.t].every(Number.isFinite);
  return {
    stepA,
    riseS,
    durationS,
    durationGiven: request.durationS !== undefined,
    droopV: Math.max(0, -droop.value),
    droopAtS: droop.t,
    overshootV: Math.max(0, peak.value),
    overshootAtS: peak.value > 0 ? peak.t : null,
    dcPath,
    finalV,
    settleS: finalV === null ? null : settleTime(times, v, finalV, voltageAt),
    fitError: impedanceError,
    shareFitError: shareError,
    resolved,
    impedance,
    shares,
  };
}

/** v(t) and each branch's current share i_b(t)/ΔI at `times`. */
export function transientCurves(t: RailTransient, times: ArrayLike<number>): { voltage: Float64Array; shares: Float64Array[] } {
  const basis = new RampBasis(t.impedance.poles, t.riseS);
  const [voltage, ...shares] = rampResponses([t.impedance, ...t.shares], basis, 1, times);
  for (let i = 0; i < voltage.length; i++) voltage[i] *= -t.stepA;
  return { voltage, shares };
}

function slowestRealPole(poles: readonly ComplexFrequency[]): number {
  let best = -1;
  poles.forEach((p, k) => {
    if (p.im === 0 && (best < 0 || Math.abs(p.re) < Math.abs(poles[best].re))) best = k;
  });
  return best;
}

/** Samples per decade of the fit's log grid; resonances get the feature grid's ladders on top. */
const FIT_PER_DECADE = 20;

interface Sampled {
  omega: Float64Array;
  z: { re: Float64Array; im: Float64Array };
  weights: Float64Array;
  shares: { re: Float64Array; im: Float64Array }[];
}

/**
 * Z(jω) and every H_b(jω) from the branches' own kernels, on a log grid a decade beyond every pole (and
 * the range) with ladders around each resonance; and the same between those samples, for the check.
 */
function samples(branches: readonly TransientBranch[], poles: readonly ComplexFrequency[], range: FrequencyRange): { fit: Sampled; check: Sampled } {
  const sizes = poles.map((p) => hypot(p.re, p.im)).filter((s) => s > 0);
  const low = Math.min(range.fromHz, ...sizes.map((s) => s / (2 * Math.PI))) / 10;
  const high = Math.max(range.toHz, ...sizes.map((s) => s / (2 * Math.PI))) * 10;
  const grid = featureGrid(logSweep({ fromHz: low, toHz: high, perDecade: FIT_PER_DECADE }), poles);
  const between = new Float64Array(grid.length - 1);
  for (let i = 0; i < between.length; i++) between[i] = Math.sqrt(grid[i] * grid[i + 1]);
  return { fit: sampleAt(branches, grid), check: sampleAt(branches, between) };
}

function sampleAt(branches: readonly TransientBranch[], hz: Float64Array): Sampled {
  const m = hz.length;
  const zr = new Float64Array(m);
  const zi = new Float64Array(m);
  const yr = branches.map(() => new Float64Array(m));
  const yi = branches.map(() => new Float64Array(m));
  const g = new Float64Array(m);
  const b = new Float64Array(m);
  branches.forEach((branch, j) => {
    impedanceSweepInto(branch.element, hz, zr, zi);
    addAdmittance(zr, zi, branch.count, yr[j], yi[j]);
    addAdmittance(zr, zi, branch.count, g, b);
  });
  const z = { re: new Float64Array(m), im: new Float64Array(m) };
  admittanceInto(g, b, z.re, z.im);
  const weights = new Float64Array(m);
  // 1/|Z|: a relative fit.
  for (let i = 0; i < m; i++) weights[i] = Math.sqrt(g[i] * g[i] + b[i] * b[i]);
  // H_b = Y_b/Y
  const shares = branches.map((_, j) => {
    const re = new Float64Array(m);
    const im = new Float64Array(m);
    for (let i = 0; i < m; i++) {
      re[i] = yr[j][i] * z.re[i] - yi[j][i] * z.im[i];
      im[i] = yr[j][i] * z.im[i] + yi[j][i] * z.re[i];
    }
    return { re, im };
  });
  return { omega: Float64Array.from(hz, (f) => 2 * Math.PI * f), z, weights, shares };
}

/**
 * The lowest (sign −1) or highest (+1) value of v over the samples, each sampled local extremum within
 * 1% of the best refined where v′ changes sign between its neighbours (Brent's method on the closed-form
 * slope).
 */
function refinedExtremum(times: Float64Array, v: Float64Array, sign: 1 | -1, valueAt: (t: number) => number, slopeAt: (t: number) => number): { t: number; value: number } {
  let best = 0;
  for (let i = 1; i < v.length; i++) if (sign * v[i] > sign * v[best]) best = i;
  const reach = sign * v[best] - 0.01 * Math.abs(v[best]);
  let result = { t: times[best], value: v[best] };
  for (let i = 1; i < v.length - 1; i++) {
    if (!(sign * v[i] >= sign * v[i - 1] && sign * v[i] >= sign * v[i + 1]) || sign * v[i] < reach) continue;
    const a = times[i - 1];
    const b = times[i + 1];
    const t = brentRoot((x) => sign * slopeAt(x), a, b, (b - a) * 1e-10);
    if (Number.isNaN(t)) continue;
    const value = valueAt(t);
    if (sign * value > sign * result.value) result = { t, value };
  }
  return result;
}

/** The last time |v − vFinal| exceeds SETTLE_FRACTION of its largest value; null if that is the end. */
function settleTime(times: Float64Array, v: Float64Array, vFinal: number, valueAt: (t: number) => number): number | null {
  let largest = 0;
  for (let i = 0; i < v.length; i++) largest = Math.max(largest, Math.abs(v[i] - vFinal));
  const band = SETTLE_FRACTION * largest;
  let last = -1;
  for (let i = 0; i < v.length; i++) if (Math.abs(v[i] - vFinal) > band) last = i;
  if (last < 0) return 0;
  if (last === v.length - 1) return null;
  const a = times[last];
  const b = times[last + 1];
  const t = brentRoot((x) => Math.abs(valueAt(x) - vFinal) - band, a, b, (b - a) * 1e-10);
  return Number.isNaN(t) ? b : t;
}
