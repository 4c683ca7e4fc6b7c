// What `plan --suggest` prints under a chosen set whose load step misses its budget. The demo's 3.3 V rail is
// such a case: the cheapest set that holds |Z| under the target dips 74 mV against a 66 mV budget, because
// |Z| ≤ Z_t at every frequency bounds the response to a sinusoid, not to a step (the peak gain of a transfer
// function does not bound its step response; any signals-and-systems text). The dip itself is checked against
// the test's own ramp evaluator elsewhere (test/analysis/load-step.test.ts); here, that the words follow it.

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { suggestPlacements } from '../../src/analysis/plan-suggest.js';
import { loadLibrary } from '../../src/model/library.js';
import { selectCandidates } from '../../src/model/plan-candidates.js';
import { describeSuggestion, loadStepHint } from '../../src/present/suggestion-report.js';

const { library } = loadLibrary(fileURLToPath(new URL('../../', import.meta.url)));
const plan = library!.plans.find((p) => p.rail === 'VDD_3V3')!;
const candidates = selectCandidates(plan, library!.parts, { only: [], allowSafetyClass: false, allowBiasExtrapolation: false, derating: library!.settings.derating });
const runs = new Map<number, ReturnType<typeof suggestPlacements>>();
const suggest = (marginDb: number) => {
  if (!runs.has(marginDb)) runs.set(marginDb, suggestPlacements(plan, candidates, { maxCount: 16, marginDb, perDecade: library!.settings.sweep.perDecade }));
  return runs.get(marginDb)!;
};
const HINT = 'does not bound a step';

describe('the load-step hint under a suggested set', () => {
  it('a set that holds the target but dips past its budget: the hint says why, and asks for a margin', () => {
    const s = suggest(0);
    const t = s.figures!.transient!;
    expect(s.figures!.pass).toBe(true);
    expect(t.resolved).toBe(true);
    expect(t.droopV).toBeGreaterThan(t.budgetV);
    const text = describeSuggestion(plan, s, { maxCount: 16, only: [] });
    expect(text).toContain(HINT);
    expect(text).toContain('--margin 1 or more');
    // Under the load step's own lines, before the set.
    expect(text.indexOf(HINT)).toBeGreaterThan(text.indexOf('  load step  FAIL'));
    expect(text.indexOf(HINT)).toBeLessThan(text.indexOf('  placements'));
  });

  it('with a 1 dB margin the set meets both, and nothing is added', () => {
    const s = suggest(1);
    const t = s.figures!.transient!;
    expect(Math.max(t.droopV, t.overshootV)).toBeLessThanOrEqual(t.budgetV);
    expect(describeSuggestion(plan, s, { maxCount: 16, only: [] })).not.toContain(HINT);
  });

  it('a margin already asked for is named, and a rail without a verdict gets no hint', () => {
    const f = suggest(0).figures!;
    expect(loadStepHint(f, 0.5).join('\n')).toContain('a margin above +0.50 dB');
    expect(loadStepHint({ ...f, transient: { ...f.transient!, resolved: false } }, 0)).toEqual([]);
    expect(loadStepHint({ ...f, transient: null }, 0)).toEqual([]);
  });
});
