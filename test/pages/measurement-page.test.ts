// What a datasheet page says of a measurement: the miss, whether it is within folio.yaml's limit, and the
// typed model beside the fitted one. The measurement is synthesised in the test (measured-library.ts).

import { describe, expect, it } from 'vitest';
import { measurementPageData } from '../../src/pages/measurement-page.js';
import { libraryMeasurements } from '../../src/measure/part-measurements.js';
import { loadLibrary } from '../../src/model/library.js';
import { measuredLibrary } from '../measure/measured-library.js';

function page(typed: string, warnDb = 1) {
  const { library } = loadLibrary(measuredLibrary({ typed }));
  const part = library!.partsById.get('CAP-M')!;
  const [m] = libraryMeasurements(library!.parts, warnDb).byPart.get('CAP-M')!;
  return measurementPageData(part, m, 1, warnDb, []);
}

describe('measurementPageData', () => {
  it('a typed model 3× the measured ESR: the miss, beyond 1 dB rms, and the fit finding 20 mΩ (−66.7% of the typed 60 mΩ)', () => {
    const p = page('{esr: 60m, esl: 0.5n}');
    expect(p.file).toBe('measurements/cap.s2p');
    expect(p.fixtureText).toBe('two-port shunt-thru (part from the line to ground), against 50 Ω');
    expect(p.pointsText).toBe('241 points from 1 kHz to 1 GHz');
    expect(p.missText).toMatch(/^1\.57 dB rms in \|Z\| \(at most 9\.54 dB, at 22\.4 MHz\) and [\d.]+° rms in phase$/);
    expect([p.within, p.limitText]).toEqual([false, '1 dB rms (folio.yaml measurements: warn-above)']);
    expect([p.date, p.note]).toEqual(['2026-01-15', 'synthetic']);
    // The file's own opening comment, as test/measure/measured-library.ts writes it.
    expect(p.header).toBe('synthetic measurement made by a test');
    const rows = p.fit!.rows;
    expect(rows.map((r) => [r.name, r.typed, r.difference])).toEqual([
      ['nominal', '100 nF', '0.0%'],
      ['esr', '60 mΩ', '−66.7%'],
      ['esl', '500 pH', '0.0%'],
      ['epr', 'absent (open)', '—'],
    ]);
    expect(rows[1].fitted).toMatch(/^20 mΩ ± /);
    expect(rows[3].fitted).toMatch(/^left out \(/);
  });

  it('a typed model as measured is within the limit', () => {
    const p = page('{esr: 20m, esl: 0.5n}');
    expect(p.within).toBe(true);
    expect(p.missText.startsWith('0.00 dB rms')).toBe(true);
  });
});
