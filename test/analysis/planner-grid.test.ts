import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { buildGrid, reachMultiplier, type PlannerProblem } from '../../src/analysis/planner-grid.js';
import { placementElement, regulatorElement } from '../../src/analysis/rail.js';
import { branchAdmittance, type RefBranch } from './rail-reference.js';

// The planner's grid is checked against admittances computed in the test with complex.js (rail-reference.ts:
// Z_R = R, Z_L = jωL, Z_C = 1/(jωC), series impedances and parallel admittances adding), and its reach
// multiplier against the defining equation |P + t·y| = T solved by bisection in the test. Values invented.

const regulator: RefBranch = { r: 2e-3, l: 10e-9, c: 0, count: 1 };
const caps: RefBranch[] = [
  { r: 5e-3, l: 0.5e-9 + 0.3e-9, c: 10e-6, count: 1 },
  { r: 12e-3, l: 0.4e-9 + 0.3e-9, c: 1e-6, count: 1 },
];
const frequencies = logSweep({ fromHz: 1e5, toHz: 1e8, perDecade: 10 });

function problem(extra: Partial<PlannerProblem> = {}): PlannerProblem {
  return {
    fixed: [{ kind: 'regulator', label: 'regulator', element: regulatorElement(regulator.r, regulator.l), count: 1 }],
    candidates: caps.map((b, i) => ({ label: `C${i}`, element: placementElement(series(resistor(b.r), inductor(b.l - 0.3e-9), capacitor(b.c)), 0.3e-9), weight: i + 1 })),
    targetOhm: 5e-3,
    frequencies,
    maxCount: 3,
    objective: 'count',
    ...extra,
  };
}

const expectY = (re: number, im: number, y: Complex) => {
  expect(Math.abs(re - y.re)).toBeLessThanOrEqual(1e-12 * y.abs());
  expect(Math.abs(im - y.im)).toBeLessThanOrEqual(1e-12 * y.abs());
};

describe('buildGrid', () => {
  it('holds the fixed admittance and each candidate’s at every sweep point, then at each cut', () => {
    const cuts = [3.3e6, 47e6];
    const grid = buildGrid(problem(), cuts);
    const points = [...frequencies, ...cuts];
    expect(grid.size).toBe(points.length);
    expect(grid.sorted).toBe(frequencies.length);
    points.forEach((f, k) => {
      expectY(grid.aRe[k], grid.aIm[k], branchAdmittance(regulator, f));
      caps.forEach((b, i) => {
        const y = branchAdmittance(b, f);
        expectY(grid.yRe[i][k], grid.yIm[i][k], y);
        // Point-major copy: index k·m + i.
        expect(grid.tRe[k * caps.length + i]).toBe(grid.yRe[i][k]);
        expect(grid.tIm[k * caps.length + i]).toBe(grid.yIm[i][k]);
      });
    });
  });
  it('a fixed branch of n placements adds n times its admittance', () => {
    const grid = buildGrid(problem({ fixed: [{ kind: 'capacitor', label: 'kept', element: series(resistor(0.02), inductor(1e-9), capacitor(2.2e-6)), count: 4 }] }), []);
    const kept: RefBranch = { r: 0.02, l: 1e-9, c: 2.2e-6, count: 4 };
    frequencies.forEach((f, k) => expectY(grid.aRe[k], grid.aIm[k], branchAdmittance(kept, f)));
  });
  it('with a scenario every sweep point stands twice, then every cut twice', () => {
    // The scenario: the capacitors at 80 % of their value, the regulator without inductance change.
    const low = caps.map((b) => ({ ...b, c: 0.8 * b.c }));
    const base = problem();
    const scenario = { fixed: base.fixed, elements: low.map((b) => placementElement(series(resistor(b.r), inductor(b.l - 0.3e-9), capacitor(b.c)), 0.3e-9)) };
    const cuts = [5e6];
    const grid = buildGrid({ ...base, scenarios: [scenario] }, cuts);
    const n = frequencies.length;
    expect(grid.size).toBe(2 * (n + 1));
    expect(grid.sorted).toBe(2 * n);
    const at = (k: number): [number, RefBranch[]] =>
      k < n ? [frequencies[k], caps] : k < 2 * n ? [frequencies[k - n], low] : k === 2 * n ? [cuts[0], caps] : [cuts[0], low];
    for (let k = 0; k < grid.size; k++) {
      const [f, set] = at(k);
      set.forEach((b, i) => expectY(grid.yRe[i][k], grid.yIm[i][k], branchAdmittance(b, f)));
      expectY(grid.aRe[k], grid.aIm[k], branchAdmittance(regulator, f));
    }
  });
});

describe('reachMultiplier: the least t ≥ 0 with |P + t·y| ≥ T', () => {
  const T = 200; // siemens: a 5 mΩ target
  /** Bisection on the defining inequality, from t = 0 (|P| < T) to a t where it holds. */
  function bisect(p: Complex, y: Complex): number {
    let lo = 0;
    let hi = 1;
    while (p.add(y.mul(hi)).abs() < T) hi *= 2;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (p.add(y.mul(mid)).abs() >= T) hi = mid;
      else lo = mid;
    }
    return hi;
  }
  const cases: [string, Complex, Complex][] = [
    ['y along P (Re(P̄y) > 0)', new Complex(50, 30), new Complex(20, 10)],
    ['y against P (Re(P̄y) < 0): the sum shrinks first, then grows', new Complex(120, -40), new Complex(-30, 5)],
    ['y at right angles to P', new Complex(0, 150), new Complex(40, 0)],
    ['P = 0', new Complex(0, 0), new Complex(3, -4)],
  ];
  for (const [name, p, y] of cases) {
    it(name, () => {
      const t = reachMultiplier(p.re, p.im, y.re, y.im, T * T);
      expect(Math.abs(t - bisect(p, y))).toBeLessThanOrEqual(1e-12 * t);
      expect(Math.abs(p.add(y.mul(t)).abs() - T)).toBeLessThanOrEqual(1e-12 * T);
    });
  }
});
