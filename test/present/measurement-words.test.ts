// A measurement in words: fixtures, the miss, why a parameter was left out, signed differences.

import { describe, expect, it } from 'vitest';
import { absentText, fixtureText, headerText, leftOutShort, limitText, missText, pointsText, signedPercent } from '../../src/present/measurement-words.js';

describe('measurement words', () => {
  it('fixtures, points and the limit', () => {
    expect(fixtureText('series-thru', true, 50)).toBe('two-port series-thru (part in series between the ports), by default for this kind and port count, against 50 Ω');
    expect(fixtureText('reflection', false, 75)).toBe('one-port reflection, against 75 Ω');
    expect(pointsText(Float64Array.of(1e4, 1e6, 3e9))).toBe('3 points from 10 kHz to 3 GHz');
    expect(limitText(1)).toBe('1 dB rms (folio.yaml measurements: warn-above)');
  });

  it('the miss, with and without where it is largest', () => {
    const r = { rmsDb: 0.3708, maxDb: 0.7077, rmsDeg: 0.4487 };
    expect(missText(r, 24.8e6)).toBe('0.37 dB rms in |Z| (at most 0.71 dB, at 24.8 MHz) and 0.45° rms in phase');
    expect(missText(r)).toBe('0.37 dB rms in |Z| (at most 0.71 dB) and 0.45° rms in phase');
  });

  it('absent parameters, reasons for leaving one out, signed differences', () => {
    expect([absentText('open'), absentText('zero'), absentText('required')]).toEqual(['absent (open)', 'absent (0)', '—']);
    const base = { name: 'epr', influence: 0, standardError: 0 };
    expect(leftOutShort({ ...base, why: 'no-effect', strongest: 'low-end' })).toBe('no visible effect in the measured range; a sweep starting lower would show it');
    expect(leftOutShort({ ...base, why: 'uncertain', strongest: 'inside' })).toBe('too uncertain in this data');
    expect(leftOutShort({ ...base, why: 'not-needed', strongest: 'high-end' })).toBe('no better fit with it than the noise explains; a sweep reaching higher would show it');
    expect([signedPercent(0.082), signedPercent(-2 / 3), signedPercent(-5e-14), signedPercent(0)]).toEqual(['+8.2%', '−66.7%', '0.0%', '0.0%']);
  });

  it("a file's opening comments as one quotation, with how many more there are", () => {
    expect(headerText({ lines: ['SYNTHETIC measurement.', 'Seed 1201.'], more: 0 })).toBe('SYNTHETIC measurement. Seed 1201.');
    expect(headerText({ lines: ['a'], more: 1 })).toBe('a … (1 more comment line in the file)');
    expect(headerText({ lines: ['a'], more: 4 })).toBe('a … (4 more comment lines in the file)');
    expect(headerText({ lines: [], more: 0 })).toBeUndefined();
  });
});
