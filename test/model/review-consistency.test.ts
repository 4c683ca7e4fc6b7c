// A review must not accept a rail that fails its target. Which statements accept a rail is a reading of
// plain engineering English (common practice in review minutes: "accept X as placed", "approved", "no change
// needed"); negations, conditions, future or hypothetical wording and stated waivers are not acceptances.
// The verdicts here are given by the test, so each case checks only the reading and the message.

import { describe, expect, it } from 'vitest';
import { acceptedFailures, railFails, railsAccepted, reviewStatements, reviewWarnings, type RailVerdict } from '../../src/model/review-consistency.js';

const RAILS = ['VCC_5V', 'VDD_CORE', 'VDD_3V3'];

describe('which rails a statement accepts', () => {
  it.each([
    ['Accept VCC_5V as placed.', ['VCC_5V']],
    ['**VCC_5V is accepted as drawn.**', ['VCC_5V']],
    ['vcc_5v approved', ['VCC_5V']],
    ['VCC_5V: no change needed.', ['VCC_5V']],
    ['VCC_5V passes; sign off.', ['VCC_5V']],
    ['Accept VDD_CORE and VCC_5V as placed.', ['VDD_CORE', 'VCC_5V']],
    ['Accept VDD_CORE as placed, but not VCC_5V.', ['VDD_CORE']],
    ['Accept VDD_CORE as placed; VCC_5V is reworked.', ['VDD_CORE']],
    ['VDD_CORE passes with 3 dB to spare; VCC_5V fails near 13 MHz.', ['VDD_CORE']],
  ])('%j accepts %j', (text, expected) => {
    expect(railsAccepted(text, RAILS)).toEqual(expected);
  });

  it('"both rails", "all rails" and "every rail plan" name the rails the review covers', () => {
    expect(railsAccepted('Both rails are fine as placed.', RAILS, ['VDD_CORE', 'VCC_5V'])).toEqual(['VDD_CORE', 'VCC_5V']);
    expect(railsAccepted('All the power rails pass.', RAILS, ['VCC_5V'])).toEqual(['VCC_5V']);
    expect(railsAccepted('Every rail plan is accepted.', RAILS, ['VDD_3V3'])).toEqual(['VDD_3V3']);
    expect(railsAccepted('Both rails fail.', RAILS, ['VDD_CORE', 'VCC_5V'])).toEqual([]);
  });

  it.each([
    'Do not accept VCC_5V as placed.',
    "VCC_5V isn't accepted.",
    'Reject VCC_5V.',
    'VCC_5V is reworked to 4 × 1 µF.',
    'VCC_5V fails its target; rework it.',
    'Accept VCC_5V once two more 22 µF parts are added.',
    'Accept VCC_5V after the layout change.',
    'VCC_5V will pass with the rev C set.',
    'A trial set on VCC_5V passes by 6 dB.',
    'Accept VCC_5V as placed: the failure is waived because the load never steps above 1 A.',
    'VCC_5V accepted despite −6.9 dB at 1.2 MHz (deviation D-12).',
    'Accept the polymer parts as placed.',
    'Accept VCC_5V_AUX as placed.',
  ])('%j accepts none of the failing rail', (text) => {
    expect(railsAccepted(text, RAILS)).not.toContain('VCC_5V');
  });
});

describe('warnings where a review accepts a failing rail', () => {
  const verdicts = new Map<string, RailVerdict>([
    ['VCC_5V', { rail: 'VCC_5V', pass: false, worstMarginDb: -6.93, worstFrequencyHz: 1.2e6, file: 'plans/vcc-5v.yaml' }],
    ['VDD_CORE', { rail: 'VDD_CORE', pass: true, worstMarginDb: 2.88, worstFrequencyHz: 13e6, file: 'plans/vdd-core.yaml' }],
  ]);
  const review = {
    summary: 'Both rails are fine as placed: VCC_5V and VDD_CORE.',
    summaryAt: { file: 'reviews/r.yaml', line: 4, column: 10 },
    decisions: ['Accept VDD_CORE as placed.', 'Accept VCC_5V as placed.', 'Rework VCC_5V.'],
    decisionsAt: [6, 7, 8].map((line) => ({ file: 'reviews/r.yaml', line, column: 5 })),
  };

  it('is located at the decision, or at the summary on the pack\'s cover, and gives the verdict', () => {
    const found = acceptedFailures(reviewStatements(review), verdicts, ['VCC_5V', 'VDD_CORE']);
    expect(found.map((f) => `${f.warning.file}:${f.warning.line}:${f.warning.column}: ${f.warning.severity}: ${f.warning.message}`)).toEqual([
      "reviews/r.yaml:4:10: warning: summary (on the pack's cover): accepts VCC_5V, which fails its target (worst margin −6.93 dB at 1.2 MHz, plans/vcc-5v.yaml); record the fix, or say that the failure is waived and why",
      'reviews/r.yaml:7:5: warning: decisions[1]: accepts VCC_5V, which fails its target (worst margin −6.93 dB at 1.2 MHz, plans/vcc-5v.yaml); record the fix, or say that the failure is waived and why',
    ]);
  });

  it('says nothing when every accepted rail passes', () => {
    const passing = new Map([...verdicts].map(([k, v]) => [k, { ...v, pass: true }]));
    expect(acceptedFailures(reviewStatements(review), passing)).toEqual([]);
  });

  it('reviewWarnings gives the same warnings for a list of reviews, and asks for the verdicts only when there is a review', () => {
    let asked = 0;
    const ask = () => {
      asked++;
      return verdicts;
    };
    expect(reviewWarnings([], ask)).toEqual([]);
    expect(asked).toBe(0);
    const found = reviewWarnings([{ ...review, plans: [{ rail: 'VCC_5V' }, { rail: 'VDD_CORE' }] }], ask);
    expect(asked).toBe(1);
    expect(found).toEqual(acceptedFailures(reviewStatements(review), verdicts, ['VCC_5V', 'VDD_CORE']).map((f) => f.warning));
    expect(found).toHaveLength(2);
  });
});

describe('a rail fails what a reviewer signs: its target at nominal, at a corner, or its load step', () => {
  const base: RailVerdict = { rail: 'VDD_CORE', pass: true, worstMarginDb: 2.88, worstFrequencyHz: 13e6, file: 'plans/vdd-core.yaml' };
  const decision = { decisions: ['Accept VDD_CORE as placed.'], decisionsAt: [{ file: 'reviews/r.yaml', line: 7, column: 5 }] };
  const messages = (v: RailVerdict) => acceptedFailures(reviewStatements(decision), new Map([[v.rail, v]])).map((f) => f.warning.message);

  it('passing everywhere: no warning', () => {
    const v = { ...base, loadStep: { pass: true, resolved: true, excursionV: 0.0145, budgetV: 0.027 }, corners: { pass: true, worstMarginDb: 0.22, worstFrequencyHz: 14.7e6, evaluated: 16 } };
    expect(railFails(v)).toBe(false);
    expect(messages(v)).toEqual([]);
  });

  it('failing only its load step', () => {
    const v = { ...base, loadStep: { pass: false, resolved: true, excursionV: 0.031, budgetV: 0.027 } };
    expect(railFails(v)).toBe(true);
    expect(messages(v)).toEqual([
      'decisions[0]: accepts VDD_CORE, which fails its load step (the rail moves by up to 31 mV against a budget of 27 mV, plans/vdd-core.yaml); record the fix, or say that the failure is waived and why',
    ]);
  });

  it('a load step without a verdict is not a pass', () => {
    const v = { ...base, loadStep: { pass: false, resolved: false, excursionV: NaN, budgetV: 0.027 } };
    expect(messages(v)[0]).toContain("fails its load step (no verdict: the rail's response could not be computed");
  });

  it('passing at nominal, failing at a corner', () => {
    const v = { ...base, corners: { pass: false, worstMarginDb: -0.8, worstFrequencyHz: 14.7e6, evaluated: 16 } };
    expect(messages(v)).toEqual([
      'decisions[0]: accepts VDD_CORE, which fails its target at a corner (worst margin −0.80 dB at 14.7 MHz over 16 corners, plans/vdd-core.yaml); record the fix, or say that the failure is waived and why',
    ]);
  });

  it('failing everything names each failure once', () => {
    const v = {
      ...base,
      pass: false,
      worstMarginDb: -1.5,
      corners: { pass: false, worstMarginDb: -3, worstFrequencyHz: 14.7e6, evaluated: 16 },
      loadStep: { pass: false, resolved: true, excursionV: 0.031, budgetV: 0.027 },
    };
    expect(messages(v)[0]).toContain(
      'fails its target (worst margin −1.50 dB at 13 MHz), also at a corner (worst margin −3.00 dB at 14.7 MHz over 16 corners), its load step (the rail moves by up to 31 mV against a budget of 27 mV, plans/vdd-core.yaml)',
    );
  });
});
