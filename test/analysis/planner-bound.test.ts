import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { logSweep } from '../../src/circuit/sweep.js';
import type { Grid } from '../../src/analysis/planner-grid.js';
import { boundNode, MAX_SAMPLES, sortByKey, violatedSamples } from '../../src/analysis/planner-bound.js';
import { branchAdmittance, type RefBranch } from './rail-reference.js';

// One node of the planner's branch and bound, checked by enumeration. The grid is built here from admittances
// computed with complex.js (rail-reference.ts: Z_R = R, Z_L = jωL, Z_C = 1/(jωC), series impedances adding),
// not by zfolio's grid. For every partial set of counts, candidate mask and budget, every completion is tried:
//  - soundness: boundNode may answer "prune" (−1) only when no completion within the budget, of the allowed
//    candidates, holds |Y| ≥ 1/Z_t at the node's sampled points (a pruned node that had one would make the
//    planner call a meetable rail unmeetable, or miss the best set);
//  - branching: every such completion adds at least one candidate the node counts as helpful at the sample
//    it branches on (unit·τ within the budget), so the branches, which each add a helpful candidate, reach it.
// Values invented (a regulator, three ceramic capacitors with their mounting inductance).

const regulator: RefBranch = { r: 3e-3, l: 15e-9, c: 0, count: 1 };
const caps: RefBranch[] = [
  { r: 4e-3, l: 0.6e-9, c: 22e-6, count: 1 },
  { r: 9e-3, l: 0.5e-9, c: 2.2e-6, count: 1 },
  { r: 25e-3, l: 0.4e-9, c: 220e-9, count: 1 },
];
const frequencies = [...logSweep({ fromHz: 1e5, toHz: 1e7, perDecade: 12 })];
const cuts = [4.7e5, 6.1e6];
const points = [...frequencies, ...cuts];
const m = caps.length;

interface C {
  re: number;
  im: number;
}
const yFixed: C[] = points.map((f) => branchAdmittance(regulator, f));
const yCap: C[][] = caps.map((b) => points.map((f) => branchAdmittance(b, f)));

function testGrid(): Grid {
  const size = points.length;
  const grid: Grid = {
    size,
    aRe: Float64Array.from(yFixed, (y) => y.re),
    aIm: Float64Array.from(yFixed, (y) => y.im),
    yRe: yCap.map((row) => Float64Array.from(row, (y) => y.re)),
    yIm: yCap.map((row) => Float64Array.from(row, (y) => y.im)),
    tRe: new Float64Array(size * m),
    tIm: new Float64Array(size * m),
    sorted: frequencies.length,
  };
  for (let k = 0; k < size; k++) {
    for (let i = 0; i < m; i++) {
      grid.tRe[k * m + i] = yCap[i][k].re;
      grid.tIm[k * m + i] = yCap[i][k].im;
    }
  }
  return grid;
}

/** The admittance at every point with `counts` placed: complex.js sums. */
function placed(counts: readonly number[]): Complex[] {
  return points.map((_, k) => {
    let y = new Complex(yFixed[k].re, yFixed[k].im);
    counts.forEach((n, i) => {
      if (n > 0) y = y.add(new Complex(yCap[i][k].re, yCap[i][k].im).mul(n));
    });
    return y;
  });
}

/** Every count vector with entries 0..max. */
function vectors(max: number): number[][] {
  const out: number[][] = [];
  const walk = (prefix: number[]) => {
    if (prefix.length === m) out.push(prefix);
    else for (let n = 0; n <= max; n++) walk([...prefix, n]);
  };
  walk([]);
  return out;
}

describe('violatedSamples', () => {
  const grid = testGrid();
  const P = placed([0, 1, 0]);
  const Pr = Float64Array.from(P, (y) => y.re);
  const Pi = Float64Array.from(P, (y) => y.im);
  for (const targetOhm of [2e-3, 6e-3, 20e-3]) {
    it(`at a ${targetOhm * 1e3} mΩ target: only violated points, the worst of each violated run, every violated cut`, () => {
      const t2 = (1 / targetOhm) ** 2;
      const samples = new Int32Array(MAX_SAMPLES * 2 + cuts.length + 2);
      const stride = Math.max(1, Math.ceil(grid.sorted / MAX_SAMPLES));
      const s = violatedSamples(grid, Pr, Pi, t2, stride, samples);
      const chosen = new Set(samples.subarray(0, s));
      const violated = (k: number) => P[k].abs() < 1 / targetOhm;
      for (const k of chosen) expect(violated(k)).toBe(true);
      // Runs of violated sweep points, each one's worst (least |Y|), found here by a scan of its own.
      let runs = 0;
      for (let k = 0; k < grid.sorted; k++) {
        if (!violated(k) || (k > 0 && violated(k - 1))) continue;
        let worst = k;
        let j = k;
        for (; j < grid.sorted && violated(j); j++) if (P[j].abs() < P[worst].abs()) worst = j;
        expect(chosen.has(worst)).toBe(true);
        runs++;
      }
      for (let k = grid.sorted; k < grid.size; k++) expect(chosen.has(k)).toBe(violated(k));
      expect(s).toBe(chosen.size);
      // The case is not empty: there is something to sample.
      expect(runs).toBeGreaterThan(0);
    });
  }
});

describe('boundNode by enumeration of every completion', () => {
  const grid = testGrid();
  const budgetsByCount = [0, 1, 2, 3, 4, 6];
  const weights = [1, 0.45, 0.2];
  const budgetsByWeight = [0.5, 1, 2, 3, 4.5];
  const completions = vectors(6);

  for (const targetOhm of [15e-3, 25e-3, 40e-3]) {
    for (const weighted of [false, true]) {
      it(`${weighted ? 'budget in weight' : 'budget in placements'}, ${targetOhm * 1e3} mΩ target`, () => {
        const yt = 1 / targetOhm;
        const t2 = yt * yt;
        const unit = (i: number) => (weighted ? weights[i] : 1);
        const cost = (c: readonly number[]) => c.reduce((sum, n, i) => sum + n * unit(i), 0);
        const stride = Math.max(1, Math.ceil(grid.sorted / MAX_SAMPLES));
        const maxSamples = MAX_SAMPLES * 2 + cuts.length + 2;
        const samples = new Int32Array(maxSamples);
        const tally = { pruned: 0, kept: 0, keptFeasible: 0 };
        for (const start of vectors(2)) {
          const P = placed(start);
          const Pr = Float64Array.from(P, (y) => y.re);
          const Pi = Float64Array.from(P, (y) => y.im);
          const s = violatedSamples(grid, Pr, Pi, t2, stride, samples);
          if (s === 0) continue;
          const at = [...samples.subarray(0, s)];
          // Which completions hold the target at the node's samples (complex.js sums, from P).
          const holds = completions.map((c) =>
            at.every((k) => {
              let y = P[k];
              c.forEach((n, i) => {
                if (n > 0) y = y.add(new Complex(yCap[i][k].re, yCap[i][k].im).mul(n));
              });
              return y.abs() >= yt;
            }),
          );
          for (let mask = 0; mask < 1 << m; mask++) {
            const allowed = Uint8Array.from({ length: m }, (_, i) => (mask >> i) & 1);
            for (const lim of weighted ? budgetsByWeight : budgetsByCount) {
              const tBuf = new Float64Array(maxSamples * m);
              const node = {
                grid,
                Pr,
                Pi,
                samples,
                count: s,
                weights,
                weighted,
                allowed,
                lim,
                t2,
                tBuf,
                need: new Float64Array(maxSamples),
                load: new Float64Array(m),
              };
              const branchAt = boundNode(node);
              const reachable = completions.filter(
                (c, n) => holds[n] && cost(c) <= lim + 1e-9 && c.every((count, i) => count === 0 || allowed[i] === 1),
              );
              if (branchAt < 0) {
                tally.pruned++;
                expect(reachable, `pruned with ${start} placed, mask ${mask}, budget ${lim}`).toEqual([]);
                continue;
              }
              tally.kept++;
              expect(branchAt).toBeGreaterThanOrEqual(0);
              expect(branchAt).toBeLessThan(s);
              if (reachable.length > 0) tally.keptFeasible++;
              for (const c of reachable) {
                const helpful = c.some((count, i) => count > 0 && unit(i) * tBuf[branchAt * m + i] <= lim + 1e-9);
                expect(helpful, `completion ${c} from ${start} adds no helpful candidate`).toBe(true);
              }
            }
          }
        }
        // Both answers occur, so neither check above holds by default; and the bound has teeth: of the nodes
        // with no completion in reach, at most one in ten is kept (a bound that never prunes is sound but
        // leaves the planner to exhaust its node budget).
        expect(tally.pruned).toBeGreaterThan(100);
        expect(tally.keptFeasible).toBeGreaterThan(20);
        const keptHopeless = tally.kept - tally.keptFeasible;
        expect(keptHopeless).toBeLessThanOrEqual(0.1 * (tally.pruned + keptHopeless));
      });
    }
  }
});

describe('sortByKey', () => {
  it('sorts by key, ties by item, keeping the pairs together', () => {
    const items = [4, 1, 3, 0, 2, 5];
    const keys = [2.5, 1, 2.5, 7, 1, 0];
    sortByKey(items, keys);
    expect(items).toEqual([5, 1, 2, 3, 4, 0]);
    expect(keys).toEqual([0, 1, 1, 2.5, 2.5, 7]);
  });
});
