import { describe, expect, it } from 'vitest';
import { analysePart } from '../../src/analysis/part-figures.js';
import { figureChange, movableFigures, movedFigures, MOVE_THRESHOLD, type PartFigures } from '../../src/history/part-figure-changes.js';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { referenceZAt } from '../reference/impedance.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';

// A capacitor C with ESR R and ESL L (values invented): its self-resonance is f0 = 1/(2π√(LC)) with |Z| = R
// there, and its effective capacitance C_eff = −1/(ωX) = C/(1 − ω²LC) (Alexander & Sadiku, Fundamentals of
// Electric Circuits, 6th ed., ch. 9); within 10 % of C up to ω²LC = 1/11, i.e. to f0/√11. Effective values
// checked with complex.js (test/reference/impedance.ts).

function part(text: string): Part {
  const d = new DiagnosticList();
  const p = readPart({ source: parseYamlSource('parts/p.yaml', text, d)!, diagnostics: d });
  expect(d.sorted().map(formatDiagnostic)).toEqual([]);
  return p!;
}
const SWEEP = { fromHz: 1e3, toHz: 1e10, perDecade: 20 };
const C = 1e-6;
const L = 0.5e-9;
const R = 8e-3;
const cap = part(`id: C1\nkind: capacitor\nnominal: 1u\nvoltage: 16V\nparasitics: {esr: 8m, esl: 0.5n}\n`);

describe('movableFigures', () => {
  const f = movableFigures(analysePart(cap, SWEEP, 0.1));
  const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C));
  it('SRF 1/(2π√(LC)) and the resistance there, ESR', () => {
    expect(f.srfHz! / f0).toBeCloseTo(1, 8);
    expect(f.esrAtSrfOhm! / R).toBeCloseTo(1, 8);
  });
  it('the usable band (C_eff within 10 %) ends at f0/√11', () => {
    expect(f.bandFromHz).toBe(1e3);
    expect(f.bandToHz! / (f0 / Math.sqrt(11))).toBeCloseTo(1, 6);
  });
  it('the effective capacitance at the band’s geometric middle, −1/(ωX) by complex.js', () => {
    const middle = Math.sqrt(f.bandFromHz! * f.bandToHz!);
    expect(f.bandMiddleHz).toBeCloseTo(middle, 6);
    const x = referenceZAt(series(resistor(R), inductor(L), capacitor(C)), middle).im;
    expect(f.effectiveUnit).toBe('F');
    expect(f.effectiveAtBandMiddle! / (-1 / (2 * Math.PI * middle * x))).toBeCloseTo(1, 10);
  });
  it('an inductor’s effective value is X/ω in henries', () => {
    const coil = part(`id: L1\nkind: inductor\nnominal: 10u\nparasitics: {dcr: 50m, cp: 2p}\n`);
    const g = movableFigures(analysePart(coil, SWEEP, 0.1));
    expect(g.effectiveUnit).toBe('H');
    const middle = g.bandMiddleHz!;
    const z = referenceZAt(coil.network, middle);
    expect(g.effectiveAtBandMiddle! / (z.im / (2 * Math.PI * middle))).toBeCloseTo(1, 10);
  });
});

describe('figureChange and movedFigures', () => {
  it('change in percent of |before|; none when a side is missing or before is zero', () => {
    expect(figureChange(200, 150).changePercent).toBeCloseTo(-25, 12);
    expect(figureChange(-2, -1).changePercent).toBeCloseTo(50, 12);
    expect(figureChange(null, 1).changePercent).toBeNull();
    expect(figureChange(0, 1).changePercent).toBeNull();
  });
  it('a figure moved when it differs by more than one part in a million, or appears or vanishes', () => {
    const base: PartFigures = { srfHz: 7e6, bandFromHz: 1e3, bandToHz: 2e6, esrAtSrfOhm: 0.008, effectiveAtBandMiddle: 1e-6, bandMiddleHz: 4.5e4, effectiveUnit: 'F' };
    const after: PartFigures = { ...base, srfHz: 7e6 * (1 + 0.5 * MOVE_THRESHOLD), bandToHz: 2e6 * (1 + 2 * MOVE_THRESHOLD), esrAtSrfOhm: null };
    expect(Object.keys(movedFigures(base, after))).toEqual(['bandToHz', 'esrAtSrfOhm']);
    expect(movedFigures(base, after).esrAtSrfOhm).toEqual({ before: 0.008, after: null, changePercent: null });
  });
});
