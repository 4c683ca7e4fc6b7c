// Which change moved a rail: each change applied alone to the earlier state, its verdict and worst margin held
// to the rail written out here and evaluated by the test's own evaluator (test/analysis/rail-reference.ts:
// complex.js element impedances, a dense log sweep, golden-section refinement of every local maximum). The
// mounting of a swapped part: an entry's own stays; one from the package table is looked up for the part
// that now stands there. Values invented.

import { describe, expect, it } from 'vitest';
import { swapParts, withPartChange, withPlanChange, withSettingsChange } from '../../src/history/rail-attribution.js';
import { readPart, type Part } from '../../src/model/part.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { parseYamlSource } from '../../src/model/source.js';
import { planFromYaml } from '../analysis/plan-from-yaml.js';
import { denseSweep, railMagnitude, worstOverBand, type RefBranch } from '../analysis/rail-reference.js';

const TARGET = 0.06;
const A_BEFORE = 'id: A\nkind: capacitor\nnominal: 1u\nvoltage: 6.3V\npackage: "0402"\nparasitics: {esr: 5m, esl: 0.5n}\n';
// The same part later: a larger package with more inductance.
const A_AFTER = 'id: A\nkind: capacitor\nnominal: 1u\nvoltage: 6.3V\npackage: "0603"\nparasitics: {esr: 5m, esl: 0.9n}\n';
// An 0603 part the library also holds (the package table names only packages the library has).
const X = 'id: X\nkind: capacitor\nnominal: 10u\nvoltage: 6.3V\npackage: "0603"\n';
const B = 'id: B\nkind: capacitor\nnominal: 100n\nvoltage: 6.3V\npackage: "0402"\nparasitics: {esr: 20m, esl: 0.4n}\n';
const plan = (counts: [number, number]) =>
  `rail: R\nvoltage: 1V\ntarget: 60m\nband: {from: 1M, to: 100M}\nmounting: 0.3n\nmounting-by-package: {"0402": 0.2n, "0603": 0.35n}\n` +
  `capacitors: [{part: A, count: ${counts[0]}}, {part: B, count: ${counts[1]}}]\n`;

function part(text: string): Part {
  const d = new DiagnosticList();
  return readPart({ source: parseYamlSource('parts/a.yaml', text, d)!, diagnostics: d })!;
}

/** Worst |Z| over 1–100 MHz and its margin under the target, dB, by the reference evaluator. */
function reference(branches: RefBranch[]): { pass: boolean; marginDb: number } {
  const sweep = denseSweep(1e6, 100e6, 3000);
  const worst = worstOverBand(branches, sweep, Float64Array.from(sweep, (f) => railMagnitude(branches, f)));
  return { pass: worst.impedanceOhm <= TARGET, marginDb: 20 * Math.log10(TARGET / worst.impedanceOhm) };
}

// The mountings: from the package table, 0.2 nH for an 0402, 0.35 nH for an 0603.
const aBefore = (n: number): RefBranch => ({ r: 5e-3, l: 0.5e-9 + 0.2e-9, c: 1e-6, count: n });
const aAfter = (n: number): RefBranch => ({ r: 5e-3, l: 0.9e-9 + 0.35e-9, c: 1e-6, count: n });
const b = (n: number): RefBranch => ({ r: 20e-3, l: 0.4e-9 + 0.2e-9, c: 100e-9, count: n });

describe('each change alone', () => {
  const before = { plan: planFromYaml([A_BEFORE, B, X], plan([4, 4])), perDecade: 20 };
  const after = { plan: planFromYaml([A_AFTER, B, X], plan([3, 8])), perDecade: 20 };
  const earlier = part(A_BEFORE);

  it('the reference sees the two changes pull opposite ways, so the attribution has something to tell', () => {
    expect(reference([aBefore(4), b(4)]).pass).toBe(true);
    expect(reference([aAfter(4), b(4)]).pass).toBe(false);
    expect(reference([aBefore(3), b(8)]).marginDb).toBeGreaterThan(reference([aBefore(4), b(4)]).marginDb);
  });

  it('the part’s change alone: the earlier counts with the part as it is now, at its new package’s mounting', () => {
    const got = withPartChange(before, 'A', after.plan.placements[0].part);
    const want = reference([aAfter(4), b(4)]);
    expect(got.pass).toBe(want.pass);
    expect(Math.abs(got.worstMarginDb - want.marginDb)).toBeLessThan(1e-6);
  });

  it('the plan’s change alone: the counts as they are now with each part as it was', () => {
    const got = withPlanChange(after, (p) => (p.id === 'A' ? earlier : undefined), 20);
    const want = reference([aBefore(3), b(8)]);
    expect(got.pass).toBe(want.pass);
    expect(Math.abs(got.worstMarginDb - want.marginDb)).toBeLessThan(1e-6);
  });

  it('the settings’ change alone: a coarser sweep finds the same refined worst peak', () => {
    const want = reference([aBefore(4), b(4)]);
    for (const perDecade of [5, 50]) {
      const got = withSettingsChange(before, perDecade);
      expect(got.pass).toBe(want.pass);
      expect(Math.abs(got.worstMarginDb - want.marginDb)).toBeLessThan(1e-6);
    }
  });
});

describe('swapParts', () => {
  it('an entry’s own mounting stays with the entry; a mounting from the package table follows the new part', () => {
    const p = planFromYaml([A_BEFORE, B, X], plan([4, 4]).replace('{part: A, count: 4}', '{part: A, count: 4, mounting: 0.8n}'));
    const later = part(A_AFTER);
    const swapped = swapParts(p, p.placements, (x) => (x.id === 'A' ? later : x.id === 'B' ? x : undefined));
    expect(swapped[0]).toMatchObject({ part: later, count: 4, mountingH: 0.8e-9, mountingFrom: 'entry' });
    expect(swapped[1].mountingFrom).toBe('package');
    expect(swapped[1].mountingH).toBeCloseTo(0.2e-9, 20);
    const fromTable = swapParts(before(), before().placements, (x) => (x.id === 'A' ? later : undefined));
    expect(fromTable[0]).toMatchObject({ part: later, mountingFrom: 'package' });
    expect(fromTable[0].mountingH).toBeCloseTo(0.35e-9, 20);
    // Nothing named: the placements are the same objects.
    expect(swapParts(p, p.placements, () => undefined)).toEqual(p.placements);
  });
  function before() {
    return planFromYaml([A_BEFORE, B, X], plan([4, 4]));
  }
});
