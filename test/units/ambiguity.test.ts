// Units that read as one thing and are often meant as another are refused with both readings named, never
// guessed (SI prefixes: BIPM, The International System of Units, 9th ed. 2019, table 7; "m" is milli and
// "M" mega. MF and MFD for microfarads on older drawings: common practice).

import { describe, expect, it } from 'vitest';
import { parseQuantity } from '../../src/units/parse.js';

const message = (text: string, dim: Parameters<typeof parseQuantity>[1]) => {
  const r = parseQuantity(text, dim);
  return r.ok ? `accepted as ${r.value}` : r.message;
};

describe('ambiguous units', () => {
  it.each([
    ['100mhz', 'MHz or mHz? write 100M or 100 MHz for megahertz, or 100 mHz if millihertz is meant'],
    ['100m', 'MHz or mHz? write 100M or 100 MHz for megahertz, or 100 mHz if millihertz is meant'],
    ['10khz', 'write 10k or 10 kHz for kilohertz (the unit is Hz)'],
    ['2.4ghz', 'write 2.4G or 2.4 GHz for gigahertz (the unit is Hz)'],
  ])('frequency %s', (text, hint) => {
    expect(message(text, 'frequency')).toBe(`expected a frequency in Hz (e.g. 10M or 10 MHz), found "${text}": ${hint}`);
  });

  it.each([
    ['1MF', '1'],
    ['1M', '1'],
    ['47 MFD', '47'],
    ['10 mfd', '10'],
    ['2M2', '2.2'],
  ])('capacitance %s', (text, number) => {
    expect(message(text, 'capacitance')).toBe(
      `expected a capacitance in F (e.g. 100n or 100 nF), found "${text}": µF or MF? older drawings wrote MF and MFD for microfarads; write ${number}u or ${number} µF (a megafarad is no component value)`,
    );
  });

  it('what is unambiguous stays accepted: mHz and MHz spelt out, M on a resistance, mF on a capacitance', () => {
    expect(message('100 mHz', 'frequency')).toBe('accepted as 0.1');
    expect(message('100 MHz', 'frequency')).toBe('accepted as 100000000');
    expect(message('100Mhz', 'frequency')).toBe('accepted as 100000000');
    expect(message('2M2', 'resistance')).toBe('accepted as 2200000');
    expect(message('1 mF', 'capacitance')).toBe('accepted as 0.001');
  });
});
