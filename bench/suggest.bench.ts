// `plan --suggest` over 200 generated candidate capacitors (goal: under 2 s): fewest placements, lowest
// cost, lowest cost with mountings from part files, a package table and plan entries, with a 3 dB margin,
// and a target no set meets (the closest-set search). Each line gives its CPU time as a ratio of the goal
// and of the plain lowest-cost search, measured in this run, and its wall-clock time. Every part and rail here is generated and invented.

import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { suggestPlacements, type SuggestOptions } from '../src/analysis/plan-suggest.js';
import { selectCandidates } from '../src/model/plan-candidates.js';
import { mulberry32 } from './generate.js';
import { measure, type BenchSection } from './measure.js';
import { load, writeRailLibrary } from './rail.bench.js';

const GOAL_S = 2;

interface Variant {
  what: string;
  withCost: boolean;
  /** Give parts and the plan mountings of their own. */
  mountings: boolean;
  marginDb: number;
  /** Ripple of the rail (2 % is met; 0.002 % is not). */
  ripple: string;
}

const VARIANTS: Variant[] = [
  { what: 'fewest placements', withCost: false, mountings: false, marginDb: 0, ripple: '2%' },
  { what: 'lowest cost', withCost: true, mountings: false, marginDb: 0, ripple: '2%' },
  { what: 'lowest cost, own mountings', withCost: true, mountings: true, marginDb: 0, ripple: '2%' },
  { what: 'same, --margin 3', withCost: true, mountings: true, marginDb: 3, ripple: '2%' },
  { what: 'target no set meets', withCost: true, mountings: true, marginDb: 0, ripple: '0.002%' },
];

/** Per-part mountings (a third of the parts), a package table and five plan entries with their own. */
export function addMountings(root: string, ripple: string): void {
  const random = mulberry32(4242);
  for (let i = 0; i < 200; i++) {
    if (random() >= 1 / 3) continue;
    const file = join(root, 'parts', `bn-c-${i}.yaml`);
    writeFileSync(file, `${readText(file)}mounting: ${(0.3 + 0.9 * random()).toFixed(2)}nH\n`);
  }
  const entries = [3, 40, 77, 120, 161].map((i) => `  - {part: BN-C-${String(i).padStart(3, '0')}, count: 1, mounting: ${(0.2 + 0.6 * random()).toFixed(2)}nH}`).join('\n');
  writeFileSync(
    join(root, 'plans', 'bench.yaml'),
    `rail: BENCH\nvoltage: 1.0V\nripple: ${ripple}\nstep: 1A\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\nmounting-by-package: {"0603": 0.35nH, "0805": 0.4nH, "1206": 0.55nH}\nregulator: {r: 1m, l: 20nH}\nplane: {c: 20nF, r: 2m}\ncapacitors:\n${entries}\n`,
  );
}

function readText(file: string): string {
  return readFileSync(file, 'utf8');
}

export const suggestBench: BenchSection = {
  name: 'suggest',
  run() {
    const lines = [`plan --suggest over 200 generated candidate capacitors, 0..16 each, band 100 kHz–100 MHz (goal < ${GOAL_S} s):`];
    let baseline: number | null = null;
    for (const v of VARIANTS) {
      const root = writeRailLibrary(200, v.withCost, '');
      if (v.mountings) addMountings(root, v.ripple);
      else if (v.ripple !== '2%') throw new Error('a changed ripple needs the rewritten plan');
      const library = load(root);
      const plan = library.plans[0];
      const options: SuggestOptions = { maxCount: 16, marginDb: v.marginDb, perDecade: library.settings.sweep.perDecade };
      const selection = selectCandidates(plan, library.parts, { only: [], derating: library.settings.derating });
      // One warm-up run, then two timed: wall-clock time and the process's CPU time (on a shared machine the
      // CPU time says more about the work; both are printed).
      let result = suggestPlacements(plan, selection, options);
      const cpuStart = process.cpuUsage();
      const timing = measure(() => {
        result = suggestPlacements(plan, selection, options);
      }, 2, 0);
      const cpuUsed = process.cpuUsage(cpuStart);
      const seconds = timing.secondsPerRun;
      // measure() runs once more than it times (its own warm-up).
      const cpuSeconds = (cpuUsed.user + cpuUsed.system) / 1e6 / (timing.runs + 1);
      if (v.what === 'lowest cost') baseline = cpuSeconds;
      const shown = result.figures ?? result.closest?.figures ?? null;
      const set = shown ? `${shown.totalPlacements} placements${shown.totalCost !== null ? `, cost ${shown.totalCost.toFixed(3)}` : ''}, margin ${shown.worstMarginDb.toFixed(2)} dB${result.figures ? '' : ' (closest set)'}` : 'no set';
      const mounted = new Set(result.candidates.map((c) => c.mountingFrom));
      const vsBaseline = baseline !== null && v.what !== 'lowest cost' ? `, ${(cpuSeconds / baseline).toFixed(2)}× lowest cost` : '';
      lines.push(
        `  ${v.what.padEnd(27)} ${String(result.candidates.length).padStart(3)} candidates  CPU ${`${(cpuSeconds * 1000).toFixed(0)} ms`.padStart(8)} (${(cpuSeconds / GOAL_S).toFixed(2)} of the goal${vsBaseline}), wall ${(seconds * 1000).toFixed(0)} ms  ${result.status}, ${result.nodes} nodes, ${set}; mountings from ${[...mounted].sort().join(', ')}`,
      );
      rmSync(root, { recursive: true, force: true });
    }
    return lines;
  },
};
