// zfolio diff on temporary git repositories: parts added, removed, renamed and changed, a rail whose
// verdict flips, uncommitted edits, and the refusals (unknown revision, folder outside git, revision with
// errors). Figures before and after are those `figures --json` prints for each revision checked out on its
// own; the rail verdicts are judged by the tests' own evaluator (complex.js, dense sweep, golden section).

import { execFileSync } from 'node:child_process';
import { cpSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../fake-io.js';
import { GIT_ENV, freshFolder, makeRepo, removeTestRepos, useGitEnv, type TestRepo } from '../../history/git-repo.js';
import { capacitor, scenarioAtRevisionTwo, writeWorkTreeEdits } from '../../history/scenario.js';
import { denseSweep, railMagnitude, worstOverBand, type RefBranch } from '../../analysis/rail-reference.js';
import type { PartSummary } from '../../../src/analysis/summary.js';

let restore: () => void;
let repo: TestRepo;
let lib: string;

beforeAll(() => {
  restore = useGitEnv();
  repo = scenarioAtRevisionTwo('diff');
  repo.commit('revision two');
  writeWorkTreeEdits(repo);
  lib = join(repo.dir, 'lib');
});

afterAll(() => {
  restore();
  removeTestRepos();
});

/** The library at `revision`, checked out on its own in a fresh clone. */
function cloneAt(revision: string): string {
  const dir = freshFolder('clone');
  execFileSync('git', ['clone', '-q', repo.dir, dir], { env: { ...process.env, ...GIT_ENV }, stdio: 'ignore' });
  execFileSync('git', ['checkout', '-q', revision], { cwd: dir, env: { ...process.env, ...GIT_ENV }, stdio: 'ignore' });
  return join(dir, 'lib');
}

async function figuresOf(library: string, id: string): Promise<PartSummary> {
  const r = await run(['figures', id, '--json', '--library', library], '/');
  expect(r.code).toBe(0);
  return (JSON.parse(r.out) as PartSummary[])[0];
}

interface Diff {
  from: { revision: string; commit: string };
  to: { revision: string | null; commit: string | null };
  parts: {
    added: string[];
    removed: string[];
    renamed: { from: string; to: string }[];
    changed: { id: string; fields: { path: string; before: unknown; after: unknown }[]; figures: Record<string, { before: number | null; after: number | null; changePercent: number | null }> }[];
  };
  plans: { rail: string; status: string; before: { pass: boolean; worstMarginDb: number }; after: { pass: boolean; worstMarginDb: number }; verdictMoved: boolean; causes: { kind: string; id: string | null; alone: { pass: boolean } | null }[] }[];
  comparisons: { added: string[]; removed: string[]; changed: { name: string }[] };
  reviews: { added: string[]; removed: string[]; changed: { name: string }[] };
}

async function diffJson(...args: string[]): Promise<Diff> {
  const r = await run(['diff', ...args, '--json', '--library', lib], '/');
  expect(r.err).toBe('');
  expect(r.code).toBe(0);
  return JSON.parse(r.out) as Diff;
}

/** The test rail (scenario.ts) as series R-L-C branches: ESR, ESL + 0.2 nH mounting, nominal C (no DC-bias table). */
function referenceWorstMarginDb(count100n: number, esl100n: number): number {
  const branches: RefBranch[] = [
    { r: 8e-3, l: 0.5e-9 + 0.2e-9, c: 1e-6, count: 6 },
    { r: 20e-3, l: esl100n + 0.2e-9, c: 100e-9, count: count100n },
  ];
  const sweep = denseSweep(1e6, 100e6, 2000);
  const worst = worstOverBand(branches, sweep, sweep.map((f) => railMagnitude(branches, f)));
  return 20 * Math.log10(25e-3 / worst.impedanceOhm);
}

describe('zfolio diff', () => {
  it('lists parts added, removed, renamed and changed since a tag, counting uncommitted edits', async () => {
    const d = await diffJson('v1');
    expect(d.from).toEqual({ revision: 'v1', commit: repo.git('rev-parse', 'v1').trim() });
    expect(d.to).toEqual({ revision: null, commit: null });
    expect(d.parts.added).toEqual(['TC-NEW', 'TC-WT']);
    expect(d.parts.removed).toEqual(['TC-OLD']);
    expect(d.parts.renamed).toEqual([{ from: 'TC-NAME-A', to: 'TC-NAME-B' }]);
    expect(d.parts.changed.map((c) => [c.id, c.fields])).toEqual([
      ['TC-100N', [{ path: 'parasitics.esl', before: '0.3n', after: '0.6n' }]],
      ['TC-10N', [{ path: 'parasitics.esr', before: '40m', after: '60m' }]],
    ]);
    expect(d.comparisons).toEqual({ added: [], removed: [], changed: [{ name: 'pair', fields: [{ path: 'title', before: '1 µF and 100 nF', after: '1 µF against 100 nF' }] }] });
    expect(d.reviews).toEqual({ added: ['second'], removed: [], changed: [] });
  });

  it('compares two revisions without the work tree, and the work tree with HEAD alone', async () => {
    const committed = await diffJson('v1', 'HEAD');
    expect(committed.to.revision).toBe('HEAD');
    expect(committed.parts.added).toEqual(['TC-NEW']);
    expect(committed.parts.changed.map((c) => c.id)).toEqual(['TC-100N']);
    const uncommitted = await diffJson('HEAD');
    expect(uncommitted.parts).toMatchObject({ added: ['TC-WT'], removed: [], renamed: [] });
    expect(uncommitted.parts.changed.map((c) => c.id)).toEqual(['TC-10N']);
    expect(uncommitted.plans).toEqual([]);
  });

  it('gives the figures that moved exactly as figures --json gives them for each revision checked out on its own', async () => {
    const d = await diffJson('v1');
    const old = cloneAt('v1');
    for (const change of d.parts.changed) {
      const [a, b] = [await figuresOf(old, change.id), await figuresOf(lib, change.id)];
      const fromSummary = (s: PartSummary) => ({
        srfHz: s.selfResonanceHz,
        bandFromHz: s.usableBand?.fromHz ?? null,
        bandToHz: s.usableBand?.toHz ?? null,
        esrAtSrfOhm: s.resonances.find((r) => r.frequencyHz === s.selfResonanceHz)?.impedanceOhm ?? null,
      });
      for (const [name, moved] of Object.entries(change.figures)) {
        if (name === 'effectiveAtBandMiddle') continue;
        expect(moved.before, `${change.id} ${name} before`).toBe(fromSummary(a)[name as keyof ReturnType<typeof fromSummary>]);
        expect(moved.after, `${change.id} ${name} after`).toBe(fromSummary(b)[name as keyof ReturnType<typeof fromSummary>]);
      }
    }
    const c100n = d.parts.changed.find((c) => c.id === 'TC-100N')!;
    expect(Object.keys(c100n.figures)).toEqual(expect.arrayContaining(['srfHz', 'bandToHz']));
    // SRF = 1/(2π√(LC)) for the series model: ESL 0.3 → 0.6 nH moves it by 1/√2 − 1 = −29.3%.
    expect(c100n.figures.srfHz.changePercent!).toBeCloseTo((1 / Math.SQRT2 - 1) * 100, 6);
    // ESR is the resistance at the series resonance: 40 mΩ → 60 mΩ, +50%.
    const c10n = d.parts.changed.find((c) => c.id === 'TC-10N')!;
    expect(c10n.figures).toEqual({ esrAtSrfOhm: { before: expect.closeTo(0.04, 12), after: expect.closeTo(0.06, 12), changePercent: expect.closeTo(50, 8) } });
  });

  it('gives the effective capacitance at the band middle as C_eff = −1/(ωX) of the series model (a closed form)', async () => {
    const d = await diffJson('v1');
    const moved = d.parts.changed.find((c) => c.id === 'TC-100N')!.figures.effectiveAtBandMiddle;
    const [a, b] = [await figuresOf(cloneAt('v1'), 'TC-100N'), await figuresOf(lib, 'TC-100N')];
    // X = ωL − 1/(ωC) for ESR + ESL + C (Alexander & Sadiku, ch. 9), so C_eff = C / (1 − ω²LC).
    const cEff = (s: PartSummary, esl: number) => {
      const f = Math.sqrt(s.usableBand!.fromHz * s.usableBand!.toHz);
      const w = 2 * Math.PI * f;
      return 100e-9 / (1 - w * w * esl * 100e-9);
    };
    expect(moved.before! / cEff(a, 0.3e-9)).toBeCloseTo(1, 12);
    expect(moved.after! / cEff(b, 0.6e-9)).toBeCloseTo(1, 12);
  });

  it("reports the rail whose verdict flipped, before and after as the tests' own evaluator judges them, and which change moved it", async () => {
    const d = await diffJson('v1');
    expect(d.plans).toHaveLength(1);
    const [p] = d.plans;
    const before = referenceWorstMarginDb(10, 0.3e-9);
    const after = referenceWorstMarginDb(4, 0.6e-9);
    expect(before).toBeGreaterThan(0.5);
    expect(after).toBeLessThan(-0.5);
    expect(p).toMatchObject({ rail: 'VDD_T', status: 'changed', verdictMoved: true, before: { pass: true }, after: { pass: false } });
    // The engine refines its peaks; the reference samples 2,000 points a decade and refines by golden section.
    expect(p.before.worstMarginDb).toBeCloseTo(before, 4);
    expect(p.after.worstMarginDb).toBeCloseTo(after, 4);
    expect(p.causes.map((c) => [c.kind, c.id])).toEqual([
      ['plan', null],
      ['part', 'TC-100N'],
    ]);
    // Each change alone, judged by the reference.
    expect(p.causes[0].alone).toMatchObject({ pass: referenceWorstMarginDb(4, 0.3e-9) >= 0 });
    expect(p.causes[1].alone).toMatchObject({ pass: referenceWorstMarginDb(10, 0.6e-9) >= 0 });
  });

  it('prints one line a change, the moved verdict first', async () => {
    const r = await run(['diff', 'v1', '--library', lib], '/');
    expect(r.code).toBe(0);
    const lines = r.out.trimEnd().split('\n');
    expect(lines[0]).toBe(`Changes from v1 (${repo.git('rev-parse', 'v1').trim().slice(0, 12)}) to the work tree`);
    expect(lines[1]).toMatch(/^rail VDD_T: PASS → FAIL, worst margin \+\d\.\d\d dB → −\d\.\d\d dB; moved by the plan \(capacitors\[TC-100N\]\.count 10 → 4; alone (PASS|FAIL) [+−]\d+\.\d\d dB\), part TC-100N \(parasitics\.esl 0\.3n → 0\.6n; alone/);
    expect(lines.slice(2)).toEqual([
      'part TC-NEW added',
      'part TC-WT added',
      'part TC-OLD removed',
      'part TC-NAME-A renamed TC-NAME-B',
      expect.stringMatching(/^part TC-100N changed: parasitics\.esl 0\.3n → 0\.6n; SRF 29\.1 MHz → 20\.5 MHz \(−29\.3%\), band top /),
      'part TC-10N changed: parasitics.esr 40m → 60m; ESR at SRF 40 mΩ → 60 mΩ (+50.0%)',
      'comparison pair changed: title 1 µF and 100 nF → 1 µF against 100 nF',
      'review second added',
    ]);
    expect(r.err).toBe('');
  });

  it('says there are no changes when there are none', async () => {
    const r = await run(['diff', 'HEAD', 'HEAD', '--library', lib], '/');
    expect(r).toEqual({ code: 0, out: `Changes from HEAD (${repo.git('rev-parse', 'HEAD').trim().slice(0, 12)}) to HEAD (${repo.git('rev-parse', 'HEAD').trim().slice(0, 12)}): none\n`, err: '' });
  });
});

describe('zfolio diff refuses', () => {
  it('an unknown revision: one line, exit 2', async () => {
    const r = await run(['diff', 'no-such-revision', '--library', lib], '/');
    expect(r).toEqual({ code: 2, out: '', err: 'zfolio diff: unknown revision "no-such-revision": git knows no commit by that name in this repository\n' });
  });

  it('a library folder that is not in a git work tree: one line, exit 2', async () => {
    const outside = freshFolder('plain');
    cpSync(lib, outside, { recursive: true });
    const r = await run(['diff', 'HEAD', '--library', outside], '/');
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toBe(`zfolio diff: the library folder ${outside} is not in a git work tree; comparing with a revision needs the library under git\n`);
  });

  it('a command line without a revision or with three: exit 2', async () => {
    expect((await run(['diff', '--library', lib], '/')).code).toBe(2);
    expect((await run(['diff', 'a', 'b', 'c', '--library', lib], '/')).code).toBe(2);
  });

  it('a revision whose files have errors: every problem as REV:file:line:col, exit 1, nothing compared', async () => {
    const broken = makeRepo('broken');
    broken.write('folio.yaml', 'title: Broken test library (invented)\n');
    broken.write('parts/a.yaml', capacitor('TA', '1u', '10m', '0.5n'));
    broken.write('parts/b.yaml', capacitor('TB', 'banana', '10m', '0.5n'));
    broken.commit('a broken part');
    broken.git('tag', 'broken');
    broken.write('parts/b.yaml', capacitor('TB', '2u', '10m', '0.5n'));
    broken.commit('fixed');
    const r = await run(['diff', 'broken', '--library', broken.dir], '/');
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    const lines = r.err.trimEnd().split('\n');
    expect(lines[0]).toMatch(/^broken:parts\/b\.yaml:5:10: nominal: /);
    expect(lines.at(-1)).toBe('1 error in revision broken; nothing was compared');
    // The work tree's own errors are named by their plain paths.
    broken.write('parts/a.yaml', capacitor('TA', '1u', 'x', '0.5n'));
    const both = await run(['diff', 'broken', '--library', broken.dir], '/');
    expect(both.err).toMatch(/^parts\/a\.yaml:7:\d+: /m);
    expect(both.err.trimEnd().split('\n').at(-1)).toBe('1 error in revision broken, 1 error in the work tree; nothing was compared');
  });
});
