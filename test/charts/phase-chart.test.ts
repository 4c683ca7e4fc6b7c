import { describe, expect, it } from 'vitest';
import { RESONANCE_MARK } from '../../src/charts/palette.js';
import { renderPartChart } from '../../src/charts/part-charts.js';
import { analysed, capacitorPart, inductorPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';

type Rows = Record<string, Record<string, unknown>[]>;

describe('phase chart', () => {
  it('spans −90°…90° with a zero line, the SRF where the phase crosses 0°, and says which side is which', async () => {
    const a = analysed(capacitorPart);
    const out = await renderPartChart('phase', a);
    const texts = svgTexts(out.svg);
    for (const t of ['−90°', '−60°', '−30°', '0°', '30°', '60°', '90°', 'Phase of Z', 'SRF 23.7 MHz', '↑ inductive (X > 0)', '↓ capacitive (X < 0)']) expect(texts).toContain(t);
    const rows = (out.spec as { datasets: Rows }).datasets.curves;
    expect(rows.some((r) => r.f === a.selfResonance!.frequencyHz && r.v === 0)).toBe(true);
    // The SRF dot sits on the zero line: the middle of a 220 px plot spanning −99°…99°.
    const dots = [...out.svg.matchAll(new RegExp(`<path transform="translate\\(([-\\d.]+),([-\\d.]+)\\)"[^>]*fill="${RESONANCE_MARK}"`, 'g'))].map((m) => Number(m[2])).filter((y) => y >= 0);
    expect(dots).toEqual([60]); // the middle of a 120 px plot
  });

  it('describes the ends of the phase curve: a capacitor starts near −90°, an inductor near +90°', async () => {
    // At 1 kHz the capacitor's X = ωL − 1/(ωC) ≈ −1.59 kΩ against R ≈ 20 mΩ: arctan gives −90.0° to 0.1°.
    expect((await renderPartChart('phase', analysed(capacitorPart))).description).toContain('−90.0° at 1 kHz');
    // The inductor's (R + jωL) at 1 kHz: X = 62.8 mΩ, R = 50 mΩ, so the phase is atan(62.8/50) = 51.5°.
    expect((await renderPartChart('phase', analysed(inductorPart))).description).toContain('51.5° at 1 kHz');
  });
});
