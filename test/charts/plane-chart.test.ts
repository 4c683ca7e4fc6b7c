import { describe, expect, it } from 'vitest';
import { planeChart } from '../../src/charts/plane-chart.js';
import { renderPartChart } from '../../src/charts/part-charts.js';
import { partPlaneConstant } from '../../src/charts/plane-scale.js';
import { describePartChart } from '../../src/present/chart-descriptions.js';
import { renderChart } from '../../src/charts/render.js';
import { analysed, beadPart, capacitorPart, resistorPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;
const DECADES = ['1 kHz', '10 kHz', '100 kHz', '1 MHz', '10 MHz', '100 MHz', '1 GHz', '10 GHz'];

/** The impedance plane of a part, whatever plane its page draws (a capacitor's page draws its admittance circle). */
function impedancePlane(input: ReturnType<typeof analysed>) {
  return renderChart(planeChart, input, describePartChart('plane', input, partPlaneConstant(input)));
}

describe('complex-plane chart', () => {
  it('labels every decade of the sweep on the path and names its scale', async () => {
    const out = await impedancePlane(analysed(capacitorPart));
    const texts = svgTexts(out.svg);
    for (const d of DECADES) expect(texts).toContain(d);
    expect(texts).toContain('SRF 23.7 MHz');
    expect(texts).toContain('Resistance R (signed-log scale)');
    expect(out.description).toContain('sign(v)·log10(1 + |v|/c) with c = 10 mΩ');
  });

  it('points its arrows upwards for a series R-L-C: X rises with frequency, R stays put', async () => {
    // Foster's reactance theorem: dX/dω > 0 for a lossless one-port; with constant ESR the path is vertical.
    const out = await impedancePlane(analysed(capacitorPart));
    const arrows = (out.spec as { datasets: Rows }).datasets.arrows;
    expect(arrows).toHaveLength(7);
    // The first one, at 3.16 kHz, leans slightly: the 1 GΩ leakage still adds a little R there.
    for (const a of arrows.slice(1)) expect(Math.abs(a.a as number)).toBeLessThan(3);
  });

  it('follows a bead round its resonance: R rises to the peak, then falls (parallel R-L-C)', async () => {
    // Core r ‖ l ‖ c: R = G/(G² + B²) is greatest at ω0 = 1/√(lc), where B = 0; below ω0 the core is
    // inductive (X > 0), above it capacitive. So the path runs right while above the zero line, left below it.
    const out = await renderPartChart('plane', analysed(beadPart));
    const { arrows } = (out.spec as { datasets: Rows }).datasets;
    expect(arrows.length).toBeGreaterThanOrEqual(4);
    expect(arrows.some((a) => (a.v as number) > 0) && arrows.some((a) => (a.v as number) < 0)).toBe(true);
    for (const arrow of arrows) {
      const rightwards = Math.sin(((arrow.a as number) * Math.PI) / 180) > 0;
      expect(rightwards).toBe((arrow.v as number) > 0);
    }
  });

  it('gives decades that land on one spot a shared label, as for a resistor below its corner', async () => {
    // (R + jωL) ‖ C with R = 1 kΩ: X ≈ ω(L − C·R²) = −5 Ω at 10 MHz, −50 Ω at 100 MHz (for ωCR ≪ 1); with
    // c = 100 Ω that is 3 px and 23 px below the zero line.
    const texts = svgTexts((await renderPartChart('plane', analysed(resistorPart))).svg);
    expect(texts).toContain('1 kHz – 10 MHz');
    expect(texts).toContain('100 MHz');
    expect(texts).not.toContain('10 kHz');
  });

  it('interpolates the decade marks from the sweep when no model is given, landing close to the exact ones', async () => {
    const a = analysed(beadPart);
    const exact = (planeChart.bind(a).datasets.decades as { x: number; v: number }[]).map((d) => [d.x, d.v]);
    const blind = { ...a, part: { ...a.part, network: undefined } };
    const approx = (planeChart.bind(blind).datasets.decades as { x: number; v: number }[]).map((d) => [d.x, d.v]);
    expect(approx).toHaveLength(exact.length);
    // In signed-log units (about one per decade of Ω): 114 points per decade leave little to interpolate.
    approx.forEach(([x, v], k) => {
      expect(Math.abs(x - exact[k][0])).toBeLessThan(1e-3);
      expect(Math.abs(v - exact[k][1])).toBeLessThan(1e-3);
    });
    // And the same decades are labelled (those that find a free place beside their mark), '10 MHz' among them.
    const labelled = (texts: string[]) => texts.filter((t) => /^\d+ [kMG]?Hz/.test(t)).sort();
    const withModel = labelled(svgTexts((await renderChart(planeChart, a, { title: 't', description: 'd' })).svg));
    expect(withModel).toContain('10 MHz');
    expect(labelled(svgTexts((await renderChart(planeChart, blind, { title: 't', description: 'd' })).svg))).toEqual(withModel);
  });
});
