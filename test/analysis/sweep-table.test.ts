// Cells of the sweep CSV. The reference is the rule the CSV states, evaluated here with the language's own
// number formatting (ECMA-262: Number.prototype.toPrecision, Number::toString, toExponential): the value
// rounded to the digits asked for, written in the shorter of its plain and exponent forms ("e+" written "e").

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { csvCell } from '../../src/analysis/sweep-table.js';

function reference(value: number, digits?: number): string {
  if (Number.isNaN(value)) return '';
  if (!Number.isFinite(value)) return value > 0 ? 'inf' : '-inf';
  if (digits === undefined) return String(value);
  const rounded = Number(value.toPrecision(digits));
  const plain = String(rounded);
  const exponent = rounded.toExponential().replace('e+', 'e');
  return exponent.length < plain.length ? exponent : plain;
}

describe('csvCell', () => {
  it('writes the examples of its own description, and the values a sweep holds at its edges', () => {
    expect(csvCell(15915.494309189535, 6)).toBe('15915.5');
    expect(csvCell(6.283185307179586e-5, 6)).toBe('6.28319e-5');
    // 1/(2π·100 nF·1 kHz) = 1591.549… Ω, a capacitor's reactance (textbook closed form).
    expect(csvCell(-1 / (2 * Math.PI * 100e-9 * 1e3), 6)).toBe('-1591.55');
    expect(csvCell(1e10, 6)).toBe('1e10');
    expect(csvCell(100, 6)).toBe('100');
    expect(csvCell(1_023_290, 6)).toBe('1023290'); // 7 characters; 1.02329e6 would be 9
    expect(csvCell(1_023_290_000, 6)).toBe('1.02329e9');
    expect(csvCell(0.000123456789, 3)).toBe('1.23e-4');
    expect(csvCell(0.0123, 6)).toBe('0.0123');
    expect(csvCell(0, 6)).toBe('0');
    expect(csvCell(-0, 6)).toBe('0');
    expect(csvCell(NaN, 6)).toBe('');
    expect(csvCell(Infinity, 6)).toBe('inf');
    expect(csvCell(-Infinity, 6)).toBe('-inf');
    expect(csvCell(0.1 + 0.2)).toBe('0.30000000000000004');
  });

  it('rounds half-way digits as toPrecision does, including a carry into a new digit', () => {
    expect(csvCell(999999.5, 6)).toBe('1e6');
    expect(csvCell(9.9999996e-7, 6)).toBe('1e-6');
    expect(csvCell(99999.95, 6)).toBe(reference(99999.95, 6));
    expect(csvCell(9.999995e20, 6)).toBe(reference(9.999995e20, 6));
  });

  it('agrees with the rule at every threshold of plain and exponent form (1e-7, 1e21) and digit count', () => {
    const differ: string[] = [];
    let checked = 0;
    for (let p = -30; p <= 30; p++) {
      for (const m of [1, 1.5, 9.99999, 9.999995, 1.234567891234, 7.00001]) {
        for (const v of [m * 10 ** p, -m * 10 ** p]) {
          for (let digits = 1; digits <= 21; digits++) {
            checked++;
            if (csvCell(v, digits) !== reference(v, digits)) differ.push(`${v} to ${digits}: ${csvCell(v, digits)}, not ${reference(v, digits)}`);
          }
        }
      }
    }
    expect(checked).toBe(61 * 6 * 2 * 21);
    expect(differ).toEqual([]);
  });

  it('agrees with the rule on any double and any digit count', () => {
    fc.assert(
      fc.property(fc.double(), fc.integer({ min: 1, max: 21 }), (value, digits) => csvCell(value, digits) === reference(value, digits)),
      { numRuns: 5_000 },
    );
    fc.assert(
      fc.property(fc.double({ min: 1e-15, max: 1e15, noNaN: true }), fc.boolean(), (value, negative) => csvCell(negative ? -value : value, 6) === reference(negative ? -value : value, 6)),
      { numRuns: 5_000 },
    );
  });
});
