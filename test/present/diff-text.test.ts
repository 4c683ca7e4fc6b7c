// The words of one changed field: as written before and after, an added or removed item of a keyed list
// without the key its path already names, long values cut.

import { describe, expect, it } from 'vitest';
import { fieldChanges } from '../../src/history/field-changes.js';
import type { PlanChange, RailVerdict } from '../../src/history/library-diff.js';
import { fieldText, percentText, railText } from '../../src/present/diff-text.js';

describe('fieldText', () => {
  it('a scalar changed, added and removed', () => {
    expect(fieldText({ path: 'parasitics.esl', before: '0.4n', after: '0.7n' })).toBe('parasitics.esl 0.4n → 0.7n');
    expect(fieldText({ path: 'cost', before: null, after: '0.01' })).toBe('cost added: 0.01');
    expect(fieldText({ path: 'cost', before: '0.01', after: null })).toBe('cost removed (was 0.01)');
  });

  it("a part's first measurement reads as the file added with its other fields, not as a truncated list", () => {
    const m = { file: 'measurements/a.s2p', fixture: 'series-thru', date: '2026-01-21' };
    const [change] = fieldChanges({ id: 'A' }, { id: 'A', measurements: [m] });
    expect(fieldText(change)).toBe('measurements[measurements/a.s2p] added: {fixture: series-thru, date: 2026-01-21}');
    const [gone] = fieldChanges({ id: 'A', measurements: [m] }, { id: 'A' });
    expect(fieldText(gone)).toBe('measurements[measurements/a.s2p] removed (was {fixture: series-thru, date: 2026-01-21})');
  });

  it('a plan entry added keeps only its other fields', () => {
    expect(fieldText({ path: 'capacitors[P0]', before: null, after: { part: 'P0', count: '1' } })).toBe('capacitors[P0] added: {count: 1}');
  });
});

describe('percentText', () => {
  it('signs with the typographic minus and keeps two significant digits for small moves', () => {
    expect(percentText(25.34)).toBe('+25.3%');
    expect(percentText(-8.024)).toBe('−8.02%');
    expect(percentText(0.00018)).toBe('+0.00018%');
    expect(percentText(-150)).toBe('−150%');
  });
});

describe('railText', () => {
  const verdict = (worstMarginDb: number, droopV = 0.0557): RailVerdict => ({ pass: worstMarginDb >= 0, worstMarginDb, worstFrequencyHz: 14.7e6, loadStep: { status: 'PASS', droopV, budgetV: 0.066 } });
  const cause = { kind: 'part' as const, id: 'P1', fields: [{ path: 'cost', before: '0.01', after: '0.02' }], alone: null };
  const change = (before: RailVerdict, after: RailVerdict): PlanChange => ({ rail: 'VDD', status: 'changed', before, after, verdictMoved: before.pass !== after.pass, causes: [cause] });

  it('a change that moves the margin is what moved the rail', () => {
    expect(railText(change(verdict(2.88), verdict(-0.42)))).toBe('rail VDD: PASS → FAIL, worst margin +2.88 dB → −0.42 dB; load step PASS, dip 55.7 mV (budget 66 mV); moved by part P1 (cost 0.01 → 0.02)');
  });

  it('a change that reaches the rail but moves none of its figures is an input that changed, not a cause', () => {
    expect(railText(change(verdict(-1.71), verdict(-1.71)))).toBe('rail VDD: FAIL, worst margin −1.71 dB unchanged; load step PASS, dip 55.7 mV (budget 66 mV); inputs changed: part P1 (cost 0.01 → 0.02)');
  });

  it('the same margin with a deeper dip still moved the rail', () => {
    expect(railText(change(verdict(1), verdict(1, 0.06)))).toBe('rail VDD: PASS, worst margin +1.00 dB unchanged; load step PASS, dip 55.7 mV → 60 mV (budget 66 mV); moved by part P1 (cost 0.01 → 0.02)');
  });
});
