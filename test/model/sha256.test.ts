// The hash of a reuse key's text: SHA-256 in hex, the same digest whichever of Node's calls makes it.

import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sha256Hex } from '../../src/model/sha256.js';

describe('sha256Hex', () => {
  it('gives the standard digest of "abc" and of the empty text', () => {
    // FIPS 180-2, appendix B.1 (one-block message "abc"), and the digest of no input.
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('agrees with createHash on texts beyond ASCII (UTF-8, as createHash takes a string)', () => {
    for (const text of ['parts/CAP-1\n0123456789abcdef\n\nno pdf', '100 nF ±10 %, ≤ 30 mΩ — µ', '😀\ttab\nline']) {
      expect(sha256Hex(text)).toBe(createHash('sha256').update(text).digest('hex'));
    }
  });
});
