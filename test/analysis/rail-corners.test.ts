// A rail at its corners, checked against an evaluator written in the test (rail-reference.ts: complex.js
// element impedances, a dense log sweep, golden-section refinement of every local maximum): the four
// corners of a two-part rail enumerated here, with each part's extremes written out from its tolerance and
// EIA-198-1 code (X7R: ±15%), never taken from zfolio.

import { describe, expect, it } from 'vitest';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { cornerCombinations, MAX_ENUMERATED, SAMPLED_CORNERS } from '../../src/analysis/rail-corners.js';
import type { Plan } from '../../src/model/plan.js';
import { planFromYaml } from './plan-from-yaml.js';
import { denseSweep, railMagnitude, worstOverBand, type RefBranch } from './rail-reference.js';

const OPERATING = { fromC: 0, toC: 70 };

const plan = (partFiles: string[], planFile: string): Plan => planFromYaml(partFiles, planFile, OPERATING);

const A = 'id: A\nkind: capacitor\nnominal: 10u\ntolerance: 20%\nvoltage: 6.3V\nparasitics: {esr: 3m, esl: 0.5n}\n';
const B = 'id: B\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nvoltage: 6.3V\ndielectric: X7R\nparasitics: {esr: 20m, esl: 0.4n}\n';

/** The reference worst over the band of every corner: [A high?, B high?] → worst |Z| and where. */
function referenceCorners(branches: (kA: number, kB: number) => RefBranch[], kA: [number, number], kB: [number, number], fromHz: number, toHz: number) {
  const sweep = denseSweep(fromHz, toHz, 4000);
  return [false, true].flatMap((aHigh) =>
    [false, true].map((bHigh) => {
      const b = branches(kA[aHigh ? 1 : 0], kB[bHigh ? 1 : 0]);
      const sampled = Float64Array.from(sweep, (f) => railMagnitude(b, f));
      return { aHigh, bHigh, ...worstOverBand(b, sweep, sampled) };
    }),
  );
}

describe('a rail of two parts at its four corners', () => {
  // A: 10 µF ±20%; B: 100 nF ±10% X7R (±15% over its range, whatever part of it the rail sees).
  const kA: [number, number] = [0.8, 1.2];
  const kB: [number, number] = [0.9 * 0.85, 1.1 * 1.15];

  for (const perDecade of [100, 10]) {
    it(`worst margin, frequency and extremes as the test's own enumeration finds them (sweep of ${perDecade} a decade)`, () => {
      const p = plan([A, B], 'rail: R\nvoltage: 1V\ntarget: 200m\nband: {from: 100k, to: 100M}\nmounting: 0.3n\nregulator: {r: 2m, l: 20n}\ncapacitors: [{part: A, count: 4}, {part: B, count: 10}]\n');
      const f = analysePlan(p, perDecade, p.placements, [], { loadStep: false, operating: OPERATING });
      const reference = referenceCorners(
        (a, b) => [
          { r: 2e-3, l: 20e-9, c: 0, count: 1 },
          { r: 3e-3, l: 0.8e-9, c: 10e-6 * a, count: 4 },
          { r: 20e-3, l: 0.7e-9, c: 100e-9 * b, count: 10 },
        ],
        kA,
        kB,
        100e3,
        100e6,
      );
      const worst = reference.reduce((w, c) => (c.impedanceOhm > w.impedanceOhm ? c : w));
      const c = f.corners!;
      expect(c.method).toBe('all');
      expect(c.evaluated).toBe(4);
      // Both searches refine to about 1e-12 in f; |Z| at a smooth maximum is flat there.
      expect(Math.abs(c.worstImpedanceOhm / worst.impedanceOhm - 1)).toBeLessThan(1e-9);
      expect(Math.abs(c.worstMarginDb - 20 * Math.log10(0.2 / worst.impedanceOhm))).toBeLessThan(1e-8);
      expect(Math.abs(c.worstFrequencyHz / worst.frequencyHz - 1)).toBeLessThan(1e-5);
      expect(c.extremes).toEqual({ A: worst.aHigh ? 'high' : 'low', B: worst.bHigh ? 'high' : 'low' });
      expect(c.failing).toBe(reference.filter((r) => r.impedanceOhm > 0.2).length);
      // The nominal verdict passes; a corner does not.
      expect(f.pass).toBe(true);
      expect(c.pass).toBe(false);
    });
  }

  it('a narrow anti-resonance between sweep points is found at every corner (high Q, 5 points a decade)', () => {
    const low = 'id: A\nkind: capacitor\nnominal: 10u\ntolerance: 20%\nvoltage: 6.3V\nparasitics: {esr: 0.05m, esl: 0.5n}\n';
    const high = 'id: B\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nvoltage: 6.3V\ndielectric: X7R\nparasitics: {esr: 0.2m, esl: 0.4n}\n';
    const p = plan([low, high], 'rail: R\nvoltage: 1V\ntarget: 50m\nband: {from: 1M, to: 200M}\nmounting: 0.1n\ncapacitors: [{part: A, count: 2}, {part: B, count: 2}]\n');
    const f = analysePlan(p, 5, p.placements, [], { loadStep: false, operating: OPERATING });
    const reference = referenceCorners(
      (a, b) => [
        { r: 0.05e-3, l: 0.6e-9, c: 10e-6 * a, count: 2 },
        { r: 0.2e-3, l: 0.5e-9, c: 100e-9 * b, count: 2 },
      ],
      kA,
      kB,
      1e6,
      200e6,
    );
    const worst = reference.reduce((w, c) => (c.impedanceOhm > w.impedanceOhm ? c : w));
    expect(worst.impedanceOhm).toBeGreaterThan(1);
    expect(Math.abs(f.corners!.worstImpedanceOhm / worst.impedanceOhm - 1)).toBeLessThan(1e-6);
    expect(f.corners!.extremes).toEqual({ A: worst.aHigh ? 'high' : 'low', B: worst.bHigh ? 'high' : 'low' });
  });

  it('a part without spread does not move; a rail of such parts has no corners', () => {
    const plain = 'id: P\nkind: capacitor\nnominal: 1u\nvoltage: 6.3V\nparasitics: {esr: 5m, esl: 0.5n}\n';
    const p = plan([plain], 'rail: R\nvoltage: 1V\ntarget: 50m\nband: {from: 1M, to: 100M}\nmounting: 0.1n\ncapacitors: [{part: P, count: 2}]\n');
    const f = analysePlan(p, 50, p.placements, [], { loadStep: false, operating: OPERATING });
    expect(f.corners).toMatchObject({ method: 'none', evaluated: 0, pass: f.pass, worstMarginDb: f.worstMarginDb, extremes: {} });
  });
});

describe('which corners are evaluated', () => {
  it(`every combination up to ${MAX_ENUMERATED} quantities`, () => {
    const { method, corners } = cornerCombinations(3, 1);
    expect(method).toBe('all');
    expect(new Set(corners.map((c) => c.join()))).toHaveProperty('size', 8);
  });

  it(`above that, ${SAMPLED_CORNERS} seeded random corners plus all-low and all-high, the same every time`, () => {
    const a = cornerCombinations(12, 42);
    const b = cornerCombinations(12, 42);
    expect(a.method).toBe('sample');
    expect(a.corners).toEqual(b.corners);
    // 2^12 = 4,096 combinations: some of the 2,000 draws repeat, and each is evaluated once.
    expect(a.corners.length).toBeGreaterThan(1500);
    expect(a.corners.length).toBeLessThanOrEqual(SAMPLED_CORNERS + 2);
    expect(a.corners[0]).toEqual(new Array(12).fill(false));
    expect(a.corners[1]).toEqual(new Array(12).fill(true));
    expect(cornerCombinations(12, 43).corners).not.toEqual(a.corners);
  });
});
