// folio.yaml: library-wide settings. Every field is optional; defaults are chosen for board-level passives.

import { quote } from './diagnostics.js';
import type { Node } from 'yaml';
import type { SweepSpec } from '../circuit/sweep.js';
import { formatEng } from '../units/format.js';
import { Fields, scalarText, type ReadContext } from './fields.js';
import { readRange, type TemperatureRange } from './spread.js';

export const PAPER_SIZES = ['A4', 'Letter'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];

export interface FolioSettings {
  title: string;
  owner?: string;
  /** A line every page of the site shows under the title (e.g. "All data here is invented"). */
  notice?: string;
  sweep: SweepSpec;
  /** Default usable-band criterion (|value_eff/nominal − 1| ≤ within). */
  within: number;
  paper: PaperSize;
  /** Fraction of a capacitor's voltage rating above which rail plans warn (common practice: 80%). */
  derating: number;
  /** The ambient temperatures the library's parts work in, °C: the span of their temperature corners. */
  temperature: TemperatureRange;
  /** A model that misses its own measurement by more than this rms |Z| error, dB, is a warning (common practice: 1 dB). */
  measurementWarnDb: number;
}

/** 100 Hz to 10 GHz covers bulk electrolytics through RF inductors; 100 points a decade resolves Q ≈ 100. */
export const DEFAULT_SETTINGS: Readonly<FolioSettings> = {
  title: 'Part library',
  sweep: { fromHz: 100, toHz: 10e9, perDecade: 100 },
  within: 0.1,
  paper: 'A4',
  derating: 0.8,
  // The commercial range (common practice); a library states its own in folio.yaml.
  temperature: { fromC: 0, toC: 70 },
  measurementWarnDb: 1,
};

/** The largest warning threshold a library may set: 40 dB is a factor of 100 in |Z|. */
export const MAX_MEASUREMENT_WARN_DB = 40;

export const MAX_POINTS_PER_DECADE = 10_000;

export function readSettings(ctx: ReadContext): FolioSettings | undefined {
  const before = ctx.diagnostics.errorCount;
  const contents = ctx.source.document.contents as Node | null;
  if (contents === null) return { ...DEFAULT_SETTINGS };
  const root = Fields.of(ctx, contents, '');
  if (!root) return undefined;
  root.expect(['title', 'owner', 'notice', 'sweep', 'band', 'paper', 'derating', 'temperature', 'measurements']);
  const settings: FolioSettings = { ...DEFAULT_SETTINGS, sweep: { ...DEFAULT_SETTINGS.sweep } };
  settings.title = root.text('title') ?? settings.title;
  settings.owner = root.text('owner');
  settings.notice = root.text('notice');
  settings.paper = (root.text('paper', { oneOf: PAPER_SIZES }) as PaperSize | undefined) ?? settings.paper;

  const sweep = root.map('sweep');
  if (sweep) {
    sweep.expect(['from', 'to', 'per-decade']);
    settings.sweep.fromHz = sweep.quantity('from', 'frequency') ?? settings.sweep.fromHz;
    settings.sweep.toHz = sweep.quantity('to', 'frequency') ?? settings.sweep.toHz;
    const perDecade = sweep.quantity('per-decade', 'ratio');
    if (perDecade !== undefined) {
      if (!Number.isInteger(perDecade) || perDecade > MAX_POINTS_PER_DECADE) {
        sweep.error('per-decade', `expected a whole number of points from 1 to ${MAX_POINTS_PER_DECADE}, found ${quote(scalarText(sweep.valueNode('per-decade')) ?? '')}`);
      } else settings.sweep.perDecade = perDecade;
    }
    const { fromHz, toHz } = settings.sweep;
    if (!(toHz > fromHz)) {
      if (sweep.has('to')) {
        const start = sweep.has('from') ? 'from' : 'default from';
        sweep.error('to', `expected a frequency above the start of the sweep (${start}: ${formatEng(fromHz, 'Hz')}), found ${formatEng(toHz, 'Hz')}`);
      } else sweep.error('from', `expected a frequency below the end of the sweep (default to: ${formatEng(toHz, 'Hz')}), found ${formatEng(fromHz, 'Hz')}`);
    }
  }
  const band = root.map('band');
  if (band) {
    band.expect(['within']);
    settings.within = band.ratio('within') ?? settings.within;
  }
  const temperature = root.map('temperature');
  if (temperature) {
    temperature.expect(['from', 'to'], ['from', 'to']);
    settings.temperature = readRange(temperature) ?? settings.temperature;
  }
  const derating = root.ratio('derating');
  if (derating !== undefined) {
    if (derating > 1) root.error('derating', `expected a fraction of the rating up to 100%, found ${quote(scalarText(root.valueNode('derating')) ?? '')}`);
    else settings.derating = derating;
  }
  const measurements = root.map('measurements');
  if (measurements) {
    measurements.expect(['warn-above']);
    settings.measurementWarnDb = readDecibels(measurements, 'warn-above') ?? settings.measurementWarnDb;
  }
  return ctx.diagnostics.errorCount > before ? undefined : settings;
}

/** A level in decibels above zero: "1 dB", "0.5dB" or a bare number of dB. */
function readDecibels(fields: Fields, name: string): number | undefined {
  if (!fields.has(name)) return undefined;
  const text = scalarText(fields.valueNode(name))?.trim() ?? '';
  const m = /^(\d+(?:\.\d*)?|\.\d+)\s*(?:dB)?$/.exec(text);
  const value = m ? Number(m[1]) : NaN;
  if (!(value > 0) || value > MAX_MEASUREMENT_WARN_DB) {
    fields.error(name, `expected an rms |Z| error in dB above 0 and at most ${MAX_MEASUREMENT_WARN_DB} (e.g. 1 dB), found ${quote(text)}`);
    return undefined;
  }
  return value;
}
