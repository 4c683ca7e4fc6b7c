import { describe, expect, it } from 'vitest';
import { fixedText, shortSignificantText, significantText } from '../../src/units/digits-text.js';

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
  // Next to a rounding tie: a decimal ending in 5 one digit past the digits kept (as read from text, so
  // within half a unit of the tie either side), its neighbouring doubles, and the powers of ten around it.
  for (let i = 0; i < 6000; i++) {
    const digits = 1 + (i % 12);
    const exponent = Math.floor(random() * 50) - 25;
    const whole = Math.floor(random() * 10 ** digits);
    const tie = Number(`${whole}5e${exponent}`);
    out.push(tie, -tie, nextUp(tie), nextDown(tie), Number(`1e${exponent}`), nextDown(Number(`1e${exponent}`)), Number(`${'9'.repeat(digits)}5e${exponent}`));
  }
  return out;
}

/** The double after (or before) a positive finite one: its bit pattern plus (minus) one. */
function nextUp(v: number): number {
  const bits = new BigInt64Array(new Float64Array([v]).buffer);
  bits[0] += 1n;
  return new Float64Array(bits.buffer)[0];
}
function nextDown(v: number): number {
  const bits = new BigInt64Array(new Float64Array([v]).buffer);
  bits[0] -= 1n;
  return new Float64Array(bits.buffer)[0];
}

describe('numbers to significant digits as text', () => {
  it('writes what String(Number(x.toPrecision(d))) writes, for every digit count', () => {
    // Every value compared, the ones that differ listed (one expect a value cost 4 to 7 s of CPU).
    const wrong: string[] = [];
    const all = values();
    for (const d of [1, 3, 6, 9, 12, 13, 15]) for (const v of all) if (significantText(v, d) !== reference(v, d)) wrong.push(`${v} to ${d}: ${significantText(v, d)}, not ${reference(v, d)}`);
    expect(wrong).toEqual([]);
  });

  it('writes the shorter of plain and exponent form, as the CSV always has', () => {
    const wrong: string[] = [];
    const all = values();
    for (const d of [1, 4, 6, 12]) for (const v of all) if (shortSignificantText(v, d) !== shortReference(v, d)) wrong.push(`${v} to ${d}: ${shortSignificantText(v, d)}, not ${shortReference(v, d)}`);
    expect(wrong).toEqual([]);
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

// The reference is the language again: ECMA-262 Number.prototype.toFixed rounds, Number() reads it back and
// Number::toString prints the double's shortest form.
const fixedReference = (v: number, d: number) => String(Number(v.toFixed(d)));

describe('numbers to a count of decimals as text', () => {
  it('writes what String(Number(x.toFixed(d))) writes, for every decimal count toFixed takes', () => {
    const all = values();
    const wrong: string[] = [];
    for (const d of [0, 1, 2, 3, 5, 6, 8, 10, 12, 14, 15, 16, 17, 20, 22, 23, 100]) for (const v of all) if (fixedText(v, d) !== fixedReference(v, d)) wrong.push(`${v} to ${d} decimals: ${fixedText(v, d)}`);
    expect(wrong).toEqual([]);
  });

  it('drops trailing zeros, writes a rounded zero as 0 and a value under 1e-6 with an exponent', () => {
    expect(fixedText(12.5, 4)).toBe('12.5');
    expect(fixedText(120, 0)).toBe('120');
    expect(fixedText(119.96, 1)).toBe('120');
    expect(fixedText(-0.00004, 3)).toBe('0');
    expect(fixedText(0.0000015, 7)).toBe('0.0000015');
    expect(fixedText(0.00000015, 8)).toBe('1.5e-7');
    // Seventeen significant digits name a double whose shortest form is shorter.
    expect(fixedText(0.1, 17)).toBe('0.1');
    expect(fixedText(-0.123456789012345678, 17)).toBe('-0.12345678901234568');
    expect(fixedText(1e21, 2)).toBe('1e+21');
  });
});
