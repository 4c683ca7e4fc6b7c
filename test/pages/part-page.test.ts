// The datasheet page's text, without a build: the impedance table and headline figures of a series R-L-C
// capacitor model (100 nF, ESR 18 mΩ, ESL 0.45 nH, leakage 1 GΩ) against the closed forms worked by hand
// (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9 and 14): X = ωL − 1/(ωC),
// |Z| = √(R² + X²), phase = atan2(X, R), C_eff = C/(1 − ω²LC), Q = |X|/R, SRF = 1/(2π√(LC)).
// From 1 MHz up the 1 GΩ leakage adds under 3 nΩ to R: far below the third digit shown.

import { describe, expect, it } from 'vitest';
import type { Part } from '../../src/model/part.js';
import { partPageText } from '../../src/pages/part-page.js';
import { analysed, capacitorPart, resistorPart } from '../charts/fixtures.js';

/** The chart fixtures carry only what the analysis reads; a page also reads the part's ratings. */
const withRatings = (p: Part): Part => ({ ...p, voltageRatings: [], dcBias: [], tags: [] }) as Part;

describe('a datasheet page of a series R-L-C capacitor', () => {
  const text = partPageText(analysed(withRatings(capacitorPart)));
  const row = (frequency: string) => text.impedanceTable.find((r) => r.frequency === frequency);

  it('tabulates Z at each decade as the closed forms give it', () => {
    expect(text.effectiveHeading).toBe('C_eff');
    // 1 MHz: X = −1.58872 Ω, |Z| = 1.58882 Ω, phase −89.351°, C_eff = 100.178 nF, Q = 88.26.
    expect(row('1 MHz')).toEqual({ frequency: '1 MHz', resistance: '18 mΩ', reactance: '−1.59 Ω', magnitude: '1.59 Ω', phase: '−89.4°', effective: '100 nF', q: '88.3' });
    // 10 MHz: X = −130.88 mΩ, |Z| = 132.11 mΩ, phase −82.169°, C_eff = 121.60 nF, Q = 7.271.
    expect(row('10 MHz')).toEqual({ frequency: '10 MHz', resistance: '18 mΩ', reactance: '−131 mΩ', magnitude: '132 mΩ', phase: '−82.2°', effective: '122 nF', q: '7.27' });
    // 100 MHz, above the SRF: X = +266.83 mΩ, |Z| = 267.43 mΩ, phase +86.141°, Q = 14.82; no capacitance to state.
    expect(row('100 MHz')).toEqual({ frequency: '100 MHz', resistance: '18 mΩ', reactance: '267 mΩ', magnitude: '267 mΩ', phase: '86.1°', effective: '', q: '14.8' });
  });

  it('says that the part states no spread, so every figure is nominal', () => {
    // The fixture states no tolerance, temperature characteristic or parasitic spread.
    expect(text.figures.find((r) => r.label === 'Spread')).toEqual({ label: 'Spread', value: 'none stated', note: 'no tolerance, temperature characteristic or parasitic spread in the part file: every figure is nominal' });
    expect(text.spreadNote).toBe('');
  });

  it('states the SRF (23.7254 MHz) and the ESR there (R = 18 mΩ, where X = 0)', () => {
    expect(text.srfText).toBe('23.7 MHz');
    expect(text.figures.find((r) => r.label === 'Self-resonant frequency')).toMatchObject({ value: '23.7 MHz', note: 'series resonance' });
    expect(text.figures.find((r) => r.label === 'ESR at SRF')?.value).toBe('18 mΩ');
  });

  it('lists every leaf of the model with its value, in drawing order', () => {
    expect(text.parameters.map((r) => [r.label, r.value])).toEqual([
      ['R1', '18 mΩ'],
      ['L1', '450 pH'],
      ['C1', '100 nF'],
      ['R2', '1 GΩ'],
    ]);
  });
});

describe('a datasheet page of a resistor', () => {
  it('heads the effective column with the deviation of |Z| from R', () => {
    const text = partPageText(analysed(withRatings(resistorPart)));
    expect(text.effectiveHeading).toBe('|Z|/R − 1');
    // 1 kΩ + j·ωL (0.6 nH), across it 0.08 pF: Z = (R + jωL)/(1 + jωC(R + jωL)). At 1 kHz |Z|/R − 1 =
    // −1.2443e-13 (mpmath at 40 digits), far under the table's 0.001 % resolution: it reads 0.000%.
    expect(text.impedanceTable[0]).toMatchObject({ frequency: '1 kHz', magnitude: '1 kΩ', effective: '0.000%' });
    // Where it is visible, it is the closed form's value, rounded to 0.001 %, with its sign.
    const closedForm = (f: number) => {
      const w = 2 * Math.PI * f, R = 1e3, L = 0.6e-9, C = 0.08e-12;
      // |R + jωL| / |1 − ω²LC + jωCR|
      return Math.hypot(R, w * L) / Math.hypot(1 - w * w * L * C, w * C * R) / R - 1;
    };
    const visible = text.impedanceTable.filter((row) => row.effective !== '0.000%');
    expect(visible.length).toBeGreaterThan(0);
    for (const row of visible) {
      const f = Number(row.frequency.replace(' kHz', 'e3').replace(' MHz', 'e6').replace(' GHz', 'e9').replace(' Hz', ''));
      const expected = closedForm(f) * 100;
      const shown = Number(row.effective.replace('−', '-').replace(/%$/, ''));
      expect(Math.abs(shown - expected)).toBeLessThanOrEqual(Math.max(0.0005, Math.abs(expected) * 5e-3));
      expect(Math.sign(shown)).toBe(Math.sign(expected));
    }
  });
});

describe('a network\'s model table', () => {
  it('fills the meaning of every element with its kind and its place in the tree', async () => {
    const { partPageText } = await import('../../src/pages/part-page.js');
    const { analysePart } = await import('../../src/analysis/part-figures.js');
    const { capacitor, inductor, parallel, resistor, series } = await import('../../src/circuit/element.js');
    // An invented RC snubber with its lead inductance, and a resistor across the capacitor.
    const network = series(resistor(4.7), inductor(1.5e-9), parallel(capacitor(470e-12), resistor(1e6)));
    const part = { id: 'DEMO-N-SNUB', kind: 'network', behavesAs: undefined, title: 'snubber', network, parameters: {}, dcBias: [], tags: [], voltageRatings: [] } as never;
    const text = partPageText(analysePart(part, { fromHz: 1e3, toHz: 1e9, perDecade: 20 }, 0.1));
    expect(text.parameters.map((r) => [r.label, r.note])).toEqual([
      ['R1', 'resistance, in series with L1 and a parallel group'],
      ['L1', 'inductance, in series with R1 and a parallel group'],
      ['C1', 'capacitance, in parallel with R2'],
      ['R2', 'resistance, in parallel with C1'],
    ]);
  });
});
