// "Did you mean": edit distance as Levenshtein (1966) defines it (insertions, deletions and substitutions of
// one character each), checked against the textbook examples and against a brute-force evaluator written
// here (the recursive definition, memoised), and the choice of the closest candidate within a typo's reach.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { closest, editDistance } from '../../src/model/suggest.js';

/** Levenshtein distance by its recursive definition (Wagner & Fischer, 1974, state it this way too). */
function reference(a: string, b: string): number {
  const memo = new Map<string, number>();
  const d = (i: number, j: number): number => {
    if (i === 0) return j;
    if (j === 0) return i;
    const key = `${i},${j}`;
    const known = memo.get(key);
    if (known !== undefined) return known;
    const value = Math.min(d(i - 1, j) + 1, d(i, j - 1) + 1, d(i - 1, j - 1) + (a[i - 1] === b[j - 1] ? 0 : 1));
    memo.set(key, value);
    return value;
  };
  return d(a.length, b.length);
}

describe('editDistance', () => {
  it('gives the textbook examples', () => {
    // kitten → sitting: 3 (two substitutions and an insertion), flaw → lawn: 2.
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('same', 'same')).toBe(0);
  });

  it('agrees with the recursive definition on any two short strings, and is symmetric', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 9 }), fc.string({ maxLength: 9 }), (a, b) => editDistance(a, b) === reference(a, b) && editDistance(a, b) === editDistance(b, a)),
      { numRuns: 500 },
    );
  });
});

describe('closest', () => {
  it('suggests the nearest candidate within a third of the word, ignoring letter case', () => {
    expect(closest('nominl', ['nominal', 'voltage', 'tolerance'])).toBe('nominal');
    expect(closest('ESL', ['esl', 'esr'])).toBe('esl');
    expect(closest('ORV-C-0402-100N-X7X', ['ORV-C-0402-100N-X7R', 'ORV-C-0402-1U-X5R'])).toBe('ORV-C-0402-100N-X7R');
  });

  it('suggests nothing beyond a typo\'s reach, nor for a word over 100 characters', () => {
    // "volts" → "voltage" is 3 edits, more than 5/3 rounded down (1).
    expect(closest('volts', ['voltage'])).toBeUndefined();
    expect(closest('x'.repeat(101), ['x'.repeat(101)])).toBeUndefined();
    expect(closest('abc', [])).toBeUndefined();
  });

  it('keeps the first of equally near candidates', () => {
    expect(closest('esx', ['esl', 'esr'])).toBe('esl');
  });
});
