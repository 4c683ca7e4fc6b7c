// Resonances in words. The fixture network's first series resonance is its 10 µF branch's own,
// 1/(2π√(1.1 nH · 10 µF)) = 1.517 MHz; the others come from the analysis (tested in test/analysis), and
// only their wording is checked here.

import { describe, expect, it } from 'vitest';
import type { Resonance } from '../../src/analysis/resonance.js';
import { extremumNote, resonanceLabel, resonanceNote, resonanceShortLabel } from '../../src/present/resonance-words.js';
import { analysed, networkPart } from '../charts/fixtures.js';

describe('resonance labels', () => {
  it('name the self-resonance SRF and the others by type', () => {
    const a = analysed(networkPart);
    expect(a.resonances.map((r) => resonanceLabel(r, a.selfResonance))).toEqual(['SRF 1.52 MHz', 'parallel 13.6 MHz', 'series 24.1 MHz']);
  });

  it('recognise the self-resonance in a copy (another thread, JSON), by value', () => {
    const a = analysed(networkPart);
    const copy = JSON.parse(JSON.stringify(a.selfResonance)) as Resonance;
    expect(resonanceLabel(a.resonances[0], copy)).toBe('SRF 1.52 MHz');
  });

  it('have a short wording, the frequency alone, for a chart with no room for the type', () => {
    const a = analysed(networkPart);
    expect(a.resonances.map(resonanceShortLabel)).toEqual(['1.52 MHz', '13.6 MHz', '24.1 MHz']);
  });
});

describe('resonance notes', () => {
  const r = (f: number, z: number, ef: number, ez: number, atSweepEnd = false): Resonance => ({ frequencyHz: f, type: 'parallel', impedanceOhm: z, extremum: { frequencyHz: ef, impedanceOhm: ez, atSweepEnd } });

  it('name the |Z| extremum only where it differs visibly (by 0.1% or more) from the X = 0 point', () => {
    expect(extremumNote(r(1e6, 100, 1.0005e6, 100.05))).toBeUndefined();
    expect(extremumNote(r(1e6, 100, 0.95e6, 134))).toBe('|Z| max 134 Ω at 950 kHz');
    expect(extremumNote({ ...r(1e6, 0.1, 1e3, 0.09, true), type: 'series' })).toBe('|Z| min 90 mΩ at 1 kHz (sweep end)');
  });

  it('give |Z| where X = 0, then the extremum', () => {
    expect(resonanceNote(r(1e6, 1.12, 0.952e6, 1.34))).toBe('|Z| 1.12 Ω where X = 0; |Z| max 1.34 Ω at 952 kHz');
    expect(resonanceNote(r(1e6, 1.12, 1e6, 1.12))).toBe('|Z| 1.12 Ω where X = 0');
  });
});
