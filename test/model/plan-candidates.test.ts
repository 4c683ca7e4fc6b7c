// Which capacitors a suggestion may place, by the library's rules, worked out by hand from the fixture
// library's files (test/fixtures/rail-library: invented parts). Derating 80% of the DC rating is the
// library's setting (common practice: a rating is a maximum, and ceramics are run below it).

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { candidateMountings, selectCandidates, unknownSelection } from '../../src/model/plan-candidates.js';
import type { Plan } from '../../src/model/plan.js';

const fixture = fileURLToPath(new URL('../fixtures/rail-library', import.meta.url));
const { library } = loadLibrary(fixture);
const parts = library!.parts;
const test = library!.plans.find((p) => p.rail === 'VDD_TEST')!;
const rules = { only: [] as string[], derating: library!.settings.derating };

describe('selectCandidates', () => {
  it('takes every capacitor within its derating at 1.0 V, leaves out the 1.2 V part (1.0 V > 80% of 1.2 V) and the inductor', () => {
    const s = selectCandidates(test, parts, rules);
    expect(s.parts.map((p) => p.id).sort()).toEqual(['RT-C-100N', 'RT-C-10N', 'RT-C-1U', 'RT-C-22U', 'RT-C-2U2-NR', 'RT-C-4U7', 'RT-N-10U']);
    expect(s.skipped).toEqual([{ partId: 'RT-C-1U-LV', reason: 'above-derating' }]);
  });

  it('at 3 V: the 1.2 V part is over its rating, and the part whose DC-bias table ends at 2 V waits to be named or allowed', () => {
    const at3: Plan = { ...test, voltageV: 3 };
    const s = selectCandidates(at3, parts, rules);
    expect(s.skipped).toEqual([
      { partId: 'RT-C-1U-LV', reason: 'over-rating' },
      { partId: 'RT-C-4U7', reason: 'beyond-bias-table', tableEndV: 2 },
    ]);
    const allowed = selectCandidates(at3, parts, { ...rules, allowBiasExtrapolation: true });
    const c = allowed.candidates.find((k) => k.part.id === 'RT-C-4U7')!;
    expect(c.warning?.severity).toBe('warning');
    expect(c.warning?.message).toMatch(/DC-bias table of RT-C-4U7 ends at 2 V, below the rail's 3 V; its last fraction, 80%/);
    const named = selectCandidates(at3, parts, { ...rules, only: ['RT-C-4U7'] });
    expect(named.parts.map((p) => p.id)).toEqual(['RT-C-4U7']);
    expect(named.skipped).toEqual([]);
  });

  it('names by tag as well as by id; a rating never gives way to a name', () => {
    expect(selectCandidates(test, parts, { ...rules, only: ['bulk'] }).parts.map((p) => p.id).sort()).toEqual(['RT-C-22U', 'RT-N-10U']);
    const lv = selectCandidates(test, parts, { ...rules, only: ['RT-C-1U-LV'] });
    expect(lv.parts).toEqual([]);
    expect(lv.skipped).toEqual([{ partId: 'RT-C-1U-LV', reason: 'above-derating' }]);
  });
});

describe('candidateMountings', () => {
  it("weighs a part the plan lists at that entry's mounting, any other at the rail default", () => {
    const byId = new Map(candidateMountings(test, parts.filter((p) => p.id === 'RT-C-100N' || p.id === 'RT-C-1U')).map((c) => [c.part.id, c]));
    expect(byId.get('RT-C-100N')).toMatchObject({ mountingH: 0.25e-9, mountingFrom: 'entry', label: 'RT-C-100N' });
    // Its entry gives no mounting of its own: the placement's resolution (the rail default) is the candidate's.
    expect(byId.get('RT-C-1U')).toMatchObject({ mountingH: 0.3e-9, mountingFrom: 'rail', label: 'RT-C-1U' });
    const unlisted = candidateMountings(test, parts.filter((p) => p.id === 'RT-C-2U2-NR'));
    expect(unlisted).toMatchObject([{ mountingH: 0.3e-9, mountingFrom: 'rail', label: 'RT-C-2U2-NR' }]);
  });

  it('a part listed at two mountings is two candidates, each labelled with its mounting', () => {
    const c100n = test.placements.find((p) => p.part.id === 'RT-C-100N')!;
    const twice: Plan = { ...test, placements: [...test.placements, { ...c100n, mountingH: 0.5e-9 }] };
    expect(candidateMountings(twice, [c100n.part]).map((c) => c.label)).toEqual(['RT-C-100N at 250 pH', 'RT-C-100N at 500 pH']);
  });
});

describe('unknownSelection', () => {
  it('lists names that are neither a capacitor id nor a capacitor tag, and the tags there are', () => {
    expect(unknownSelection(parts, ['RT-C-1U', 'hf', 'RT-L-1U', 'nope'])).toEqual({ unknown: ['RT-L-1U', 'nope'], tags: ['bulk', 'decoupling', 'hf', 'spare'] });
  });
});
