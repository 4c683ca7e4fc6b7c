// Rails at their corners: a rail of 10 distinct parts (each with a tolerance and an X7R or X5R code, so
// 2^10 = 1,024 corners) over 1,000 frequencies, against the 1 s goal on one core, and as a ratio to one
// nominal evaluation of the same rail in the same run. Every part and rail here is generated and invented.

import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { cornerFigures } from '../src/analysis/plan-corners.js';
import { planTargetOhm, railBranches } from '../src/analysis/plan-figures.js';
import { evaluateRail } from '../src/analysis/rail.js';
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
    const single = measure(() => {
      sink += evaluateRail(branches, target, frequencies, { branchCurves: false }).peaks.length;
    });
    // Corner models are cached per part, as in a build: the warm-up run pays for compiling their kernels and
    // finding their natural frequencies, the measured runs for the grid, the sums and every peak search.
    const corners = measure(() => {
      sink += cornerFigures(plan, plan.placements, operating, target, frequencies, nominal).evaluated;
    }, 3, 2);
    const figures = cornerFigures(plan, plan.placements, operating, target, frequencies, nominal);
    if (sink < 0) console.log(sink);
    return [
      `corner evaluation: ${figures.evaluated} corners (${figures.method}) × ${frequencies.length} frequencies, ${figures.factors.length} moving values: ${(corners.secondsPerRun * 1000).toFixed(0)} ms a rail, ${(corners.secondsPerRun / GOAL_S).toFixed(2)} of the 1 s goal`,
      `one nominal evaluation of the same rail: ${(single.secondsPerRun * 1000).toFixed(2)} ms; the corners take ${(corners.secondsPerRun / single.secondsPerRun).toFixed(0)} × one nominal evaluation (${((corners.secondsPerRun / single.secondsPerRun) / figures.evaluated).toFixed(2)} × per corner)`,
    ];
  },
};
