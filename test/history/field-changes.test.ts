// Field changes between two files' data: the paths, the values as written, list items by their key.

import { describe, expect, it } from 'vitest';
import { fieldChanges, sameValue, valueText } from '../../src/history/field-changes.js';

describe('fieldChanges', () => {
  it('names each changed scalar by its dotted path, with the values as written', () => {
    const before = { id: 'A', parasitics: { esr: '25m', esl: '0.45 nH' }, tags: ['x'] };
    const after = { id: 'A', parasitics: { esr: '25m', esl: '0.75 nH' }, tags: ['x'] };
    expect(fieldChanges(before, after)).toEqual([{ path: 'parasitics.esl', before: '0.45 nH', after: '0.75 nH' }]);
  });

  it('says null for a field that is absent on one side, in file order with new fields last', () => {
    const changes = fieldChanges({ a: '1', b: '2' }, { b: '2', c: '3', a: '1x' });
    expect(changes).toEqual([
      { path: 'a', before: '1', after: '1x' },
      { path: 'c', before: null, after: '3' },
    ]);
    expect(fieldChanges({ a: '1', gone: { x: '1' } }, { a: '1' })).toEqual([{ path: 'gone', before: { x: '1' }, after: null }]);
  });

  it('matches plan entries by their part, so an inserted entry does not shift the others', () => {
    const before = { capacitors: [{ part: 'P1', count: '4' }, { part: 'P2', count: '6' }] };
    const after = { capacitors: [{ part: 'P0', count: '1' }, { part: 'P1', count: '4' }, { part: 'P2', count: '3' }] };
    expect(fieldChanges(before, after)).toEqual([
      { path: 'capacitors[P2].count', before: '6', after: '3' },
      { path: 'capacitors[P0]', before: null, after: { part: 'P0', count: '1' } },
    ]);
  });

  it('compares lists of plain values whole, and lists of mappings without a key by index', () => {
    expect(fieldChanges({ tags: ['a', 'b'] }, { tags: ['a', 'c'] })).toEqual([{ path: 'tags', before: ['a', 'b'], after: ['a', 'c'] }]);
    expect(fieldChanges({ r: [{ x: '1' }, { x: '2' }] }, { r: [{ x: '1' }, { x: '3' }] })).toEqual([{ path: 'r[1].x', before: '2', after: '3' }]);
  });

  it('finds nothing between equal data, and a whole-file change when the file is no mapping', () => {
    expect(fieldChanges({ a: ['1', { b: '2' }] }, { a: ['1', { b: '2' }] })).toEqual([]);
    expect(fieldChanges(null, { a: '1' })).toEqual([{ path: '(file)', before: null, after: { a: '1' } }]);
    expect(sameValue({ a: '1' }, { a: '1', b: '2' })).toBe(false);
    expect(sameValue(['1'], { 0: '1' })).toBe(false);
  });
});

describe('valueText', () => {
  it('writes values as YAML flow text, absence as (none), control characters escaped, long values cut', () => {
    expect(valueText('0.45 nH')).toBe('0.45 nH');
    expect(valueText(null)).toBe('(none)');
    expect(valueText({ part: 'P0', count: '1' })).toBe('{part: P0, count: 1}');
    expect(valueText(['a', 'b'])).toBe('[a, b]');
    expect(valueText('a\u001bb')).toBe('a\\u001bb');
    const long = valueText('x'.repeat(200));
    expect(long).toHaveLength(60);
    expect(long.endsWith('…')).toBe(true);
  });
});

describe('a keyed list added or removed whole', () => {
  it('is listed item by item, measurements by their file', () => {
    const m = { file: 'measurements/a.s2p', fixture: 'series-thru', date: '2026-01-21' };
    expect(fieldChanges({ id: 'A' }, { id: 'A', measurements: [m] })).toEqual([{ path: 'measurements[measurements/a.s2p]', before: null, after: m }]);
    expect(fieldChanges({ id: 'A', measurements: [m] }, { id: 'A' })).toEqual([{ path: 'measurements[measurements/a.s2p]', before: m, after: null }]);
  });

  it('a list of plain values added whole stays one change', () => {
    expect(fieldChanges({ id: 'A' }, { id: 'A', tags: ['x'] })).toEqual([{ path: 'tags', before: null, after: ['x'] }]);
  });
});
