// Which times a load-step response is looked at: how long (the default duration) and where the search for
// its extremes samples it, both from the poles and how much of the response each carries.

import type { ComplexFrequency } from '../circuit/natural-frequencies.js';
import type { PartialFractions } from './partial-fractions.js';
import { phiFunctions, type ComplexPair } from './phi-functions.js';
import { hypot } from '../circuit/hypot.js';

/** A pole carrying at least this share of the transient sets the default duration. */
export const SIGNIFICANT_SHARE = 1e-3;
/** Time constants a significant pole is followed for: e^−7 < 0.1% of its start is left. */
export const DECAY_TIME_CONSTANTS = 7;
/** …or this many periods, for an oscillation that decays slower than that (Q above about 45). */
export const MOST_PERIODS = 100;
/** The shortest default duration, in rise times. */
export const LEAST_RISE_TIMES = 20;

/**
 * Each pole's share of the transient: after the ramp, v − v_final = Σ c_k·e^{p_k(t − t_r)} with
 * c_k = −ΔI·r_k·φ1(p_k·t_r)/p_k (ramp-response.ts); the share is |c_k| (twice for a pair) over their sum.
 * A pole at 0, and `integrator` (the slowest real pole of a rail without a DC path, which never decays
 * within any duration of interest), get 0.
 */
export function poleWeights(f: PartialFractions, riseS: number, integrator: number): Float64Array {
  const e: ComplexPair = [0, 0];
  const p1: ComplexPair = [0, 0];
  const p2: ComplexPair = [0, 0];
  const w = new Float64Array(f.poles.length);
  let total = 0;
  f.poles.forEach((p, k) => {
    const size = hypot(p.re, p.im);
    if (k === integrator || size === 0) return;
    phiFunctions(p.re * riseS, p.im * riseS, e, p1, p2);
    const r = f.residues[k];
    const c = (hypot(r.re, r.im) * hypot(p1[0], p1[1])) / size;
    w[k] = p.im === 0 ? c : 2 * c;
    total += w[k];
  });
  if (total > 0) for (let k = 0; k < w.length; k++) w[k] /= total;
  return w;
}

/**
 * The default duration: the rise time plus the longest time a significant pole takes to decay, seven of
 * its time constants 1/|Re p| (or a hundred of its periods, whichever is shorter), and at least twenty rise
 * times.
 */
export function defaultDuration(poles: readonly ComplexFrequency[], weights: Float64Array, riseS: number): number {
  let longest = 0;
  poles.forEach((p, k) => {
    if (!(weights[k] >= SIGNIFICANT_SHARE)) return;
    let t = DECAY_TIME_CONSTANTS / Math.abs(p.re);
    if (p.im > 0) t = Math.min(t, (MOST_PERIODS * 2 * Math.PI) / p.im);
    if (Number.isFinite(t)) longest = Math.max(longest, t);
  });
  return Math.max(riseS + longest, LEAST_RISE_TIMES * riseS);
}

/** Points on the ramp, per decade after it, and evenly over the whole duration. */
const ON_RAMP = 64;
const PER_DECADE = 100;
const EVEN = 1000;
/** Points per period of a significant oscillation while it lasts (its 8 time constants), at most… */
const PER_PERIOD = 16;
const MOST_PER_POLE = 4000;
/** …for poles carrying at least this share. */
const RESOLVED_SHARE = 1e-4;

/**
 * Where the search for the droop samples v(t), ascending from 0 to `durationS`: evenly on the ramp, t_r
 * itself, log-spaced after it, evenly over the duration, and every significant oscillation at 16 points a
 * period for as long as it lasts, so no dip of the ringing falls between two samples.
 */
export function transientSearchTimes(poles: readonly ComplexFrequency[], weights: Float64Array, riseS: number, durationS: number): Float64Array {
  const t: number[] = [0];
  const end = Math.max(durationS, riseS);
  for (let i = 1; i <= ON_RAMP; i++) t.push((riseS * i) / ON_RAMP);
  const decades = Math.log10(end / riseS);
  const logSteps = Math.ceil(decades * PER_DECADE);
  for (let i = 1; i <= logSteps; i++) t.push(riseS * 10 ** ((decades * i) / logSteps));
  for (let i = 1; i <= EVEN; i++) t.push((end * i) / EVEN);
  poles.forEach((p, k) => {
    if (!(p.im > 0) || !(weights[k] >= RESOLVED_SHARE)) return;
    const lasts = Math.min(end, p.re < 0 ? 8 / -p.re : end);
    const step = Math.max((2 * Math.PI) / p.im / PER_PERIOD, lasts / MOST_PER_POLE);
    const count = Math.ceil(lasts / step);
    for (let i = 1; i <= count; i++) t.push(Math.min(end, i * step));
  });
  // The ramp's corner exactly, not a rounding-level neighbour of it (v may step there).
  const sorted = Float64Array.from(t.filter((x) => x === riseS || Math.abs(x - riseS) > 1e-9 * riseS)).sort();
  let n = 1;
  for (let i = 1; i < sorted.length; i++) if (sorted[i] > sorted[n - 1]) sorted[n++] = sorted[i];
  return sorted.subarray(0, n);
}
