// Charts of a part against one of its measurements: the model's |Z| and the measured |Z| on log-log axes,
// the two phases, and the residual (model − measurement: the |Z| error in dB and the phase error in
// degrees) over the measured frequencies. Everything is drawn at the measurement's own frequencies.

import { measurementChartText } from '../present/measurement-chart-descriptions.js';
import { AXIS_TITLE, degreesLabel } from '../present/chart-words.js';
import { MAX_DECADES, sweepAxis, Y_TICK_SPACING } from './axes.js';
import { curveRows, plainCurve } from './curves.js';
import { halfFrame } from './frame.js';
import type { KeyItem } from './key.js';
import { PART_SERIES, ZERO_LINE, type SeriesStyle } from './palette.js';
import { renderChart, type ChartDefinition, type ChartOutput, type Row } from './render.js';
import { rowLayouts } from './chart-definition.js';
import { linearAxis, linearTicks, logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import { curveLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart, type AxisSpec } from './xy-chart.js';

/** What the measurement charts draw; SI units (Hz, Ω), errors in dB and degrees. */
export interface MeasurementChartData {
  partId: string;
  /** The measurement file, as the part file names it. */
  file: string;
  fixture: string;
  frequencies: Float64Array;
  measured: { re: Float64Array; im: Float64Array };
  model: { re: Float64Array; im: Float64Array };
  errorDb: Float64Array;
  errorDeg: Float64Array;
  residual: { rmsDb: number; maxDb: number; rmsDeg: number };
}

/** The measurement: thin, in the second overlay colour, so the model's line stays readable over it. */
const MEASURED: SeriesStyle = { color: '#b5520b', dash: [], width: 1.1 };
const MODEL: SeriesStyle = PART_SERIES.magnitude;
const PAIR: SeriesScale = { keys: ['model', 'measured'], styles: [MODEL, MEASURED] };
const RESIDUAL: SeriesScale = { keys: ['db', 'deg'], styles: [{ color: '#1f3d73', dash: [], width: 1.3 }, { color: '#b5520b', dash: [5, 3], width: 1.3 }] };
const FRAME = halfFrame(160);
const RESIDUAL_FRAME = halfFrame(140);
const DEG = 180 / Math.PI;

const X: AxisSpec = { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency };

/** The values at every measured frequency; non-finite ones (or ≤ 0 on a log axis, when `positive`) are gaps. */
function curveOf(f: Float64Array, value: (k: number) => number, positive = false) {
  return plainCurve(
    f,
    Float64Array.from(f, (_, k) => {
      const v = value(k);
      return Number.isFinite(v) && (!positive || v > 0) ? v : NaN;
    }),
  );
}

/**
 * The key of the |Z| and phase charts: the same two entries, the quantity being the y axis's, so the two
 * keys take as many lines and the plots beside each other on a page line up.
 */
function pairKey(data: MeasurementChartData): KeyItem[] {
  return [
    { kind: 'line', style: { s: 'model' }, text: `model (${data.partId})` },
    { kind: 'line', style: { s: 'measured' }, text: `measured (${data.file})` },
  ];
}

export const measuredImpedanceChart = xyChart<MeasurementChartData>({
  name: 'measured-impedance',
  frame: FRAME,
  x: X,
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.impedance },
  keyStyle: seriesEncoding(PAIR),
  marks: (x, y) => [curveLayer('curves', x, y, seriesEncoding(PAIR))],
  draw(data) {
    const x = sweepAxis(data.frequencies, FRAME.width);
    const size = (z: { re: Float64Array; im: Float64Array }) => Float64Array.from(data.frequencies, (_, k) => Math.hypot(z.re[k], z.im[k]));
    const model = size(data.model);
    const measured = size(data.measured);
    const domain = paddedLogDomain(...positiveExtent([model, measured], MAX_DECADES));
    const yMap = logAxis(domain, FRAME.height);
    // The measurement over the model: its scatter stays visible where the two agree.
    const curves: Row[] = [...curveRows(curveOf(data.frequencies, (k) => model[k], true), x.map, yMap, 'model'), ...curveRows(curveOf(data.frequencies, (k) => measured[k], true), x.map, yMap, 'measured')];
    return { x, y: { domain, ticks: logTicks(domain, FRAME.height, 'Ω', Y_TICK_SPACING) }, datasets: { curves }, key: pairKey(data) };
  },
});

const PHASE_DOMAIN: [number, number] = [-99, 99];

export const measuredPhaseChart = xyChart<MeasurementChartData>({
  name: 'measured-phase',
  frame: FRAME,
  x: X,
  y: { name: 'y', field: 'v', scale: 'linear', title: AXIS_TITLE.phase },
  keyStyle: seriesEncoding(PAIR),
  marks: (x, y) => [curveLayer('curves', x, y, seriesEncoding(PAIR))],
  draw(data) {
    const x = sweepAxis(data.frequencies, FRAME.width);
    const yMap = linearAxis(PHASE_DOMAIN, FRAME.height);
    // A measured phase beyond ±90° (a little negative resistance from the fixture's error) is drawn at the edge.
    const phase = (z: { re: Float64Array; im: Float64Array }) => (k: number) => Math.max(-99, Math.min(99, Math.atan2(z.im[k], z.re[k]) * DEG));
    const curves: Row[] = [...curveRows(curveOf(data.frequencies, phase(data.model)), x.map, yMap, 'model'), ...curveRows(curveOf(data.frequencies, phase(data.measured)), x.map, yMap, 'measured')];
    return {
      x,
      y: { domain: PHASE_DOMAIN, ticks: { ...linearTicks([-90, 90], 30, degreesLabel), minor: [-75, -45, -15, 15, 45, 75] } },
      datasets: { curves },
      key: pairKey(data),
    };
  },
});

/**
 * A symmetric range around zero that holds every error, in about three steps of 1, 2 or 5 × 10^k a side, with
 * one step more when the largest error would touch the frame.
 */
export function residualDomain(errorDb: ArrayLike<number>, errorDeg: ArrayLike<number>): { domain: [number, number]; step: number } {
  let peak = 0;
  for (const list of [errorDb, errorDeg]) for (let k = 0; k < list.length; k++) if (Number.isFinite(list[k])) peak = Math.max(peak, Math.abs(list[k]));
  // Nothing under 0.1 (dB or degrees) is drawn finer: a perfect match shows as a flat line near zero.
  peak = Math.max(peak, 0.1);
  const raw = peak / 3;
  const base = 10 ** Math.floor(Math.log10(raw));
  const m = raw / base;
  const step = (m <= 1.0000001 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * base;
  let top = Math.ceil(peak / step - 1e-9) * step;
  if (peak > top * 0.98) top += step;
  return { domain: [-top, top], step };
}

export const residualChart = xyChart<MeasurementChartData>({
  name: 'residual',
  frame: RESIDUAL_FRAME,
  x: X,
  // One axis for both errors: its title names both units, the key says which line is which.
  y: { name: 'y', field: 'v', scale: 'linear', title: 'Model − measurement (dB, °)' },
  keyStyle: seriesEncoding(RESIDUAL),
  zeroLine: { color: ZERO_LINE, width: 1 },
  marks: (x, y) => [curveLayer('curves', x, y, seriesEncoding(RESIDUAL))],
  draw(data) {
    const x = sweepAxis(data.frequencies, RESIDUAL_FRAME.width);
    const { domain, step } = residualDomain(data.errorDb, data.errorDeg);
    const yMap = linearAxis(domain, RESIDUAL_FRAME.height);
    const label = (v: number) => (v === 0 ? '0' : `${v < 0 ? '−' : '+'}${Number(Math.abs(v).toPrecision(3))}`);
    const curves: Row[] = [...curveRows(curveOf(data.frequencies, (k) => data.errorDeg[k]), x.map, yMap, 'deg'), ...curveRows(curveOf(data.frequencies, (k) => data.errorDb[k]), x.map, yMap, 'db')];
    const r = data.residual;
    return {
      x,
      y: { domain, ticks: { ...linearTicks(domain, step, label), minor: [] } },
      datasets: { curves },
      key: [
        { kind: 'line', style: { s: 'db' }, text: `|Z| error, dB (rms ${r.rmsDb.toFixed(2)}, max ${r.maxDb.toFixed(2)})` },
        { kind: 'line', style: { s: 'deg' }, text: `phase error, degrees (rms ${r.rmsDeg.toFixed(2)})` },
      ],
    };
  },
});

export const MEASUREMENT_CHARTS = { 'measured-impedance': measuredImpedanceChart, 'measured-phase': measuredPhaseChart, residual: residualChart } as const;
export type MeasurementChartKind = keyof typeof MEASUREMENT_CHARTS;
export const MEASUREMENT_CHART_KINDS = Object.keys(MEASUREMENT_CHARTS) as MeasurementChartKind[];

/** The three charts of one measurement, with their titles and text alternatives. */
export async function renderMeasurementCharts(data: MeasurementChartData): Promise<Record<MeasurementChartKind, ChartOutput>> {
  // The page sets them two to a row, in this order (rowLayouts).
  const defs: ChartDefinition<MeasurementChartData>[] = MEASUREMENT_CHART_KINDS.map((kind) => MEASUREMENT_CHARTS[kind]);
  const layouts = rowLayouts(defs, data);
  const outputs = await Promise.all(MEASUREMENT_CHART_KINDS.map((kind, i) => renderChart(defs[i], data, measurementChartText(kind, data), layouts[i])));
  return Object.fromEntries(MEASUREMENT_CHART_KINDS.map((kind, i) => [kind, outputs[i]])) as Record<MeasurementChartKind, ChartOutput>;
}
