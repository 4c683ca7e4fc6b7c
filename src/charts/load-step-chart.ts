// Charts of a rail's load step, on a log time axis (the ringing of the capacitors' inductance in the first
// nanoseconds and the regulator's settling over microseconds both show): the rail's voltage deviation v(t)
// with the ripple budget either way, the final offset, the deepest dip marked and the ramp shaded; and each
// branch's share of the load current over time, in the rail chart's branch styles, so one sees which
// capacitors carry the step and when the regulator takes over.

import { AXIS_TITLE, KEY_TEXT, dipLabel, loadStepKey } from '../present/chart-words.js';
import { describeLoadStep } from '../present/plan-chart-descriptions.js';
import type { LoadStepChartData } from './load-step-data.js';
import { linearValueAxis, logRangeAxis } from './axes.js';
import { curveObstacle, curveRows, levelObstacle, plainCurve } from './curves.js';
import { frame, PLOT_WIDTH } from './frame.js';
import type { KeyItem } from './key.js';
import { BELOW_FIRST } from './labels.js';
import { placeMarkLabels, shown } from './mark-labels.js';
import { overlayEncoding, overlayStyle } from './overlay.js';
import { INK, RAIL_TOTAL, RESONANCE_MARK, TARGET_LINE, ZERO_LINE } from './palette.js';
import { renderChart, type ChartOutput, type Row } from './render.js';
import { curveLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart, type AxisSpec } from './xy-chart.js';

const SERIES: SeriesScale = { keys: ['voltage', 'budget', 'final'], styles: [RAIL_TOTAL, TARGET_LINE, { color: ZERO_LINE, dash: [2, 3], width: 1.2 }] };
const VOLTAGE_FRAME = frame(PLOT_WIDTH, 260, 28, 42);
const SHARE_FRAME = frame(PLOT_WIDTH, 220, 28, 42);
const BRANCH_WIDTH = 1.3;
const TIME: AxisSpec = { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.time };
const ZERO = { color: ZERO_LINE, width: 0.8 };

/** The time axis: a tenth of the rise time to the end of what is followed. */
function timeAxis(data: LoadStepChartData) {
  const t = data.timesS;
  return logRangeAxis(t[0], t[t.length - 1], PLOT_WIDTH, 's');
}

/** The ramp, shaded from the first time shown to the end of the rise. */
function ramp(data: LoadStepChartData) {
  return { band: [{ f: data.timesS[0], f2: data.riseS }], bandEdges: [{ f: data.riseS }] };
}

export const loadStepChart = xyChart<LoadStepChartData>({
  name: 'load-step',
  frame: VOLTAGE_FRAME,
  x: TIME,
  y: { name: 'y', field: 'v', scale: 'linear', title: AXIS_TITLE.deviation },
  keyStyle: seriesEncoding(SERIES),
  band: true,
  zeroLine: ZERO,
  marks: (X, Y) => [curveLayer('curves', X, Y, seriesEncoding(SERIES), 'p'), pointLayer('points', X, Y, RESONANCE_MARK), placedLabelLayer('labels', X, Y, INK)],
  draw(data) {
    const x = timeAxis(data);
    const v = data.voltageV;
    let lo = -data.budgetV;
    let hi = data.budgetV;
    for (let i = 0; i < v.length; i++) {
      lo = Math.min(lo, v[i]);
      hi = Math.max(hi, v[i]);
    }
    const pad = 0.08 * (hi - lo);
    const y = linearValueAxis(lo - pad, hi + pad, VOLTAGE_FRAME.height, 'V', 6);
    const t = data.timesS;
    const first = t[0];
    const last = t[t.length - 1];
    const droopIndex = Array.prototype.indexOf.call(t, data.droop.atS) as number;
    const voltage = plainCurve(t, v, (i) => i === droopIndex);
    const level = (value: number) => plainCurve([first, last], [value, value]);
    const curves: Row[] = [
      ...curveRows(voltage, x.map, y.map, 'voltage', { p: 0 }),
      ...curveRows(level(-data.budgetV), x.map, y.map, 'budget', { p: 1 }),
      ...curveRows(level(data.budgetV), x.map, y.map, 'budget', { p: 2 }),
      ...(data.finalV !== null ? curveRows(level(data.finalV), x.map, y.map, 'final', { p: 3 }) : []),
    ];
    const droop = { f: data.droop.atS, v: -data.droop.droopV };
    const dip = { at: droop, x: x.map.toPx(droop.f), y: VOLTAGE_FRAME.height - y.map.toPx(droop.v), text: dipLabel(data.droop.droopV, data.droop.atS), required: true, candidates: BELOW_FIRST };
    const placed = placeMarkLabels([dip], VOLTAGE_FRAME, [curveObstacle(voltage, x.map, y.map), levelObstacle(-data.budgetV, x.map, y.map), levelObstacle(data.budgetV, x.map, y.map)]);
    const key: KeyItem[] = [
      { kind: 'line', style: { s: 'voltage' }, text: loadStepKey.voltage(data.stepA) },
      { kind: 'line', style: { s: 'budget' }, text: loadStepKey.budget(data.budgetV) },
      ...(data.finalV !== null ? [{ kind: 'line' as const, style: { s: 'final' }, text: loadStepKey.final(data.finalV) }] : []),
      { kind: 'point', color: RESONANCE_MARK, text: KEY_TEXT.deepestDip },
      { kind: 'band', text: loadStepKey.ramp(data.riseS) },
    ];
    return { x, y, band: ramp(data), datasets: { curves, points: [droop], labels: shown(placed.labels) }, key };
  },
});

export const loadShareChart = xyChart<LoadStepChartData>({
  name: 'load-share',
  frame: SHARE_FRAME,
  x: TIME,
  y: { name: 'y', field: 'v', scale: 'linear', title: AXIS_TITLE.share },
  keyStyle: overlayEncoding(BRANCH_WIDTH),
  band: true,
  zeroLine: ZERO,
  marks: (X, Y) => [curveLayer('branches', X, Y, overlayEncoding(BRANCH_WIDTH), 'p')],
  draw(data) {
    const x = timeAxis(data);
    let lo = 0;
    let hi = 1;
    for (const b of data.branches) {
      for (let i = 0; i < b.share.length; i++) {
        lo = Math.min(lo, b.share[i]);
        hi = Math.max(hi, b.share[i]);
      }
    }
    const pad = 0.05 * (hi - lo);
    const y = linearValueAxis(lo - pad, hi + pad, SHARE_FRAME.height, '', 5);
    const branches: Row[] = [];
    data.branches.forEach((b, k) => branches.push(...curveRows(plainCurve(data.timesS, b.share), x.map, y.map, 'branch', { ...overlayStyle(k), p: k })));
    const key: KeyItem[] = [...data.branches.map((b, k) => ({ kind: 'line' as const, style: overlayStyle(k), text: b.label })), { kind: 'band' as const, text: KEY_TEXT.loadRamp }];
    return { x, y, band: ramp(data), datasets: { branches }, key };
  },
});

/** Render both charts. */
export async function renderLoadStepCharts(data: LoadStepChartData): Promise<{ voltage: ChartOutput; share: ChartOutput }> {
  const text = describeLoadStep(data);
  return { voltage: await renderChart(loadStepChart, data, text.voltage), share: await renderChart(loadShareChart, data, text.share) };
}
