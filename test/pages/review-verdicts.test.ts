// A review that accepts a rail failing its target: `zfolio check` and `zfolio build` warn at the decision,
// and the review page and the pack state each covered rail's verdict beside the decisions and on the cover.
//
// The two rails hold one capacitor each (C 1 µF, ESR 10 mΩ, ESL 1 nH, no mounting, regulator or plane), so
// |Z| is the series R-L-C closed form |R + j(ωL − 1/(ωC))| (Alexander & Sadiku, ch. 14), largest at the band's
// low end, 100 kHz, where the margin to target is 20·log10(Z_t/|Z|): −44.0 dB against 10 mΩ (FAIL),
// +1.99 dB against 2 Ω (PASS).

import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildFolio, type BuildResult } from '../../src/build/build.js';
import { formatDecibels } from '../../src/units/format.js';
import { run } from '../cli/fake-io.js';
import { read, tempDir } from '../site-helpers.js';

const C = 1e-6;
const ESR = 0.01;
const ESL = 1e-9;
const seriesRlc = (f: number) => Math.hypot(ESR, 2 * Math.PI * f * ESL - 1 / (2 * Math.PI * f * C));
const marginDb = (target: number) => 20 * Math.log10(target / seriesRlc(1e5));

let root: string;
let built: BuildResult;

beforeAll(async () => {
  root = tempDir('review-verdicts');
  for (const d of ['parts', 'plans', 'reviews']) mkdirSync(join(root, d));
  writeFileSync(join(root, 'folio.yaml'), 'title: Review verdict test library (invented)\nsweep: {from: 10k, to: 1G, per-decade: 40}\n');
  writeFileSync(join(root, 'parts/c.yaml'), 'id: T-C-1U\nkind: capacitor\nnominal: 1u\nvoltage: 16V\nparasitics: {esr: 10m, esl: 1n}\n');
  const plan = (rail: string, target: string) => `rail: ${rail}\nvoltage: 1V\ntarget: ${target}\nband: {from: 100k, to: 10M}\nmounting: 0nH\ncapacitors:\n  - {part: T-C-1U, count: 1}\n`;
  writeFileSync(join(root, 'plans/bad.yaml'), plan('RAIL_BAD', '10m'));
  writeFileSync(join(root, 'plans/ok.yaml'), plan('RAIL_OK', '2'));
  writeFileSync(
    join(root, 'reviews/r.yaml'),
    [
      'title: Rail review (invented)',
      'date: 2026-03-18',
      'board: test board',
      'reviewers: [A. Person]',
      'summary: Both rails are fine as placed.',
      'covers: {plans: [RAIL_OK, RAIL_BAD]}',
      'decisions:',
      '  - Accept **RAIL_OK** as placed.',
      '  - Accept RAIL_BAD as placed.',
      '  - Keep the part list as it is.',
      '',
    ].join('\n'),
  );
  built = await buildFolio({ libraryRoot: root, outDir: join(root, '_site'), cache: false, workers: 0 });
}, 120_000);

describe('a review accepting a failing rail', () => {
  const bad = formatDecibels(marginDb(0.01));

  it('the closed form puts RAIL_BAD at −44 dB and RAIL_OK at +1.99 dB', () => {
    expect(marginDb(0.01)).toBeCloseTo(-44.04, 1);
    expect(marginDb(2)).toBeCloseTo(1.99, 1);
  });

  it('zfolio check warns at the decision and at the summary, with the verdict, and still exits 0', async () => {
    const r = await run(['check', '--library', root], '/');
    expect(r.code).toBe(0);
    const warnings = r.err.split('\n').filter((l) => l.startsWith('reviews/'));
    expect(warnings).toEqual([
      `reviews/r.yaml:5:10: warning: summary (on the pack's cover): accepts RAIL_BAD, which fails its target (worst margin ${bad} at 100 kHz, plans/bad.yaml); record the fix, or say that the failure is waived and why`,
      `reviews/r.yaml:9:5: warning: decisions[1]: accepts RAIL_BAD, which fails its target (worst margin ${bad} at 100 kHz, plans/bad.yaml); record the fix, or say that the failure is waived and why`,
    ]);
  });

  it('zfolio build reports the same warnings and builds', () => {
    expect(built.ok).toBe(true);
    expect(built.diagnostics.filter((d) => d.file === 'reviews/r.yaml').map((d) => `${d.line}:${d.column}`)).toEqual(['5:10', '9:5']);
  });

  it('the review page states each rail\'s verdict beside the decisions and marks the decision', () => {
    const page = read(join(root, '_site'), 'reviews/r/index.html');
    const decisions = page.slice(page.indexOf('<section aria-label="Decisions">'), page.indexOf('<section aria-label="Open points">'));
    expect(decisions).toContain(`Rail <span class="mono">RAIL_OK</span></th><td><span class="verdict-pass">PASS</span> worst margin ${formatDecibels(marginDb(2))} at 100 kHz`);
    expect(decisions).toContain(`Rail <span class="mono">RAIL_BAD</span></th><td><span class="verdict-fail">FAIL</span> worst margin ${bad} at 100 kHz`);
    const items = decisions.split('<li>').slice(1);
    expect(items).toHaveLength(3);
    expect(items[0]).not.toContain('review-warning');
    expect(items[1]).toContain(`This decision accepts RAIL_BAD, which fails its target (worst margin ${bad} at 100 kHz, plans/bad.yaml).`);
    expect(items[2]).not.toContain('review-warning');
  });

  it('the pack states the verdicts on its cover, beside the summary that accepts the failing rail, and beside the decisions', () => {
    const pack = read(join(root, '_site'), 'reviews/r/pack.html');
    const cover = pack.slice(pack.indexOf('id="pack-cover"'), pack.indexOf('id="pack-contents"'));
    expect(cover).toContain(`The summary accepts RAIL_BAD, which fails its target (worst margin ${bad} at 100 kHz, plans/bad.yaml).`);
    expect(cover).toMatch(/<li>Rail <span class="mono">RAIL_BAD<\/span>: at nominal <span class="verdict-fail">FAIL<\/span>/);
    expect(cover).toMatch(/<li>Rail <span class="mono">RAIL_OK<\/span>: at nominal <span class="verdict-pass">PASS<\/span>/);
    // The part states no tolerance: its corners are the nominal, and the cover says so.
    expect(cover).toContain('at its corners: <span class="verdict-pass">PASS</span> as nominal: no placed part states a spread');
    const decisions = pack.slice(pack.indexOf('id="pack-decisions"'));
    expect(decisions).toContain('<span class="verdict-fail">FAIL</span>');
    expect(decisions).toContain('This decision accepts RAIL_BAD');
  });
});
