import { describe, expect, it } from 'vitest';
import { analyseLoadStep } from '../../src/analysis/load-step.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { describeLoadStep } from '../../src/present/plan-chart-descriptions.js';
import { niceStep } from '../../src/charts/axes.js';
import { loadShareChart, loadStepChart, renderLoadStepCharts } from '../../src/charts/load-step-chart.js';
import { loadStepChartInput, type LoadStepChartData } from '../../src/charts/load-step-data.js';
import { formatEng } from '../../src/units/format.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;

// An invented rail: regulator, a bulk capacitor pair and a small one.
const branches = [
  { kind: 'regulator' as const, label: 'regulator', element: series(resistor(2e-3), inductor(12e-9)), count: 1 },
  { kind: 'capacitor' as const, label: '2 × bulk', element: series(resistor(8e-3), inductor(1e-9), capacitor(47e-6)), count: 2 },
  { kind: 'capacitor' as const, label: '8 × small', element: series(resistor(20e-3), inductor(0.4e-9), capacitor(1e-6)), count: 8 },
];
const t = analyseLoadStep({ voltageV: 1, target: { kind: 'ripple', ripple: 0.03, stepA: 2 }, band: { fromHz: 1e5, toHz: 5e7 }, riseS: undefined, durationS: undefined }, branches)!;
const data: LoadStepChartData = loadStepChartInput('VDD_X', t, branches.map((b) => b.label));

describe('load-step charts', () => {
  it('draw v(t) with the budget either way, the final offset, the ramp and the deepest dip labelled', async () => {
    const { voltage } = await renderLoadStepCharts(data);
    const texts = svgTexts(voltage.svg);
    for (const s of ['v(t) for a 2 A step', 'budget ±30 mV', `final ${formatEng(t.finalV!, 'V')}`, 'deepest dip', `load ramp, ${formatEng(t.riseS, 's')}`, `−${formatEng(t.droopV, 'V')} at ${formatEng(t.atS, 's')}`]) expect(texts).toContain(s);
    const { curves, points } = (voltage.spec as { datasets: Rows }).datasets;
    expect(new Set(curves.filter((r) => r.s === 'budget').map((r) => r.v))).toEqual(new Set([-t.budgetV, t.budgetV]));
    // The curve passes through the refined dip, which is marked.
    expect(curves.some((r) => r.s === 'voltage' && r.f === t.atS && r.v === -t.droopV)).toBe(true);
    expect(points.map((p) => [p.f, p.v])).toEqual([[t.atS, -t.droopV]]);
  });

  it('draw each branch\'s share of the load current in the rail chart\'s branch styles, keyed by label', async () => {
    const { share } = await renderLoadStepCharts(data);
    const texts = svgTexts(share.svg);
    for (const b of branches) expect(texts).toContain(b.label);
    const rows = (share.spec as { datasets: Rows }).datasets.branches;
    expect(new Set(rows.map((r) => r.p))).toEqual(new Set([0, 1, 2]));
  });

  it('have a log time axis from a tenth of the rise time and a linear voltage axis holding the budget', () => {
    const v = loadStepChart.bind(data);
    expect(v.params.fDomain).toEqual([t.riseS / 10, t.durationS]);
    const [lo, hi] = v.params.yDomain as [number, number];
    expect(lo).toBeLessThanOrEqual(-t.budgetV);
    expect(hi).toBeGreaterThanOrEqual(t.budgetV);
    const s = loadShareChart.bind(data);
    const [slo, shi] = s.params.yDomain as [number, number];
    expect(slo).toBeLessThanOrEqual(0);
    expect(shi).toBeGreaterThanOrEqual(1);
  });

  it('describe what they show in words', () => {
    const text = describeLoadStep(data);
    expect(text.voltage.title).toBe('VDD_X: voltage after a 2 A load step');
    expect(text.voltage.description).toContain(`The deepest dip is ${formatEng(t.droopV, 'V')} at ${formatEng(t.atS, 's')}`);
    // After the step the regulator carries it all (the capacitors block DC), to the 0.1% its ringing keeps
    // at the end of the default duration.
    expect(text.share.description).toMatch(/regulator ends at (99\.9|100|100\.1)%/);
  });

  it('tick steps are 1, 2 or 5 × 10^k', () => {
    expect(niceStep(0.07, 6)).toBeCloseTo(0.01, 15);
    expect(niceStep(1.6, 5)).toBeCloseTo(0.2, 15);
    expect(niceStep(1.2, 6)).toBeCloseTo(0.2, 15);
    expect(niceStep(40, 6)).toBeCloseTo(5, 15);
  });
});
