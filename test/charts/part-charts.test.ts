import { describe, expect, it } from 'vitest';
import { describePartChart } from '../../src/present/chart-descriptions.js';
import { PART_SERIES } from '../../src/charts/palette.js';
import { chartOf, PART_CHART_KINDS, renderPartCharts } from '../../src/charts/part-charts.js';
import { renderChart } from '../../src/charts/render.js';
import { ALL_PARTS, analysed, beadPart, capacitorPart, inductorPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';

describe('a part’s four charts', () => {
  it('renders all four for every demo part, titled by the part id', async () => {
    for (const p of ALL_PARTS) {
      const charts = await renderPartCharts(analysed(p));
      expect(Object.keys(charts)).toEqual([...PART_CHART_KINDS]);
      for (const kind of PART_CHART_KINDS) {
        expect(charts[kind].title.startsWith(`${p.id}: `)).toBe(true);
        expect(charts[kind].svg).toContain(`>${charts[kind].title}</title>`);
      }
    }
  });

  it('starts the plots of the two charts of a row (as the page sets them) at the same height, each under its whole key', async () => {
    // The plot's top-left corner is where vega's root group is translated to: the first translate of the SVG.
    const plotTop = (svg: string) => Number(/translate\(([-\d.]+),([-\d.]+)\)/.exec(svg)![2]);
    for (const p of ALL_PARTS) {
      const input = analysed(p);
      const charts = await renderPartCharts(input);
      for (const [a, b] of [['impedance', 'phase'], ['plane', 'admittance']] as const) {
        // Drawn alone (no layout), each chart's plot starts just under its own key.
        const alone = await Promise.all([a, b].map(async (kind) => plotTop((await renderChart(chartOf(kind, input), input, { title: 't', description: 'd' })).svg)));
        expect(plotTop(charts[a].svg), `${p.id} ${a}`).toBe(Math.max(...alone));
        expect(plotTop(charts[b].svg), `${p.id} ${b}`).toBe(Math.max(...alone));
      }
    }
  });

  it('writes only finite numbers into SVG attributes; a one-series chart draws its curve at the palette width', async () => {
    // A one-key ordinal scale for stroke width once mapped to NaN; every attribute must be a real number.
    for (const p of ALL_PARTS) {
      const charts = await renderPartCharts(analysed(p));
      for (const kind of PART_CHART_KINDS) {
        expect(charts[kind].svg, `${p.id} ${kind}`).not.toMatch(/="[^"]*(NaN|Infinity|undefined)[^"]*"/);
      }
      expect(charts.phase.svg).toContain(`stroke-width="${PART_SERIES.phase.width}"`);
      expect(charts.plane.svg).toContain(`stroke-width="${PART_SERIES.path.width}"`);
    }
  });

  it('writes the figures a reader takes from the charts into their descriptions', () => {
    const c = analysed(capacitorPart);
    const d = describePartChart('impedance', c).description;
    expect(d).toContain('SRF 23.7 MHz (series, |Z| = 18 mΩ)'); // at a series resonance |Z| = ESR
    expect(d).toContain('usable band (±10%), up to 7.15 MHz');
    // Parallel resonance of (R + jωL) ‖ C: f ≈ 1/(2π√(LC)) = 35.6 MHz for 10 µH and 2 pF (R/L negligible).
    expect(describePartChart('phase', analysed(inductorPart)).description).toContain('SRF 35.6 MHz (parallel');
    // Bead core r ‖ l ‖ c: resonance at 1/(2π√(lc)) = 130 MHz, where |Z| = rdc + r = 600.03 Ω.
    expect(describePartChart('admittance', analysed(beadPart)).description).toContain('SRF 130 MHz (parallel, |Z| = 600 Ω)');
  });

  it('takes the caller’s title and description where given', async () => {
    const charts = await renderPartCharts(analysed(capacitorPart), { phase: { title: 'Figure 2', description: 'Phase, as measured.' } });
    expect(charts.phase.title).toBe('Figure 2');
    expect(charts.phase.svg).toContain('>Phase, as measured.</desc>');
    expect(charts.impedance.title).not.toBe('Figure 2');
    expect(svgTexts(charts.phase.svg)).toContain('SRF 23.7 MHz');
  });
});
