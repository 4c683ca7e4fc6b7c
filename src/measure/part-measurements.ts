// A part against its own measurements: each file read as Touchstone, turned into the part's impedance by
// its fixture, compared point by point with the part's model, and (for the four fitted kinds) fitted, so a
// page can show how far the typed model is from the measurement and what a fit would make of it.

import { impedanceSweep } from '../circuit/impedance.js';
import type { Diagnostic } from '../model/diagnostics.js';
import type { MeasurementEntry } from '../model/measurement-entry.js';
import type { Part } from '../model/part.js';
import { formatEng } from '../units/format.js';
import { fitImpedance, residualOf, type FitResidual, type FitResult } from './fit.js';
import { FIT_KINDS, type FitKind } from './fit-models.js';
import { impedanceFromNetwork, type Fixture, type MeasuredImpedance } from './fixtures.js';
import { readTouchstone } from './touchstone-read.js';

export interface PartMeasurement {
  entry: MeasurementEntry;
  fixture: Fixture;
  fixtureByDefault: boolean;
  /** The measured impedance at the frequencies above zero. */
  measured: MeasuredImpedance;
  /** The part's model at the same frequencies. */
  model: { re: Float64Array; im: Float64Array };
  /** Model against measurement at each frequency: |Z| error in dB and phase error in degrees (model − measured). */
  errorDb: Float64Array;
  errorDeg: Float64Array;
  residual: FitResidual;
  /** Where the largest |Z| error is. */
  worstHz: number;
  /** The kind's model fitted to the measurement; absent for networks, or with why it could not be. */
  fit?: FitResult;
  fitProblem?: string;
}

export interface LibraryMeasurements {
  byPart: Map<string, PartMeasurement[]>;
  diagnostics: Diagnostic[];
}

const DB_PER_NEPER = 20 / Math.LN10;
const DEGREES = 180 / Math.PI;

/** Every part's measurements; errors for files that cannot be read as measurements, warnings above `warnDb`. */
export function libraryMeasurements(parts: readonly Part[], warnDb: number): LibraryMeasurements {
  const byPart = new Map<string, PartMeasurement[]>();
  const diagnostics: Diagnostic[] = [];
  for (const part of parts) {
    if (part.measurements.length === 0) continue;
    const found: PartMeasurement[] = [];
    part.measurements.forEach((entry, i) => {
      const m = measurePart(part, entry, i, diagnostics);
      if (!m) return;
      found.push(m);
      if (m.residual.rmsDb > warnDb) {
        diagnostics.push({
          ...entry.at,
          severity: 'warning',
          message: `measurements[${i}]: the model misses ${entry.file} by ${m.residual.rmsDb.toFixed(2)} dB rms in |Z| (up to ${m.residual.maxDb.toFixed(2)} dB, at ${formatEng(m.worstHz, 'frequency')}), more than the ${warnDb} dB folio.yaml allows (measurements: warn-above)${fitHint(part, entry)}`,
        });
      }
    });
    byPart.set(part.id, found);
  }
  return { byPart, diagnostics };
}

function fitHint(part: Part, entry: MeasurementEntry): string {
  return isFitKind(part.kind) ? `; "zfolio fit ${entry.file} --kind ${part.kind}${entry.fixture ? ` --fixture ${entry.fixture}` : ''}" gives a model that matches it` : '';
}

function isFitKind(kind: string): kind is FitKind {
  return (FIT_KINDS as readonly string[]).includes(kind);
}

/** One measurement of a part, or undefined with its problems added to `diagnostics`. */
export function measurePart(part: Part, entry: MeasurementEntry, index: number, diagnostics: Diagnostic[]): PartMeasurement | undefined {
  if (entry.text === undefined) return undefined;
  const read = readTouchstone(entry.text, entry.file);
  if (!read.ok) {
    diagnostics.push(...read.errors);
    return undefined;
  }
  const data = read.data;
  const kind = part.behavesAs ?? part.kind;
  const fixture: Fixture = entry.fixture ?? (data.ports === 1 ? 'reflection' : kind === 'capacitor' ? 'shunt-thru' : 'series-thru');
  const converted = impedanceFromNetwork(data, fixture);
  if (!converted.ok) {
    diagnostics.push({ ...entry.at, severity: 'error', message: `measurements[${index}]: ${entry.file}: ${converted.error.message}` });
    return undefined;
  }
  const measured = abovezero(converted.impedance);
  if (measured.frequencies.length < 2) {
    diagnostics.push({ ...entry.at, severity: 'error', message: `measurements[${index}]: ${entry.file} holds ${measured.frequencies.length} frequency above 0 Hz with a non-zero impedance; a comparison needs at least 2` });
    return undefined;
  }
  const model = impedanceSweep(part.network, measured.frequencies);
  const n = measured.frequencies.length;
  const residualLn = new Float64Array(2 * n);
  const errorDb = new Float64Array(n);
  const errorDeg = new Float64Array(n);
  let worst = 0;
  for (let k = 0; k < n; k++) {
    // ln(Z_model/Z_measured): the same residual the fit minimises.
    const d = measured.re[k] * measured.re[k] + measured.im[k] * measured.im[k];
    const qr = (model.re[k] * measured.re[k] + model.im[k] * measured.im[k]) / d;
    const qi = (model.im[k] * measured.re[k] - model.re[k] * measured.im[k]) / d;
    residualLn[k] = 0.5 * Math.log(qr * qr + qi * qi);
    residualLn[n + k] = Math.atan2(qi, qr);
    errorDb[k] = residualLn[k] * DB_PER_NEPER;
    errorDeg[k] = residualLn[n + k] * DEGREES;
    if (Math.abs(errorDb[k]) > Math.abs(errorDb[worst])) worst = k;
  }
  const result: PartMeasurement = {
    entry,
    fixture,
    fixtureByDefault: entry.fixture === undefined,
    measured,
    model: { re: model.re, im: model.im },
    errorDb,
    errorDeg,
    residual: residualOf(residualLn, n),
    worstHz: measured.frequencies[worst],
  };
  if (isFitKind(part.kind)) {
    const fitted = fitImpedance(part.kind, measured);
    if (fitted.ok) result.fit = fitted.fit;
    else result.fitProblem = fitted.message;
  }
  return result;
}

/** The points above 0 Hz with a non-zero, finite impedance (a log axis and ln|Z| need both). */
function abovezero(z: MeasuredImpedance): MeasuredImpedance {
  const keep: number[] = [];
  for (let k = 0; k < z.frequencies.length; k++) {
    const size = Math.hypot(z.re[k], z.im[k]);
    if (z.frequencies[k] > 0 && size > 0 && Number.isFinite(size)) keep.push(k);
  }
  if (keep.length === z.frequencies.length) return z;
  return { ...z, frequencies: Float64Array.from(keep, (k) => z.frequencies[k]), re: Float64Array.from(keep, (k) => z.re[k]), im: Float64Array.from(keep, (k) => z.im[k]) };
}
