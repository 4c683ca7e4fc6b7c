// The measurement charts: the model and the measurement drawn at the measured frequencies, the residual
// about zero with a symmetric axis, and text alternatives that state the miss. The data are made here:
// a model and a "measurement" 10% above it in |Z| and 3° ahead in phase, so every error is known exactly:
// 20·log10(1/1.1) = −0.828 dB and −3°.

import { describe, expect, it } from 'vitest';
import { measuredImpedanceChart, renderMeasurementCharts, residualDomain, type MeasurementChartData } from '../../src/charts/measurement-charts.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;

function data(): MeasurementChartData {
  const n = 61;
  const frequencies = Float64Array.from({ length: n }, (_, k) => 1e3 * 10 ** (k / 10));
  // A capacitor-like model: 1/(jωC) + 20 mΩ.
  const model = { re: new Float64Array(n).fill(0.02), im: Float64Array.from(frequencies, (f) => -1 / (2 * Math.PI * f * 100e-9)) };
  const turn = (3 * Math.PI) / 180;
  const measured = {
    re: Float64Array.from({ length: n }, (_, k) => 1.1 * (model.re[k] * Math.cos(turn) - model.im[k] * Math.sin(turn))),
    im: Float64Array.from({ length: n }, (_, k) => 1.1 * (model.re[k] * Math.sin(turn) + model.im[k] * Math.cos(turn))),
  };
  const db = 20 * Math.log10(1 / 1.1);
  return {
    partId: 'DEMO-C',
    file: 'measurements/demo.s2p',
    fixture: 'shunt-thru',
    frequencies,
    measured,
    model,
    errorDb: new Float64Array(n).fill(db),
    errorDeg: new Float64Array(n).fill(-3),
    residual: { rmsDb: Math.abs(db), maxDb: Math.abs(db), rmsDeg: 3 },
  };
}

describe('residualDomain', () => {
  it.each([
    [[0.83], [3], [-4, 4], 1],
    [[0.001], [0.002], [-0.15, 0.15], 0.05],
    [[12], [-40], [-60, 60], 20],
    [[0.25], [0.1], [-0.3, 0.3], 0.1],
    [[-2.5], [0], [-3, 3], 1],
  ])('errors %j dB and %j° give %j in steps of %d', (db, deg, domain, step) => {
    const r = residualDomain(db, deg);
    expect(r.domain[0]).toBeCloseTo(domain[0], 12);
    expect(r.domain[1]).toBeCloseTo(domain[1], 12);
    expect(r.step).toBeCloseTo(step, 12);
  });
});

describe('measurement charts', () => {
  it('|Z|: the model and the measurement at every measured frequency, the measurement 10% above', () => {
    const d = data();
    const rows = measuredImpedanceChart.bind(d).datasets.curves;
    const model = rows.filter((r) => r.s === 'model');
    const measured = rows.filter((r) => r.s === 'measured');
    expect(model.length).toBeGreaterThan(1);
    for (const r of measured) {
      const k = Array.prototype.indexOf.call(d.frequencies, r.f) as number;
      expect(k).toBeGreaterThanOrEqual(0);
      expect(Math.abs((r.v as number) / Math.hypot(d.model.re[k], d.model.im[k]) - 1.1)).toBeLessThan(1e-12);
    }
  });

  it('renders three charts whose titles and descriptions state the miss', async () => {
    const charts = await renderMeasurementCharts(data());
    expect(Object.keys(charts)).toEqual(['measured-impedance', 'measured-phase', 'residual']);
    expect(charts.residual.title).toBe('DEMO-C: model − measured (measurements/demo.s2p), |Z| in dB and phase in degrees');
    expect(charts['measured-impedance'].title).toBe('DEMO-C: |Z| of the model and as measured (measurements/demo.s2p)');
    expect(charts.residual.description).toContain('The model misses the measurement by 0.83 dB rms in |Z| (at most 0.83 dB) and 3.00° rms in phase.');
    expect(charts.residual.description).toContain('The largest |Z| error, −0.83 dB, is at 1 kHz.');
    expect(charts['measured-impedance'].description).toContain('shunt-thru fixture, 61 points, 1 kHz to 1 GHz');
    const texts = svgTexts(charts.residual.svg);
    for (const t of ['Model − measurement (dB, °)', '−4', '+4', '−1', '0', '|Z| error, dB (rms 0.83, max 0.83)', 'phase error, degrees (rms 3.00)']) expect(texts).toContain(t);
    // The residual rows are the errors as given.
    const rows = (charts.residual.spec as { datasets: Rows }).datasets.curves;
    expect(rows.filter((r) => r.s === 'deg').every((r) => r.v === -3)).toBe(true);
    // The page sets |Z| and phase side by side: both plots start at the same height (vega's root group, the SVG's first translate).
    const plotTop = (svg: string) => Number(/translate\(([-\d.]+),([-\d.]+)\)/.exec(svg)![2]);
    expect(plotTop(charts['measured-phase'].svg)).toBe(plotTop(charts['measured-impedance'].svg));
  });
});
