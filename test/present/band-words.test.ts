// The usable band in words. The capacitor's band edge is SRF·√(1 − 1/(1 + within)) for the plain series model
// (from C_eff = C/(1 − (f/SRF)²); see src/analysis/band.ts), SRF = 1/(2π√(LC)) = 23.72 MHz for the fixture's
// 100 nF and 0.45 nH, so 7.15 MHz at ±10%.

import { describe, expect, it } from 'vitest';
import { bandCaption, bandRange, bandRuleText, bandText } from '../../src/present/band-words.js';
import { analysed, beadPart, capacitorPart, resistorPart } from '../charts/fixtures.js';

describe('a chart key and caption', () => {
  it('name the rule the band was found by', () => {
    const c = analysed(capacitorPart);
    expect(bandCaption(c.part.behavesAs, c.within)).toBe('usable band (±10%)');
    expect(bandCaption('bead', analysed(beadPart).within)).toBe('absorbing band (R − Rdc ≥ |X|)');
    expect(bandCaption('resistor', analysed(resistorPart).within)).toBe('usable band (|Z − R|/R ≤ 10%)');
    expect(bandCaption(undefined, undefined)).toBe('usable band');
  });

  it('say where an edge is the sweep end', () => {
    expect(bandRange(analysed(capacitorPart).usableBand!)).toBe('up to 7.15 MHz');
    expect(bandRange({ fromHz: 1e3, toHz: 1e6, fromIsSweepEnd: false, toIsSweepEnd: true })).toBe('from 1 kHz');
    expect(bandRange({ fromHz: 1e3, toHz: 1e6, fromIsSweepEnd: false, toIsSweepEnd: false })).toBe('1 kHz – 1 MHz');
    expect(bandRange({ fromHz: 1e3, toHz: 1e6, fromIsSweepEnd: true, toIsSweepEnd: true })).toBe('whole sweep');
  });
});

describe('the figures table and the command line', () => {
  it('mark an edge at the sweep end with ≤ or ≥', () => {
    expect(bandText(analysed(capacitorPart).usableBand)).toBe('≤ 1 kHz to 7.15 MHz');
    expect(bandText({ fromHz: 1e3, toHz: 1e6, fromIsSweepEnd: false, toIsSweepEnd: true })).toBe('1 kHz to ≥ 1 MHz');
    expect(bandText(null)).toBe('none in the sweep');
  });

  it('state the rule: within a fraction of nominal, or a bead\'s resistive band, or none', () => {
    expect(bandRuleText('capacitor', 0.2)).toBe('value within 20% of nominal');
    expect(bandRuleText('bead', null)).toBe('resistive: R − Rdc ≥ |X|');
    expect(bandRuleText(undefined, undefined)).toBeUndefined();
  });
});
