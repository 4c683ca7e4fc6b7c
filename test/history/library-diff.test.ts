// diffLibraries on libraries loaded from plain folders: what counts as a change, renamed parts matched by
// file or by content, folio.yaml changes that move every part's figures, and parts not analysed at all.

import { join } from 'node:path';
import { mkdirSync, writeFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary, type Library } from '../../src/model/library.js';
import { diffLibraries } from '../../src/history/library-diff.js';
import { freshFolder, removeTestRepos } from './git-repo.js';
import { FOLIO, capacitor } from './scenario.js';
import { rampResponse } from './ramp-reference.js';
import { railText } from '../../src/present/diff-text.js';

afterAll(removeTestRepos);

function library(files: Record<string, string>): Library {
  const root = freshFolder('lib');
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(join(root, path, '..'), { recursive: true });
    writeFileSync(join(root, path), text);
  }
  const { library, diagnostics } = loadLibrary(root);
  expect(diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  return library!;
}

const base = {
  'folio.yaml': FOLIO,
  'parts/a.yaml': capacitor('TA', '1u', '10m', '0.5n'),
  'parts/b.yaml': capacitor('TB', '100n', '20m', '0.3n'),
};

describe('diffLibraries', () => {
  it('finds no change between a library and itself, and analyses nothing', () => {
    const { diff, analyses } = diffLibraries(library(base), library(base));
    expect(diff).toEqual({ settings: [], parts: { added: [], removed: [], renamed: [], changed: [] }, plans: [], comparisons: { added: [], removed: [], changed: [] }, reviews: { added: [], removed: [], changed: [] } });
    expect(analyses.parts.size).toBe(0);
  });

  it('takes a comment-only edit for no change', () => {
    const { diff } = diffLibraries(library(base), library({ ...base, 'parts/a.yaml': `# a new comment\n${base['parts/a.yaml']}` }));
    expect(diff.parts.changed).toEqual([]);
  });

  it('matches a renamed part by its file, and a moved and renamed one by its content', () => {
    const after = library({
      'folio.yaml': FOLIO,
      'parts/a.yaml': capacitor('TA-2', '1u', '10m', '0.5n'),
      'parts/moved/b.yaml': capacitor('TB-2', '100n', '20m', '0.3n'),
    });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.parts).toEqual({
      added: [],
      removed: [],
      renamed: [
        { from: 'TA', to: 'TA-2' },
        { from: 'TB', to: 'TB-2' },
      ],
      changed: [],
    });
  });

  it('reports a renamed part whose values also changed among the changed parts, by its new id, without the id field', () => {
    const after = library({ ...base, 'parts/a.yaml': capacitor('TA-2', '1u', '10m', '0.7n') });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.parts.renamed).toEqual([{ from: 'TA', to: 'TA-2' }]);
    expect(diff.parts.changed.map((c) => [c.id, c.previousId, c.fields.map((f) => f.path)])).toEqual([['TA-2', 'TA', ['parasitics.esl']]]);
  });

  it('re-analyses every part when folio.yaml changes the sweep, and reports those whose figures moved', () => {
    // The usable band of TA starts at the sweep's first point; starting the sweep higher moves that edge.
    const after = library({ ...base, 'folio.yaml': FOLIO.replace('from: 1k', 'from: 10k') });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.settings).toEqual([{ path: 'sweep.from', before: '1k', after: '10k' }]);
    expect(diff.parts.changed.map((c) => [c.id, c.fields, Object.keys(c.figures)])).toEqual([
      ['TA', [], ['bandFromHz', 'effectiveAtBandMiddle']],
      ['TB', [], ['bandFromHz', 'effectiveAtBandMiddle']],
    ]);
    expect(diff.parts.changed[0].figures.bandFromHz).toEqual({ before: 1000, after: 10000, changePercent: 900 });
  });
});

describe('diffLibraries on a rail with a load step', () => {
  const rail = (count: number) => `rail: VDD_L
voltage: 1.0V
ripple: 3%
step: 2A
rise: 1us
band: {from: 10k, to: 20M}
mounting: 0.5nH
regulator: {r: 2m, l: 50nH}
capacitors:
  - {part: TL-47U, count: ${count}}
`;
  const files = (count: number) => ({
    'folio.yaml': FOLIO,
    'parts/c47.yaml': capacitor('TL-47U', '47u', '4m', '1n'),
    'plans/rail.yaml': rail(count),
  });
  /** The reference's dip, and its verdict: the largest excursion either way within V·ripple = 30 mV. */
  const reference = (count: number) => {
    const r = rampResponse({ v0: 1, regulator: { r: 2e-3, l: 50e-9 }, branches: [{ r: 4e-3, l: 1e-9 + 0.5e-9, c: 47e-6, count }], stepA: 2, riseS: 1e-6, untilS: 60e-6, dtS: 2e-10 });
    return { ...r, pass: Math.max(r.droopV, r.overshootV) <= 0.03 };
  };

  it('counts a load-step verdict that turned as a moved verdict, judged by a Runge–Kutta reference', () => {
    const { diff } = diffLibraries(library(files(3)), library(files(8)));
    const [p] = diff.plans;
    const [then, now] = [p.before!, p.after!];
    const [before, after] = [reference(3), reference(8)];
    expect(before.pass).toBe(false);
    expect(after.pass).toBe(true);
    expect(then.loadStep).toEqual({ status: 'FAIL', droopV: expect.any(Number), budgetV: expect.closeTo(0.03, 12) });
    expect(now.loadStep?.status).toBe('PASS');
    // RK4 at 0.2 ns steps against the closed-form ramp response: they agree to better than 0.05%.
    expect(then.loadStep!.droopV / before.droopV).toBeCloseTo(1, 3);
    expect(now.loadStep!.droopV / after.droopV).toBeCloseTo(1, 3);
    // The impedance verdict fails in both (the 15 mΩ target is not met); only the load step turned.
    expect([then.pass, now.pass]).toEqual([false, false]);
    expect(p.verdictMoved).toBe(true);
    expect(railText(p)).toMatch(/^rail VDD_L: FAIL, worst margin −\d+\.\d\d dB → −\d+\.\d\d dB; load step FAIL → PASS, dip [\d.]+ mV → [\d.]+ mV \(budget 30 mV\); moved by the plan \(capacitors\[TL-47U\]\.count 3 → 8\)$/);
  });
});
