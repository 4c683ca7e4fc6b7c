// A rail that passes at nominal and fails at a corner, and the review pack that says so.
//
// The rail holds one capacitor (C 1 µF ±20%, ESR 10 mΩ, ESL 1 nH, no mounting, regulator or plane), so |Z|
// is the series R-L-C closed form |R + j(ωL − 1/(ωC))| (Alexander & Sadiku, ch. 14), largest at the band's
// low end, 100 kHz. Against 1.75 Ω the nominal part passes by 20·log10(1.75/|Z|) ≈ +0.82 dB; at its low
// corner (C·0.8) |Z| is about 1.25 times larger and the margin about −1.1 dB; its high corner passes.
// The PDFs are printed by the system Chromium and read back with poppler's pdftotext (Debian poppler-utils).

import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { buildFolio, type BuildResult } from '../../src/build/build.js';
import { loadLibrary } from '../../src/model/library.js';
import { formatDecibels } from '../../src/units/format.js';
import { run } from '../cli/fake-io.js';
import { read, tempDir } from '../site-helpers.js';
import { startChrome, stopChrome } from '../print/site-tabs.js';

const ESR = 0.01;
const ESL = 1e-9;
const TARGET = 1.75;
const seriesRlc = (f: number, c: number) => Math.hypot(ESR, 2 * Math.PI * f * ESL - 1 / (2 * Math.PI * f * c));
const marginDb = (c: number) => 20 * Math.log10(TARGET / seriesRlc(1e5, c));

let root: string;
let built: BuildResult;
let browser: BrowserContext;

beforeAll(async () => {
  root = tempDir('review-corners');
  for (const d of ['parts', 'plans', 'reviews']) mkdirSync(join(root, d));
  writeFileSync(join(root, 'folio.yaml'), 'title: Corner verdict test library (invented)\nsweep: {from: 10k, to: 1G, per-decade: 40}\n');
  writeFileSync(join(root, 'parts/c.yaml'), 'id: T-C-1U\nkind: capacitor\nnominal: 1u\ntolerance: 20%\nvoltage: 16V\nparasitics: {esr: 10m, esl: 1n}\n');
  writeFileSync(join(root, 'plans/edge.yaml'), `rail: RAIL_EDGE\nvoltage: 1V\ntarget: ${TARGET}\nband: {from: 100k, to: 10M}\nmounting: 0nH\ncapacitors:\n  - {part: T-C-1U, count: 1}\n`);
  writeFileSync(join(root, 'reviews/r.yaml'), 'title: Corner review (invented)\ndate: 2026-03-18\nboard: test board\nreviewers: [A. Person]\ncovers: {plans: [RAIL_EDGE]}\ndecisions: [Measure the rail before sign-off.]\n');
  // Printed by the run's Chromium for printing (test/setup/shared-chrome.ts), in this file's context of it.
  browser = await startChrome('print');
  built = await buildFolio({
    libraryRoot: root,
    outDir: join(root, '_site'),
    cache: false,
    workers: 0,
    pdf: { env: process.env, browser, date: new Date('2026-12-01T12:00:00Z'), select: { parts: new Set(['T-C-1U']) } },
  });
  if (built.pdfProblem) throw new Error(`PDF tests need Chromium: ${built.pdfProblem}`);
}, 300_000);

afterAll(() => stopChrome(browser));

/** A PDF's text, its lines' runs of spaces (layout columns, wrapped lines) read as one space. */
const pdfText = (file: string) => execFileSync('pdftotext', ['-layout', join(root, '_site', file), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
const AGEING = 'ageing, which the maker\'s data must cover (class 2 ceramics lose a few percent of their capacitance per decade of hours, common practice)';

describe('a rail passing at nominal and failing at a corner', () => {
  const nominal = formatDecibels(marginDb(1e-6));
  const low = formatDecibels(marginDb(0.8e-6));

  it('the closed form: nominal +0.82 dB, low corner −1.1 dB, high corner passing', () => {
    expect(marginDb(1e-6)).toBeCloseTo(0.82, 1);
    expect(marginDb(0.8e-6)).toBeCloseTo(-1.1, 1);
    expect(marginDb(1.2e-6)).toBeGreaterThan(0);
  });

  it('zfolio plan says so on two lines, and exits 3 only with --corners', async () => {
    const r = await run(['plan', 'RAIL_EDGE', '--library', root], '/');
    expect(r.code).toBe(0);
    expect(r.out).toContain(`  nominal    PASS  worst margin ${nominal} at 100 kHz`);
    expect(r.out).toContain(`  corners    FAIL (1 of 2 corners miss the target)  worst margin ${low} at 100 kHz`);
    expect(r.out).toContain('with T-C-1U low; all 2 corners of 1 moving quantity, over 0 °C to 70 °C');
    expect((await run(['plan', 'RAIL_EDGE', '--corners', '--library', root], '/')).code).toBe(3);
    const json = JSON.parse((await run(['plan', 'RAIL_EDGE', '--json', '--library', root], '/')).out);
    expect(json.pass).toBe(true);
    expect(json.corners).toMatchObject({ method: 'all', evaluated: 2, pass: false, worstFrequencyHz: 1e5, extremes: { 'T-C-1U': 'low' }, failing: 1 });
    expect(json.corners.worstMarginDb).toBeCloseTo(marginDb(0.8e-6), 9);
  });

  it('the plan page states both verdicts and what a corner is', () => {
    expect(built.ok).toBe(true);
    const page = read(join(root, '_site'), 'plans/RAIL_EDGE/index.html');
    expect(page).toContain(`<span class="verdict-label">Nominal</span> PASS <span class="verdict-text">— worst margin ${nominal} at 100 kHz`);
    expect(page).toContain(`<span class="verdict-label">Worst corner</span> <span class="verdict-fail">FAIL</span> <span class="verdict-text">— worst margin ${low} at 100 kHz`);
    expect(page).toContain('leaves out ageing');
  });

  it('the pack\'s cover says it passes at nominal and fails at its corners', () => {
    const pack = read(join(root, '_site'), 'reviews/r/pack.html');
    const cover = pack.slice(pack.indexOf('id="pack-cover"'), pack.indexOf('id="pack-contents"'));
    expect(cover).toMatch(/<li>Rail <span class="mono">RAIL_EDGE<\/span>: at nominal <span class="verdict-pass">PASS<\/span>/);
    expect(cover).toContain(`<br>at its corners: <span class="verdict-fail">FAIL</span> worst margin ${low} at 100 kHz`);
    expect(cover).toContain('with T-C-1U low; 1 of 2 corners miss the target');
  });

  it('the pack PDF\'s cover says so too, and its plan section says what a corner is and leaves out', () => {
    const text = pdfText('pdf/reviews/r.pdf');
    const cover = text.slice(0, text.indexOf('Sign-off'));
    expect(cover).toContain(`Rail RAIL_EDGE: at nominal PASS worst margin ${nominal} at 100 kHz`);
    expect(cover).toContain(`at its corners: FAIL worst margin ${low} at 100 kHz`);
    expect(cover).toContain('with T-C-1U low; 1 of 2 corners miss the target');
    expect(text).toContain(`Worst corner FAIL — worst margin ${low} at 100 kHz`);
    expect(text).toContain(`A corner puts every placed part at the low or the high end of its spread at once`);
    expect(text).toContain(AGEING);
  });

  it('the part\'s PDF datasheet states its spread and what its corners leave out', () => {
    const text = pdfText('pdf/parts/T-C-1U.pdf');
    // 1 µF ±20% with no temperature characteristic: 0.8 µF to 1.2 µF.
    expect(text).toContain('1 µF ±20%: 800 nF to 1.2 µF');
    // A capacitor of no stated dielectric: its spread leaves out ageing, and says nothing of class 2 ceramics.
    expect(text).toMatch(/without ageing, which the maker's data must\s+cover\./);
    expect(text).not.toContain('class 2');
  });

  it('the rail chart\'s range holds the nominal curve: near 5 MHz |Z| is least at nominal, between its corners\' SRFs', () => {
    // SRF 1/(2π√(LC)): 5.03 MHz at C, 4.59 MHz at 1.2·C, 5.63 MHz at 0.8·C; at the nominal SRF both corners
    // sit above the ESR the nominal part reaches (series R-L-C closed form, as above).
    const library = loadLibrary(root).library!;
    const f = analysePlan(library.plans[0], library.settings.sweep.perDecade, undefined, undefined, { operating: library.settings.temperature });
    const { minOhm, maxOhm } = f.corners!.envelope!;
    f.frequenciesHz.forEach((hz, i) => {
      const corners = [seriesRlc(hz, 0.8e-6), seriesRlc(hz, 1.2e-6)];
      expect(minOhm[i] / Math.min(seriesRlc(hz, 1e-6), ...corners) - 1).toBeCloseTo(0, 6);
      expect(maxOhm[i] / Math.max(seriesRlc(hz, 1e-6), ...corners) - 1).toBeCloseTo(0, 6);
    });
    const near = f.frequenciesHz.reduce((best, hz, i) => (Math.abs(Math.log(hz / 5.03e6)) < Math.abs(Math.log(f.frequenciesHz[best] / 5.03e6)) ? i : best), 0);
    // About 10 mΩ against 11.3 mΩ and 12.7 mΩ at the corners.
    expect(minOhm[near]).toBeLessThan(0.95 * Math.min(seriesRlc(f.frequenciesHz[near], 0.8e-6), seriesRlc(f.frequenciesHz[near], 1.2e-6)));
  });
});
