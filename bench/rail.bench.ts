// Rail plans: evaluating a 50-placement plan over 1,000 frequencies (`plan --suggest` is in
// suggest.bench.ts). Every part and rail here is generated and invented.

import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analysePlan, railBranches, planTargetOhm } from '../src/analysis/plan-figures.js';
import { evaluateRail, railSlopeAt, railZeros } from '../src/analysis/rail.js';
import { impedancePeaks } from '../src/analysis/peaks.js';
import { sweepRange } from '../src/analysis/feature-grid.js';
import { impedanceSweepInto } from '../src/circuit/impedance.js';
import { mergedTree } from '../src/circuit/state-space.js';
import { logSweep } from '../src/circuit/sweep.js';
import { loadLibrary, type Library } from '../src/model/library.js';
import { mulberry32 } from './generate.js';
import { measure, type BenchSection } from './measure.js';

const E6 = [1, 1.5, 2.2, 3.3, 4.7, 6.8];
// Package → typical ESL (common practice: larger packages, longer current loops).
const PACKAGES: [string, number][] = [
  ['0201', 0.2e-9],
  ['0402', 0.3e-9],
  ['0603', 0.45e-9],
  ['0805', 0.6e-9],
  ['1206', 0.9e-9],
];

/** An invented capacitor: value 1 nF–68 µF, package ESL, ESR falling with size, a rating, maybe a DC-bias table. */
export function capacitorYaml(i: number, random: () => number, withCost: boolean): string {
  const c = E6[Math.floor(random() * 6)] * 10 ** (-9 + Math.floor(random() * 5));
  const [pkg, esl] = PACKAGES[Math.floor(random() * PACKAGES.length)];
  const esr = 0.003 + 0.03 * random() * (1e-7 / c) ** 0.25;
  const rating = [4, 6.3, 10, 16, 25, 50][Math.floor(random() * 6)];
  const bias = c >= 1e-6 && random() < 0.7 ? `dc-bias: {0V: 100%, 1V: ${Math.round(85 + 10 * random())}%, 3.3V: ${Math.round(45 + 20 * random())}%}\n` : '';
  const cost = withCost ? `cost: ${(0.005 + 0.2 * random()).toFixed(3)}\n` : '';
  return `id: BN-C-${String(i).padStart(3, '0')}\nkind: capacitor\ntitle: Generated ${pkg} capacitor ${i}\nnominal: ${c.toPrecision(2)}\nvoltage: ${rating}V\npackage: "${pkg}"\nparasitics: {esr: ${esr.toPrecision(3)}, esl: ${(esl * (0.85 + 0.3 * random())).toPrecision(3)}}\n${bias}${cost}tags: [decoupling]\n`;
}

/** A library of `count` generated capacitors and one invented rail plan with `placed` placements listed. */
export function writeRailLibrary(count: number, withCost: boolean, placed: string): string {
  const root = mkdtempSync(join(tmpdir(), 'zfolio-rail-'));
  const random = mulberry32(20240 + count);
  mkdirSync(join(root, 'parts'));
  mkdirSync(join(root, 'plans'));
  for (let i = 0; i < count; i++) writeFileSync(join(root, 'parts', `bn-c-${i}.yaml`), capacitorYaml(i, random, withCost));
  writeFileSync(join(root, 'folio.yaml'), 'title: Generated rail benchmark library (invented parts)\nsweep: {from: 1k, to: 1G, per-decade: 100}\n');
  writeFileSync(
    join(root, 'plans', 'bench.yaml'),
    `rail: BENCH\nvoltage: 1.0V\nripple: 2%\nstep: 1A\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\nregulator: {r: 1m, l: 20nH}\nplane: {c: 20nF, r: 2m}\ncapacitors:${placed ? `\n${placed}` : ' []\n'}`,
  );
  return root;
}

export function load(root: string): Library {
  const { library, diagnostics } = loadLibrary(root);
  if (!library) throw new Error(`generated library failed to load: ${diagnostics[0]?.message}`);
  return library;
}

const ms = (seconds: number) => `${(seconds * 1000).toFixed(seconds < 0.01 ? 2 : 0)} ms`;

export const railBench: BenchSection = {
  name: 'rail',
  run() {
    const lines: string[] = [];

    // 1. A plan of 50 distinct placements (plus regulator and plane) over 1,000 frequencies.
    const fifty = Array.from({ length: 50 }, (_, i) => `  - {part: BN-C-${String(i).padStart(3, '0')}, count: 1}\n`).join('');
    const evalRoot = writeRailLibrary(60, false, fifty);
    const evalLibrary = load(evalRoot);
    const plan = evalLibrary.plans[0];
    const frequencies = logSweep({ fromHz: 1e4, toHz: 1e9, perDecade: 1000 / 5 });
    const { branches } = railBranches(plan, plan.placements);
    const target = planTargetOhm(plan.voltageV, plan.target);
    let sink = 0;
    // The first evaluation compiles a sweep kernel and a slope kernel per branch; later ones reuse them.
    const coldStart = process.hrtime.bigint();
    sink += evaluateRail(branches, target, frequencies).peaks.length;
    const cold = Number(process.hrtime.bigint() - coldStart) / 1e9;
    for (let i = 0; i < 50; i++) sink += evaluateRail(branches, target, frequencies).peaks.length; // JIT warm-up
    const curve = measure(() => {
      sink += evaluateRail(branches, target, frequencies, { branchCurves: false }).worst.marginDb;
    });
    const withCurves = measure(() => {
      sink += evaluateRail(branches, target, frequencies).peaks.length;
    });
    const planPoints = analysePlan(plan, 200).frequenciesHz.length;
    const figures = measure(() => {
      sink += analysePlan(plan, 200).peaks.length;
    });
    const peaks = evaluateRail(branches, target, frequencies).peaks.length;
    const ratio = (seconds: number) => `${(seconds / 0.01).toFixed(2)} of the goal`;
    lines.push(`evaluate a plan of ${plan.placements.length} placements + regulator + plane over ${frequencies.length} frequencies, ${peaks} peaks refined (goal < 10 ms):`);
    lines.push(`  |Z|, peaks, worst margin                 ${ms(curve.secondsPerRun).padStart(8)}  (${ratio(curve.secondsPerRun)})`);
    lines.push(`  + each branch's |Z| curve                ${ms(withCurves.secondsPerRun).padStart(8)}  (${ratio(withCurves.secondsPerRun)})`);
    lines.push(`  first call, compiling ${2 * branches.length} kernels        ${ms(cold).padStart(8)}  (${ratio(cold)})`);
    lines.push(`  analysePlan, all page data, ${planPoints} points ${ms(figures.secondsPerRun).padStart(8)}  (${ratio(figures.secondsPerRun)})`);
    // The same search on the band's sweep alone (no ladders around the rail's zeros): what the feature
    // ladders cost, and the eigenvalue work of finding the zeros, branch by branch, on fresh trees.
    const plain = measure(() => {
      const n = frequencies.length;
      const g = new Float64Array(n);
      const b = new Float64Array(n);
      const re = new Float64Array(n);
      const im = new Float64Array(n);
      for (const branch of branches) {
        impedanceSweepInto(branch.element, frequencies, re, im);
        for (let i = 0; i < n; i++) {
          const d = re[i] * re[i] + im[i] * im[i];
          g[i] += (branch.count * re[i]) / d;
          b[i] -= (branch.count * im[i]) / d;
        }
      }
      const magnitude = Float64Array.from(g, (gi, i) => 1 / Math.hypot(gi, b[i]));
      sink += impedancePeaks(frequencies, magnitude, (f) => railSlopeAt(branches, f)).length;
    });
    const zeros = measure(() => {
      sink += railZeros(branches.map((branch) => ({ ...branch, element: mergedTree(branch.element) })), sweepRange(frequencies)).length;
    }, 5);
    lines.push(`  sweep points only, no ladders (the search before the feature ladders) ${ms(plain.secondsPerRun)}: the full search costs ${(curve.secondsPerRun / plain.secondsPerRun).toFixed(2)}×`);
    lines.push(`  finding the rail's zeros on fresh trees (eigenvalues, ${branches.length} branches) ${ms(zeros.secondsPerRun)} = ${(zeros.secondsPerRun / curve.secondsPerRun).toFixed(2)}× one cached evaluation`);
    rmSync(evalRoot, { recursive: true, force: true });

    if (sink === 42) lines.push('');
    return lines;
  },
};
