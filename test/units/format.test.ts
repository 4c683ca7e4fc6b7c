import { describe, expect, it } from 'vitest';
import { formatDegrees, formatDeviation, formatEng, formatNumber, formatPercent } from '../../src/units/format.js';
import { parseQuantity } from '../../src/units/parse.js';

describe('engineering notation at the edges', () => {
  it.each([
    [22.5e6, 'frequency', '22.5 MHz'],
    [100e-9, 'capacitance', '100 nF'],
    [0.018, 'resistance', '18 mΩ'],
    [4700, 'resistance', '4.7 kΩ'],
    [1e-15, 'capacitance', '1 fF'],
    [1e12, 'resistance', '1 TΩ'],
    [0, 'resistance', '0 Ω'],
    [-159.15, 'resistance', '−159 Ω'],
    [2.5e-18, 'capacitance', '2.5e-18 F'],
    [16, 'voltage', '16 V'],
  ] as const)('%d %s -> %s', (v, dim, text) => {
    expect(formatEng(v, dim)).toBe(text);
  });

  it('rounds before choosing the prefix, so 999.96 is 1 k and not 1000', () => {
    expect(formatEng(999.96, 'resistance')).toBe('1 kΩ');
    expect(formatEng(999_960, 'frequency')).toBe('1 MHz');
  });

  it('round-trips through the parser to the printed precision', () => {
    for (const v of [1.234e-12, 5.6e-9, 47e-6, 0.33, 8.2, 120, 3.3e3, 7.5e6, 2.2e9]) {
      const text = formatEng(v, 'resistance', { digits: 6 });
      const back = parseQuantity(text, 'resistance');
      expect(back.ok && back.value).toBeCloseTo(v, 15);
    }
  });

  it('formats percentages, degrees and plain numbers', () => {
    expect(formatPercent(0.1)).toBe('10%');
    expect(formatPercent(-0.025)).toBe('−2.5%'); // a minus sign, as every other formatter writes it
    expect(formatDegrees(-89.94)).toBe('−89.9°');
    expect(formatNumber(42.123)).toBe('42.1');
    expect(formatNumber(NaN)).toBe('—');
  });

  it('writes a resistor\'s deviation at 0.001 % resolution, signed, and nothing for rounding noise', () => {
    // |Z|/R − 1 of a resistor: a value of order 1e−13 is float rounding in R + jX, not a figure (common practice:
    // the tightest resistor tolerance sold is 0.01 %, so 0.001 % resolution loses nothing a reader can use).
    expect(formatDeviation(-1.24e-13)).toBe('0.000%');
    expect(formatDeviation(1.2e-4)).toBe('+0.012%');
    expect(formatDeviation(-0.034)).toBe('−3.400%');
    expect(formatDeviation(2.5)).toBe('+250%');
    expect(formatDeviation(NaN)).toBe('—');
  });
});
