// Exact JSON: what it gives back is the value it was given, judged by Node's own isDeepStrictEqual (strict:
// -0 is not 0, a missing key is not an undefined one, prototypes must match), and what JSON cannot give back
// is refused rather than changed.

import { isDeepStrictEqual } from 'node:util';
import { describe, expect, it } from 'vitest';
import { decodeExact, encodeExact } from '../../src/model/exact-json.js';

const roundTrip = (value: unknown) => {
  const exact = encodeExact(value);
  return exact && decodeExact(JSON.parse(exact.text), exact.holes);
};

describe('exact JSON', () => {
  it('keeps undefined property values where they were, keys in their order', () => {
    const value = { a: 1, b: undefined, c: { d: undefined, e: [1, undefined, { f: undefined }] }, g: 'x' };
    const back = roundTrip(value) as typeof value;
    expect(isDeepStrictEqual(back, value)).toBe(true);
    expect(Object.keys(back)).toEqual(['a', 'b', 'c', 'g']);
    expect(Object.hasOwn(back.c, 'd')).toBe(true);
    expect(Object.hasOwn(back.c.e[2] as object, 'f')).toBe(true);
    // Plain JSON would have dropped the key (the reason this module exists).
    expect(Object.hasOwn(JSON.parse(JSON.stringify(value)).c, 'd')).toBe(false);
  });

  it('gives back every finite double bit for bit', () => {
    const numbers = [0.1 + 0.2, 1e-300, 5e-324, 1.7976931348623157e308, -123.456e-12, 2 ** 53 + 2];
    expect(roundTrip({ numbers })).toEqual({ numbers });
    for (const [i, x] of (roundTrip({ numbers }) as { numbers: number[] }).numbers.entries()) expect(Object.is(x, numbers[i])).toBe(true);
  });

  it('refuses what JSON would change', () => {
    for (const value of [{ x: -0 }, { x: NaN }, { x: Infinity }, { x: new Map() }, { x: new Float64Array(2) }, { x: new Date(0) }, new (class Point { x = 1 })(), [1, , 3], undefined]) {
      expect(encodeExact(value)).toBeUndefined();
    }
  });
});
