// Fitting a kind's model to a measured impedance: nonlinear least squares on ln|Z| and phase together, as
// the complex residual ln(Z_model/Z_measured) (its real part is the |Z| error in nepers, its imaginary part
// the phase error in radians), over the logarithms of the parameters so every value stays positive and
// relative errors weigh alike. A parameter the data cannot determine is left out of the model (a series
// element shorted, a parallel one open) and the fit is redone; the reason is kept for the report.

import { FIT_PARAMETERS, type FitKind } from './fit-models.js';
import { startingValues, type Sweep } from './fit-start.js';
import { activeIndices, ModelFit, NEEDED_CHI2, TRIAL_ITERATIONS, type Solved } from './model-fit.js';
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
export { NEEDED_CHI2 } from './model-fit.js';

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
