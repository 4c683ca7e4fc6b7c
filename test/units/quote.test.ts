// How messages quote a found value: as a JSON string (RFC 8259 §7: quotes, backslash and C0 controls
// escaped), with C1 controls and the line and paragraph separators escaped too, cut after 80 characters
// (Unicode code points, as ECMAScript's string iterator counts them) with the full length said.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { QUOTE_LIMIT, quote } from '../../src/units/quote.js';

describe('quote', () => {
  it('writes a short value as a JSON string', () => {
    expect(quote('10 nH')).toBe('"10 nH"');
    expect(quote('say "hi"\\')).toBe('"say \\"hi\\"\\\\"');
    expect(quote('tab\there\nnew')).toBe('"tab\\there\\nnew"');
    expect(quote('\u0000')).toBe('"\\u0000"');
  });

  it('escapes C1 controls and U+2028/U+2029, which end a line in some readers', () => {
    expect(quote('a\u0085b\u2028c\u2029d\u007f')).toBe('"a\\u0085b\\u2028c\\u2029d\\u007f"');
  });

  it('cuts a long value after 80 characters and says how long it was, counting code points', () => {
    expect(QUOTE_LIMIT).toBe(80);
    const long = 'x'.repeat(200);
    expect(quote(long)).toBe(`"${'x'.repeat(80)}…" (200 characters)`);
    // 81 emoji: 162 UTF-16 units, 81 code points; never cut inside a surrogate pair.
    const emoji = '😀'.repeat(81);
    expect(quote(emoji)).toBe(`"${'😀'.repeat(80)}…" (81 characters)`);
    expect(quote('😀'.repeat(80))).toBe(`"${'😀'.repeat(80)}"`);
  });

  it('is the JSON string of the value itself whenever the value is short and has no C1 or separator', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: QUOTE_LIMIT, unit: 'grapheme' }), (s) => [...s].length > QUOTE_LIMIT || /[\u007f-\u009f\u2028\u2029]/.test(s) || quote(s) === JSON.stringify(s)),
      { numRuns: 300 },
    );
    fc.assert(
      fc.property(fc.string({ minLength: QUOTE_LIMIT + 1, maxLength: 300, unit: 'binary' }), (s) => quote(s).endsWith(`…" (${[...s].length} characters)`)),
      { numRuns: 100 },
    );
  });
});
