// A part's spread in plain words, and the sentence on what a corner leaves out. The value's extremes are
// C·(1 − t)·(1 + ΔC_low) and C·(1 + t)·(1 + ΔC_high), the factors multiplied at their own extremes; X7R is
// −55 °C to 125 °C and ±15 % (EIA-198 class 2 letter R), class 1 C0G is 0 ± 30 ppm/K (EIA-198);
// class 2 ceramics lose a few percent per decade of hours (common practice).

import { describe, expect, it } from 'vitest';
import { analysePart } from '../../src/analysis/part-figures.js';
import { spreadSummary } from '../../src/analysis/summary.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { partCornerSentence, railCornerSentence, spreadFigureTexts, valueSpreadText } from '../../src/present/corner-words.js';
import { formatEng, formatEngRange } from '../../src/units/format.js';

function part(yaml: string): Part {
  const diagnostics = new DiagnosticList();
  const p = readPart({ source: parseYamlSource('parts/p.yaml', yaml, diagnostics)!, diagnostics });
  expect(diagnostics.sorted()).toEqual([]);
  return p!;
}

const SWEEP = { fromHz: 1e3, toHz: 1e9, perDecade: 20 };
const words = (p: Part, operating: { fromC: number; toC: number }) => valueSpreadText(p, spreadSummary(analysePart(p, SWEEP, 0.1, operating))!);

describe('a part\'s value over its spread, in plain words', () => {
  it('10 µF ±10% X7R over −55 °C to 125 °C: the tolerance, the change over the range, and where it comes from', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 10u\ntolerance: 10%\ndielectric: X7R\nparasitics: {esr: 5m, esl: 0.5n}\n');
    const low = formatEng(10e-6 * 0.9 * 0.85, 'F');
    const high = formatEng(10e-6 * 1.1 * 1.15, 'F');
    expect([low, high]).toEqual(['7.65 µF', '12.7 µF']);
    expect(words(p, { fromC: -55, toC: 125 })).toBe(`10 µF ±10%, −15% … +15% over −55 °C to 125 °C (X7R, EIA-198 class 2, specified −55 °C to 125 °C): ${low} to ${high}`);
  });

  it('an asymmetric tolerance and a stated temperature block', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 4.7u\ntolerance: +80%/-20%\ntemperature: {from: -30°C, to: 85°C, change: +22%/-56%}\nparasitics: {esr: 5m, esl: 0.5n}\n');
    const text = words(p, { fromC: 0, toC: 70 });
    expect(text).toBe(`4.7 µF +80%/−20%, −56% … +22% over 0 °C to 70 °C (as the part states, −30 °C to 85 °C): ${formatEng(4.7e-6 * 0.8 * 0.44, 'F')} to ${formatEng(4.7e-6 * 1.8 * 1.22, 'F')}`);
  });

  it('C0G: ±30 ppm/K from 25 °C, so at most ±30e-6 × 45 K = ±0.135% over 0 °C to 70 °C', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 100p\ntolerance: 5%\ndielectric: C0G\nparasitics: {esr: 50m, esl: 0.4n}\n');
    const change = 30e-6 * (70 - 25);
    // 100 pF × 0.95 × (1 − 0.00135) = 94.872 pF and × 1.05 × 1.00135 = 105.14 pF, at four digits (the ends
    // are a tenth of the value apart).
    expect([100e-12 * 0.95 * (1 - change), 100e-12 * 1.05 * (1 + change)].map((f) => f * 1e12)).toEqual([expect.closeTo(94.872, 3), expect.closeTo(105.142, 3)]);
    expect(words(p, { fromC: 0, toC: 70 })).toBe('100 pF ±5%, −0.135% … +0.135% over 0 °C to 70 °C (C0G, EIA-198 class 1, ±30 ppm/K from 25 °C): 94.87 pF to 105.1 pF');
  });

  it('a C0G with no tolerance stated: the ±0.135% ends are told apart, not both "3.3 pF"', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 3.3p\ndielectric: C0G\nparasitics: {esr: 15m, esl: 0.47n}\n');
    const text = words(p, { fromC: 0, toC: 70 })!;
    const ends = text.slice(text.lastIndexOf(': ') + 2).split(' to ');
    expect(ends).toHaveLength(2);
    expect(ends[0]).not.toBe(ends[1]);
    // Each end read back agrees with 3.3 pF × (1 ∓ 30e-6 × 45 K) to its last digit (5 digits: 3.2955, 3.3045).
    const exact = [3.3 * (1 - 30e-6 * 45), 3.3 * (1 + 30e-6 * 45)];
    ends.forEach((e, i) => {
      expect(e).toMatch(/^\d\.\d{4} pF$/);
      expect(Math.abs(parseFloat(e) - exact[i])).toBeLessThanOrEqual(0.5e-4 + 1e-12);
    });
  });
});

describe('what a corner is and what it leaves out, in one sentence', () => {
  const x7r = part('id: C\nkind: capacitor\nnominal: 10u\ntolerance: 10%\ndielectric: X7R\nparasitics: {esr: 5m, esl: 0.5n}\n');
  it.each([
    ['part', partCornerSentence({ fromC: -40, toC: 85 }, x7r)],
    ['rail', railCornerSentence({ fromC: -40, toC: 85 })],
  ])('%s: one sentence naming ageing and its usual size', (_, sentence) => {
    expect(sentence.match(/[.!?](\s|$)/g)).toHaveLength(1);
    expect(sentence).toMatch(/ageing, which the maker's data must cover \(class 2 ceramics lose a few percent of their capacitance per decade of hours, common practice\)\.$/);
    expect(sentence).toContain('−40 °C to 85 °C');
  });

  it('a class 2 ceramic\'s spread leaves out DC bias, which a rail plan applies', () => {
    expect(partCornerSentence({ fromC: -40, toC: 85 }, x7r)).toContain('without DC bias (a rail plan applies it at its voltage) and without ageing');
  });

  it.each([
    ['a resistor', 'id: R\nkind: resistor\nnominal: 10k\ntolerance: 1%\nparasitics: {ls: 0.4n, cp: 0.15p}\n'],
    ['a C0G capacitor', 'id: C\nkind: capacitor\nnominal: 100p\ntolerance: 5%\ndielectric: C0G\nparasitics: {esr: 50m, esl: 0.4n}\n'],
  ])('%s: neither DC bias nor the ageing of class 2 ceramics, which are not its own', (_, yaml) => {
    const sentence = partCornerSentence({ fromC: -40, toC: 85 }, part(yaml));
    expect(sentence.match(/[.!?](\s|$)/g)).toHaveLength(1);
    expect(sentence).not.toMatch(/DC bias|class 2/);
    expect(sentence).toMatch(/ — without ageing, which the maker's data must cover\.$/);
  });
});

describe('figures over the spread, in plain words', () => {
  it('a bead whose rated |Z| spreads: its SRF does not move, and the words say so once, not "at every corner" beside "at 2 corners"', () => {
    // A parallel R‖L‖C tank is real at ω = 1/√(LC) whatever R is (closed form), and a series Rdc adds no
    // reactance: the SRF of this bead is 1/(2π√(1.4 µH · 0.45 pF)) ≈ 200.5 MHz at both ends of its tolerance.
    const p = part('id: FB\nkind: bead\nnominal: 600 Ω\nat: 100 MHz\ntolerance: 25%\nmodel: {rdc: 150m, r: 700, l: 1.4u, c: 0.45p}\n');
    const s = spreadSummary(analysePart(p, { fromHz: 1e6, toHz: 3e9, perDecade: 50 }, 0.1, { fromC: 0, toC: 70 }))!;
    const srf = 1 / (2 * Math.PI * Math.sqrt(1.4e-6 * 0.45e-12));
    const texts = spreadFigureTexts(s);
    expect(texts.srf).toBe(`${formatEng(srf, 'Hz')}, the same at each corner`);
    expect(texts.corners).toBe('2 corners (every combination of the value at its low and high end)');
  });

  it('a capacitor whose value spreads: its SRF is a range, lowest at the highest value (f = 1/(2π√(LC)))', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nparasitics: {esr: 20m, esl: 0.5n}\n');
    const s = spreadSummary(analysePart(p, { fromHz: 1e3, toHz: 1e9, perDecade: 50 }, 0.1, { fromC: 0, toC: 70 }))!;
    const f = (c: number) => 1 / (2 * Math.PI * Math.sqrt(0.5e-9 * c));
    expect(spreadFigureTexts(s).srf).toBe(formatEngRange(f(110e-9), f(90e-9), 'Hz').join(' to '));
  });
});
