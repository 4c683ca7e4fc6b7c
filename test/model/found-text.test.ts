// How messages name what they found: a YAML value as written, a near miss for a misspelt word, and a
// reference to something the library could not read. The YAML nodes come from the yaml package itself.

import { parseDocument, type Node } from 'yaml';
import { describe, expect, it } from 'vitest';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { describeNode, expectationInBrackets, missingTarget, nearMiss, scalarText } from '../../src/model/found-text.js';
import type { ReadContext } from '../../src/model/fields.js';

/** The value of key `v` in a one-line YAML document. */
const valueOf = (yaml: string) => parseDocument(yaml).get('v', true) as Node | null | undefined;

describe('describeNode', () => {
  it('quotes a scalar, says "nothing" for an empty plain value, and names collections', () => {
    expect(describeNode(valueOf('v: 4.7u'))).toBe('"4.7u"');
    expect(describeNode(valueOf('v:'))).toBe('nothing');
    expect(describeNode(valueOf('v: ""'))).toBe('""');
    expect(describeNode(valueOf('v: []'))).toBe('an empty list');
    expect(describeNode(valueOf('v: [1]'))).toBe('a list');
    expect(describeNode(valueOf('v: {}'))).toBe('an empty mapping');
    expect(describeNode(valueOf('v: {a: 1}'))).toBe('a mapping');
    expect(describeNode(undefined)).toBe('nothing');
  });

  it('reads a scalar as text, and nothing else', () => {
    expect(scalarText(valueOf('v: 100n'))).toBe('100n');
    expect(scalarText(valueOf('v: [100n]'))).toBeUndefined();
    expect(scalarText(valueOf('v:'))).toBeUndefined();
  });
});

describe('nearMiss', () => {
  it('offers the closest field for a slip of one letter or two swapped neighbours', () => {
    expect(nearMiss('nominl', ['nominal', 'tolerance'])).toBe('nominal');
    expect(nearMiss('titel', ['title', 'tags'])).toBe('title');
  });

  it('offers nothing for a one-letter word unless only its case differs', () => {
    expect(nearMiss('x', ['r', 'l', 'c'])).toBeUndefined();
    expect(nearMiss('R', ['r', 'l', 'c'])).toBe('r');
  });
});

describe('missingTarget', () => {
  const ctx = (unreadable?: ReadContext['unreadable']) => ({ source: undefined, diagnostics: new DiagnosticList(), unreadable }) as unknown as ReadContext;

  it('points at the file that defines the name when that file has errors of its own', () => {
    const text = missingTarget(ctx({ parts: new Map([['C-1', 'parts/c-1.yaml']]) }), 'parts', 'part with id', 'C-1', []);
    expect(text).toBe('part with id "C-1" is defined in "parts/c-1.yaml", which has errors (listed there); fix them first');
  });

  it('else says there is none, with a near name when there is one', () => {
    expect(missingTarget(ctx(), 'parts', 'part with id', 'C-10', ['C-100', 'L-1'])).toBe('no part with id "C-10" in the library; did you mean "C-100"?');
  });
});

describe('expectationInBrackets', () => {
  it('writes the expectation without nested brackets', () => {
    expect(expectationInBrackets('inductance')).toBe('an inductance in H, e.g. 0.45n or 0.45 nH');
  });
});
