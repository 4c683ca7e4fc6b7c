import { describe, expect, it } from 'vitest';
import { signRuns } from '../../src/charts/admittance-chart.js';
import { renderPartChart } from '../../src/charts/part-charts.js';
import { analysed, capacitorPart, networkPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;

describe('admittance chart', () => {
  it('splits a signed curve into runs of magnitudes, breaking at zeros and gaps', () => {
    const runs = signRuns({ f: [1, 2, 3, 4, 5, 6], v: [2, 3, 0, -4, -5, 6], keep: [false, false, false, false, false, false] });
    expect(runs.map((r) => [r.sign, r.curve.v])).toEqual([
      [1, [2, 3]],
      [-1, [4, 5]],
      [1, [6]],
    ]);
    expect(runs.every((r) => r.curve.keep[0] && r.curve.keep[r.curve.keep.length - 1])).toBe(true);
  });

  it('draws |B| solid where B > 0 (below a capacitor’s SRF) and dashed where B < 0 (above it)', async () => {
    // B = −X/(R² + X²): the capacitor's X < 0 below its series resonance, > 0 above.
    const a = analysed(capacitorPart);
    const out = await renderPartChart('admittance', a);
    const rows = (out.spec as { datasets: Rows }).datasets.curves;
    const srf = a.selfResonance!.frequencyHz;
    const bc = rows.filter((r) => r.s === 'bc' && r.v !== null);
    const bl = rows.filter((r) => r.s === 'bl' && r.v !== null);
    expect(bc.length).toBeGreaterThan(2);
    expect(bl.length).toBeGreaterThan(2);
    expect(bc.every((r) => (r.f as number) < srf)).toBe(true);
    expect(bl.every((r) => (r.f as number) > srf)).toBe(true);
    // G = 1/R at the resonance, exactly (X = 0 there).
    expect(rows.some((r) => r.s === 'g' && r.f === srf && r.v === 1 / a.selfResonance!.impedanceOhm)).toBe(true);
    const texts = svgTexts(out.svg);
    for (const t of ['G', '|B|, B > 0 capacitive', '|B|, B < 0 inductive', 'SRF 23.7 MHz', '1 S']) expect(texts).toContain(t);
  });

  it('keeps each run of one sign a separate line: three resonances, four runs', async () => {
    const a = analysed(networkPart);
    const rows = ((await renderPartChart('admittance', a)).spec as { datasets: Rows }).datasets.curves;
    const segments = new Set(rows.filter((r) => r.s !== 'g').map((r) => r.g));
    expect(segments.size).toBe(a.resonances.length + 1);
  });
});
