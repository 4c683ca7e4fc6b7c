// A part's downloads (sweep.csv, figures.json, its Touchstone and SPICE files) as a
// plain, cloneable value, written by whichever thread draws the part's charts: a chart worker on a cold
// build, so that turning numbers into text (about a third of the thread that feeds the workers, CPU
// profile of a 1,000-part build) is spread over the workers instead of holding them up.

import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { PartAnalysis } from '../analysis/part-figures.js';
import { partSummary, type PartSummary } from '../analysis/summary.js';
import { sweepPointsCsv } from '../analysis/sweep-table.js';
import { impedanceSweep } from '../circuit/impedance.js';
import { roundedSweep } from '../circuit/sweep.js';
import { partSubcircuit, partTouchstone, type ExportablePart } from '../measure/part-export.js';
import type { Library } from '../model/library.js';
import { modelFileNames } from '../pages/site-data.js';
import { SWEEP_CSV, SWEEP_CSV_DIGITS } from '../pages/spec-download.js';
import { escapeJsonMarkup } from '../present/escape.js';
import { sweepText } from '../present/part-words.js';
import type { ChartArtifact } from './chart-maker.js';
import { writeFileDeep } from './output.js';

type Sweep = Library['settings']['sweep'];

/** Where a part's downloads go: its folder in the site being written, and the library's sweep. */
export interface DownloadPlace {
  folder: string;
  sweep: Sweep;
}

/** Everything a part's downloads are made from: plain objects only (the sweep is evaluated where they are written). */
export interface PartDownloads extends DownloadPlace {
  part: ExportablePart;
  summary: PartSummary;
}

export function partDownloads(a: PartAnalysis, place: DownloadPlace): PartDownloads {
  const { id, kind, title, network, source } = a.part;
  return {
    ...place,
    part: { id, kind, title, network, source: { path: source.path, hash: source.hash } },
    summary: partSummary(a),
  };
}

/**
 * Pretty JSON with a final newline (downloads are read by people too), with <, > and & written as \u
 * escapes: the same data when parsed, and inert if a file is ever sniffed or pasted as HTML.
 */
export const jsonFile = (value: unknown) => escapeJsonMarkup(JSON.stringify(value, null, 2)) + '\n';

/** The file name of a chart's spec beside its page. */
export const specFileName = (chart: Pick<ChartArtifact, 'key'>) => `${chart.key}.vl.json`;

/** Write a chart's spec beside its page, compact (any vega-lite tool lays it out). */
export function writeChartSpec(chart: ChartArtifact, folder: string): void {
  writeFileDeep(join(folder, specFileName(chart)), escapeJsonMarkup(JSON.stringify(chart.spec)) + '\n');
}

/**
 * Write a part's downloads into its folder: sweep.csv (frequency, R and X at the frequencies as written,
 * sweepPointsCsv), figures.json, and the model for simulators at the same frequencies: a one-port
 * Touchstone file (S11 with the decimals that keep the impedance read back from it to 6 significant digits,
 * as sweep.csv keeps R and X) and a SPICE subcircuit. Its charts' specs are the site's shared ones
 * (spec-download.ts), not written here.
 */
export function writePartDownloads(d: PartDownloads): void {
  mkdirSync(d.folder, { recursive: true });
  const frequencies = downloadFrequencies(d.sweep);
  // Both files are at the same frequencies: the model is evaluated once.
  const z = impedanceSweep(d.part.network, frequencies);
  writeFileSync(join(d.folder, SWEEP_CSV), sweepPointsCsv(d, SWEEP_CSV_DIGITS, frequencies, z));
  writeFileSync(join(d.folder, 'figures.json'), jsonFile(d.summary));
  const names = modelFileNames(d.part.id);
  writeFileSync(join(d.folder, names.touchstone), partTouchstone(d.part, frequencies, sweepText(d.sweep), SWEEP_CSV_DIGITS, z));
  writeFileSync(join(d.folder, names.spice), partSubcircuit(d.part));
}

/** The last sweep's download frequencies: every part of a library has the same (kept, never changed). */
let lastFrequencies: { key: string; frequencies: Float64Array } | undefined;

/** roundedSweep(sweep, SWEEP_CSV_DIGITS), made once a sweep: a thread writes a library's parts one after another. */
function downloadFrequencies(sweep: Sweep): Float64Array {
  const key = `${sweep.fromHz} ${sweep.toHz} ${sweep.perDecade}`;
  if (lastFrequencies?.key !== key) lastFrequencies = { key, frequencies: roundedSweep(sweep, SWEEP_CSV_DIGITS) };
  return lastFrequencies.frequencies;
}
