import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { loadStepFacts, loadStepVerdict } from '../../src/present/load-step-words.js';
import { planPageData } from '../../src/pages/plan-page.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPlan } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';

// The words a plan page, a review pack and `zfolio plan` use for the load step (fixture library, invented).
const { library } = loadLibrary(fileURLToPath(new URL('../fixtures/rail-library', import.meta.url)));
const read = (text: string) => {
  const diagnostics = new DiagnosticList();
  return readPlan({ source: parseYamlSource('plans/t.yaml', text, diagnostics)!, diagnostics }, library!.partsById, 0.8)!;
};
const BASE = 'rail: T\nvoltage: 1V\nripple: 3%\nstep: 2A\nband: {from: 100k, to: 50M}\nmounting: 0.3nH\n';

describe('load-step text', () => {
  it('a rail with a regulator: the dip, the budget and the settling time', () => {
    const f = analysePlan(read(BASE + 'regulator: {r: 1m, l: 10nH}\ncapacitors:\n  - {part: RT-C-22U, count: 6}\n  - {part: RT-C-100N, count: 8}\n'), 50);
    const t = f.transient!;
    expect(loadStepVerdict(f)).toMatch(/^dips \S+ [mµn]V at \S+ [mµn]?s \(budget 30 mV\), settles by \S+ [mµn]?s$/);
    const facts = loadStepFacts(f);
    expect(facts.map((r) => r.label)).toEqual(['Load step', 'Ripple budget', 'Deepest dip', 'Highest rise', 'Final offset', 'Settling', 'Followed for']);
    expect(facts[1].value).toBe('30 mV = 1 V × 3%');
    expect(facts[4].value).toBe('−2 mV');
    const page = planPageData(f, 'hash', undefined, undefined);
    expect(page.loadStep).toMatchObject({ pass: t.pass, verdict: loadStepVerdict(f) });
    expect(page.loadStep!.caution).toContain('without its control loop');
  });

  it('a rail of capacitors alone keeps falling, and says so', () => {
    const f = analysePlan(read(BASE + 'capacitors:\n  - {part: RT-C-22U, count: 6}\n'), 50);
    expect(f.transient!.pass).toBe(false);
    expect(loadStepVerdict(f)).toContain('keeps falling: no DC path holds the rail');
    expect(loadStepFacts(f).find((r) => r.label === 'Final offset')!.value).toBe('none: the rail keeps falling');
  });

  it('a plan without a step says why there is no load step', () => {
    const f = analysePlan(read(BASE.replace('ripple: 3%\nstep: 2A\n', 'target: 10m\n') + 'regulator: {r: 1m}\n'), 50);
    const page = planPageData(f, 'hash', undefined, undefined);
    expect(page.loadStep).toBeNull();
    expect(page.loadStepNote).toBe('No load step: the plan gives its target without a step current ("step" beside "target" adds one).');
  });
});

describe('a response not computed to its accuracy', () => {
  it('is NO VERDICT, with the reason, and no facts', async () => {
    const { analyseLoadStep } = await import('../../src/analysis/load-step.js');
    const { capacitor, inductor, resistor, series } = await import('../../src/circuit/element.js');
    const { loadStepStatus, loadStepLines } = await import('../../src/present/load-step-words.js');
    const target = { kind: 'ripple' as const, ripple: 0.05, stepA: 2 };
    const transient = analyseLoadStep({ voltageV: 1, target, band: { fromHz: 1e3, toHz: 1e8 }, riseS: undefined, durationS: undefined }, [
      { kind: 'regulator', label: 'regulator', element: series(resistor(1e-9), inductor(1e6)), count: 1 },
      { kind: 'capacitor', label: '7 × C', element: series(resistor(1), inductor(1e-3), capacitor(1)), count: 7 },
      { kind: 'plane', label: 'plane', element: series(capacitor(1e-12), resistor(1)), count: 1 },
    ]);
    const f = { transient, target, voltageV: 1, targetOhm: 0.025 };
    expect(loadStepStatus(f)).toBe('NO VERDICT');
    expect(loadStepVerdict(f)).toMatch(/^not computed: the rail's element values lie too far apart/);
    expect(loadStepFacts(f)).toEqual([]);
    expect(loadStepLines(f)).toHaveLength(1);
  });
});
