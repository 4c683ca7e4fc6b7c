// build --since REV and a review's `since:` on a temporary git repository: the "Changes since REV" page,
// the review page's and pack's "What changed since REV" section after the decisions, the charts of every
// changed rail and part, and the refusals (nothing written).

import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../cli/fake-io.js';
import { freshFolder, makeRepo, removeTestRepos, useGitEnv, type TestRepo } from '../history/git-repo.js';
import { REVIEW, scenarioAtRevisionTwo, writeRevisionOne, writeWorkTreeEdits } from '../history/scenario.js';
import { svgTexts } from '../charts/svg-text.js';

let restore: () => void;
let repo: TestRepo;
let lib: string;

beforeAll(() => {
  restore = useGitEnv();
  repo = scenarioAtRevisionTwo('changes');
  // The second review was held on revision two and names the first as the one signed before.
  repo.write('lib/reviews/second.yaml', `${REVIEW('Second review')}since: v1\n`);
  repo.commit('revision two');
  writeWorkTreeEdits(repo);
  lib = join(repo.dir, 'lib');
});

afterAll(() => {
  restore();
  removeTestRepos();
});

const text = (html: string) => html.replace(/<svg[\s\S]*?<\/svg>/g, '').replace(/<[^>]+>/g, '').replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;|&#34;/g, '"').replace(/&#39;/g, "'");

describe('build --since', () => {
  let out: string;
  let diffLines: string[];

  beforeAll(async () => {
    out = join(freshFolder('site'), 'site');
    const r = await run(['build', '--since', 'v1', '--out', out, '--workers', '0', '--library', lib], '/');
    expect(r.code, r.err).toBe(0);
    const d = await run(['diff', 'v1', '--library', lib], '/');
    diffLines = d.out.trimEnd().split('\n').slice(1);
  });

  it('adds a page with the summary and every change of `zfolio diff`, in its order, the moved verdict first', () => {
    const page = readFileSync(join(out, 'changes/index.html'), 'utf8');
    const words = text(page);
    expect(words).toContain('Changes since v1');
    expect(words).toContain(`(commit ${repo.git('rev-parse', 'v1').trim().slice(0, 12)}): 1 rail verdict moved; 1 rail changed; 2 parts changed; 2 parts added; 1 part removed; 1 part renamed; comparisons changed; reviews changed.`);
    const items = [...page.matchAll(/<li class="change-(\w+)">([\s\S]*?)<\/li>/g)].map((m) => text(m[2]).replace(/^verdict moved /, ''));
    expect(items).toEqual(diffLines);
    expect(page).toMatch(/<li class="change-verdict"><span class="verdict-moved">verdict moved<\/span> rail VDD_T: PASS → FAIL/);
  });

  it('draws the rail and each changed part then and now, with the specs beside the page', () => {
    const page = readFileSync(join(out, 'changes/index.html'), 'utf8');
    const charts = [...page.matchAll(/<figure class="chart wide change-chart">([\s\S]*?)<\/figure>/g)].map((m) => m[1]);
    expect(charts).toHaveLength(3);
    expect(svgTexts(charts[0])).toEqual(expect.arrayContaining(['at v1', 'now', 'target 25 mΩ', 'worst point']));
    expect(text(charts[1])).toContain('part TC-100N changed: parasitics.esl 0.3n → 0.6n');
    expect(text(charts[2])).toContain('part TC-10N changed: parasitics.esr 40m → 60m');
    for (const name of ['change-rail-VDD_T', 'change-part-TC-100N', 'change-part-TC-10N']) {
      const spec = JSON.parse(readFileSync(join(out, 'changes', `${name}.vl.json`), 'utf8')) as { datasets: { curves: { s: string }[] } };
      expect(new Set(spec.datasets.curves.map((r) => r.s))).toEqual(new Set(name.includes('rail') ? ['before', 'now', 'target'] : ['before', 'now']));
      expect(page).toContain(`href="${name}.vl.json"`);
    }
  });

  it('links the page from the index', () => {
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('<a href="changes/index.html">Changes since v1</a>');
  });

  it("puts the review's section after its decisions, on the page and in the pack, and in the pack's contents", () => {
    const page = readFileSync(join(out, 'reviews/second/index.html'), 'utf8');
    const order = ['<h2>Decisions</h2>', '<h2>Open points</h2>', '<h2>What changed since v1</h2>', '<h2>What the review covers</h2>'].map((h) => page.indexOf(h));
    expect(order.every((at) => at >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    expect(page).toContain('rail VDD_T: PASS → FAIL');
    const pack = readFileSync(join(out, 'reviews/second/pack.html'), 'utf8');
    const sections = [...pack.matchAll(/<section class="pack-section[^"]*" id="([^"]+)"/g)].map((m) => m[1]);
    expect(sections.slice(0, 4)).toEqual(['pack-cover', 'pack-contents', 'pack-decisions', 'pack-changes']);
    expect(pack).toMatch(/<a class="entry" href="#pack-decisions">[^<]*<\/a>[\s\S]*?<a class="entry" href="#pack-changes">What changed since v1<\/a>/);
    expect(existsSync(join(out, 'reviews/second/change-rail-VDD_T.vl.json'))).toBe(true);
    // The first review names no revision: no section.
    expect(readFileSync(join(out, 'reviews/first/index.html'), 'utf8')).not.toContain('What changed since');
  });
});

describe('a build without --since', () => {
  it('has no changes page and no link to one', async () => {
    const out = join(freshFolder('site'), 'site');
    const r = await run(['build', '--out', out, '--workers', '0', '--library', lib], '/');
    expect(r.code, r.err).toBe(0);
    expect(existsSync(join(out, 'changes'))).toBe(false);
    expect(readFileSync(join(out, 'index.html'), 'utf8')).not.toContain('changes/index.html');
  });
});

describe('build refuses, writing nothing', () => {
  it('--since with an unknown revision: one line, exit 2', async () => {
    const out = join(freshFolder('site'), 'site');
    const r = await run(['build', '--since', 'v9', '--out', out, '--library', lib], '/');
    expect(r).toEqual({ code: 2, out: '', err: 'zfolio build: --since: unknown revision "v9": git knows no commit by that name in this repository\n' });
    expect(existsSync(out)).toBe(false);
  });

  it("a review whose since: git does not know: an error at that line, exit 1", async () => {
    const other = makeRepo('bad-since');
    writeRevisionOne(other);
    other.write('lib/reviews/first.yaml', `${REVIEW('First review')}since: never-tagged\n`);
    other.commit('one');
    const out = join(freshFolder('site'), 'site');
    const r = await run(['build', '--out', out, '--library', join(other.dir, 'lib')], '/');
    expect(r.code).toBe(1);
    expect(r.err).toContain('reviews/first.yaml:7:8: since: unknown revision "never-tagged": git knows no commit by that name in this repository\n');
    expect(existsSync(out)).toBe(false);
  });
});

describe('a review naming a revision whose files have errors', () => {
  it('is an error at its since: line, with the revision\'s own problems named REV:path; nothing written', async () => {
    const other = makeRepo('broken-since');
    writeRevisionOne(other);
    other.write('lib/parts/c-1u.yaml', 'id: TC-1U\nkind: capacitor\ntitle: broken\nnominal: banana\n');
    other.commit('broken');
    other.git('tag', 'broken');
    writeRevisionOne(other);
    other.write('lib/reviews/first.yaml', `${REVIEW('First review')}since: broken\n`);
    other.commit('fixed');
    const out = join(freshFolder('site'), 'site');
    const r = await run(['build', '--out', out, '--library', join(other.dir, 'lib')], '/');
    expect(r.code).toBe(1);
    const lines = r.err.trimEnd().split('\n');
    expect(lines).toContain('reviews/first.yaml:7:8: since: the library at revision broken has 4 errors (listed as broken:file), so nothing can be compared with it');
    // The broken part, and the files that name it, at that revision.
    expect(lines.some((l) => /^broken:parts\/c-1u\.yaml:4:10: nominal: /.test(l))).toBe(true);
    expect(lines.filter((l) => l.startsWith('broken:'))).toHaveLength(4);
    expect(existsSync(out)).toBe(false);
  });
});

describe('check', () => {
  it("resolves each review's since: and loads that revision", async () => {
    expect((await run(['check', '--library', lib], '/')).code).toBe(0);
    const other = makeRepo('check-since');
    writeRevisionOne(other);
    other.write('lib/reviews/first.yaml', `${REVIEW('First review')}since: v0\n`);
    other.commit('one');
    const r = await run(['check', '--library', join(other.dir, 'lib')], '/');
    expect(r.code).toBe(1);
    expect(r.err).toBe('reviews/first.yaml:7:8: since: unknown revision "v0": git knows no commit by that name in this repository\n1 error in the library\'s reviews\n');
  });
});
