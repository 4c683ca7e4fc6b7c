import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyseLoadStep, rippleBudget } from '../../src/analysis/load-step.js';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPlan } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('the ripple budget', () => {
  it('is V × ripple with ripple and step (the allowed excursion the target impedance comes from, Smith et al. 1999)', () => {
    expect(rippleBudget(0.9, { kind: 'ripple', ripple: 0.03, stepA: 2.5 })).toEqual({ budgetV: 0.9 * 0.03, from: 'ripple' });
  });
  it('is target × step for an explicit target with a step, and there is none without a step', () => {
    expect(rippleBudget(1, { kind: 'explicit', ohms: 0.01, stepA: 3 })).toEqual({ budgetV: 0.03, from: 'target' });
    expect(rippleBudget(1, { kind: 'explicit', ohms: 0.01 })).toBeNull();
  });
});

describe('the verdict, against a closed form', () => {
  // The regulator R + L with one capacitor C: the series RLC loop of Alexander & Sadiku, Fundamentals of
  // Electric Circuits, 6th ed., §8.5. For a step I with t_r ≪ the period, v = −I·[L·(ω0²/ωd)·e^{−αt}·sin ωd·t
  // + R·(1 − e^{−αt}(cos ωd·t + (α/ωd)·sin ωd·t))]; its deepest dip is found here by a dense sweep.
  const [R, L, C, I] = [2e-3, 10e-9, 100e-6, 2];
  const alpha = R / (2 * L);
  const w0 = 1 / Math.sqrt(L * C);
  const wd = Math.sqrt(w0 * w0 - alpha * alpha);
  const v = (t: number) => -I * (L * (w0 * w0 / wd) * Math.exp(-alpha * t) * Math.sin(wd * t) + R * (1 - Math.exp(-alpha * t) * (Math.cos(wd * t) + (alpha / wd) * Math.sin(wd * t))));
  let deepest = 0;
  for (let i = 1; i <= 200_000; i++) deepest = Math.min(deepest, v((i / 200_000) * (Math.PI / wd)));
  const branches = [
    { kind: 'regulator' as const, label: 'regulator', element: series(resistor(R), inductor(L)), count: 1 },
    { kind: 'capacitor' as const, label: '1 × C', element: capacitor(C), count: 1 },
  ];
  const rise = (2 * Math.PI) / wd / 1e6;
  const plan = (ripple: number) => ({ voltageV: 1, target: { kind: 'ripple' as const, ripple, stepA: I }, band: { fromHz: 1e3, toHz: 1e8 }, riseS: rise, durationS: undefined });

  it('the droop agrees with the closed form (to 1e-4: the dense sweep and the 1e-6 rise)', () => {
    const t = analyseLoadStep(plan(0.05), branches)!;
    expect(rel(t.droopV, -deepest)).toBeLessThan(1e-4);
    expect(t.riseFrom).toBe('plan');
    expect(t.durationFrom).toBe('poles');
  });
  it('passes with a budget just above the droop and fails just below it', () => {
    expect(analyseLoadStep(plan((-deepest * 1.001) / 1), branches)!.pass).toBe(true);
    expect(analyseLoadStep(plan((-deepest * 0.999) / 1), branches)!.pass).toBe(false);
  });
  it('the ringing rises above the DC value, and a budget below that rise fails even when the dip is within it', () => {
    const t = analyseLoadStep(plan(0.05), branches)!;
    // The first maximum after the dip, half a period later (closed form, dense sweep).
    let highest = -Infinity;
    for (let i = 0; i <= 200_000; i++) highest = Math.max(highest, v(Math.PI / wd + (i / 200_000) * (Math.PI / wd)));
    expect(rel(t.overshootV, highest)).toBeLessThan(1e-4);
    expect(t.overshootV).toBeLessThan(t.droopV);
  });
  it('a rail with capacitors only has no DC path and fails, whatever the budget', () => {
    const t = analyseLoadStep({ ...plan(0.5), riseS: 1e-8 }, [branches[1]])!;
    expect(t.dcPath).toBe(false);
    expect(t.finalV).toBeNull();
    expect(t.pass).toBe(false);
  });
});

describe('from a plan file', () => {
  const { library } = loadLibrary(fileURLToPath(new URL('../fixtures/rail-library', import.meta.url)));
  const read = (text: string) => {
    const diagnostics = new DiagnosticList();
    return readPlan({ source: parseYamlSource('plans/t.yaml', text, diagnostics)!, diagnostics }, library!.partsById, 0.8)!;
  };
  it('takes rise 0.35/band.to by default and the final offset −R·ΔI of the regulator (leakage aside)', () => {
    const f = analysePlan(library!.plans.find((p) => p.rail === 'VDD_TEST')!, 50);
    const t = f.transient!;
    expect(t.riseS).toBeCloseTo(0.35 / 100e6, 20);
    expect(t.riseFrom).toBe('band');
    expect(t.budgetV).toBeCloseTo(1.0 * 0.05, 15);
    // 3 mΩ × 2 A, less what the capacitors' insulation resistance (parallel to it) takes.
    expect(rel(t.finalV!, -3e-3 * 2)).toBeLessThan(1e-6);
    expect(t.curves.shares).toHaveLength(f.branches.length);
    // Every branch's share adds up to the load at every drawn time (the load is 1 after the ramp).
    t.curves.timesS.forEach((time, i) => {
      const sum = t.curves.shares.reduce((s, h) => s + h[i], 0);
      expect(Math.abs(sum - Math.min(time / t.riseS, 1))).toBeLessThan(1e-6);
    });
    expect(t.fitError).toBeLessThan(1e-9);
  });
  it('a plan with an explicit target and no step has no load step', () => {
    expect(analysePlan(library!.plans.find((p) => p.rail === 'VDD_WEAK')!, 50).transient).toBeNull();
  });
  it('an explicit target with a step is judged against target × step', () => {
    const p = read('rail: T\nvoltage: 1V\ntarget: 10m\nstep: 2A\nrise: 5n\nduration: 50u\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\nregulator: {r: 2m, l: 15nH}\ncapacitors:\n  - {part: RT-C-22U, count: 4}\n');
    const t = analysePlan(p, 50).transient!;
    expect(t).toMatchObject({ budgetV: 0.02, budgetFrom: 'target', riseS: 5e-9, durationS: 50e-6, durationFrom: 'plan' });
  });
});

describe('an unresolved response', () => {
  it('gives no verdict and no curves', () => {
    const t = analyseLoadStep({ voltageV: 1, target: { kind: 'ripple', ripple: 0.05, stepA: 2 }, band: { fromHz: 1e3, toHz: 1e8 }, riseS: undefined, durationS: undefined }, [
      { kind: 'regulator', label: 'regulator', element: series(resistor(1e-9), inductor(1e6)), count: 1 },
      { kind: 'capacitor', label: '7 × C', element: series(resistor(1), inductor(1e-3), capacitor(1)), count: 7 },
      { kind: 'plane', label: 'plane', element: series(capacitor(1e-12), resistor(1)), count: 1 },
    ])!;
    expect(t.resolved).toBe(false);
    expect(t.pass).toBe(false);
    expect(t.curves.timesS).toEqual([]);
  });
});
