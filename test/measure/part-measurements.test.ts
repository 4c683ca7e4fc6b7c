// A part against its measurement: model and measured impedance compared point by point (the error in dB is
// 20·log10(|Z_model|/|Z_measured|), the phase error arg(Z_model/Z_measured)), a warning above folio.yaml's
// threshold, errors for files that are not measurements, and the fit beside the typed model. The
// measurements are synthesised in the tests (test/measure/measured-library.ts, complex.js).

import { describe, expect, it } from 'vitest';
import { libraryMeasurements } from '../../src/measure/part-measurements.js';
import { formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { referenceZAt } from '../reference/impedance.js';
import { MEASURED_TRUTH, measuredLibrary, measuredTree } from './measured-library.js';

function measure(options: Parameters<typeof measuredLibrary>[0] = {}, warnDb = 1) {
  const { library, diagnostics } = loadLibrary(measuredLibrary(options));
  expect(diagnostics).toEqual([]);
  return { library: library!, ...libraryMeasurements(library!.parts, warnDb) };
}

describe('libraryMeasurements', () => {
  it('a model typed as the truth matches its noiseless measurement: errors at rounding level, no warning', () => {
    const { byPart, diagnostics } = measure();
    expect(diagnostics).toEqual([]);
    const [m] = byPart.get('CAP-M')!;
    expect(m.fixture).toBe('shunt-thru');
    expect(m.measured.frequencies).toHaveLength(241);
    expect(m.residual.maxDb).toBeLessThan(1e-9);
    expect(m.residual.rmsDeg).toBeLessThan(1e-9);
  });

  it('an entry without a fixture takes shunt-thru for a capacitor in a two-port file', () => {
    const [m] = measure({ entry: '{file: measurements/cap.s2p}' }).byPart.get('CAP-M')!;
    expect([m.fixture, m.fixtureByDefault]).toEqual(['shunt-thru', true]);
  });

  it('the error at each point is 20·log10 |Z_model/Z_measured| and arg(Z_model/Z_measured) (complex.js)', () => {
    // Typed ESR 60 mΩ against a measured 20 mΩ: the error is largest at resonance, 20·log10(3) ≈ 9.54 dB.
    const { byPart, diagnostics } = measure({ typed: '{esr: 60m, esl: 0.5n}' });
    const [m] = byPart.get('CAP-M')!;
    const typed = loadLibrary(measuredLibrary({ typed: '{esr: 60m, esl: 0.5n}' })).library!.partsById.get('CAP-M')!.network;
    m.measured.frequencies.forEach((f, k) => {
      const ratio = referenceZAt(typed, f).div(referenceZAt(measuredTree, f));
      expect(Math.abs(m.errorDb[k] - 20 * Math.log10(ratio.abs()))).toBeLessThan(1e-9);
      expect(Math.abs(m.errorDeg[k] - (ratio.arg() * 180) / Math.PI)).toBeLessThan(1e-9);
    });
    const srf = 1 / (2 * Math.PI * Math.sqrt(MEASURED_TRUTH.esl * MEASURED_TRUTH.nominal));
    expect(m.residual.maxDb).toBeGreaterThan(9);
    expect(m.residual.maxDb).toBeLessThanOrEqual(20 * Math.log10(3) + 1e-9);
    expect(Math.abs(Math.log(m.worstHz / srf))).toBeLessThan(0.03);
    // rms over the sweep is well below the peak but above 1 dB: a warning at the entry.
    expect(m.residual.rmsDb).toBeGreaterThan(1);
    expect(diagnostics.map(formatDiagnostic)).toEqual([
      `parts/cap.yaml:7:5: warning: measurements[0]: the model misses measurements/cap.s2p by ${m.residual.rmsDb.toFixed(2)} dB rms in |Z| (up to ${m.residual.maxDb.toFixed(2)} dB, at 22.4 MHz), more than the 1 dB folio.yaml allows (measurements: warn-above); "zfolio fit measurements/cap.s2p --kind capacitor --fixture shunt-thru" gives a model that matches it`,
    ]);
  });

  it('no warning when the threshold is above the miss', () => {
    const { diagnostics } = measure({ typed: '{esr: 60m, esl: 0.5n}' }, 10);
    expect(diagnostics).toEqual([]);
  });

  it('the fit beside the typed model gives the measured values back', () => {
    const { byPart } = measure({ typed: '{esr: 40m, esl: 0.6n}' });
    const [m] = byPart.get('CAP-M')!;
    for (const [name, value] of Object.entries(MEASURED_TRUTH)) expect(Math.abs(m.fit!.parameters[name] / value - 1)).toBeLessThan(1e-6);
  });

  it('a file that is not Touchstone is an error in that file; a fixture that does not fit it, at the entry', () => {
    const bad = libraryMeasurements(loadLibrary(measuredLibrary({ measurement: '# GHz S RI R 50\n1 0.1 0.2 x 0 0 0 0 0\n' })).library!.parts, 1);
    expect(bad.diagnostics.map(formatDiagnostic)).toEqual(['measurements/cap.s2p:2:11: expected a number, found "x"']);
    expect(bad.byPart.get('CAP-M')).toEqual([]);
    const wrong = libraryMeasurements(loadLibrary(measuredLibrary({ entry: '{file: measurements/cap.s2p, fixture: reflection}' })).library!.parts, 1);
    expect(wrong.diagnostics.map(formatDiagnostic)).toEqual([
      'parts/cap.yaml:7:5: measurements[0]: measurements/cap.s2p: a reflection measurement needs a 1-port file, found 2 ports; a two-port file is a shunt-thru or series-thru measurement',
    ]);
  });

  it('parts without measurements are not listed', () => {
    const { library } = measure();
    expect([...libraryMeasurements(library.parts.map((p) => ({ ...p, measurements: [] })), 1).byPart.keys()]).toEqual([]);
  });
});

