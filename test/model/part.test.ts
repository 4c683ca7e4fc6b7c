// Reading good part files: each kind's model topology (DESIGN.md), checked by evaluating its impedance
// against the closed form; absent parasitics; number notations; fields that must stay as written.
//
// Closed forms: element impedances Z_R = R, Z_L = jωL, Z_C = 1/(jωC), series impedances add, parallel
// admittances add (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §9.4–9.7). The complex
// arithmetic of the reference side is done by complex.js (a general-purpose library from the npm registry),
// not by zfolio's kernel.

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { impedanceAt } from '../../src/circuit/impedance.js';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';

const TWO_PI = 2 * Math.PI;
const j = new Complex(0, 1);

function read(yaml: string): { part?: Part; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/under-test.yaml', yaml, diagnostics);
  const part = source ? readPart({ source, diagnostics }) : undefined;
  return { part, messages: diagnostics.sorted().map(formatDiagnostic) };
}

/** A part that must read without a single message. */
function good(yaml: string): Part {
  const { part, messages } = read(yaml);
  expect(messages).toEqual([]);
  expect(part).toBeDefined();
  return part!;
}

/** |Z_zfolio − Z_reference| / |Z_reference|. */
function mismatch(part: Part, f: number, reference: (w: number) => Complex): number {
  const [re, im] = impedanceAt(part.network, f);
  const z = reference(TWO_PI * f);
  return new Complex(re, im).sub(z).abs() / z.abs();
}

// Sum of the double-rounding errors of a handful of operations; far below any physical meaning.
const CLOSE = 1e-12;
const FREQUENCIES = [1e3, 1e6, 30e6, 1e9];

describe('capacitor: esr + esl + (C ‖ epr)', () => {
  const part = good(`
id: CAP-T1
kind: capacitor
nominal: 100n
parasitics: {esr: 18m, esl: 0.45n, epr: 500M}
`);
  const reference = (w: number) => new Complex(0.018).add(j.mul(w * 0.45e-9)).add(j.mul(w * 100e-9).add(1 / 500e6).inverse());

  it('has the series topology with the leakage across C only', () => {
    expect(part.network).toMatchObject({
      type: 'series',
      parts: [{ type: 'R', ohms: 0.018 }, { type: 'L', henries: 0.45e-9 }, { type: 'parallel', parts: [{ type: 'C', farads: 100e-9 }, { type: 'R', ohms: 500e6 }] }],
    });
    expect(part.parameters).toEqual({ esr: 0.018, esl: 0.45e-9, epr: 500e6 });
  });

  it.each(FREQUENCIES)('matches the closed form at %d Hz', (f) => {
    expect(mismatch(part, f, reference)).toBeLessThan(CLOSE);
  });

  it('is purely the ESR at the series resonance 1/(2π√(LC)) (leakage aside: 500 MΩ adds < 1e-9 Ω)', () => {
    const srf = 1 / (TWO_PI * Math.sqrt(0.45e-9 * 100e-9));
    const [re, im] = impedanceAt(part.network, srf);
    expect(Math.abs(re - 0.018)).toBeLessThan(1e-9);
    // X = ωL − 1/(ωC) cancels; what is left is rounding, compared with the size of either term (≈ 67 mΩ).
    expect(Math.abs(im) / (TWO_PI * srf * 0.45e-9)).toBeLessThan(1e-9);
  });
});

describe('inductor: (dcr + L) ‖ cp ‖ rp', () => {
  const [L, dcr, cp, rp] = [10e-6, 0.12, 2e-12, 50e3];
  const part = good(`
id: IND-T1
kind: inductor
nominal: 10u
parasitics:
  dcr: 120m
  cp: 2p
  rp: 50k
`);
  const reference = (w: number) => new Complex(dcr).add(j.mul(w * L)).inverse().add(j.mul(w * cp)).add(1 / rp).inverse();

  it('has the parallel topology with the winding resistance in series with L', () => {
    expect(part.network).toMatchObject({
      type: 'parallel',
      parts: [{ type: 'series', parts: [{ type: 'R', ohms: dcr }, { type: 'L', henries: L }] }, { type: 'C', farads: cp }, { type: 'R', ohms: rp }],
    });
  });

  it.each(FREQUENCIES)('matches the closed form at %d Hz', (f) => {
    expect(mismatch(part, f, reference)).toBeLessThan(CLOSE);
  });

  it('has X = 0 where ω² = 1/(L·Cp) − (dcr/L)² (Im Y = 0 of the lossy tank; Rp only adds conductance)', () => {
    const w0 = Math.sqrt(1 / (L * cp) - (dcr / L) ** 2);
    const [re, im] = impedanceAt(part.network, w0 / TWO_PI);
    expect(Math.abs(im) / Math.hypot(re, im)).toBeLessThan(1e-9);
  });
});

describe('resistor: (R + ls) ‖ cp', () => {
  const part = good(`
id: RES-T1
kind: resistor
nominal: 4k7
parasitics: {ls: 1n, cp: 0.2p}
`);
  const reference = (w: number) => new Complex(4700).add(j.mul(w * 1e-9)).inverse().add(j.mul(w * 0.2e-12)).inverse();

  it('has the parallel topology with ls in series with R', () => {
    expect(part.network).toMatchObject({
      type: 'parallel',
      parts: [{ type: 'series', parts: [{ type: 'R', ohms: 4700 }, { type: 'L', henries: 1e-9 }] }, { type: 'C', farads: 0.2e-12 }],
    });
  });

  it.each(FREQUENCIES)('matches the closed form at %d Hz', (f) => {
    expect(mismatch(part, f, reference)).toBeLessThan(CLOSE);
  });
});

describe('bead: rdc + (r ‖ l ‖ c)', () => {
  const [rdc, r, l, c] = [0.15, 600, 1.2e-6, 1.5e-12];
  const part = good(`
id: BEAD-T1
kind: bead
nominal: 600
at: 100M
model: {rdc: 150m, r: 600, l: 1.2u, c: 1.5p}
`);
  const reference = (w: number) => new Complex(1 / r).add(j.mul(w * l).inverse()).add(j.mul(w * c)).inverse().add(rdc);

  it('has rdc in series with the parallel core', () => {
    expect(part.network).toMatchObject({
      type: 'series',
      parts: [{ type: 'R', ohms: rdc }, { type: 'parallel', parts: [{ type: 'R', ohms: r }, { type: 'L', henries: l }, { type: 'C', farads: c }] }],
    });
    expect(part.nominal).toBe(600);
    expect(part.ratedAtHz).toBe(100e6);
  });

  it.each(FREQUENCIES)('matches the closed form at %d Hz', (f) => {
    expect(mismatch(part, f, reference)).toBeLessThan(CLOSE);
  });

  it('is rdc + r at the core resonance 1/(2π√(lc)), where the l and c admittances cancel', () => {
    const [re, im] = impedanceAt(part.network, 1 / (TWO_PI * Math.sqrt(l * c)));
    expect(Math.abs(re - (rdc + r)) / (rdc + r)).toBeLessThan(1e-9);
    expect(Math.abs(im) / r).toBeLessThan(1e-9);
  });
});

describe('network: any element tree', () => {
  const part = good(`
id: NET-T1
kind: network
behaves-as: capacitor
nominal: 10u
network: {series: [{r: 5m}, {l: 1.1n}, {parallel: [{c: 10u}, {r: 50M}]}]}
`);
  const reference = (w: number) => new Complex(5e-3).add(j.mul(w * 1.1e-9)).add(j.mul(w * 10e-6).add(1 / 50e6).inverse());

  it('reads the tree as written, with its behaviour and nominal', () => {
    expect(part.network).toMatchObject({
      type: 'series',
      parts: [{ type: 'R', ohms: 5e-3 }, { type: 'L', henries: 1.1e-9 }, { type: 'parallel', parts: [{ type: 'C', farads: 10e-6 }, { type: 'R', ohms: 50e6 }] }],
    });
    expect(part.behavesAs).toBe('capacitor');
    expect(part.nominal).toBe(10e-6);
  });

  it.each(FREQUENCIES)('matches the closed form at %d Hz', (f) => {
    expect(mismatch(part, f, reference)).toBeLessThan(CLOSE);
  });

  it('without behaves-as has no nominal and no behaviour', () => {
    const free = good('id: NET-T2\nkind: network\nnetwork: {parallel: [{c: 1n}, {l: 1u}]}\n');
    expect(free.behavesAs).toBeUndefined();
    expect(free.nominal).toBeUndefined();
  });
});

describe('absent parasitics: 0 in series, open in parallel', () => {
  it('a bare capacitor is C alone: Z = −j/(ωC) with no resistance at all', () => {
    const part = good('id: C\nkind: capacitor\nnominal: 1u\n');
    expect(part.network).toMatchObject({ type: 'C', farads: 1e-6 });
    const [re, im] = impedanceAt(part.network, 1e3);
    expect(re).toBe(0);
    expect(Math.abs(im - -1 / (TWO_PI * 1e3 * 1e-6)) / Math.abs(im)).toBeLessThan(1e-15);
  });

  it('a capacitor without epr has no leakage: at 1 Hz the resistance is exactly the ESR', () => {
    const part = good('id: C\nkind: capacitor\nnominal: 1u\nparasitics: {esr: 10m, esl: 1n}\n');
    expect(impedanceAt(part.network, 1)[0]).toBe(0.01);
  });

  it('an inductor without cp and rp never turns capacitive: Z = dcr + jωL even at 10 GHz', () => {
    const part = good('id: L\nkind: inductor\nnominal: 1u\nparasitics: {dcr: 50m}\n');
    const f = 10e9;
    const [re, im] = impedanceAt(part.network, f);
    expect(re).toBe(0.05);
    expect(Math.abs(im - TWO_PI * f * 1e-6) / im).toBeLessThan(1e-15);
  });

  it('an inductor without dcr is lossless: Z = jωL', () => {
    const part = good('id: L\nkind: inductor\nnominal: 1u\n');
    expect(impedanceAt(part.network, 1e6)[0]).toBe(0);
  });

  it('a resistor without ls and cp is R at every frequency', () => {
    const part = good('id: R\nkind: resistor\nnominal: 50\n');
    expect(impedanceAt(part.network, 10e9)).toEqual([50, 0]);
  });

  it('a bead without rdc and c is r ‖ l', () => {
    const part = good('id: B\nkind: bead\nmodel: {r: 100, l: 1u}\n');
    const f = 10e6;
    expect(mismatch(part, f, (w) => new Complex(1 / 100).add(j.mul(w * 1e-6).inverse()).inverse())).toBeLessThan(CLOSE);
  });
});

describe('number notations (SI prefixes, unit symbols, IEC 60062 RKM codes)', () => {
  const nominal = (kind: string, text: string) => good(`id: X\nkind: ${kind}\nnominal: ${text}\n`).nominal;

  it.each(['4.7µH', '4.7μH', '4.7uH', '4.7u', '4.7 µH', '4u7', '4.7e-6', '0.0000047'])('inductance %s is 4.7 µH', (text) => {
    // µ is U+00B5 MICRO SIGN, μ is U+03BC GREEK SMALL LETTER MU; both are written for micro.
    expect(nominal('inductor', text)).toBe(4.7e-6);
  });

  it.each(['18m', '18 m\u03a9', '18mohm', '18 mohm', '0.018', '18e-3'])('resistance %s is 18 mΩ', (text) => {
    // U+03A9 GREEK CAPITAL LETTER OMEGA, the omega the SI Brochure prints.
    expect(nominal('resistor', text)).toBe(0.018);
  });

  // U+2126 OHM SIGN is accepted too: keyboards and PDFs produce it.
  it('resistance "18 m\u2126" (OHM SIGN) is 18 mΩ', () => {
    expect(nominal('resistor', '18 m\u2126')).toBe(0.018);
  });

  it.each([
    ['4R7', 4.7],
    ['R47', 0.47],
    ['4K7', 4700],
    ['4k7', 4700],
    ['2M2', 2.2e6],
    ['2.2 kΩ', 2200],
    ['100 ohm', 100],
  ])('resistance %s is %s Ω', (text, value) => {
    expect(nominal('resistor', text)).toBe(value);
  });

  it.each([
    ['4n7', 4.7e-9],
    ['100nF', 100e-9],
    ['100 nF', 100e-9],
    ['0.1u', 0.1e-6],
    ['4p7', 4.7e-12],
  ])('capacitance %s is %s F', (text, value) => {
    expect(nominal('capacitor', text)).toBe(value);
  });

  it('a bare number is in SI base units: nominal 104 on a capacitor is 104 F', () => {
    expect(nominal('capacitor', '104')).toBe(104);
  });

  it('marking "104" means 100 nF (IEC 60062: 10·10⁴ pF) and agrees with nominal 100n', () => {
    const part = good('id: C\nkind: capacitor\nnominal: 100n\nmarking: "104"\n');
    expect(part.marking).toBe('104');
    expect(part.nominal).toBe(100e-9);
    // Unquoted, it is still the code as written (all scalars are read as text).
    expect(good('id: C\nkind: capacitor\nnominal: 100n\nmarking: 104\n').marking).toBe('104');
  });

  it('marking "472" on a resistor means 4.7 kΩ (47·10² Ω)', () => {
    expect(good('id: R\nkind: resistor\nnominal: 4k7\nmarking: "472"\n').marking).toBe('472');
  });
});

describe('fields kept as written', () => {
  const part = good(`
id: CAP-0402-T
kind: capacitor
nominal: 100n
package: 0402
dielectric: X7R
tolerance: 10%
voltage: 16V
tags: decoupling
notes: invented test part
band: {within: 5%}
dc-bias: {0V: 100%, 5V: 60%, 10V: 40%}
`);

  it('an unquoted 0402 package stays the text "0402"', () => {
    expect(part.package).toBe('0402');
  });

  it('tags given as a single word are a list of one', () => {
    expect(part.tags).toEqual(['decoupling']);
    expect(good('id: X\nkind: resistor\nnominal: 1\ntags: [a, b-c]\n').tags).toEqual(['a', 'b-c']);
  });

  it('reads ratings, the band criterion and the DC-bias table in SI units', () => {
    expect(part.title).toBe('CAP-0402-T'); // the id stands in for a missing title
    expect(part.dielectric).toBe('X7R');
    expect(part.tolerance).toBe(0.1);
    expect(part.voltageV).toBe(16);
    expect(part.within).toBe(0.05);
    expect(part.notes).toBe('invented test part');
    expect(part.dcBias).toEqual([
      { voltageV: 0, fraction: 1 },
      { voltageV: 5, fraction: 0.6 },
      { voltageV: 10, fraction: 0.4 },
    ]);
  });

  it('remembers where the id is written, for messages about the part', () => {
    expect(part.at).toEqual({ file: 'parts/under-test.yaml', line: 2, column: 5 });
  });
});
