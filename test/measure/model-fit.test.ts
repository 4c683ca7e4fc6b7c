// The least-squares problem of one model and one sweep (src/measure/model-fit.ts), checked against numbers
// made in the test: synthetic sweeps of element trees by complex.js (synthetic.ts), the residual
// ln(Z_model/Z_measured) and its cost ½‖r‖² evaluated here with complex.js's log, and the nested-model
// F-test (Press et al., Numerical Recipes, 3rd ed., 2007, §14.2, §15.6) recomputed from those costs.
// Part values invented.

import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { activeIndices, ModelFit, NEEDED_CHI2 } from '../../src/measure/model-fit.js';
import { logFrequencies, synthesise, type SyntheticSweep } from './synthetic.js';

/** The capacitor kind's topology written out: esr + jω·esl + 1/(1/epr + jωC), epr left out when absent. */
function capacitorZ(w: number, v: ArrayLike<number>, on: readonly boolean[]): Complex {
  const [c, esr, esl, epr] = [v[0], v[1], v[2], v[3]];
  const y = new Complex(on[3] ? 1 / epr : 0, w * c);
  return y.inverse().add(new Complex(on[1] ? esr : 0, on[2] ? w * esl : 0));
}

/** ½ Σ |ln(Z_model/Z_measured)|² over the sweep, with complex.js. */
function referenceCost(sweep: SyntheticSweep, values: ArrayLike<number>, on: readonly boolean[]): number {
  let sum = 0;
  sweep.frequencies.forEach((f, i) => {
    const ratio = capacitorZ(2 * Math.PI * f, values, on).div(new Complex(sweep.re[i], sweep.im[i]));
    const r = ratio.log();
    sum += r.re * r.re + r.im * r.im;
  });
  return sum / 2;
}

const ALL = [true, true, true, true];
const NO_EPR = [true, true, true, false];
const frequencies = logFrequencies(1e2, 1e9, 141);
// 4.7 µF, 6 mΩ, 0.7 nH, with a 20 kΩ leak that shows below a few hundred hertz.
const truth = [4.7e-6, 6e-3, 0.7e-9, 20e3];
const leaky = series(resistor(truth[1]), inductor(truth[2]), parallel(capacitor(truth[0]), resistor(truth[3])));
const tight = series(resistor(truth[1]), inductor(truth[2]), capacitor(truth[0]));

describe('ModelFit', () => {
  it('recovers every parameter of a noise-free sweep from a start off by factors of 2 to 5', () => {
    const sweep = synthesise(leaky, frequencies);
    const fit = new ModelFit('capacitor', sweep);
    expect(fit.points).toBe(frequencies.length);
    const solved = fit.solveFromStarts(ALL, [Float64Array.of(2e-6, 30e-3, 2e-9, 100e3)]);
    truth.forEach((v, i) => expect(Math.abs(solved.values[i] / v - 1), `parameter ${i}`).toBeLessThan(1e-6));
    expect(solved.solution.cost).toBeLessThan(1e-20);
  });

  it('its cost is ½‖ln(Z_model/Z_measured)‖² at the values it returns, on a noisy sweep', () => {
    const sweep = synthesise(leaky, frequencies, { db: 0.05, deg: 0.3, seed: 7 });
    const fit = new ModelFit('capacitor', sweep);
    for (const on of [ALL, NO_EPR, [true, true, false, false]]) {
      const solved = fit.solveFromStarts(on, [Float64Array.from(truth)]);
      const reference = referenceCost(sweep, solved.values, on);
      expect(Math.abs(solved.solution.cost / reference - 1), on.join()).toBeLessThan(1e-9);
      // A parameter that is off keeps its start value.
      on.forEach((o, i) => {
        if (!o) expect(solved.values[i]).toBe(truth[i]);
      });
    }
  });

  it('solveFromStarts keeps the start whose fit costs least', () => {
    const sweep = synthesise(leaky, frequencies, { db: 0.05, deg: 0.3, seed: 11 });
    const fit = new ModelFit('capacitor', sweep);
    const starts = [Float64Array.of(1e-9, 1, 1e-12, 1e9), Float64Array.from(truth)];
    // One step from a far start cannot reach the minimum; from the true values it is already there.
    const each = starts.map((s) => fit.solveFromStarts(ALL, [s], 1));
    const both = fit.solveFromStarts(ALL, starts, 1);
    const least = Math.min(...each.map((s) => s.solution.cost));
    expect(each[0].solution.cost).toBeGreaterThan(each[1].solution.cost);
    expect(both.solution.cost).toBe(least);
    expect(Math.abs(referenceCost(sweep, both.values, ALL) / least - 1)).toBeLessThan(1e-9);
  });

  describe('neededOn: the χ² test at the 0.1 % point (10.83, one degree of freedom)', () => {
    // The statistic recomputed here from the costs at the values each fit returns.
    function statistic(sweep: SyntheticSweep, full: ArrayLike<number>, reduced: ArrayLike<number>): number {
      const cFull = referenceCost(sweep, full, ALL);
      const cReduced = referenceCost(sweep, reduced, NO_EPR);
      const variance = (2 * cFull) / (2 * frequencies.length - activeIndices(ALL).length);
      return (2 * (cReduced - cFull)) / variance;
    }

    for (const seed of [1, 2, 3]) {
      it(`a leak the sweep shows is needed; one it does not show is not (noise seed ${seed})`, () => {
        const noise = { db: 0.05, deg: 0.3, seed };
        for (const [element, expected] of [
          [leaky, true],
          [tight, false],
        ] as const) {
          const sweep = synthesise(element, frequencies, noise);
          const fit = new ModelFit('capacitor', sweep);
          // The leak's start for the sweep without one: far above what the sweep can see.
          const start = Float64Array.of(truth[0], truth[1], truth[2], expected ? truth[3] : 1e12);
          const needed = fit.neededOn(ALL, NO_EPR, start);
          expect(needed, expected ? 'leaky' : 'tight').toBe(expected);
          const full = fit.solveFromStarts(ALL, [start]);
          const reduced = fit.solveFromStarts(NO_EPR, [start], 40);
          const chi = statistic(sweep, full.values, reduced.values);
          expect(chi >= NEEDED_CHI2).toBe(needed);
          // Far from the threshold either way, so the verdict is not a coin toss.
          if (expected) expect(chi).toBeGreaterThan(3 * NEEDED_CHI2);
          else expect(chi).toBeLessThan(NEEDED_CHI2);
        }
      });
    }
  });
});

describe('activeIndices', () => {
  it('lists the positions that are on, in order', () => {
    expect(activeIndices([true, false, true, true])).toEqual([0, 2, 3]);
    expect(activeIndices([false, false])).toEqual([]);
  });
});
