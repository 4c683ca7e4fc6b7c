import { describe, expect, it } from 'vitest';
import { parseQuantity, parseRatio } from '../../src/units/parse.js';
import type { Dimension } from '../../src/units/quantity.js';

function value(text: string | number, dim: Dimension): number {
  const r = parseQuantity(text, dim);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

// Values are built from one decimal literal, so each expectation is the exact double of the decimal value.
describe('SI prefixes (BIPM, The International System of Units, 9th ed. 2019, table 7)', () => {
  it.each([
    ['1f', 1e-15],
    ['1p', 1e-12],
    ['1n', 1e-9],
    ['1u', 1e-6],
    ['1µ', 1e-6], // U+00B5 micro sign
    ['1μ', 1e-6], // U+03BC Greek mu
    ['1m', 1e-3],
    ['1k', 1e3],
    ['1M', 1e6],
    ['1G', 1e9],
    ['1T', 1e12],
  ])('%s = %d', (text, expected) => {
    // In ohms: on a capacitance "M" is refused as ambiguous (µF or MF?), see ambiguity.test.ts.
    expect(value(text, 'resistance')).toBe(expected);
  });

  it('reads unit symbols with or without a space, and a bare number as SI base units', () => {
    expect(value('100nF', 'capacitance')).toBe(100e-9);
    expect(value('100 nF', 'capacitance')).toBe(100e-9);
    expect(value('0.1u', 'capacitance')).toBe(0.1e-6);
    expect(value('1e-7', 'capacitance')).toBe(1e-7);
    expect(value('104', 'capacitance')).toBe(104); // a bare number is farads, never a marking code
    expect(value('2.2 kΩ', 'resistance')).toBe(2200);
    expect(value('2.2 k\u2126', 'resistance')).toBe(2200); // U+2126 OHM SIGN
    expect(value('10 ohm', 'resistance')).toBe(10);
    expect(value('22.5 MHz', 'frequency')).toBe(22.5e6);
    expect(value('16V', 'voltage')).toBe(16);
    expect(value('500 mA', 'current')).toBe(0.5);
    expect(value('0.45nH', 'inductance')).toBe(0.45e-9);
    expect(value('1.5e3k', 'resistance')).toBe(1.5e6);
  });

  it('keeps the sign; ranges are the model layer\'s concern', () => {
    expect(value('-3n', 'capacitance')).toBe(-3e-9);
  });
});

describe('RKM code (IEC 60062:2016, clause 3, letter and digit code)', () => {
  // Resistance: R K M G T mark the decimal point and the multiplier 1, 10^3, 10^6, 10^9, 10^12.
  it.each([
    ['R47', 0.47],
    ['4R7', 4.7],
    ['47R', 47],
    ['470R', 470],
    ['4K7', 4.7e3],
    ['47K', 47e3],
    ['4M7', 4.7e6],
    ['2M2', 2.2e6],
    ['1G0', 1e9],
    ['1T0', 1e12],
    ['4k7', 4.7e3], // lower-case k: common practice, not in the standard's table
  ])('resistance %s = %d Ω', (text, expected) => {
    expect(value(text, 'resistance')).toBe(expected);
  });

  // Capacitance: p n µ m F mark the decimal point and 10^-12 .. 10^0.
  it.each([
    ['p68', 0.68e-12],
    ['6p8', 6.8e-12],
    ['n68', 0.68e-9],
    ['4n7', 4.7e-9],
    ['6n8', 6.8e-9],
    ['µ68', 0.68e-6],
    ['6µ8', 6.8e-6],
    ['2u2', 2.2e-6],
    ['m68', 0.68e-3],
    ['6m8', 6.8e-3],
    ['6F8', 6.8],
    ['4n7F', 4.7e-9],
  ])('capacitance %s = %d F', (text, expected) => {
    expect(value(text, 'capacitance')).toBe(expected);
  });

  it('R stands for ohms only: 4R7 is no inductance', () => {
    const r = parseQuantity('4R7', 'inductance');
    expect(r.ok).toBe(false);
  });
});

describe('wrong or malformed values say what was expected and what was found', () => {
  it('names the dimension that was written', () => {
    const r = parseQuantity('0.45nF', 'inductance');
    expect(r).toEqual({ ok: false, message: 'expected an inductance in H (e.g. 0.45n or 0.45 nH), found "0.45nF" (a capacitance, in F)' });
  });
  it.each(['', 'abc', '10 nX', '1..2', 'n', '4R7R'])('rejects %j', (text) => {
    expect(parseQuantity(text, 'capacitance').ok).toBe(false);
  });
  it('rejects values that overflow a double', () => {
    expect(parseQuantity('1e400', 'resistance').ok).toBe(false);
  });
});

describe('ratios', () => {
  it('reads percentages and plain fractions', () => {
    expect(parseRatio('10%')).toEqual({ ok: true, value: 0.1 });
    expect(parseRatio('10 %')).toEqual({ ok: true, value: 0.1 });
    expect(parseRatio('0.25')).toEqual({ ok: true, value: 0.25 });
    expect(parseRatio('ten').ok).toBe(false);
  });
});
