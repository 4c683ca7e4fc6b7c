import { describe, expect, it } from 'vitest';
import { shortSignificantText, significantText } from '../../src/units/digits-text.js';

// The reference is the language itself: ECMA-262 Number.prototype.toPrecision rounds, Number() reads the
// text back and Number::toString prints the double's shortest form; the fast version must write the same.
const reference = (v: number, d: number) => String(Number(v.toPrecision(d)));
const shortReference = (v: number, d: number) => {
  const rounded = Number(v.toPrecision(d));
  const plain = String(rounded);
  const exponent = rounded.toExponential().replace('e+', 'e');
  return exponent.length < plain.length ? exponent : plain;
};

/** Deterministic values over the whole double range, with both signs and every digit count. */
function values(): number[] {
  let s = 12345;
  const random = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
  const out = [0, -0, 1, -1, 0.1, 9.9999995, 999999.5, 1e21, 9.999995e20, 1e-7, 9.9999996e-7, 1.5e-7, 123456789, 5e-324, 1.7976931348623157e308, 0.000001, 100, 1e6, 2.5, -482288000];
  for (let i = 0; i < 20000; i++) {
    const exponent = Math.floor(random() * 60) - 30;
    const mantissa = random() * 10;
    const v = mantissa * 10 ** exponent * (random() < 0.3 ? -1 : 1);
    out.push(v, Number(v.toPrecision(1 + (i % 7))));
  }
  return out;
}

describe('numbers to significant digits as text', () => {
  it('writes what String(Number(x.toPrecision(d))) writes, for every digit count', () => {
    for (const d of [1, 3, 6, 12, 15]) for (const v of values()) expect(significantText(v, d), `${v} to ${d}`).toBe(reference(v, d));
  });

  it('writes the shorter of plain and exponent form, as the CSV always has', () => {
    for (const d of [4, 6, 12]) for (const v of values()) expect(shortSignificantText(v, d), `${v} to ${d}`).toBe(shortReference(v, d));
  });

  it('rounds as toPrecision does and drops trailing zeros', () => {
    expect(shortSignificantText(482288000.4, 6)).toBe('482288000');
    expect(shortSignificantText(4.8e10, 6)).toBe('4.8e10');
    expect(shortSignificantText(0.00628319, 6)).toBe('0.00628319');
    expect(shortSignificantText(0.0000628319, 6)).toBe('6.28319e-5');
    expect(significantText(1.5e-6, 6)).toBe('0.0000015');
    expect(shortSignificantText(1.5e-6, 6)).toBe('1.5e-6');
    expect(shortSignificantText(6.2831853e-7, 6)).toBe('6.28319e-7');
    expect(shortSignificantText(Infinity, 6)).toBe('Infinity');
    expect(significantText(-90.00000001, 6)).toBe('-90');
    expect(significantText(1.23456789e25, 6)).toBe('1.23457e+25');
  });
});
