// The least-squares problem of one kind's model and one measured sweep: the complex residual
// ln(Z_model/Z_measured) and its Jacobian over ln p for any set of active parameters, solved by
// Levenberg–Marquardt from one or several starts, and the test of whether a parameter is needed.

import { VALUE_RANGES } from '../units/ranges.js';
import { FIT_PARAMETERS, MODELS, type FitKind } from './fit-models.js';
import type { Sweep } from './fit-start.js';
import { levenbergMarquardt, type LeastSquaresSolution } from './levenberg-marquardt.js';

/**
 * A parameter is needed when leaving it out raises ‖r‖² by more than this many times the noise variance
 * σ² = ‖r‖²/(m − n): the 0.1% point of χ² with one degree of freedom (the F-test of nested least-squares
 * models, e.g. Press et al., Numerical Recipes, 3rd ed., 2007, §14.2 and §15.6). Below it, the gain is
 * what fitting the noise would give.
 */
export const NEEDED_CHI2 = 10.83;

/** Steps allowed a trial fit without one parameter, when judging whether it is needed. */
export const TRIAL_ITERATIONS = 40;

export function activeIndices(on: readonly boolean[]): number[] {
  return on.flatMap((o, i) => (o ? [i] : []));
}

export interface Solved {
  values: Float64Array;
  solution: LeastSquaresSolution;
  iterations: number;
}

/** The least-squares problem of one kind and one sweep, for any set of active parameters. */
export class ModelFit {
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
