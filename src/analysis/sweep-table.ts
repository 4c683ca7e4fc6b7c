// A part's sweep as columns, for CSV and JSON downloads (SI base units; full precision unless a CSV asks
// for fewer digits).

import type { PartAnalysis } from './part-figures.js';
import { impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import { roundedSweep } from '../circuit/sweep.js';
import { shortSignificantText } from '../units/digits-text.js';

export const SWEEP_COLUMNS = [
  ['frequency_Hz', 'frequencyHz'],
  ['R_ohm', 'resistanceOhm'],
  ['X_ohm', 'reactanceOhm'],
  ['Zmag_ohm', 'magnitudeOhm'],
  ['phase_deg', 'phaseDeg'],
  ['G_S', 'conductanceS'],
  ['B_S', 'susceptanceS'],
  ['Ymag_S', 'admittanceMagnitudeS'],
  ['Q', 'q'],
  ['Ceff_F', 'effectiveCapacitanceF'],
  ['Leff_H', 'effectiveInductanceH'],
] as const;

export type SweepColumns = Record<(typeof SWEEP_COLUMNS)[number][1], Float64Array>;

export function sweepColumns(a: Pick<PartAnalysis, 'columns'>): SweepColumns {
  return a.columns;
}

/**
 * A number rounded to `digits` significant digits (all of them when undefined), in the shorter of plain and
 * exponent form ("15915.5", "6.28319e-5"); empty where undefined (NaN).
 */
export function csvCell(value: number, digits?: number): string {
  if (Number.isNaN(value)) return '';
  if (!Number.isFinite(value)) return value > 0 ? 'inf' : '-inf';
  if (digits === undefined) return String(value);
  return shortSignificantText(value, digits);
}

/** The sweep as CSV, one row per point; `digits` rounds every value to that many significant digits. */
export function sweepCsv(a: Pick<PartAnalysis, 'frequencies' | 'columns'>, digits?: number): string {
  const columns = sweepColumns(a);
  const arrays = SWEEP_COLUMNS.map(([, key]) => columns[key]);
  let text = SWEEP_COLUMNS.map(([header]) => header).join(',') + '\n';
  for (let i = 0; i < a.frequencies.length; i++) {
    let line = csvCell(arrays[0][i], digits);
    for (let c = 1; c < arrays.length; c++) line += ',' + csvCell(arrays[c][i], digits);
    text += line + '\n';
  }
  return text;
}

export function sweepJson(a: PartAnalysis): object {
  const columns = sweepColumns(a);
  const out: Record<string, unknown> = { id: a.part.id, sweep: { ...a.sweep }, points: a.frequencies.length };
  for (const [, key] of SWEEP_COLUMNS) {
    out[key] = Array.from(columns[key], (v) => (Number.isFinite(v) ? v : null));
  }
  return out;
}

/**
 * A part's sweep as a site writes it: the independent columns only (frequency, R and X), every value to
 * `digits` significant digits, each row the model evaluated at the frequency as written (roundedSweep), so
 * a row reads back as the model at its own frequency. The other columns of SWEEP_COLUMNS are closed forms
 * of R and X (|Z| = √(R² + X²), phase = atan2(X, R), G = R/|Z|², B = −X/|Z|², |Y| = 1/|Z|, Q = |X|/R,
 * C_eff = −1/(ωX), L_eff = X/ω); `zfolio sweep --csv` writes them all. `f` is roundedSweep(a.sweep, digits)
 * and `z` the model at `f`, given by a caller that has them already.
 */
export function sweepPointsCsv(
  a: { part: Pick<PartAnalysis['part'], 'network'>; sweep: PartAnalysis['sweep'] },
  digits: number,
  f = roundedSweep(a.sweep, digits),
  z: ImpedanceArrays = impedanceSweep(a.part.network, f),
): string {
  const frequencies = frequencyCells(f, digits);
  let text = 'frequency_Hz,R_ohm,X_ohm\n';
  for (let i = 0; i < f.length; i++) text += `${frequencies[i]},${csvCell(z.re[i], digits)},${csvCell(z.im[i], digits)}\n`;
  return text;
}

/** The frequency column's cells of the last frequencies written: the same for every part of a library. */
let lastCells: { f: Float64Array; digits: number; cells: string[] } | undefined;

function frequencyCells(f: Float64Array, digits: number): string[] {
  if (!lastCells || lastCells.digits !== digits || !sameValues(lastCells.f, f)) lastCells = { f: f.slice(), digits, cells: Array.from(f, (v) => csvCell(v, digits)) };
  return lastCells.cells;
}

/** Whether two arrays hold the same values (NaN equal to NaN, as Object.is: the same cells). */
function sameValues(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}
