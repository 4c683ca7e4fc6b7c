import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { renderPartChart } from '../../src/charts/part-charts.js';
import { formatEng } from '../../src/units/format.js';
import { referenceZAt } from '../reference/impedance.js';
import { analysed, capacitorPart, inductorPart, networkPart } from './fixtures.js';
import { svgTexts } from './svg-text.js';
import { loadLibrary } from '../../src/model/library.js';
import { analysePart } from '../../src/analysis/part-figures.js';
import { REPO } from '../site-helpers.js';

type Rows = Record<string, Record<string, number>[]>;

// The fixture capacitor: ESR 18 mΩ + ESL 0.45 nH + (100 nF ‖ 1 GΩ). Series R-L-C closed forms (any
// circuit-analysis text on series resonance): f0 = 1/(2π√(LC)), Q = √(L/C)/R,
// f1,2 = f0·(√(1 + 1/(4Q²)) ∓ 1/(2Q)); Y = 1/(R + jX) lies on the circle |Y − 1/(2R)| = 1/(2R).
const R = 0.018;
const L = 0.45e-9;
const C = 100e-9;
const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
const Q = Math.sqrt(L / C) / R;
const root = Math.sqrt(1 + 1 / (4 * Q * Q));
const [f1, f2] = [f0 * (root - 1 / (2 * Q)), f0 * (root + 1 / (2 * Q))];

describe('a capacitor\'s complex plane: the admittance circle', () => {
  const a = analysed(capacitorPart);

  it('draws Y = G + jB on the circle of diameter 1/ESR through the origin', async () => {
    const out = await renderPartChart('plane', a);
    const c = 1 / (2 * R);
    const rows = (out.spec as { datasets: Rows }).datasets.curves;
    expect(rows.length).toBeGreaterThan(20);
    // (G − c)² + B² = c²; the 1 GΩ leakage moves points by far less than this tolerance.
    for (const r of rows) expect(Math.abs((r.x - c) ** 2 + r.v ** 2 - c * c)).toBeLessThan(1e-6 * c * c);
    // Some points go round the far side of the circle: it is not a line.
    expect(Math.max(...rows.map((r) => r.x))).toBeGreaterThan(1.9 * c);
    expect(Math.max(...rows.map((r) => r.v))).toBeGreaterThan(0.9 * c);
    expect(Math.min(...rows.map((r) => r.v))).toBeLessThan(-0.9 * c);
  });

  it('marks the SRF at G = 1/ESR, B = 0, as complex.js gives at the closed-form f0', async () => {
    const out = await renderPartChart('plane', a);
    const [p] = (out.spec as { datasets: Rows }).datasets.points;
    const y = new Complex(1, 0).div(referenceZAt(capacitorPart.network!, f0));
    expect(p.x / y.re - 1).toBeCloseTo(0, 6);
    expect(p.v).toBe(0);
    expect(Math.abs(y.im)).toBeLessThan(1e-6 * y.re);
    expect(svgTexts(out.svg)).toContain('SRF 23.7 MHz');
  });

  it('marks the half-power points at the closed-form f1 and f2, at the top and bottom of the circle', async () => {
    const out = await renderPartChart('plane', a);
    const half = (out.spec as { datasets: Rows }).datasets.halfPower;
    expect(half).toHaveLength(2);
    for (const [k, f] of [f1, f2].entries()) {
      const y = new Complex(1, 0).div(referenceZAt(capacitorPart.network!, f));
      expect(half[k].x / y.re - 1).toBeCloseTo(0, 5);
      expect(half[k].v / y.im - 1).toBeCloseTo(0, 5);
      // |B| = G there: the top (below the SRF, capacitive) and the bottom (above it).
      expect(Math.abs(half[k].v) / half[k].x - 1).toBeCloseTo(0, 5);
      expect(Math.sign(half[k].v)).toBe(k === 0 ? 1 : -1);
    }
    const texts = svgTexts(out.svg);
    expect(texts).toContain(formatEng(f1, 'Hz'));
    expect(texts).toContain(formatEng(f2, 'Hz'));
    expect(out.description).toContain(`Q = f0/(f2 − f1) = ${Number((f0 / (f2 - f1)).toPrecision(3))}`);
    // Q from the closed form, √(L/C)/R = 3.73.
    expect(Number((f0 / (f2 - f1)).toPrecision(3))).toBeCloseTo(Number(Q.toPrecision(3)), 2);
  });

  it('says in words which side is which, and names its axes', async () => {
    const texts = svgTexts((await renderPartChart('plane', a)).svg);
    for (const t of ['capacitive (B > 0) ↑', 'inductive (B < 0) ↓', 'Conductance G', 'Susceptance B', 'half power, |X| = R']) expect(texts).toContain(t);
  });

  it('names both halves for every capacitor of the demo: on the plot beside the zero line or in a corner, else in the key', async () => {
    const library = loadLibrary(REPO).library!;
    const capacitors = library.parts.filter((p) => p.kind === 'capacitor');
    expect(capacitors.length).toBeGreaterThan(10);
    let onPlot = 0;
    for (const part of capacitors) {
      const texts = svgTexts((await renderPartChart('plane', analysePart(part, library.settings.sweep, library.settings.within, library.settings.temperature))).svg);
      const notes = ['capacitive (B > 0) ↑', 'inductive (B < 0) ↓'].filter((t) => texts.includes(t));
      if (notes.length === 2) onPlot++;
      else expect(texts.join(' '), part.id).toContain('upper half capacitive (B > 0), lower inductive');
      // Never one half on the plot and the other nowhere.
      expect(notes.length === 2 || notes.length === 0, part.id).toBe(true);
    }
    expect(onPlot, 'capacitors whose plot names both halves').toBeGreaterThan(capacitors.length / 2);
  });

  it('draws a sharp resonance round: no chord of the path strays more than 1% of the radius inside the circle', async () => {
    // The demo's X2 capacitor, ESR 60 mΩ + ESL 9 nH + 100 nF (its part file): Q = √(L/C)/R = 5, so between two
    // sweep points 2.3% apart the path turns by about 4Q × 2.3% = 26° of the circle.
    const library = loadLibrary(REPO).library!;
    const part = library.partsById.get('ORV-C-X2-100N-310V')!;
    const out = await renderPartChart('plane', analysePart(part, library.settings.sweep, library.settings.within, library.settings.temperature));
    const rows = (out.spec as { datasets: Rows }).datasets.curves;
    // Circle of diameter 1/ESR through the origin (series resonance, as above); the 30 GΩ leakage is far below this tolerance.
    const r = 1 / (2 * 0.06);
    let worst = 0;
    for (let k = 1; k < rows.length; k++) {
      const [mx, mv] = [(rows[k - 1].x + rows[k].x) / 2, (rows[k - 1].v + rows[k].v) / 2];
      worst = Math.max(worst, (r - Math.hypot(mx - r, mv)) / r);
    }
    expect(worst).toBeLessThan(0.01);
  });

  it('labels a decade that falls on a half-power point once: the 100 pF C0G of the demo has one "1 GHz", not two', async () => {
    // Its part file: ESR 300 mΩ + ESL 0.3 nH + 100 pF. Series R-L-C closed forms as above: f0 = 919 MHz,
    // Q = √(L/C)/R = 5.77, f2 = f0·(√(1 + 1/(4Q²)) + 1/(2Q)) = 1.00 GHz, a hair from the 1 GHz decade.
    const [r, l, c] = [0.3, 0.3e-9, 100e-12];
    const w0 = 1 / Math.sqrt(l * c);
    const q = Math.sqrt(l / c) / r;
    const upper = (w0 / (2 * Math.PI)) * (Math.sqrt(1 + 1 / (4 * q * q)) + 1 / (2 * q));
    expect(formatEng(upper, 'Hz')).toBe('1 GHz');
    const library = loadLibrary(REPO).library!;
    const part = library.partsById.get('ORV-C-0201-100P-C0G')!;
    const out = await renderPartChart('plane', analysePart(part, library.settings.sweep, library.settings.within, library.settings.temperature));
    const texts = svgTexts(out.svg);
    expect(texts.filter((t) => t === '1 GHz')).toHaveLength(1);
    // The decade's dot stays: 1 GHz is still marked on the path.
    const decades = (out.spec as { datasets: Rows }).datasets.decades;
    const w = 2 * Math.PI * 1e9;
    const y = new Complex(1, 0).div(new Complex(r, w * l - 1 / (w * c)));
    expect(decades.some((d) => Math.abs(d.x / y.re - 1) < 1e-3 && Math.abs(d.v / y.im - 1) < 1e-3)).toBe(true);
  });

  it('is for capacitors only: an inductor and a network keep the impedance plane', async () => {
    for (const p of [inductorPart, networkPart]) {
      const texts = svgTexts((await renderPartChart('plane', analysed(p))).svg);
      expect(texts).toContain('Resistance R (signed-log scale)');
      expect(texts).not.toContain('Conductance G');
    }
  });
});
