// What a datasheet page shows of a part's measurement: where it came from, how far the typed model is from
// it, the model-against-measurement charts, and the typed parameters beside the ones a fit of the same
// model gives ("model vs fit").

import type { MeasurementChartData } from '../charts/measurement-charts.js';
import { FIT_PARAMETERS, type FitKind } from '../measure/fit-models.js';
import type { LeftOut } from '../measure/fit.js';
import type { PartMeasurement } from '../measure/part-measurements.js';
import type { Part } from '../model/part.js';
import { formatEng, formatPercent } from '../units/format.js';
import type { ChartOnPage } from './site-data.js';

export interface FitRow {
  name: string;
  typed: string;
  fitted: string;
  /** fitted/typed − 1, or why there is no such number. */
  difference: string;
}

export interface MeasurementPageData {
  /** 1-based, in the order the part file lists them. */
  index: number;
  file: string;
  fixtureText: string;
  note?: string;
  date?: string;
  pointsText: string;
  /** "0.37 dB rms in |Z| (at most 0.71 dB, at 24.8 MHz) and 0.45° rms in phase" */
  missText: string;
  /** Whether the miss is within folio.yaml's warn-above, and that limit in words. */
  within: boolean;
  limitText: string;
  fit?: { rows: FitRow[]; residualText: string; leftOut: string[] };
  fitProblem?: string;
  charts: ChartOnPage[];
}

const FIXTURE_TEXT: Readonly<Record<string, string>> = {
  reflection: 'one-port reflection',
  'shunt-thru': 'two-port shunt-thru (part from the line to ground)',
  'series-thru': 'two-port series-thru (part in series between the ports)',
};

export function measurementChartData(part: Part, m: PartMeasurement): MeasurementChartData {
  return {
    partId: part.id,
    file: m.entry.file,
    fixture: m.fixture,
    frequencies: m.measured.frequencies,
    measured: { re: m.measured.re, im: m.measured.im },
    model: m.model,
    errorDb: m.errorDb,
    errorDeg: m.errorDeg,
    residual: m.residual,
  };
}

export function measurementPageData(part: Part, m: PartMeasurement, index: number, warnDb: number, charts: ChartOnPage[]): MeasurementPageData {
  const f = m.measured.frequencies;
  const r = m.residual;
  return {
    index,
    file: m.entry.file,
    fixtureText: `${FIXTURE_TEXT[m.fixture]}${m.fixtureByDefault ? ', by default for this kind and port count' : ''}, against ${formatEng(m.measured.referenceOhm, 'resistance')}`,
    note: m.entry.note,
    date: m.entry.date,
    pointsText: `${f.length} points from ${formatEng(f[0], 'frequency')} to ${formatEng(f[f.length - 1], 'frequency')}`,
    missText: `${r.rmsDb.toFixed(2)} dB rms in |Z| (at most ${r.maxDb.toFixed(2)} dB, at ${formatEng(m.worstHz, 'frequency')}) and ${r.rmsDeg.toFixed(2)}° rms in phase`,
    within: !(r.rmsDb > warnDb),
    limitText: `${warnDb} dB rms (folio.yaml measurements: warn-above)`,
    fit: m.fit ? fitTable(part, m) : undefined,
    fitProblem: m.fitProblem,
    charts,
  };
}

function fitTable(part: Part, m: PartMeasurement): MeasurementPageData['fit'] {
  const fit = m.fit!;
  const kind = part.kind as FitKind;
  const typedValue = (name: string) => (name === 'nominal' ? part.nominal : part.parameters[name]);
  const rows = FIT_PARAMETERS[kind].map((spec) => {
    const typed = typedValue(spec.name);
    const fitted = fit.parameters[spec.name];
    const left = fit.leftOut.find((l) => l.name === spec.name);
    const typedText = typed !== undefined ? formatEng(typed, spec.dimension, { digits: 4 }) : absentText(spec.absence);
    const fittedText = fitted !== undefined ? `${formatEng(fitted, spec.dimension, { digits: 4 })} ± ${formatPercent(Math.expm1(fit.standardErrors[spec.name]), 2)}` : left ? `left out (${leftOutShort(left)})` : '—';
    const difference = typed !== undefined && fitted !== undefined ? signedPercent(fitted / typed - 1) : '—';
    return { name: spec.name, typed: typedText, fitted: fittedText, difference };
  });
  const res = fit.residual;
  return {
    rows,
    residualText: `the fitted model misses the measurement by ${res.rmsDb.toFixed(2)} dB rms in |Z| (at most ${res.maxDb.toFixed(2)} dB) and ${res.rmsDeg.toFixed(2)}° rms in phase`,
    leftOut: fit.leftOut.map((l) => `${l.name}: ${leftOutShort(l)}`),
  };
}

function absentText(absence: string): string {
  return absence === 'open' ? 'absent (open)' : absence === 'zero' ? 'absent (0)' : '—';
}

function leftOutShort(l: LeftOut): string {
  const where = l.strongest === 'low-end' ? '; a sweep starting lower would show it' : l.strongest === 'high-end' ? '; a sweep reaching higher would show it' : '';
  if (l.why === 'no-effect') return `no visible effect in the measured range${where}`;
  if (l.why === 'uncertain') return `too uncertain in this data${where}`;
  return `no better fit with it than the noise explains${where}`;
}

/** A relative difference to a tenth of a percent, with its sign: "+8.2%", "−66.7%", "0.0%". */
function signedPercent(ratio: number): string {
  const text = Math.abs(ratio * 100).toFixed(1);
  return text === '0.0' ? '0.0%' : `${ratio > 0 ? '+' : '−'}${text}%`;
}
