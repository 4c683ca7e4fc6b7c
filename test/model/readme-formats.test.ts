// The README's examples of the three file formats (a part, a rail plan, a review), read by the library
// loader as a librarian would paste them: beside the demo library (whose parts the plan and review name), each
// loads without a problem and means what its comments say. A variant of the part for each claim a comment
// makes (the spellings of 100 nF, an asymmetric tolerance, a marking that disagrees with the value) is read
// the same way. Values are the README's own; units as SI base units (100 nF = 1e-7 F).

import { cpSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { tempDir } from '../site-helpers.js';
import { capacitorShuntThruFile } from '../measure/shunt-thru.js';

const DEMO = fileURLToPath(new URL('../../', import.meta.url));
const README = readFileSync(join(DEMO, 'README.md'), 'utf8');
const dir = tempDir('readme-formats');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The README's yaml block under the heading `heading`. */
function example(heading: string): string {
  const at = README.indexOf(`\n${heading}\n`);
  expect(at, heading).toBeGreaterThan(0);
  const start = README.indexOf('```yaml\n', at) + '```yaml\n'.length;
  return README.slice(start, README.indexOf('```', start));
}

const PART = example('### A part');
const PLAN = example('### A rail plan');
const REVIEW = example('### A review');

let count = 0;
/** A copy of the demo's parts, comparisons and measurements with `files` added (path → text); the demo's own
 *  plans and reviews are left out (the README's plan is for a rail the demo already plans). */
function libraryWith(files: Record<string, string>) {
  const lib = join(dir, `lib${count++}`);
  for (const name of ['folio.yaml', 'parts', 'comparisons', 'measurements']) cpSync(join(DEMO, name), join(lib, name), { recursive: true });
  // The part names a measurement file of its own: a synthetic shunt-thru file of a 100 nF capacitor.
  capacitorShuntThruFile(join(lib, 'measurements', 'cap-0402-100n.s2p'));
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(join(lib, path, '..'), { recursive: true });
    writeFileSync(join(lib, path), text);
  }
  return loadLibrary(lib);
}

describe('the README example of a part', () => {
  const { library, diagnostics } = libraryWith({ 'parts/readme.yaml': PART });
  const part = library!.partsById.get('CAP-0402-100N-X7R')!;

  it('loads without a problem', () => {
    expect(diagnostics).toEqual([]);
    expect(part).toBeDefined();
  });

  it('holds the values its lines write, in SI base units', () => {
    expect([part.kind, part.title, part.package, part.dielectric, part.marking]).toEqual(['capacitor', '100 nF 16 V X7R 0402', '0402', 'X7R', '104']);
    expect(part.nominal).toBeCloseTo(100e-9, 20);
    expect(part.tolerance).toBe(0.1);
    expect(part.voltageRatings).toEqual([{ volts: 16, kind: 'DC', stated: false }]);
    expect(part.parameters).toEqual({ esr: 0.018, esl: expect.closeTo(0.45e-9, 20) });
    expect(part.dcBias).toEqual([
      { voltageV: 1, fraction: 0.95 },
      { voltageV: 3.3, fraction: 0.7 },
      { voltageV: 6.3, fraction: 0.52 },
    ]);
    expect(part.within).toBe(0.1);
    expect(part.cost).toBe(0.004);
    expect(part.tags).toEqual(['decoupling']);
    expect(part.measurements!.map((m) => [m.file, m.fixture, m.note, m.date])).toEqual([['measurements/cap-0402-100n.s2p', 'shunt-thru', 'bench sample 1', '2026-01-20']]);
  });

  it('"100n, 100nF, 100 nF, 0.1u and 1e-7 all mean 100 nF"', () => {
    const line = /^nominal: (\S+) +# (.*)$/m.exec(PART)!;
    expect(line[2]).toBe('100n, 100nF, 100 nF, 0.1u and 1e-7 all mean 100 nF');
    for (const spelling of ['100n', '100nF', '100 nF', '0.1u', '1e-7']) {
      const r = libraryWith({ 'parts/readme.yaml': PART.replace(/^nominal: .*$/m, `nominal: ${spelling}`) });
      expect(r.diagnostics, spelling).toEqual([]);
      expect(r.library!.partsById.get('CAP-0402-100N-X7R')!.nominal! / 100e-9 - 1, spelling).toBeCloseTo(0, 12);
    }
  });

  it('"or asymmetric: +80%/-20%"', () => {
    const r = libraryWith({ 'parts/readme.yaml': PART.replace(/^tolerance: .*$/m, 'tolerance: +80%/-20%') });
    expect(r.diagnostics).toEqual([]);
    expect(r.library!.partsById.get('CAP-0402-100N-X7R')!.spread.tolerance).toEqual({ minus: 0.2, plus: 0.8 });
  });

  it('"optional IEC 60062 code, checked against nominal": 105 (1 µF) on a 100 nF part is an error at its line', () => {
    const r = libraryWith({ 'parts/readme.yaml': PART.replace('marking: "104"', 'marking: "105"') });
    const line = PART.split('\n').findIndex((l) => l.startsWith('marking:')) + 1;
    expect(r.diagnostics.filter((d) => d.severity === 'error').map((d) => [d.file, d.line])).toEqual([['parts/readme.yaml', line]]);
  });
});

describe('the README examples of a rail plan and a review', () => {
  const { library, diagnostics } = libraryWith({ 'plans/readme.yaml': PLAN, 'reviews/readme.yaml': REVIEW });

  it('load beside the demo parts without a problem', () => {
    expect(diagnostics).toEqual([]);
    expect(library!.plans.map((p) => p.rail)).toEqual(['VDD_CORE']);
    expect(library!.reviews.map((r) => r.title)).toEqual(['DL-3 main board — power integrity review']);
  });

  it('the plan holds what its lines write, in SI base units', () => {
    const plan = library!.plans[0];
    expect(plan.voltageV).toBe(0.9);
    expect(plan.target).toEqual({ kind: 'ripple', ripple: 0.03, stepA: 2.5 });
    expect(plan.band).toEqual({ fromHz: 1e5, toHz: 40e6 });
    expect(plan.riseS).toBeCloseTo(10e-9, 20);
    expect(plan.durationS).toBeCloseTo(50e-6, 20);
    expect(plan.regulator).toEqual({ rOhm: 0.001, lH: expect.closeTo(15e-9, 20) });
    expect(plan.plane).toEqual({ cF: expect.closeTo(15e-9, 20), rOhm: 0.002 });
  });

  it('each placement gets the mounting the rule after the example names: the entry\'s own, else the rail\'s', () => {
    const plan = library!.plans[0];
    expect(plan.placements.map((p) => [p.part.id, p.count, p.mountingFrom, p.mountingH])).toEqual([
      ['ORV-C-0402-100N-X7R', 16, 'rail', expect.closeTo(0.3e-9, 20)],
      ['ORV-C-POLY-220U-6V3', 2, 'entry', expect.closeTo(1e-9, 20)],
    ]);
  });

  it('the review holds its reviewers, what it covers, its decisions, open points and previous revision', () => {
    const review = library!.reviews[0];
    expect([review.date, review.board, review.since]).toEqual(['2026-03-18', 'DL-3 main board, rev B', 'dl3-review-2026-02']);
    expect(review.reviewers).toEqual([{ name: 'A. Person', role: 'power integrity' }]);
    expect(review.plans.map((p) => p.rail)).toEqual(['VDD_CORE']);
    expect(review.comparisons.map((c) => c.source.path)).toEqual(['comparisons/decoupling-0402.yaml']);
    expect(review.parts.map((p) => p.id)).toEqual(['ORV-C-0402-100N-X7R']);
    expect(review.decisions).toEqual(['Accept **VDD_CORE** as placed.']);
    expect(review.openPoints).toEqual([{ text: 'Measure the rail', owner: 'A. Person', due: '2026-04-01' }]);
  });
});
