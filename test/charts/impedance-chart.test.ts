import { describe, expect, it } from 'vitest';
import { HALF_PLOT_WIDTH as PLOT_WIDTH } from '../../src/charts/frame.js';
import { RESONANCE_MARK } from '../../src/charts/palette.js';
import { PART_CHARTS, renderPartChart } from '../../src/charts/part-charts.js';
import { formatEng } from '../../src/units/format.js';
import { analysed, beadPart, capacitorPart, resistorPart } from './fixtures.js';
import { RATED_MARK } from '../../src/charts/palette.js';
import type { Part } from '../../src/model/part.js';
import { svgTexts } from './svg-text.js';
import { envelopeMiss } from './envelope-check.js';
import { readFontAdvances } from './font-advances.js';

// Text widths from DejaVu Sans Book's advance widths (the font file's hmtx table, test/charts/font-advances.ts),
// the widest of the charts' font stack that .ci/run installs.
const dejaVu = readFontAdvances('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');
const widthPx = (text: string, sizePx: number) => [...text].reduce((w, c) => w + (dejaVu.advanceEm(c) ?? 1) * sizePx, 0);

type Rows = Record<string, Record<string, unknown>[]>;

/** Centres of the resonance dots inside the plot (the key's dot sits above it, at negative y). */
function resonanceDots(svg: string): { x: number; y: number }[] {
  return [...svg.matchAll(new RegExp(`<path transform="translate\\(([-\\d.]+),([-\\d.]+)\\)"[^>]*fill="${RESONANCE_MARK}"`, 'g'))]
    .map((m) => ({ x: Number(m[1]), y: Number(m[2]) }))
    .filter((p) => p.y >= 0);
}

describe('impedance chart', () => {
  // Series R-L-C: |Z| is least, = ESR, at f0 = 1/(2π√(LC)) (any circuit text, e.g. Alexander & Sadiku, ch. 14).
  const L = 0.45e-9;
  const C = 100e-9;
  const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));

  it('labels the SRF of the demo capacitor at the closed-form frequency, where the dot sits on the log axes', async () => {
    const a = analysed(capacitorPart);
    const out = await renderPartChart('impedance', a);
    expect(Math.abs(a.selfResonance!.frequencyHz / f0 - 1)).toBeLessThan(1e-6);
    expect(svgTexts(out.svg)).toContain(`SRF ${formatEng(f0, 'Hz')}`);
    expect(svgTexts(out.svg)).toContain('SRF 23.7 MHz');
    // Plot: x log over 1 kHz..10 GHz across PLOT_WIDTH; y log over 1 mΩ..10 kΩ across the plot's height, up.
    const [dot] = resonanceDots(out.svg);
    expect(dot.x).toBeCloseTo((PLOT_WIDTH * Math.log10(f0 / 1e3)) / 7, 1);
    expect(dot.y).toBeCloseTo(160 - (160 * Math.log10(0.018 / 1e-3)) / 7, 1);
  });

  it('has engineering-notation ticks, a key and the band with its edge', async () => {
    const out = await renderPartChart('impedance', analysed(capacitorPart));
    const texts = svgTexts(out.svg);
    // Drawn for half a printed column: decades labelled every other one, on even powers of ten.
    for (const t of ['10 kHz', '1 MHz', '10 GHz', '1 mΩ', '100 mΩ', '1 Ω', '10 kΩ', 'Frequency', '|Z|', 'R (ESR)', 'resonance (X = 0)']) expect(texts).toContain(t);
    // Band edge SRF·√(1 − 1/1.1) = 7.153 MHz (closed form for the series model, see src/analysis/band.ts).
    expect(texts).toContain(`usable band (±10%): up to ${formatEng(f0 * Math.sqrt(1 - 1 / 1.1), 'Hz')}`);
  });

  it('keeps the SRF label off the band edge a factor of about 3 below it (closed form), in the finished SVG', async () => {
    const out = await renderPartChart('impedance', analysed(capacitorPart));
    // The edge: a dashed rule across the plot at SRF·√(1 − 1/1.1) = 7.153 MHz, x log over 1 kHz..10 GHz.
    const edgeHz = f0 * Math.sqrt(1 - 1 / 1.1);
    const rules = [...out.svg.matchAll(/<line transform="translate\(([-\d.]+),0\)" x2="0" y2="(\d+)"[^>]*stroke-dasharray/g)].map((m) => Number(m[1]));
    expect(rules).toHaveLength(1);
    expect(rules[0]).toBeCloseTo((PLOT_WIDTH * Math.log10(edgeHz / 1e3)) / 7, 0);
    const label = /<text text-anchor="(start|middle|end)" transform="translate\(([-\d.]+),[-\d.]+\)" font-size="([\d.]+)px"[^>]*>(SRF [^<]*)<\/text>/.exec(out.svg);
    expect(label).not.toBeNull();
    const [, anchor, at, size, text] = label!;
    const w = widthPx(text, Number(size));
    const x0 = Number(at) - (anchor === 'start' ? 0 : anchor === 'middle' ? w / 2 : w);
    // Not across the rule, nor within a pixel of it.
    expect(rules[0] < x0 - 1 || rules[0] > x0 + w + 1, `label ${x0.toFixed(1)}..${(x0 + w).toFixed(1)} px, rule at ${rules[0]} px`).toBe(true);
  });

  it('passes |Z| and R through the exact resonance point, not just the nearest sweep point', async () => {
    const a = analysed(capacitorPart);
    const out = await renderPartChart('impedance', a);
    const curves = (out.spec as { datasets: Rows }).datasets.curves;
    const srf = a.selfResonance!;
    for (const s of ['mag', 'res']) expect(curves.some((r) => r.s === s && r.f === srf.frequencyHz && r.v === srf.impedanceOhm)).toBe(true);
    // Down-sampled: far fewer rows than the two 801-point curves.
    expect(curves.length).toBeLessThan(400);
  });

  it('draws no resonance for a resistor without one, and calls R plain R', async () => {
    const a = analysed(resistorPart);
    expect(a.resonances).toHaveLength(0);
    const out = await renderPartChart('impedance', a);
    const texts = svgTexts(out.svg);
    expect(texts.some((t) => t.startsWith('SRF'))).toBe(false);
    expect(texts).toContain('R');
    expect(texts).not.toContain('resonance (X = 0)');
    expect(resonanceDots(out.svg)).toHaveLength(0);
  });

  it('marks a bead\'s rated point (nominal at its rated frequency) and names it in the key in words', async () => {
    // The fixture bead, rated 600 Ω at 100 MHz. Plot as above: x log over 1 kHz..10 GHz (7 decades).
    const rated = { ...beadPart, ratedAtHz: 100e6 } as Part;
    const out = await renderPartChart('impedance', analysed(rated));
    const rows = (out.spec as { datasets: Rows }).datasets.rated;
    expect(rows).toMatchObject([{ f: 100e6, v: 600 }]);
    expect(svgTexts(out.svg)).toContain('rated |Z| 600 Ω at 100 MHz');
    const diamonds = [...out.svg.matchAll(new RegExp(`<path transform="translate\\(([-\\d.]+),([-\\d.]+)\\)"[^>]*fill="${RATED_MARK}"`, 'g'))].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
    const inPlot = diamonds.filter((p) => p.y >= 0);
    expect(inPlot).toHaveLength(1);
    expect(inPlot[0].x).toBeCloseTo((PLOT_WIDTH * Math.log10(100e6 / 1e3)) / 7, 1);
    // And one more in the key, above the plot.
    expect(diamonds.filter((p) => p.y < 0)).toHaveLength(1);
  });

  it('marks no rated point where there is no rating, or it lies outside the sweep', async () => {
    for (const p of [beadPart, { ...beadPart, ratedAtHz: 1e11 } as Part, { ...capacitorPart, ratedAtHz: 1e6 } as Part]) {
      const out = await renderPartChart('impedance', analysed(p));
      expect((out.spec as { datasets: Rows }).datasets.rated).toEqual([]);
      expect(svgTexts(out.svg).some((t) => t.startsWith('rated'))).toBe(false);
    }
  });
  it('draws the envelope of a spread behind the curves, thinned within 0.15 px of it, and the nominal |Z| inside it', async () => {
    // The demo capacitor with C anywhere in C·(1 ± 10%): |Z| = |R + j(ωL − 1/(ωC))| (series R-L-C, as above;
    // its 1 GΩ leakage is left out, which moves |Z| by far less than a pixel here) is greatest at an end of
    // the range and least at an end or, between the ends' SRFs, at resonance, where it is R.
    const a = analysed(capacitorPart);
    const frequencies = Float64Array.from(a.frequencies);
    const z = (f: number, c: number) => Math.hypot(0.018, 2 * Math.PI * f * L - 1 / (2 * Math.PI * f * c));
    const srf = (c: number) => 1 / (2 * Math.PI * Math.sqrt(L * c));
    const min = frequencies.map((f) => (f >= srf(C * 1.1) && f <= srf(C * 0.9) ? 0.018 : Math.min(z(f, C * 0.9), z(f, C * 1.1))));
    const max = frequencies.map((f) => Math.max(z(f, C * 0.9), z(f, C * 1.1)));
    const out = await renderPartChart('impedance', { ...a, spread: { frequencies, min, max, corners: 2 } });
    expect(svgTexts(out.svg)).toContain('range of |Z| over the spread');
    const widest = Math.max(...Array.from(frequencies, (_, i) => max[i] / min[i]));
    expect(out.description).toContain(`where it is widest, its greatest |Z| is ${Number(widest.toPrecision(3))} times its least.`);
    const layers = (PART_CHARTS.impedance.spec() as { layer: { data?: { name?: string } }[] }).layer.map((l) => l.data?.name);
    expect(layers.indexOf('spread')).toBeGreaterThan(-1);
    expect(layers.indexOf('spread')).toBeLessThan(layers.indexOf('curves'));
    const rows = (out.spec as { datasets: Rows }).datasets.spread;
    // Thinned as the curves are (simplify.ts, 0.15 px), from the first sweep point to the last.
    expect(rows.length).toBeLessThan(frequencies.length / 4);
    expect([rows[0].i, rows[rows.length - 1].i]).toEqual([0, frequencies.length - 1]);
    const miss = envelopeMiss(out.spec, rows, frequencies, min, max);
    expect(miss.exact).toBe(true);
    // 0.15 px, plus what 6 significant digits move a point (1e-6 of a value: 2e-5 px at 23 px a decade).
    expect(miss.worstPx).toBeLessThan(0.1501);
    for (const r of rows) {
      const nominal = z(r.f as number, C);
      // Within what rounding to 6 significant digits moves a value: half a unit in the 6th digit, 5e-6 of it.
      expect(r.v as number).toBeLessThanOrEqual(nominal * (1 + 5e-6));
      expect(r.v2 as number).toBeGreaterThanOrEqual(nominal * (1 - 5e-6));
    }
    expect((await renderPartChart('impedance', a)).spec).toMatchObject({ datasets: { spread: [] } });
  });
});
