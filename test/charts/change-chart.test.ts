// The before-and-after chart: both curves on common axes, each in its own style, marks on each, a rail's
// targets, and the text alternative.

import { describe, expect, it } from 'vitest';
import { changeChart, renderChangeChart, type ChangeChartData, type ChangeCurve } from '../../src/charts/change-chart.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;

/** |Z| of a series R-L-C (ESR + ESL + C) on a log sweep: the textbook series model (Alexander & Sadiku, ch. 14). */
function seriesRlc(esr: number, esl: number, c: number): ChangeCurve {
  const frequencies = Array.from({ length: 301 }, (_, i) => 1e3 * 10 ** (i / 50));
  const ohm = frequencies.map((f) => {
    const w = 2 * Math.PI * f;
    return Math.hypot(esr, w * esl - 1 / (w * c));
  });
  const srf = 1 / (2 * Math.PI * Math.sqrt(esl * c));
  return { frequencies, ohm, marks: [{ frequencyHz: srf, impedanceOhm: esr }] };
}

const part: ChangeChartData = { subject: 'TC-100N', kind: 'part', since: 'v1', before: seriesRlc(0.02, 0.3e-9, 100e-9), after: seriesRlc(0.02, 0.6e-9, 100e-9), markName: 'SRF' };

describe('change chart', () => {
  it('draws the curve before dashed and grey and the curve now solid, with the key naming the revision', async () => {
    const out = await renderChangeChart(part);
    const { curves, marks } = (out.spec as { datasets: Rows }).datasets;
    expect(curves.filter((r) => r.s === 'before').length).toBeGreaterThan(10);
    expect(curves.filter((r) => r.s === 'now').length).toBeGreaterThan(10);
    // Each SRF is a point of its curve, exactly where the closed form puts it.
    expect(marks.map((m) => m.f)).toEqual([1 / (2 * Math.PI * Math.sqrt(0.3e-9 * 100e-9)), 1 / (2 * Math.PI * Math.sqrt(0.6e-9 * 100e-9))]);
    expect(curves.some((r) => r.s === 'before' && r.f === marks[0].f && r.v === 0.02)).toBe(true);
    const texts = svgTexts(out.svg);
    expect(texts).toEqual(expect.arrayContaining(['at v1', 'now', 'SRF']));
  });

  it('spans both curves and both targets on its axes, and draws a changed target twice', () => {
    const rail: ChangeChartData = { ...part, subject: 'VDD_T', kind: 'rail', target: { before: 0.025, after: 0.004 }, band: { fromHz: 1e6, toHz: 1e8 }, markName: 'worst point' };
    const b = changeChart.bind(rail);
    const [lo, hi] = b.params.yDomain as number[];
    expect(lo).toBeLessThanOrEqual(0.004);
    expect(hi).toBeGreaterThanOrEqual(Math.max(...part.before!.ohm as number[]));
    const curves = (b.datasets as Rows).curves;
    expect(curves.filter((r) => r.s === 'target').map((r) => r.v)).toEqual([0.004, 0.004]);
    expect(curves.filter((r) => r.s === 'target-before').map((r) => r.v)).toEqual([0.025, 0.025]);
    const same = changeChart.bind({ ...rail, target: { before: 0.025, after: 0.025 } });
    expect((same.datasets as Rows).curves.filter((r) => r.s === 'target-before')).toEqual([]);
  });

  it('draws a subject that is new with its curve now alone, and says so in words', async () => {
    const added = { ...part, before: null };
    const out = await renderChangeChart(added);
    expect((out.spec as { datasets: Rows }).datasets.curves.every((r) => r.s === 'now')).toBe(true);
    expect(out.description).toContain('absent at v1');
    expect((await renderChangeChart(part)).title).toBe('TC-100N: |Z| at v1 and now');
    await expect(renderChangeChart({ ...part, before: null, after: null })).rejects.toThrow(/needs a curve/);
  });
});
