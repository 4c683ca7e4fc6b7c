// A part's facts, kind names and model words, from the fixture library's invented parts.

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { kindLabel, kindPlural } from '../../src/present/kinds.js';
import { modelCaption, parameterMeaning } from '../../src/present/model-words.js';
import { nominalText, ratingText, ratingTexts, selectionText, signedPercent, sweepRangeText, sweepText } from '../../src/present/part-words.js';
import type { Part } from '../../src/model/part.js';
import type { VoltageRating } from '../../src/model/voltage-rating.js';
import { comparisonSlug, railSlug, reviewSlug } from '../../src/present/slugs.js';

const good = loadLibrary(fileURLToPath(new URL('../fixtures/good-library', import.meta.url))).library!;
const part = (id: string) => good.partsById.get(id)!;

describe('part facts', () => {
  it('give the nominal with its tolerance, and a bead\'s rated impedance with its frequency', () => {
    expect(nominalText(part('CAP-TEST-100N'))).toBe('100 nF ±10%');
    expect(nominalText(part('BEAD-TEST-600R'))).toBe('600 Ω at 100 MHz');
  });

  it('list the ratings, and the sweep', () => {
    expect(ratingText(part('CAP-TEST-100N'))).toBe('16 V');
    expect(ratingText(part('IND-TEST-10U'))).toBe('1.5 A');
    expect(sweepText({ fromHz: 1e3, toHz: 1e10, perDecade: 50 })).toBe('1 kHz to 10 GHz, 50 points per decade');
    expect(sweepRangeText(1e3, 3e9)).toBe('1 kHz to 3 GHz');
  });

  it('give each part its own rating text when the texts are remembered by the values they are made of', () => {
    // Invented ratings, drawn from few values so that most parts share a text with another, and pairs that
    // differ in one value only (kind, whether the kind was stated, the order of two ratings, a current or a
    // power added): the remembered text must be the one ratingText makes for that very part.
    const volts = [6.3, 16, 16.0001, 250, 310];
    const ratings: VoltageRating[] = volts.flatMap((v) => [
      { volts: v, kind: 'DC', stated: false },
      { volts: v, kind: 'DC', stated: true },
      { volts: v, kind: 'AC', stated: true },
    ]);
    let seed = 11;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    const pick = <T>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)];
    const parts: Part[] = [];
    for (let i = 0; i < 2000; i++) {
      const count = pick([0, 1, 1, 1, 2]);
      const own = Array.from({ length: count }, () => pick(ratings));
      parts.push({ id: `P-${i}`, voltageRatings: own, currentA: pick([undefined, undefined, 0.5, 1.5, 2]), powerW: pick([undefined, undefined, 0.1, 0.25]) } as unknown as Part);
    }
    const [a, b] = [ratings[4], ratings[14]];
    parts.push(...[[a, b], [b, a]].map((own, i) => ({ id: `Q-${i}`, voltageRatings: own }) as unknown as Part));
    const remembered = ratingTexts();
    const texts = parts.map(remembered);
    expect(texts).toEqual(parts.map(ratingText));
    // The ratings as written (SI Brochure notation, a kind written out only when stated or AC).
    expect(texts.slice(-2)).toEqual(['16 V DC, 310 V AC', '310 V AC, 16 V DC']);
    expect(new Set(texts).size).toBeGreaterThan(50);
    expect(new Set(texts).size).toBeLessThan(parts.length / 2);
  });

  it('sign a deviation with a true minus', () => {
    expect(signedPercent(0.0061)).toBe('+0.61%');
    expect(signedPercent(-0.0183)).toBe('−1.83%');
  });
});

describe('kinds and models', () => {
  it('name kinds one by one and in the plural', () => {
    expect(kindLabel({ kind: 'bead', behavesAs: 'bead' })).toBe('Ferrite bead');
    expect(kindLabel({ kind: 'network', behavesAs: 'capacitor' })).toBe('Network (behaves as capacitor)');
    expect(kindLabel({ kind: 'network', behavesAs: undefined })).toBe('Network');
    expect(kindPlural('bead')).toBe('ferrite beads');
  });

  it('caption the model and say what its named elements stand for', () => {
    // The caption names the elements each part's file gives it, read off the fixture files by hand: the
    // capacitor has no leakage (EPR), the inductor every optional element, the network its values.
    expect(modelCaption('capacitor', part('CAP-TEST-100N').network)).toBe('Capacitor model: ESR + ESL + C.');
    expect(modelCaption('inductor', part('IND-TEST-10U').network)).toBe('Inductor model: (DCR + L) ‖ Cp ‖ Rp.');
    expect(modelCaption('resistor', part('RES-TEST-4K7').network)).toBe('Resistor model: (R + Ls) ‖ Cp.');
    expect(modelCaption('bead', part('BEAD-TEST-600R').network)).toBe('Bead model: Rdc + (R ‖ L ‖ C).');
    expect(modelCaption('network', part('NET-TEST-BULK').network)).toBe('Network as written in the part file: 5 mΩ + 1.1 nH + (10 µF ‖ 50 MΩ).');
    expect(parameterMeaning('ESR', 'capacitor')).toBe('equivalent series resistance');
    expect(parameterMeaning('L', 'bead')).toBe('core inductance');
    expect(parameterMeaning('Cp', 'inductor')).toBe('parallel (winding) capacitance');
    expect(parameterMeaning('Cp', 'resistor')).toBe('parallel (terminal-to-terminal) capacitance');
    expect(parameterMeaning('R2', 'network')).toBe('');
    expect(parameterMeaning('constructor', 'network')).toBe('');
  });
});

describe('comparisons and page folders', () => {
  it('say how a comparison chose its parts', () => {
    for (const c of good.comparisons) expect(selectionText(c)).toMatch(/^(\d+ parts named in the file|every part with .+)$/);
  });

  it('name page folders by one rule: safe characters kept, others a dash', () => {
    expect(railSlug('VDD_CORE')).toBe('VDD_CORE');
    expect(railSlug('VDD 3V3/aux')).toBe('VDD-3V3-aux');
    expect(reviewSlug({ source: { path: 'reviews/dl3 power.yaml' } })).toBe('dl3-power');
    for (const c of good.comparisons) expect(comparisonSlug(c)).toMatch(/^[A-Za-z0-9._-]+$/);
  });
});
