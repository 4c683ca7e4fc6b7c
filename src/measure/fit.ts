// Fitting a kind's model to a measured impedance: nonlinear least squares on ln|Z| and phase together, as
// the complex residual ln(Z_model/Z_measured) (its real part is the |Z| error in nepers, its imaginary part
// the phase error in radians), over the logarithms of the parameters so every value stays positive and
// relative errors weigh alike. A parameter the data cannot determine is left out of the model (a series
// element shorted, a parallel one open) and the fit is redone; the reason is kept for the report.

import { VALUE_RANGES } from '../units/ranges.js';
import { FIT_PARAMETERS, MODELS, type FitKind } from './fit-models.js';
import { startingValues, type Sweep } from './fit-start.js';
import { levenbergMarquardt, type LeastSquaresSolution } from './levenberg-marquardt.js';
import { parameterStatistics } from './fit-statistics.js';

export interface FitWindow {
  fromHz?: number;
  toHz?: number;
}

/**
 * Why a parameter was left out: it changes Z too little anywhere; the scatter leaves it too uncertain; or
 * the fit without it is as good as the noise allows (a nested-model χ² test).
 */
export interface LeftOut {
  name: string;
  why: 'no-effect' | 'uncertain' | 'not-needed';
  /** Where its effect is largest: at the low or high end of the range (a wider sweep would show it), or inside. */
  strongest: 'low-end' | 'high-end' | 'inside';
  /** max over the range of |∂ln Z/∂ln p| at the value the fit reached. */
  influence: number;
  /** Standard error of ln p (≈ relative error), from the residual scatter. */
  standardError: number;
}

export interface FitResidual {
  /** Root-mean-square and largest |Z| error, dB; root-mean-square phase error, degrees. */
  rmsDb: number;
  maxDb: number;
  rmsDeg: number;
}

export interface FitResult {
  kind: FitKind;
  points: number;
  fromHz: number;
  toHz: number;
  /** The determined parameters, SI base units, named as the part format names them. */
  parameters: Record<string, number>;
  /** Standard error of ln p for each determined parameter (≈ its relative uncertainty). */
  standardErrors: Record<string, number>;
  leftOut: LeftOut[];
  residual: FitResidual;
  iterations: number;
}

export type FitOutcome = { ok: true; fit: FitResult } | { ok: false; message: string };

/**
 * A parameter whose halving or doubling changes Z by less than this (relative) at every point has no
 * effect the data can show: |∂ln Z/∂ln p|·ln 2 < 1e-3, about 0.009 dB or 0.06°.
 */
export const NO_EFFECT = 1e-3;
/** A parameter known only within a factor of two (standard error of ln p above ln 2) is not determined. */
export const TOO_UNCERTAIN = Math.LN2;
/**
 * A parameter is needed when leaving it out raises ‖r‖² by more than this many times the noise variance
 * σ² = ‖r‖²/(m − n): the 0.1% point of χ² with one degree of freedom (the F-test of nested least-squares
 * models, e.g. Press et al., Numerical Recipes, 3rd ed., 2007, §14.2 and §15.6). Below it, the gain is
 * what fitting the noise would give.
 */
export const NEEDED_CHI2 = 10.83;

const DB_PER_NEPER = 20 / Math.LN10;
const DEGREES = 180 / Math.PI;

export function fitImpedance(kind: FitKind, measured: Sweep, window: FitWindow = {}): FitOutcome {
  const specs = FIT_PARAMETERS[kind];
  const from = window.fromHz ?? 0;
  const to = window.toHz ?? Infinity;
  const keep: number[] = [];
  for (let i = 0; i < measured.frequencies.length; i++) {
    const f = measured.frequencies[i];
    const size = Math.hypot(measured.re[i], measured.im[i]);
    if (f > 0 && f >= from && f <= to && size > 0 && Number.isFinite(size)) keep.push(i);
  }
  const minimum = specs.length + 2;
  if (keep.length < minimum) return { ok: false, message: `${keep.length} usable points in the range; a ${kind} fit needs at least ${minimum}` };
  const sweep: Sweep = {
    frequencies: Float64Array.from(keep, (i) => measured.frequencies[i]),
    re: Float64Array.from(keep, (i) => measured.re[i]),
    im: Float64Array.from(keep, (i) => measured.im[i]),
  };
  const on = specs.map(() => true);
  const leftOut: LeftOut[] = [];
  let starts = startingValues(kind, sweep);
  let iterations = 0;
  // A long sweep is first fitted on an evenly thinned subset (every start, every parameter that shows no
  // effect left out), then the whole sweep refines that answer: the same minimum for a fraction of the work.
  let screen: ModelFit | undefined;
  if (sweep.frequencies.length > 2 * COARSE_POINTS) {
    screen = new ModelFit(kind, thinned(sweep, COARSE_POINTS));
    const coarse = settle(screen, on, starts, leftOut, false);
    starts = [coarse.values];
    iterations += coarse.iterations;
  }
  const fit = new ModelFit(kind, sweep);
  const best = settle(fit, on, starts, leftOut, true, screen);
  iterations += best.iterations;
  const stats = parameterStatistics(best.solution, fit.points, activeIndices(on).length);
  const parameters: Record<string, number> = {};
  const standardErrors: Record<string, number> = {};
  activeIndices(on).forEach((index, column) => {
    parameters[specs[index].name] = best.values[index];
    standardErrors[specs[index].name] = stats.standardError[column];
  });
  return {
    ok: true,
    fit: {
      kind,
      points: fit.points,
      fromHz: sweep.frequencies[0],
      toHz: sweep.frequencies[sweep.frequencies.length - 1],
      parameters,
      standardErrors,
      leftOut,
      residual: residualOf(best.solution.residual, fit.points),
      iterations,
    },
  };
}

/** Steps allowed a trial fit without one parameter, when judging whether it is needed. */
const TRIAL_ITERATIONS = 40;

/** Points of the thinned sweep for the first, rough fit of a long sweep. */
const COARSE_POINTS = 400;

/**
 * Fit from the starts, then leave out one undetermined parameter at a time (weakest first) and fit again
 * from where the fit stood, until every parameter left is determined. `on` and `leftOut` are updated.
 * The uncertainty test is made only on the whole sweep (`judgeScatter`): a subset's scatter says less.
 */
function settle(fit: ModelFit, on: boolean[], starts: readonly Float64Array[], leftOut: LeftOut[], judgeScatter: boolean, screen?: ModelFit): Solved {
  const specs = FIT_PARAMETERS[fit.kind];
  let best = fit.solveFromStarts(on, starts);
  let iterations = best.iterations;
  for (let round = 0; round < specs.length; round++) {
    const active = activeIndices(on);
    const stats = parameterStatistics(best.solution, fit.points, active.length);
    const candidates = active
      .map((index, column) => ({ index, influence: stats.influence[column], error: stats.standardError[column], strongest: stats.strongest[column] }))
      .filter((c) => specs[c.index].absence !== 'required');
    const noEffect = candidates.filter((c) => c.influence * Math.LN2 < NO_EFFECT).sort((a, b) => a.influence - b.influence)[0];
    const uncertain = judgeScatter ? candidates.filter((c) => c.error > TOO_UNCERTAIN).sort((a, b) => b.error - a.error)[0] : undefined;
    let drop: ((typeof candidates)[number] & { why: LeftOut['why'] }) | undefined = noEffect ? { ...noEffect, why: 'no-effect' } : uncertain ? { ...uncertain, why: 'uncertain' } : undefined;
    let without: Solved | undefined;
    if (!drop && judgeScatter) {
      // Each optional parameter left out in turn: the one whose absence costs least, if that is within the noise.
      const variance = (2 * best.solution.cost) / (2 * fit.points - active.length);
      let least: { c: (typeof candidates)[number]; solved: Solved; chi2: number } | undefined;
      for (const c of candidates) {
        const trial = on.slice();
        trial[c.index] = false;
        // A misfit's χ² grows with the number of points: a parameter the thinned sweep already needs, the
        // whole sweep needs too, so the costly trial on the whole sweep is made only for the others.
        if (screen && screen.neededOn(on, trial, best.values)) continue;
        // A needed parameter's absence shows within a few dozen steps; the cost only falls with more.
        const solved = fit.solveFromStarts(trial, [best.values], TRIAL_ITERATIONS);
        iterations += solved.iterations;
        const chi2 = (2 * (solved.solution.cost - best.solution.cost)) / variance;
        if (!least || chi2 < least.chi2) least = { c, solved, chi2 };
      }
      if (least && least.chi2 < NEEDED_CHI2) {
        drop = { ...least.c, why: 'not-needed' };
        without = fit.solveFromStarts(on.map((o, i) => o && i !== least.c.index), [least.solved.values]);
      }
    }
    if (!drop) break;
    leftOut.push({ name: specs[drop.index].name, why: drop.why, strongest: drop.strongest, influence: drop.influence, standardError: drop.error });
    on[drop.index] = false;
    best = without ?? fit.solveFromStarts(on, [best.values]);
    iterations += best.iterations;
  }
  return { ...best, iterations };
}

/** About `count` points of the sweep, evenly spread by index, both ends kept. */
function thinned(sweep: Sweep, count: number): Sweep {
  const n = sweep.frequencies.length;
  const pick = Array.from({ length: count }, (_, k) => Math.round((k * (n - 1)) / (count - 1)));
  return { frequencies: Float64Array.from(pick, (i) => sweep.frequencies[i]), re: Float64Array.from(pick, (i) => sweep.re[i]), im: Float64Array.from(pick, (i) => sweep.im[i]) };
}

function activeIndices(on: readonly boolean[]): number[] {
  return on.flatMap((o, i) => (o ? [i] : []));
}

/** rms and max |Z| error in dB and rms phase error in degrees, from the residual [ln-ratio re…, im…]. */
export function residualOf(r: Float64Array, points: number): FitResidual {
  let db2 = 0;
  let maxDb = 0;
  let deg2 = 0;
  for (let i = 0; i < points; i++) {
    const db = r[i] * DB_PER_NEPER;
    const deg = r[points + i] * DEGREES;
    db2 += db * db;
    deg2 += deg * deg;
    maxDb = Math.max(maxDb, Math.abs(db));
  }
  return { rmsDb: Math.sqrt(db2 / points), maxDb, rmsDeg: Math.sqrt(deg2 / points) };
}

interface Solved {
  values: Float64Array;
  solution: LeastSquaresSolution;
  iterations: number;
}

/** The least-squares problem of one kind and one sweep, for any set of active parameters. */
class ModelFit {
  readonly points: number;
  private readonly omega: Float64Array;
  // 1/Z_measured, so the ratio Z_model/Z_measured is one complex product.
  private readonly inverseRe: Float64Array;
  private readonly inverseIm: Float64Array;

  constructor(
    readonly kind: FitKind,
    sweep: Sweep,
  ) {
    this.points = sweep.frequencies.length;
    this.omega = Float64Array.from(sweep.frequencies, (f) => 2 * Math.PI * f);
    this.inverseRe = new Float64Array(this.points);
    this.inverseIm = new Float64Array(this.points);
    for (let i = 0; i < this.points; i++) {
      const d = sweep.re[i] * sweep.re[i] + sweep.im[i] * sweep.im[i];
      this.inverseRe[i] = sweep.re[i] / d;
      this.inverseIm[i] = -sweep.im[i] / d;
    }
  }

  /** Whether this sweep's fit with `on` is significantly better than with `without` (the χ² test above). */
  neededOn(on: readonly boolean[], without: readonly boolean[], values: Float64Array): boolean {
    const full = this.solveFromStarts(on, [values]);
    const reduced = this.solveFromStarts(without, [values], TRIAL_ITERATIONS);
    const variance = (2 * full.solution.cost) / (2 * this.points - activeIndices(on).length);
    return (2 * (reduced.solution.cost - full.solution.cost)) / variance >= NEEDED_CHI2;
  }

  /** The best of the fits from each start (lowest cost), with `on` choosing the parameters that take part. */
  solveFromStarts(on: readonly boolean[], starts: readonly Float64Array[], maxIterations?: number): Solved {
    let best: Solved | undefined;
    for (const start of starts) {
      const solved = this.solve(on, start, maxIterations);
      if (!best || solved.solution.cost < best.solution.cost) best = solved;
    }
    return best!;
  }

  private solve(on: readonly boolean[], start: Float64Array, maxIterations?: number): Solved {
    const specs = FIT_PARAMETERS[this.kind];
    const active = activeIndices(on);
    const values = Float64Array.from(start);
    const lower = Float64Array.from(active, (i) => Math.log(VALUE_RANGES[specs[i].dimension]!.min));
    const upper = Float64Array.from(active, (i) => Math.log(VALUE_RANGES[specs[i].dimension]!.max));
    const model = MODELS[this.kind];
    const m = this.points;
    const z = new Float64Array(2);
    const dz = new Float64Array(2 * specs.length);
    const solution = levenbergMarquardt(
      {
        parameters: active.length,
        residuals: 2 * m,
        lower,
        upper,
        evaluate: (x, r, jac) => {
          active.forEach((index, j) => (values[index] = Math.exp(x[j])));
          for (let i = 0; i < m; i++) {
            model(this.omega[i], values, on, z, jac ? dz : null);
            // ratio = Z_model/Z_measured; r = ln ratio = ln|ratio| + j·arg ratio
            const qr = z[0] * this.inverseRe[i] - z[1] * this.inverseIm[i];
            const qi = z[0] * this.inverseIm[i] + z[1] * this.inverseRe[i];
            r[i] = 0.5 * Math.log(qr * qr + qi * qi);
            r[m + i] = Math.atan2(qi, qr);
            if (!jac) continue;
            // ∂r/∂ln p = (∂Z/∂ln p)/Z_model
            const d = z[0] * z[0] + z[1] * z[1];
            const ur = z[0] / d;
            const ui = -z[1] / d;
            for (let j = 0; j < active.length; j++) {
              const ar = dz[2 * active[j]];
              const ai = dz[2 * active[j] + 1];
              jac[j * 2 * m + i] = ar * ur - ai * ui;
              jac[j * 2 * m + m + i] = ar * ui + ai * ur;
            }
          }
        },
      },
      Float64Array.from(active, (i) => Math.log(start[i])),
      { maxIterations },
    );
    active.forEach((index, j) => (values[index] = Math.exp(solution.x[j])));
    return { values, solution, iterations: solution.iterations };
  }
}
