import { describe, expect, it } from 'vitest';
import { TARGET_LINE } from '../../src/charts/palette.js';
import { railChart, renderRailChart } from '../../src/charts/rail-chart.js';
import { describeRail } from '../../src/present/plan-chart-descriptions.js';
import { formatEng } from '../../src/units/format.js';
import { demoRail } from './fixtures.js';
import { svgTexts } from './svg-text.js';
import { envelopeMiss } from './envelope-check.js';

type Rows = Record<string, Record<string, unknown>[]>;

describe('rail chart', () => {
  it('draws the rail against its target with branches, band and the highest peak labelled', async () => {
    const data = demoRail();
    const out = await renderRailChart(data);
    const texts = svgTexts(out.svg);
    for (const t of ['rail |Z|', 'target 4.5 mΩ', 'band 100 kHz – 200 MHz', 'peak above target', ...data.branches.map((b) => b.label)]) expect(texts).toContain(t);
    const top = [...data.peaks].sort((a, b) => b.impedanceOhm - a.impedanceOhm)[0];
    expect(texts).toContain(`${formatEng(top.impedanceOhm, 'Ω')} at ${formatEng(top.frequencyHz, 'Hz')}`);
    const { peaks, curves } = (out.spec as { datasets: Rows }).datasets;
    // Every demo peak exceeds the 4.5 mΩ target: all drawn in the target's colour.
    expect(peaks.every((p) => p.color === TARGET_LINE.color)).toBe(true);
    // The total passes through each peak exactly.
    for (const p of data.peaks) expect(curves.some((r) => r.s === 'total' && r.f === p.frequencyHz && r.v === p.impedanceOhm)).toBe(true);
    expect(out.description).toContain('against the target 4.5 mΩ');
  });

  it('takes a target that varies with frequency, and colours peaks by the target at their frequency', () => {
    const data = demoRail();
    const target = Array.from(data.frequencies, (f) => (f < 1e6 ? 0.5 : 5e-3));
    const b = railChart.bind({ ...data, target });
    const rows = (b.datasets.curves as Record<string, unknown>[]).filter((r) => r.s === 'target');
    expect(new Set(rows.map((r) => r.v))).toEqual(new Set([0.5, 5e-3]));
    const peaks = b.datasets.peaks as Record<string, unknown>[];
    // 221 mΩ at 174 kHz is under the 0.5 Ω target there; the others are over 5 mΩ.
    expect(peaks.filter((p) => p.color !== TARGET_LINE.color).map((p) => p.f)).toEqual(data.peaks.filter((p) => p.frequencyHz < 1e6).map((p) => p.frequencyHz));
    expect(describeRail({ ...data, target }).description).toContain('its target (varying with frequency)');
  });

  it('draws a rail without band or peaks', async () => {
    const data = { ...demoRail(), peaks: [], band: null };
    const out = await renderRailChart(data);
    const texts = svgTexts(out.svg);
    expect(texts.some((t) => t.startsWith('band'))).toBe(false);
    expect(texts.some((t) => t.startsWith('peak'))).toBe(false);
    expect(out.description).toContain('No peaks.');
  });

  it('draws the envelope of the corners as a tinted band behind every curve, and its key says what it is', async () => {
    const data = demoRail();
    const min = Array.from(data.totalOhm, (z) => z * 0.8);
    const max = Array.from(data.totalOhm, (z) => z * 1.25);
    const out = await renderRailChart({ ...data, envelope: { minOhm: min, maxOhm: max, corners: 1024 } });
    expect(svgTexts(out.svg)).toContain('range of rail |Z| over nominal and 1,024 corners');
    const top = max.indexOf(Math.max(...max));
    expect(out.description).toContain(`A tinted band behind the curves is the range of the rail's |Z| over nominal and 1,024 corners of its parts' spreads; its highest point on the sweep is ${formatEng(max[top], 'Ω')} at ${formatEng(data.frequencies[top], 'Hz')}.`);
    const layers = (railChart.spec() as { layer: { data?: { name?: string } }[] }).layer.map((l) => l.data?.name);
    expect(layers.indexOf('spread')).toBeGreaterThan(-1);
    for (const drawnLater of ['branches', 'curves', 'peaks']) expect(layers.indexOf('spread')).toBeLessThan(layers.indexOf(drawnLater));
    const rows = (out.spec as { datasets: Rows }).datasets.spread;
    // Thinned in screen space within 0.15 px of the full envelope (simplify.ts), values to 6 digits.
    expect(rows.length).toBeLessThan(data.frequencies.length);
    expect([rows[0].i, rows[rows.length - 1].i]).toEqual([0, data.frequencies.length - 1]);
    const miss = envelopeMiss(out.spec, rows, data.frequencies, min, max);
    expect(miss.exact).toBe(true);
    expect(miss.worstPx).toBeLessThan(0.1501);
    // Without an envelope, no band and no key entry.
    const plain = await renderRailChart(data);
    expect((plain.spec as { datasets: Rows }).datasets.spread).toEqual([]);
    expect(svgTexts(plain.svg).some((t) => t.startsWith('range of'))).toBe(false);
    expect(plain.description).not.toContain('tinted');
  });
});
