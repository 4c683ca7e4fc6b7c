// A plan's rail at its corners, as the figures a page and `plan --json` read: the moving quantities, the worst
// corner part by part (value and parasitic extremes), the corners that fail, and the envelope of |Z| drawn on
// the rail chart. Checked against the evaluator written for the tests (rail-reference.ts: complex.js element
// impedances, a dense log sweep, golden-section refinement of every local maximum) over the eight corners
// enumerated here, each part's extremes written out from its tolerance, its parasitic's stated spread and its
// EIA-198-1 code (X7R: ±15 %), never taken from zfolio. Values invented.

import { describe, expect, it } from 'vitest';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { cornerElement } from '../../src/analysis/plan-corners.js';
import { spreadFactors } from '../../src/analysis/part-spread.js';
import { planFromYaml } from './plan-from-yaml.js';
import { denseSweep, railMagnitude, worstOverBand, type RefBranch } from './rail-reference.js';
import { referenceZAt } from '../reference/impedance.js';

const OPERATING = { fromC: 0, toC: 70 };
const MOUNTING = 0.3e-9;
const TARGET = 0.04;

// A: 10 µF ±20 %, its ESL 0.5 nH −20 %/+40 %; B: 100 nF ±10 % X7R; C: 1 µF with no spread (does not move).
// No regulator: the worst is the anti-resonance of A's inductance with B's capacitance near 13 MHz, where
// every moving quantity counts (A's value least: the worst corner beats the next by 0.2 %).
const A = 'id: A\nkind: capacitor\nnominal: 10u\ntolerance: 20%\nvoltage: 6.3V\nparasitics: {esr: 3m, esl: 0.5n +40%/-20%}\n';
const B = 'id: B\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nvoltage: 6.3V\ndielectric: X7R\nparasitics: {esr: 20m, esl: 0.4n}\n';
const C = 'id: C\nkind: capacitor\nnominal: 1u\nvoltage: 6.3V\nparasitics: {esr: 8m, esl: 0.45n}\n';
const PLAN =
  `rail: R\nvoltage: 1V\ntarget: ${TARGET * 1e3}m\nband: {from: 1M, to: 25M}\nmounting: 0.3n\n` +
  'capacitors: [{part: A, count: 3}, {part: B, count: 8}, {part: C, count: 2}]\n';

const aValue = [0.8, 1.2];
const aEsl = [0.5e-9 * 0.8, 0.5e-9 * 1.4];
const bValue = [0.9 * 0.85, 1.1 * 1.15];

/** The rail as the test writes it: [A value high?, A ESL high?, B value high?]. */
function branches(corner: readonly boolean[] | null): RefBranch[] {
  const [av, al, bv] = corner ?? [null, null, null];
  const pick = (ends: number[], high: boolean | null, nominal: number) => (high === null ? nominal : ends[high ? 1 : 0]);
  return [
    { r: 3e-3, l: pick(aEsl, al, 0.5e-9) + MOUNTING, c: 10e-6 * pick(aValue, av, 1), count: 3 },
    { r: 20e-3, l: 0.4e-9 + MOUNTING, c: 100e-9 * pick(bValue, bv, 1), count: 8 },
    { r: 8e-3, l: 0.45e-9 + MOUNTING, c: 1e-6, count: 2 },
  ];
}

const corners: boolean[][] = [0, 1, 2, 3, 4, 5, 6, 7].map((n) => [(n & 4) !== 0, (n & 2) !== 0, (n & 1) !== 0]);

describe('a plan at the corners of its parts’ spreads', () => {
  const plan = planFromYaml([A, B, C], PLAN, OPERATING);
  const figures = analysePlan(plan, 40, plan.placements, [], { loadStep: false, operating: OPERATING });
  const c = figures.corners!;
  const sweep = denseSweep(1e6, 25e6, 3000);
  const reference = corners.map((corner) => {
    const b = branches(corner);
    return { corner, ...worstOverBand(b, sweep, Float64Array.from(sweep, (f) => railMagnitude(b, f))) };
  });
  const worst = reference.reduce((w, r) => (r.impedanceOhm > w.impedanceOhm ? r : w));

  it('names the moving quantities with their multipliers; the part without spread is not among them', () => {
    expect(c.method).toBe('all');
    expect(c.evaluated).toBe(8);
    expect(c.possible).toBe(8);
    expect(c.seed).toBeNull();
    expect(c.temperature).toEqual(OPERATING);
    expect(c.factors).toEqual([
      { partId: 'A', quantity: 'value', low: expect.closeTo(aValue[0], 12), high: expect.closeTo(aValue[1], 12) },
      { partId: 'A', quantity: 'esl', low: expect.closeTo(0.8, 12), high: expect.closeTo(1.4, 12) },
      { partId: 'B', quantity: 'value', low: expect.closeTo(bValue[0], 12), high: expect.closeTo(bValue[1], 12) },
    ]);
  });

  it('the worst corner, its |Z|, margin and frequency, and the failing count, as the enumeration finds them', () => {
    // The case has a verdict to give: some corners fail, not all, and the worst is a single corner.
    const failing = reference.filter((r) => r.impedanceOhm > TARGET).length;
    expect(failing).toBeGreaterThan(0);
    expect(failing).toBeLessThan(8);
    const second = Math.max(...reference.filter((r) => r !== worst).map((r) => r.impedanceOhm));
    expect(worst.impedanceOhm / second).toBeGreaterThan(1.001);
    expect(c.failing).toBe(failing);
    expect(c.pass).toBe(false);
    expect(Math.abs(c.worstImpedanceOhm / worst.impedanceOhm - 1)).toBeLessThan(1e-9);
    expect(Math.abs(c.worstMarginDb - 20 * Math.log10(TARGET / worst.impedanceOhm))).toBeLessThan(1e-8);
    expect(Math.abs(c.worstFrequencyHz / worst.frequencyHz - 1)).toBeLessThan(1e-5);
    const side = (high: boolean) => (high ? 'high' : 'low');
    expect(c.extremes).toEqual({ A: side(worst.corner[0]), B: side(worst.corner[2]) });
    expect(c.parasiticExtremes).toEqual({ A: { esl: side(worst.corner[1]) } });
  });

  it('the envelope at every sweep point holds the least and greatest |Z| of the eight corners and the nominal rail', () => {
    const f = figures.frequenciesHz;
    expect(c.envelope!.minOhm).toHaveLength(f.length);
    f.forEach((hz, i) => {
      const values = [...corners.map((corner) => railMagnitude(branches(corner), hz)), railMagnitude(branches(null), hz)];
      expect(Math.abs(c.envelope!.minOhm[i] / Math.min(...values) - 1)).toBeLessThan(1e-9);
      expect(Math.abs(c.envelope!.maxOhm[i] / Math.max(...values) - 1)).toBeLessThan(1e-9);
    });
  });
});

describe('cornerElement', () => {
  it('a part at a combination of its extremes, at the rail’s DC bias, in series with its mounting', () => {
    const plan = planFromYaml([A, B, C], PLAN, OPERATING);
    const a = plan.placements.find((p) => p.part.id === 'A')!.part;
    const factors = spreadFactors(a, OPERATING);
    const element = cornerElement(a, factors, [true, false], 1, MOUNTING);
    // No DC-bias curve stated: the value is tolerance only; R + jωL + 1/(jωC) written out here.
    for (const hz of [1e4, 2.2e6, 80e6]) {
      const w = 2 * Math.PI * hz;
      const z = referenceZAt(element, hz);
      expect(z.re).toBeCloseTo(3e-3, 12);
      expect(Math.abs(z.im / (w * (aEsl[0] + MOUNTING) - 1 / (w * 10e-6 * aValue[1])) - 1)).toBeLessThan(1e-12);
    }
    // A part with no factors is its own model, placed.
    const plain = plan.placements.find((p) => p.part.id === 'C')!.part;
    const zc = referenceZAt(cornerElement(plain, [], [], 1, MOUNTING), 1e6);
    const w = 2 * Math.PI * 1e6;
    expect(Math.abs(zc.im / (w * (0.45e-9 + MOUNTING) - 1 / (w * 1e-6)) - 1)).toBeLessThan(1e-12);
  });
});
