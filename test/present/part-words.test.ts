// A part's facts, kind names and model words, from the fixture library's invented parts.

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { kindLabel, kindPlural } from '../../src/present/kinds.js';
import { modelCaption, parameterMeaning } from '../../src/present/model-words.js';
import { nominalText, ratingText, selectionText, signedPercent, sweepRangeText, sweepText } from '../../src/present/part-words.js';
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
