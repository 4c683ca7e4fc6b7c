// Rails at their corners: a rail of 10 distinct parts (each with a tolerance and an X7R or X5R code, so
// 2^10 = 1,024 corners) over 1,000 frequencies, against the 1 s goal on one core (CPU time, with the
// wall-clock time beside it), and as a ratio to one nominal evaluation of the same rail in the same run;
// then plan --suggest over the same parts, with and without --corners. Every part and rail here is generated and invented.

import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { cornerFigures } from '../src/analysis/plan-corners.js';
import { planTargetOhm, railBranches } from '../src/analysis/plan-figures.js';
import { suggestPlacements, type Suggestion } from '../src/analysis/plan-suggest.js';
import { evaluateRail } from '../src/analysis/rail.js';
import { selectCandidates } from '../src/model/plan-candidates.js';
import { logSweep } from '../src/circuit/sweep.js';
import { mulberry32 } from './generate.js';
import { measure, type BenchSection } from './measure.js';
import { capacitorYaml, load, writeRailLibrary } from './rail.bench.js';

const GOAL_S = 1;

export const cornersBench: BenchSection = {
  name: 'corners',
  run() {
    const placed = Array.from({ length: 10 }, (_, i) => `  - {part: BN-C-${String(i).padStart(3, '0')}, count: ${1 + (i % 4)}}\n`).join('');
    const root = writeRailLibrary(10, false, placed);
    // Every generated part with a tolerance and a class 2 code: ten moving values.
    const random = mulberry32(7);
    for (let i = 0; i < 10; i++) {
      const code = i % 2 === 0 ? 'X7R' : 'X5R';
      writeFileSync(join(root, 'parts', `bn-c-${i}.yaml`), `${capacitorYaml(i, random, false)}tolerance: ${i % 3 === 0 ? '20%' : '10%'}\ndielectric: ${code}\n`);
    }
    const library = load(root);
    rmSync(root, { recursive: true, force: true });
    const plan = library.plans[0];
    const frequencies = logSweep({ fromHz: 1e5, toHz: 1e8, perDecade: 1000 / 3 });
    const target = planTargetOhm(plan.voltageV, plan.target);
    const { branches } = railBranches(plan, plan.placements);
    const nominal = evaluateRail(branches, target, frequencies, { branchCurves: false });
    const operating = { fromC: -40, toC: 85 };
    let sink = 0;
    // Wall-clock time, and the process's CPU time per run (on a shared machine the CPU time says more about
    // the work; measure() runs once more than it times, its warm-up, which the CPU time leaves out).
    const timed = (fn: () => void, minRuns?: number, minSeconds?: number) => {
      fn();
      const start = process.cpuUsage();
      const wall = measure(fn, minRuns, minSeconds);
      const used = process.cpuUsage(start);
      return { ...wall, cpuPerRun: (used.user + used.system) / 1e6 / (wall.runs + 1) };
    };
    const single = timed(() => {
      sink += evaluateRail(branches, target, frequencies, { branchCurves: false }).peaks.length;
    });
    // Corner models are cached per part, as in a build: the warm-up run pays for compiling their kernels and
    // finding their natural frequencies, the measured runs for the grid, the sums and every peak search.
    const corners = timed(() => {
      sink += cornerFigures(plan, plan.placements, operating, target, frequencies, nominal).evaluated;
    }, 3, 2);
    const figures = cornerFigures(plan, plan.placements, operating, target, frequencies, nominal);
    // plan --suggest over the same ten parts as candidates (0..8 each), at nominal and for the worst corner,
    // against a target 5 % above the placed rail's worst |Z| (met at nominal by the placed set's like).
    const loose: typeof plan = { ...plan, target: { kind: 'explicit', ohms: nominal.worst.impedanceOhm * 1.05 } };
    const selection = selectCandidates(loose, library.parts, { only: [], derating: library.settings.derating });
    const suggest = (corners: boolean) => {
      let result: Suggestion | null = null;
      const t = timed(() => {
        result = suggestPlacements(loose, selection, { maxCount: 8, perDecade: library.settings.sweep.perDecade, corners: corners ? operating : undefined });
      }, 2, 0);
      const r = result as unknown as Suggestion;
      const set = r.figures ? `${r.figures.totalPlacements} placements` : 'no set';
      const n = r.cornerRounds;
      const rounds = n ? `, ${n.rounds} search${n.rounds === 1 ? '' : 'es'}, ${n.scenarios} corner${n.scenarios === 1 ? '' : 's'} added` : '';
      return { cpu: t.cpuPerRun, text: `${r.status}, ${set}${rounds}` };
    };
    const atNominal = suggest(false);
    const atCorners = suggest(true);
    if (sink < 0) console.log(sink);
    return [
      `corner evaluation: ${figures.evaluated} corners (${figures.method}) × ${frequencies.length} frequencies, ${figures.factors.length} moving values: CPU ${(corners.cpuPerRun * 1000).toFixed(0)} ms a rail, ${(corners.cpuPerRun / GOAL_S).toFixed(2)} of the 1 s goal (wall ${(corners.secondsPerRun * 1000).toFixed(0)} ms)`,
      `one nominal evaluation of the same rail: CPU ${(single.cpuPerRun * 1000).toFixed(2)} ms (wall ${(single.secondsPerRun * 1000).toFixed(2)} ms); the corners take ${(corners.cpuPerRun / single.cpuPerRun).toFixed(0)} × one nominal evaluation in CPU time (${(corners.cpuPerRun / single.cpuPerRun / figures.evaluated).toFixed(2)} × per corner)`,
      `plan --suggest over these ${selection.candidates.length} parts, 0..8 each: CPU ${(atNominal.cpu * 1000).toFixed(0)} ms at nominal (${atNominal.text}); --corners ${(atCorners.cpu * 1000).toFixed(0)} ms, ${(atCorners.cpu / atNominal.cpu).toFixed(1)} × nominal (${atCorners.text})`,
    ];
  },
};
