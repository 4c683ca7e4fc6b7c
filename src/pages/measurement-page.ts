// What a datasheet page shows of a part's measurement: where it came from, how far the typed model is from
// it (with the file's own opening comments), the model-against-measurement charts, and the typed parameters beside the ones a fit of the same
// model gives ("model vs fit"). The words come from src/present/measurement-words.ts.

import type { MeasurementChartData } from '../charts/measurement-charts.js';
import { FIT_PARAMETERS, type FitKind } from '../measure/fit-models.js';
import type { PartMeasurement } from '../measure/part-measurements.js';
import type { Part } from '../model/part.js';
import { formatEng, formatPercent } from '../units/format.js';
import { headerComments } from '../measure/touchstone-header.js';
import { absentText, fixtureText, headerText, leftOutShort, limitText, missText, pointsText, signedPercent } from '../present/measurement-words.js';
import type { ChartOnPage } from './site-data.js';

export interface FitRow {
  /** The element, as the model table names it ("ESR", "Rdc", "C"). */
  name: string;
  /** Its key in the part file ("esr", "rdc", "nominal"). */
  key: string;
  typed: string;
  /** The fitted value with its standard error, or why the fit left the parameter out. */
  fitted: string;
  leftOut: boolean;
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
  /** The file's own opening comments (what was measured, how, by whom), quoted. */
  header?: string;
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
  return {
    index,
    file: m.entry.file,
    fixtureText: fixtureText(m.fixture, m.fixtureByDefault, m.measured.referenceOhm),
    note: m.entry.note,
    date: m.entry.date,
    header: m.entry.text !== undefined ? headerText(headerComments(m.entry.text)) : undefined,
    pointsText: pointsText(m.measured.frequencies),
    missText: missText(m.residual, m.worstHz),
    within: !(m.residual.rmsDb > warnDb),
    limitText: limitText(warnDb),
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
    return { name: spec.element, key: spec.name, typed: typedText, fitted: fittedText, leftOut: fitted === undefined, difference };
  });
  return {
    rows,
    residualText: `the fitted model misses the measurement by ${missText(fit.residual)}`,
    leftOut: fit.leftOut.map((l) => `${elementOf(kind, l.name)}: ${leftOutShort(l)}`),
  };
}

/** The element a fitted parameter sets, as the model table names it. */
function elementOf(kind: FitKind, name: string): string {
  return FIT_PARAMETERS[kind].find((spec) => spec.name === name)?.element ?? name;
}
