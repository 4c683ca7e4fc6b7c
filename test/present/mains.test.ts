// Mains (safety-class) capacitors: each class family gets its own caution (IEC 60384-14: X across the line,
// Y across the insulation barrier), energies are taken at the peak of an AC rating (√2·V_rms, then the
// closed form E = ½·C·V²), the touch current of a Y part is I = 2π·f·C·V (an ideal capacitor's admittance,
// any circuits text), and every mains text defers to the equipment safety standard, local codes and
// licensed practice. Reference values are computed here, not taken from zfolio.

import { describe, expect, it } from 'vitest';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { cautionsFor, storedEnergyText } from '../../src/present/cautions.js';
import { mainsBanner, mainsMark, safetyClassCaution } from '../../src/present/mains.js';
import { REPO } from '../site-helpers.js';

function part(yaml: string): Part {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/t.yaml', yaml, diagnostics);
  const p = source ? readPart({ source, diagnostics }) : undefined;
  expect(diagnostics.errorCount).toBe(0);
  return p!;
}

const X2 = part('id: T-X2\nkind: capacitor\nnominal: 100n\nvoltage: 310V AC\nsafety: X2\n');
const Y2 = part('id: T-Y2\nkind: capacitor\nnominal: 2n2\nvoltage: 300V AC\nsafety: Y2\n');
const Y1 = part('id: T-Y1\nkind: capacitor\nnominal: 1n\nvoltage: 500V AC\nsafety: Y1\n');
const DC = part('id: T-DC\nkind: capacitor\nnominal: 100n\nvoltage: 310V\n');

/** Pages print three significant digits, so a printed figure is within half a unit of its third digit: 0.5%. */
function expectPrinted(printed: number, reference: number): void {
  expect(Math.abs(printed / reference - 1)).toBeLessThanOrEqual(5e-3);
}

/** The energy figure a text states, in joules ("9.61 mJ" → 9.61e-3). */
function joulesIn(text: string): number {
  const m = /([\d.]+) (m|µ|)J\b/.exec(text);
  expect(m, text).not.toBeNull();
  return Number(m![1]) * { m: 1e-3, µ: 1e-6, '': 1 }[m![2] as 'm' | 'µ' | ''];
}

describe('stored energy at the peak of the rating', () => {
  it('the demo X2 part, 100 nF at 310 V AC, holds about 9.6 mJ, not the 4.8 mJ of 310 V DC', () => {
    const reference = 0.5 * 100e-9 * (Math.SQRT2 * 310) ** 2; // ½·C·(√2·V_rms)² = C·V_rms²
    expect(reference).toBeCloseTo(9.61e-3, 5);
    const text = cautionsFor(X2).find((c) => c.startsWith('Stored charge'))!;
    expectPrinted(joulesIn(text), reference);
    expect(text).toContain('438 V peak of its 310 V AC rating');
    expect(text).toContain('½·C·V²');
  });

  it('a DC rating is its own peak: 100 nF at 310 V DC holds ½·C·V² = 4.8 mJ', () => {
    const text = cautionsFor(DC).find((c) => c.startsWith('Stored charge'))!;
    expectPrinted(joulesIn(text), 0.5 * 100e-9 * 310 ** 2);
    expect(text).toContain('rated 310 V');
  });

  it('with both ratings, the higher peak counts: 630 V DC over the 438 V peak of 310 V AC', () => {
    const both = part('id: T-B\nkind: capacitor\nnominal: 100n\nvoltage: [310V AC, 630V DC]\nsafety: X2\n');
    expectPrinted(joulesIn(storedEnergyText(both)!), 0.5 * 100e-9 * 630 ** 2);
  });
});

describe('class cautions (IEC 60384-14)', () => {
  const x = safetyClassCaution(X2)!;
  const y = safetyClassCaution(Y2)!;

  it('X and Y parts get different cautions, each naming the standard', () => {
    expect(x).not.toBe(y);
    expect(x).toContain('IEC 60384-14');
    expect(y).toContain('IEC 60384-14');
  });

  it('X: across the line, a failure short-circuits the supply, so it must fail safe', () => {
    expect(x).toMatch(/across the line \(line to line or line to neutral\)/);
    expect(x).toMatch(/short-circuits the supply/);
    expect(x).toMatch(/fail safe/);
    expect(x).not.toMatch(/protective earth/);
  });

  it('Y: across the insulation barrier, value limited by touch current, only approved Y parts of the right subclass', () => {
    expect(y).toMatch(/insulation barrier/);
    expect(y).toMatch(/line to protective earth/);
    expect(y).toMatch(/touch \(leakage\) current/);
    expect(y).toMatch(/applicable equipment safety standard/);
    expect(y).toMatch(/only a certified Y part of the subclass/);
    expect(y).toMatch(/never an X part/);
    // Y2 bridges basic or supplementary insulation; double or reinforced needs Y1 (IEC 60384-14, from memory).
    expect(y).toMatch(/basic or supplementary insulation only/);
    expect(safetyClassCaution(Y1)).toMatch(/Y1 may bridge double or reinforced insulation/);
  });

  it('Y: the touch current at the AC rating and 60 Hz is I = 2π·f·C·V', () => {
    const reference = 2 * Math.PI * 60 * 2.2e-9 * 300; // 249 µA
    const m = /passes about ([\d.]+) µA/.exec(y);
    expect(m, y).not.toBeNull();
    expectPrinted(Number(m![1]) * 1e-6, reference);
  });

  it('every mains part defers to the equipment standard, local codes and licensed practice, and names bleeders as common practice', () => {
    for (const p of [X2, Y2]) {
      const all = cautionsFor(p).join(' ');
      expect(all).toMatch(/equipment safety standard, local electrical codes and licensed practice/);
      expect(all).toMatch(/qualified person/);
      expect(all).toMatch(/can stay charged after power is removed/);
    }
    expect(cautionsFor(X2).join(' ')).toMatch(/common practice is a bleeder resistor across the line/);
  });

  it('an ordinary part gets no class caution, banner or mark', () => {
    expect(safetyClassCaution(DC)).toBeUndefined();
    expect(mainsBanner(DC)).toBeUndefined();
    expect(mainsMark(DC)).toBeUndefined();
  });
});

describe('banner and index mark', () => {
  it('the banner names the class, the standard, where the part sits and the hazard', () => {
    const banner = mainsBanner(X2, storedEnergyText(X2))!;
    expect(banner.heading).toBe('Mains part: class X2 safety capacitor (IEC 60384-14)');
    expect(banner.text).toMatch(/^Hazardous voltage \(rated 310 V AC\)\. For use across the line/);
    expect(banner.text).toContain('9.61 mJ');
    expect(mainsBanner(Y2)!.text).toMatch(/across the insulation barrier \(line to protective earth/);
  });

  it('the mark says MAINS and the class, with words for the tooltip', () => {
    expect(mainsMark(Y2)).toEqual({
      label: 'MAINS Y2',
      title: expect.stringMatching(/^Mains safety capacitor, class Y2 \(IEC 60384-14\), for use across the insulation barrier .*hazardous voltage/),
    });
  });

  it('the demo library\'s mains parts read as AC ratings and carry their class cautions', () => {
    const library = loadLibrary(REPO).library!;
    const x2 = library.partsById.get('ORV-C-X2-100N-310V')!;
    const y2 = library.partsById.get('ORV-C-Y2-2N2-300V')!;
    expect([x2.voltageAcV, x2.voltageV]).toEqual([310, undefined]);
    expect([y2.voltageAcV, y2.voltageV]).toEqual([300, undefined]);
    expect(cautionsFor(x2)[0]).toBe(safetyClassCaution(x2));
    expect(cautionsFor(y2)[0]).toBe(safetyClassCaution(y2));
  });
});
