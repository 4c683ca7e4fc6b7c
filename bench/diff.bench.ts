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
import { measure, type BenchSection } from './measure.js';

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

export const diffBench: BenchSection = {
  name: 'diff',
  run() {
    const root = twoRevisions();
    try {
      let changed = 0;
      const diffRun = measure(
        () => {
          const before = loadLibraryAt(root, 'HEAD~1');
          const after = loadLibraryAt(root, 'HEAD');
          changed = diffLibraries(before.library!, after.library!).diff.parts.changed.length;
        },
        3,
        1,
      );
      if (changed !== CHANGED) throw new Error(`expected ${CHANGED} changed parts, the diff found ${changed}`);
      const load = measure(() => void loadLibrary(root), 3, 1);
      const checkout = measure(() => void loadLibraryAt(root, 'HEAD'), 3, 1);
      const library = loadLibrary(root).library!;
      const analyseAll = measure(() => {
        for (const p of library.parts) analysePart(p, library.settings.sweep, library.settings.within);
      }, 1, 0);
      const d = diffRun.secondsPerRun;
      return [
        `diff HEAD~1 HEAD, ${PARTS} parts, ${CHANGED} changed, one rail: ${d.toFixed(2)} s a run (${d < LIMIT_S ? 'under' : 'OVER'} the ${LIMIT_S} s goal: ${(d / LIMIT_S).toFixed(2)} of it)`,
        `  = ${(d / load.secondsPerRun).toFixed(2)} × loading one revision from disk`,
        `  reading one revision from git and loading it = ${(checkout.secondsPerRun / load.secondsPerRun).toFixed(2)} × loading it from disk`,
        `  analysing every part of one revision (what the diff skips) = ${(analyseAll.secondsPerRun / d).toFixed(1)} × the whole diff`,
      ];
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  },
};
