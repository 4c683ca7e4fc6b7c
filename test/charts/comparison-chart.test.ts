import { describe, expect, it } from 'vitest';
import { comparisonChart, renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { describeComparison } from '../../src/present/chart-descriptions.js';
import { overlayStyle } from '../../src/charts/overlay.js';
import { lastSceneBounds } from '../../src/charts/render.js';
import { formatEng } from '../../src/units/format.js';
import { ALL_PARTS, analysed, capacitorPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;
const parts = ALL_PARTS.map((p) => analysed(p));

describe('comparison chart', () => {
  it('lists the parts in the key in the order given, each with its own style', async () => {
    const out = await renderComparisonChart(parts);
    const texts = svgTexts(out.svg);
    const ids = parts.map((p) => p.part.id);
    expect(texts.filter((t) => ids.includes(t))).toEqual(ids);
    const { curves, points } = (out.spec as { datasets: Rows }).datasets;
    parts.forEach((_, k) => {
      const rows = curves.filter((r) => r.p === k);
      expect(rows.length).toBeGreaterThan(2);
      expect(rows.every((r) => r.c === overlayStyle(k).c && r.d === overlayStyle(k).d)).toBe(true);
    });
    // One dot per part that has a self-resonance in the sweep (the resistor has none).
    expect(points).toHaveLength(parts.filter((p) => p.selfResonance).length);
    expect(texts).toContain('self-resonance (SRF)');
  });

  it('puts every part on common axes spanning all their sweeps', () => {
    const narrow = analysed(capacitorPart, { fromHz: 1e5, toHz: 1e8, perDecade: 50 });
    const b = comparisonChart.bind([narrow, parts[1]]);
    expect(b.params.fDomain).toEqual([1e3, 1e10]);
    const yDomain = b.params.yDomain as number[];
    for (const p of [narrow, parts[1]]) for (let i = 0; i < p.frequencies.length; i++) {
      const m = Math.hypot(p.z.re[i], p.z.im[i]);
      expect(m).toBeGreaterThanOrEqual(yDomain[0]);
      expect(m).toBeLessThanOrEqual(yDomain[1]);
    }
  });

  it('adds key rows above the plot, the chart growing to hold them, when many parts are compared', async () => {
    const nine = Array.from({ length: 9 }, (_, k) => ({ ...parts[k % parts.length], part: { ...parts[k % parts.length].part, id: `DEMO-PART-WITH-LONG-ID-${k}` } }));
    const few = await renderComparisonChart(parts.slice(0, 2));
    const many = await renderComparisonChart(nine);
    const height = (svg: string) => Number(/viewBox="0 0 \d+ ([\d.]+)"/.exec(svg)![1]);
    expect(height(many.svg)).toBeGreaterThan(height(few.svg));
    expect(svgTexts(many.svg).filter((t) => t.startsWith('DEMO-PART-WITH-LONG-ID-'))).toHaveLength(9);
    // Nothing drawn outside the (taller) viewBox.
    const b = lastSceneBounds('comparison')!;
    expect(b.y1).toBeGreaterThanOrEqual(0);
    expect(b.y2).toBeLessThanOrEqual(height(many.svg));
    expect(b.x2).toBeLessThanOrEqual(640);
  });

  it('describes each part by its SRF', () => {
    const d = describeComparison(parts, 'Decoupling candidates');
    expect(d.title).toBe('Decoupling candidates');
    expect(d.description).toContain(`DEMO-C-100N (SRF ${formatEng(parts[0].selfResonance!.frequencyHz, 'Hz')}`);
    expect(d.description).toContain('DEMO-R-1K (no SRF in the sweep)');
  });

  it('refuses an empty comparison', async () => {
    await expect(renderComparisonChart([])).rejects.toThrow(/at least one part/);
  });
});
