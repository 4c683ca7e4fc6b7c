// A part whose late fields are read on first use (src/model/lazy-part.ts) reads as the part it was made from:
// the same own enumerable keys and values under Node's isDeepStrictEqual (strict: a missing key is not an
// undefined one), spreading and the structured clone (which read getters of own enumerable keys, HTML's
// StructuredSerialize over [[OwnPropertyKeys]]); its late fields are read once, and only when one is asked for.

import { isDeepStrictEqual } from 'node:util';
import { describe, expect, it } from 'vitest';
import { EARLY_FIELDS, lateFieldsRead, lazyPart, splitPart } from '../../src/model/lazy-part.js';

const PART = {
  id: 'CAP-1',
  kind: 'capacitor',
  behavesAs: 'capacitor',
  title: 'Test capacitor (invented)',
  nominal: 1e-7,
  tolerance: undefined,
  spread: { tolerance: undefined, parasitics: {} },
  voltageRatings: [],
  package: '0402',
  parameters: { esr: 0.02, esl: 5e-10 },
  network: { type: 'series', parts: [{ type: 'C', farads: 1e-7 }] },
  dcBias: [],
  tags: ['test'],
  notes: undefined,
  measurements: [],
  at: { file: 'parts/c.yaml', line: 1, column: 5 },
};

function made() {
  const original = structuredClone(PART);
  const { early, late } = splitPart(original);
  let reads = 0;
  const part = lazyPart(structuredClone(early), Object.keys(late), { read: () => (reads++, structuredClone(late)) });
  return { part: part as unknown as Record<string, unknown>, reads: () => reads };
}

describe('lazyPart', () => {
  it('splits a part into the early fields and the rest, each in key order', () => {
    const { early, late } = splitPart(PART);
    expect(Object.keys(early)).toEqual(Object.keys(PART).filter((k) => EARLY_FIELDS.includes(k)));
    expect(Object.keys(late)).toEqual(['title', 'tolerance', 'parameters', 'network', 'dcBias', 'tags', 'notes']);
    expect(Object.hasOwn(late, 'notes')).toBe(true);
  });

  it('reads its late fields once, when the first is asked for', () => {
    const { part, reads } = made();
    expect(part.id).toBe('CAP-1');
    expect(part.package).toBe('0402');
    expect(reads()).toBe(0);
    expect(lateFieldsRead(part)).toBe(false);
    expect(part.title).toBe(PART.title);
    expect((part.parameters as { esr: number }).esr).toBe(0.02);
    expect(part.notes).toBeUndefined();
    expect(reads()).toBe(1);
    expect(lateFieldsRead(part)).toBe(true);
    expect(lateFieldsRead(PART)).toBe(true);
  });

  it('is the part it was made from to isDeepStrictEqual, spreading, Object.keys and the structured clone', () => {
    const { part } = made();
    expect(isDeepStrictEqual(part, PART)).toBe(true);
    expect(new Set(Object.keys(part))).toEqual(new Set(Object.keys(PART)));
    expect(isDeepStrictEqual({ ...made().part }, PART)).toBe(true);
    expect(isDeepStrictEqual(structuredClone(made().part), PART)).toBe(true);
    expect(JSON.parse(JSON.stringify(made().part))).toEqual(JSON.parse(JSON.stringify(PART)));
    // A key the part does not have is not one of its keys, and a changed value is not the same part.
    const other = made().part;
    other.title = 'changed';
    expect(other.title).toBe('changed');
    expect(isDeepStrictEqual(other, PART)).toBe(false);
    expect(Object.hasOwn(made().part, 'marking')).toBe(false);
  });
});
