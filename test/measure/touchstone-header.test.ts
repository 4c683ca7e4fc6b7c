// The opening comments of a Touchstone file ("!" starts a comment; Touchstone File Format Specification 2.0,
// IBIS Open Forum, 2009, §"Rules"), as a page quotes them.

import { describe, expect, it } from 'vitest';
import { headerComments } from '../../src/measure/touchstone-header.js';

describe('headerComments', () => {
  it('takes the comment lines before the option line, without "!" and blanks, and stops at the first data line', () => {
    const text = '\r\n!  Sample 3, bench fixture  \r\n!\r\n! calibrated 2026-01-20\r\n# MHz S RI R 50\r\n! after the option line\r\n1 0.1 0.2\r\n';
    expect(headerComments(text)).toEqual({ lines: ['Sample 3, bench fixture', 'calibrated 2026-01-20'], more: 0 });
  });

  it('stops at a version 2 keyword', () => {
    expect(headerComments('! one\n[Version] 2.0\n! two\n').lines).toEqual(['one']);
  });

  it('keeps at most maxLines and counts the rest', () => {
    const text = Array.from({ length: 11 }, (_, i) => `! line ${i + 1}`).join('\n') + '\n# Hz S MA\n';
    expect(headerComments(text, 8)).toEqual({ lines: Array.from({ length: 8 }, (_, i) => `line ${i + 1}`), more: 3 });
  });

  it('a file without opening comments has none', () => {
    expect(headerComments('# GHz Z MA R 75\n1 50 0\n')).toEqual({ lines: [], more: 0 });
    expect(headerComments('')).toEqual({ lines: [], more: 0 });
  });
});
