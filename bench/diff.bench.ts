// `zfolio diff` of two revisions of a 1,000-part library in which 10 part files changed (and a rail that
// places two of them): the whole comparison (both revisions read from git and loaded with every check, the
// changed parts and the rail analysed) against loading one revision from disk, and against analysing every
// part of one revision, which the diff avoids.

import { execFileSync } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { analysePart } from '../src/analysis/part-figures.js';
import { loadLibrary } from '../src/model/library.js';
import { loadLibraryAt } from '../src/history/revision-library.js';
import { diffLibraries } from '../src/history/library-diff.js';
import { writeGeneratedLibrary } from './generate.js';
import type { BenchSection } from './measure.js';

const PARTS = 1000;
const CHANGED = 10;
const LIMIT_S = 3;

function git(root: string, ...args: string[]): void {
  execFileSync('git', ['-c', 'user.name=Bench', '-c', 'user.email=bench@example.invalid', '-c', 'init.defaultBranch=main', ...args], {
    cwd: root,
    stdio: 'ignore',
    env: { ...process.env, GIT_CONFIG_NOSYSTEM: '1' },
  });
}

/** The generated library in a git repository: revision one, then ten capacitors' ESL raised by half. */
function twoRevisions(): string {
  const root = writeGeneratedLibrary(PARTS);
  mkdirSync(join(root, 'plans'));
  // Generated capacitors are the parts whose index is a multiple of 5; the rail places the first two.
  writeFileSync(
    join(root, 'plans', 'rail.yaml'),
    'rail: VDD_BENCH\nvoltage: 1V\ntarget: 20m\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\ncapacitors:\n  - {part: GEN-00000, count: 4}\n  - {part: GEN-00005, count: 8}\n',
  );
  git(root, 'init', '-q');
  git(root, 'add', '-A');
  git(root, 'commit', '-q', '-m', 'one');
  for (let k = 0; k < CHANGED; k++) {
    const i = k * 5 * Math.floor(PARTS / 5 / CHANGED);
    const file = join(root, 'parts', `group-${Math.floor(i / 100)}`, `gen-${i}.yaml`);
    const text = readFileSync(file, 'utf8');
    const changed = text.replace(/esl: ([0-9.]+)e(-?\d+)/, (_, m: string, e: string) => `esl: ${(Number(m) * 1.5).toFixed(2)}e${e}`);
    if (changed === text) throw new Error(`part ${i} has no ESL to change`);
    writeFileSync(file, changed);
  }
  git(root, 'commit', '-q', '-a', '-m', 'two');
  return root;
}

/**
 * CPU seconds of this process and of the children it has waited for (the git programs), from
 * /proc/self/stat (utime, stime, cutime, cstime in clock ticks; Linux). On a shared machine the CPU time
 * says more about the work than the wall time; both are printed.
 */
function cpuSeconds(): number {
  const fields = readFileSync('/proc/self/stat', 'utf8').replace(/^.*\) /, '').split(' ');
  // After the command name: state is field 3, utime 14 … cstime 17 (1-based, proc(5)).
  const ticks = [11, 12, 13, 14].reduce((sum, i) => sum + Number(fields[i]), 0);
  return ticks / CLOCK_TICKS;
}
/** sysconf(_SC_CLK_TCK): 100 on Linux on every common architecture. */
const CLOCK_TICKS = 100;

/** Wall and CPU seconds a run (the mean of `runs`, after one warm-up). */
function timed(fn: () => void, runs: number): { wall: number; cpu: number } {
  fn();
  const wall = performance.now();
  const cpu = cpuSeconds();
  for (let i = 0; i < runs; i++) fn();
  return { wall: (performance.now() - wall) / 1000 / runs, cpu: (cpuSeconds() - cpu) / runs };
}

export const diffBench: BenchSection = {
  name: 'diff',
  run() {
    const root = twoRevisions();
    try {
      let changed = 0;
      const diffOf = (from: string, to?: string) => () => {
        const before = loadLibraryAt(root, from);
        const after = to === undefined ? loadLibrary(root) : loadLibraryAt(root, to);
        changed = diffLibraries(before.library!, after.library!).diff.parts.changed.length;
      };
      const twoRevisions = timed(diffOf('HEAD~1', 'HEAD'), 3);
      if (changed !== CHANGED) throw new Error(`expected ${CHANGED} changed parts, the diff found ${changed}`);
      const withWorkTree = timed(diffOf('HEAD~1'), 3);
      if (changed !== CHANGED) throw new Error(`expected ${CHANGED} changed parts, the diff found ${changed}`);
      const load = timed(() => void loadLibrary(root), 5);
      const checkout = timed(() => void loadLibraryAt(root, 'HEAD'), 3);
      const library = loadLibrary(root).library!;
      const analyseAll = timed(() => {
        for (const p of library.parts) analysePart(p, library.settings.sweep, library.settings.within);
      }, 1);
      const line = (what: string, t: { wall: number; cpu: number }) =>
        `${what}: ${t.wall.toFixed(2)} s wall (${(t.wall / LIMIT_S).toFixed(2)} of the ${LIMIT_S} s goal), ${t.cpu.toFixed(2)} s CPU with git's (${(t.cpu / LIMIT_S).toFixed(2)} of the goal); ` +
        `= ${(t.wall / load.wall).toFixed(2)} × loading one revision from disk in wall time, ${(t.cpu / load.cpu).toFixed(2)} × in CPU time`;
      return [
        `${PARTS} parts, ${CHANGED} part files changed, one rail`,
        line('  diff HEAD~1 HEAD (both revisions read from git)', twoRevisions),
        line('  diff HEAD~1 (the work tree against one revision)', withWorkTree),
        `  reading one revision from git and loading it = ${(checkout.wall / load.wall).toFixed(2)} × loading it from disk (wall), ${(checkout.cpu / load.cpu).toFixed(2)} × (CPU)`,
        `  analysing every part of one revision (what the diff skips) = ${(analyseAll.cpu / twoRevisions.cpu).toFixed(2)} × the CPU time of diff HEAD~1 HEAD`,
      ];
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  },
};
