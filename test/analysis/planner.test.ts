import { describe, expect, it } from 'vitest';
import { capacitor, inductor, resistor, series, type Element } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { planDecoupling, type PlannerCandidate, type PlannerProblem } from '../../src/analysis/planner.js';
import { mulberry32 } from '../../bench/generate.js';
import { evaluateRail, placementElement, regulatorElement, planeElement, type RailBranch } from '../../src/analysis/rail.js';

// The planner is checked against the most direct reference there is: exhaustive enumeration of every
// count vector (0..N for each candidate), each judged by the same full rail evaluation. Cases are random
// but seeded (mulberry32, a public-domain 32-bit generator), so every run checks the same cases.

const logUniform = (r: () => number, lo: number, hi: number) => 10 ** (lo + (hi - lo) * r());

function branchesFor(problem: PlannerProblem, counts: readonly number[]): RailBranch[] {
  const out: RailBranch[] = [...problem.fixed];
  counts.forEach((n, i) => {
    if (n > 0) out.push({ kind: 'capacitor', label: problem.candidates[i].label, element: problem.candidates[i].element, count: n });
  });
  return out;
}

/** Every count vector in [0..N]^m, the best passing one by the problem's objective (ties: first found). */
function exhaustive(problem: PlannerProblem): { objective: number; counts: number[] } | null {
  const m = problem.candidates.length;
  const counts = new Array<number>(m).fill(0);
  let best: { objective: number; counts: number[] } | null = null;
  const total = (problem.maxCount + 1) ** m;
  for (let code = 0; code < total; code++) {
    let c = code;
    for (let i = 0; i < m; i++) {
      counts[i] = c % (problem.maxCount + 1);
      c = Math.floor(c / (problem.maxCount + 1));
    }
    const objective = counts.reduce((sum, n, i) => sum + n * (problem.objective === 'cost' ? problem.candidates[i].weight : 1), 0);
    if (best && objective >= best.objective) continue;
    if (evaluateRail(branchesFor(problem, counts), problem.targetOhm, problem.frequencies, { branchCurves: false }).pass) {
      best = { objective, counts: [...counts] };
    }
  }
  return best;
}

function randomCase(seed: number): PlannerProblem {
  const r = mulberry32(seed);
  const m = 2 + Math.floor(r() * 3); // 2..4 candidates
  const maxCount = 2 + Math.floor(r() * 2); // 0..2 or 0..3 each
  const candidates: PlannerCandidate[] = [];
  for (let i = 0; i < m; i++) {
    const model: Element = series(resistor(logUniform(r, -3, -1.3)), inductor(logUniform(r, -10.3, -9)), capacitor(logUniform(r, -8.5, -4.5)));
    candidates.push({ label: `C${i}`, element: placementElement(model, logUniform(r, -10.5, -9.5)), weight: Math.round(logUniform(r, -2, 0) * 1000) / 1000 });
  }
  const fixed: RailBranch[] = [{ kind: 'regulator', label: 'regulator', element: regulatorElement(logUniform(r, -3, -2), logUniform(r, -8.5, -7.5)), count: 1 }];
  if (r() < 0.5) fixed.push({ kind: 'plane', label: 'plane', element: planeElement(logUniform(r, -9, -7.5), 1e-3), count: 1 });
  const frequencies = logSweep({ fromHz: logUniform(r, 4.5, 5.5), toHz: logUniform(r, 7.7, 8.5), perDecade: 40 });
  // A target near what a random set achieves, so optima are neither empty nor everything (some cases unmeetable).
  const probe = candidates.map(() => Math.floor(r() * (maxCount + 1)));
  const base: PlannerProblem = { fixed, candidates, targetOhm: 1, frequencies, maxCount, objective: r() < 0.5 ? 'count' : 'cost' };
  const worst = evaluateRail(branchesFor(base, probe), 1, frequencies, { branchCurves: false }).worst.impedanceOhm;
  return { ...base, targetOhm: worst * (0.85 + 0.6 * r()) };
}

describe('planner against exhaustive search', () => {
  const seeds = Array.from({ length: 30 }, (_, i) => 1000 + i);
  let meetable = 0;
  let unmeetable = 0;
  let nontrivial = 0;
  let moreIsWorse = 0;
  it.each(seeds)('seed %i: same optimum as enumerating every count vector', (seed) => {
    const problem = randomCase(seed);
    const reference = exhaustive(problem);
    const result = planDecoupling(problem);
    if (reference === null) {
      unmeetable++;
      expect(result.status).toBe('unmeetable');
      expect(result.counts).toBeNull();
      return;
    }
    meetable++;
    if (reference.objective > 0) nontrivial++;
    const everything = problem.candidates.map(() => problem.maxCount);
    if (!evaluateRail(branchesFor(problem, everything), problem.targetOhm, problem.frequencies, { branchCurves: false }).pass) moreIsWorse++;
    expect(result.status).toBe('optimal');
    // Costs are sums of three-decimal numbers: equal to rounding.
    expect(Math.abs(result.objective! - reference.objective)).toBeLessThanOrEqual(1e-9 * Math.max(1, reference.objective));
    // The chosen set itself passes the full evaluation, and its objective is what the planner says.
    const again = evaluateRail(branchesFor(problem, result.counts!), problem.targetOhm, problem.frequencies, { branchCurves: false });
    expect(again.pass).toBe(true);
    expect(result.counts!.every((n) => n >= 0 && n <= problem.maxCount)).toBe(true);
  });
  it('the random cases cover meetable, unmeetable and non-trivial rails', () => {
    expect(meetable + unmeetable).toBe(seeds.length);
    expect(meetable).toBeGreaterThanOrEqual(20);
    expect(nontrivial).toBeGreaterThanOrEqual(15);
    expect(unmeetable).toBeGreaterThanOrEqual(1);
    // Rails that pass with some set but fail with every candidate at its maximum: adding capacitors can
    // raise |Z| at an anti-resonance, and the planner must not assume otherwise.
    expect(moreIsWorse).toBeGreaterThanOrEqual(1);
  });
});

describe('planner edge cases', () => {
  const frequencies = logSweep({ fromHz: 1e5, toHz: 1e8, perDecade: 50 });
  const regulator: RailBranch = { kind: 'regulator', label: 'regulator', element: regulatorElement(2e-3, 10e-9), count: 1 };
  const cap = (c: number, esr: number, label: string): PlannerCandidate => ({ label, element: placementElement(series(resistor(esr), inductor(0.4e-9), capacitor(c)), 0.3e-9), weight: 1 });

  it('a target below what any set can reach is reported unmeetable, with no set', () => {
    // At 100 kHz the best the parts can do is ESR/N in parallel with the regulator: 10 mΩ/3 ‖ … ≫ 0.1 mΩ.
    const result = planDecoupling({ fixed: [regulator], candidates: [cap(10e-6, 0.01, 'A'), cap(100e-9, 0.02, 'B')], targetOhm: 1e-4, frequencies, maxCount: 3, objective: 'count' });
    expect(result.status).toBe('unmeetable');
    expect(result.counts).toBeNull();
    expect(result.evaluation).toBeNull();
  });

  it('a rail that already meets its target needs nothing', () => {
    const result = planDecoupling({ fixed: [{ kind: 'regulator', label: 'r', element: resistor(1e-3), count: 1 }], candidates: [cap(1e-6, 0.01, 'A')], targetOhm: 2e-3, frequencies, maxCount: 3, objective: 'count' });
    expect(result.status).toBe('optimal');
    expect(result.counts).toEqual([0]);
    expect(result.evaluation!.pass).toBe(true);
  });

  it('out of search budget, it says so; whatever set it returns still passes', () => {
    const problem = randomCase(1001);
    const result = planDecoupling({ ...problem, nodeLimit: 1 });
    expect(result.status).toBe('unproven');
    if (result.counts) expect(evaluateRail(branchesFor(problem, result.counts), problem.targetOhm, problem.frequencies, { branchCurves: false }).pass).toBe(true);
  });

  it('is deterministic', () => {
    const problem = randomCase(1007);
    expect(planDecoupling(problem).counts).toEqual(planDecoupling(problem).counts);
  });
});
