import { describe, expect, it } from 'vitest';
import { analysePlan, planFiguresWithoutCurves, planTargetOhm } from '../../src/analysis/plan-figures.js';
import { planFromYaml } from './plan-from-yaml.js';
import { denseSweep, railMagnitude, worstOverBand, type RefBranch } from './rail-reference.js';

// A rail plan's figures checked against the test's own evaluator (rail-reference.ts: complex.js element
// impedances, a dense sweep of 2,000 points a decade, golden-section refinement of each peak). The target
// impedance is Z_t = V·ripple/ΔI, the target-impedance method of power-distribution design (L. D. Smith et
// al., "Power distribution system design methodology and capacitor selection for modern CMOS technology",
// IEEE Trans. Advanced Packaging 22(3), 1999; cited from memory). Parts and plan are invented.

const A = 'id: A\nkind: capacitor\nnominal: 10u\nvoltage: 6.3V\npackage: "0805"\ncost: 0.12\nparasitics: {esr: 3m, esl: 0.5n}\n';
const B = 'id: B\nkind: capacitor\nnominal: 100n\nvoltage: 6.3V\npackage: "0402"\ncost: 0.01\nparasitics: {esr: 20m, esl: 0.4n}\n';
const C = 'id: C\nkind: capacitor\nnominal: 1u\nvoltage: 6.3V\npackage: "0402"\nparasitics: {esr: 10m, esl: 0.45n}\n';

const PLAN = `rail: VTEST
voltage: 1.0V
ripple: 5%
step: 2A
band: {from: 100k, to: 100M}
mounting: 0.3nH
mounting-by-package: {"0402": 0.2nH}
regulator: {r: 2m, l: 20nH}
capacitors:
  - {part: A, count: 4}
  - {part: B, count: 10, mounting: 0.15nH}
  - {part: C, count: 3}
`;

// The same rail as the reference sees it: ESL plus the mounting each placement gets.
const reference: RefBranch[] = [
  { r: 2e-3, l: 20e-9, c: 0, count: 1 },
  { r: 3e-3, l: 0.5e-9 + 0.3e-9, c: 10e-6, count: 4 },
  { r: 20e-3, l: 0.4e-9 + 0.15e-9, c: 100e-9, count: 10 },
  { r: 10e-3, l: 0.45e-9 + 0.2e-9, c: 1e-6, count: 3 },
];

describe('analysePlan', () => {
  const plan = planFromYaml([A, B, C], PLAN);
  const f = analysePlan(plan, 50, plan.placements, [], { loadStep: false });
  const sweep = denseSweep(1e5, 1e8, 2000);
  const worst = worstOverBand(reference, sweep, Float64Array.from(sweep, (x) => railMagnitude(reference, x)));

  it('target impedance V·ripple/ΔI: 1 V × 5 % / 2 A = 25 mΩ', () => {
    expect(f.targetOhm).toBeCloseTo(0.025, 15);
    expect(planTargetOhm(1, { kind: 'explicit', ohms: 0.004 })).toBe(0.004);
  });
  it('worst |Z| over the band, where it is, and the verdict, as the dense reference finds them', () => {
    expect(f.worstImpedanceOhm / worst.impedanceOhm).toBeCloseTo(1, 6);
    expect(Math.abs(Math.log(f.worstFrequencyHz / worst.frequencyHz))).toBeLessThan(1e-3);
    expect(f.pass).toBe(worst.impedanceOhm <= 0.025);
    // Margin in dB: 20·log10(Z_t/|Z|), positive when the rail is under its target.
    expect(f.worstMarginDb).toBeCloseTo(20 * Math.log10(0.025 / worst.impedanceOhm), 4);
  });
  it('|Z| at each sweep point as complex.js gives it', () => {
    expect(f.frequenciesHz).toHaveLength(151);
    f.frequenciesHz.forEach((x, k) => expect(f.impedanceOhm[k] / railMagnitude(reference, x)).toBeCloseTo(1, 12));
  });
  it('each placement’s mounting and where it comes from: rail, entry, package table', () => {
    expect(f.placements.map((p) => [p.partId, p.mountingH, p.mountingFrom])).toEqual([
      ['A', 0.3e-9, 'rail'],
      ['B', 0.15e-9, 'entry'],
      ['C', 0.2e-9, 'package'],
    ]);
  });
  it('totals: 17 placements; no total cost while a part has none', () => {
    expect(f.totalPlacements).toBe(17);
    expect(f.totalCost).toBeNull();
    const priced = planFromYaml([A, B], PLAN.replace('  - {part: C, count: 3}\n', ''));
    // 4 × 0.12 + 10 × 0.01 = 0.58
    expect(analysePlan(priced, 10, priced.placements, [], { loadStep: false }).totalCost).toBeCloseTo(0.58, 12);
  });
  it('every figure but the curves, for --json', () => {
    const plain = planFiguresWithoutCurves(f);
    expect(plain.frequenciesHz).toBeUndefined();
    expect(plain.impedanceOhm).toBeUndefined();
    expect(plain.worstImpedanceOhm).toBe(f.worstImpedanceOhm);
    expect(plain.branches).toEqual(f.branches.map((b) => ({ kind: b.kind, label: b.label, partId: b.partId, count: b.count })));
  });
});
