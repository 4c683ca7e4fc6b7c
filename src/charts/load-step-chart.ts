// Charts of a rail's load step, on a log time axis (the ringing of the capacitors' inductance in the first
// nanoseconds and the regulator's settling over microseconds both show): the rail's voltage deviation v(t)
// with the ripple budget either way, the final offset, the deepest dip marked and the ramp shaded; and each
// branch's share of the load current over time, in the rail chart's branch styles, so one sees which
// capacitors carry the step and when the regulator takes over.

import { formatEng } from '../units/format.js';
import { describeLoadStep } from '../present/plan-chart-descriptions.js';
import { frameForKey, layoutKey, type KeyItem } from './key.js';
import { BELOW_FIRST, placeLabels, type LabelRequest } from './labels.js';
import { overlayEncoding, overlayStyle } from './overlay.js';
import { FONT_SIZE, INK, PLOT_WIDTH, RAIL_TOTAL, RESONANCE_MARK, TARGET_LINE, ZERO_LINE, frame } from './palette.js';
import { curveRows, X_TICK_SPACING, type Curve } from './part-data.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText, type Row } from './render.js';
import { linearAxis, logAxis, logTicks, type Ticks } from './scales.js';
import { axisBinding, axisParams, bandLayers, curveLayer, frameLayer, gridLayers, keyLayers, placedLabelLayer, pointLayer, position, referenceLineLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';

/** What the load-step charts draw; SI units (s, V, A/A). */
export interface LoadStepChartData {
  rail?: string;
  /** Ascending times after the step begins, s (all > 0). */
  timesS: ArrayLike<number>;
  voltageV: ArrayLike<number>;
  budgetV: number;
  /** The settled deviation, V; null when the rail keeps falling. */
  finalV: number | null;
  riseS: number;
  stepA: number;
  droop: { atS: number; droopV: number };
  settleS: number | null;
  /** Each branch's share of the load current at each time. */
  branches: readonly { label: string; share: ArrayLike<number> }[];
}

const SERIES: SeriesScale = { keys: ['voltage', 'budget', 'final'], styles: [RAIL_TOTAL, TARGET_LINE, { color: ZERO_LINE, dash: [2, 3], width: 1.2 }] };
const VOLTAGE_FRAME = frame(PLOT_WIDTH, 260, 28, 42);
const SHARE_FRAME = frame(PLOT_WIDTH, 220, 28, 42);
const BRANCH_WIDTH = 1.3;
const X = position('f', 'f', 'log', 'Time after the load step begins (log scale)');
const Y_VOLTAGE = position('v', 'y', 'linear', 'Deviation from the DC voltage');
const Y_SHARE = position('v', 'y', 'linear', 'Share of the load current');

/** The time axis: a tenth of the rise time to the end of what is followed. */
function timeAxis(data: LoadStepChartData) {
  const t = data.timesS;
  const domain: [number, number] = [t[0], t[t.length - 1]];
  return { map: logAxis(domain, PLOT_WIDTH), binding: axisBinding('f', domain, logTicks(domain, PLOT_WIDTH, 's', X_TICK_SPACING)) };
}

/** 1, 2 or 5 × 10^k: the tick step nearest to `count` intervals over `span`. */
export function niceStep(span: number, count: number): number {
  const raw = span / count;
  const base = 10 ** Math.floor(Math.log10(raw));
  const m = raw / base;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * base;
}

function linearAxisTicks(lo: number, hi: number, unit: string, count: number): { domain: [number, number]; ticks: Ticks } {
  const step = niceStep(hi - lo, count);
  const domain: [number, number] = [Math.floor(lo / step - 1e-9) * step, Math.ceil(hi / step + 1e-9) * step];
  const values: number[] = [];
  for (let k = Math.round(domain[0] / step); k * step <= domain[1] + step * 1e-9; k++) values.push(k * step);
  const labels = values.map((v) => (Math.abs(v) < step * 1e-9 ? `0${unit ? ' ' + unit : ''}` : unit ? formatEng(v, unit) : String(Number(v.toPrecision(3))).replace('-', '−')));
  return { domain, ticks: { values, labels, minor: [] } };
}

function curveOf(t: ArrayLike<number>, v: ArrayLike<number>, keep: (i: number) => boolean = () => false): Curve {
  const out: Curve = { f: [], v: [], keep: [] };
  for (let i = 0; i < t.length; i++) {
    out.f.push(t[i]);
    out.v.push(v[i]);
    out.keep.push(i === 0 || i === t.length - 1 || keep(i));
  }
  return out;
}

export const loadStepChart: ChartDefinition<LoadStepChartData> = {
  name: 'load-step',
  frame: VOLTAGE_FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y_VOLTAGE),
        ...bandLayers(X),
        referenceLineLayer('zero', Y_VOLTAGE, { color: ZERO_LINE, width: 0.8 }),
        curveLayer('curves', X, Y_VOLTAGE, seriesEncoding(SERIES), 'p'),
        pointLayer('points', X, Y_VOLTAGE, RESONANCE_MARK),
        placedLabelLayer('labels', X, Y_VOLTAGE, INK),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(data) {
    const x = timeAxis(data);
    const v = data.voltageV;
    let lo = -data.budgetV;
    let hi = data.budgetV;
    for (let i = 0; i < v.length; i++) {
      lo = Math.min(lo, v[i]);
      hi = Math.max(hi, v[i]);
    }
    const pad = 0.08 * (hi - lo);
    const y = linearAxisTicks(lo - pad, hi + pad, 'V', 6);
    const yMap = linearAxis(y.domain, VOLTAGE_FRAME.height);
    const t = data.timesS;
    const first = t[0];
    const last = t[t.length - 1];
    const droopIndex = Array.prototype.indexOf.call(t, data.droop.atS) as number;
    const curves: Row[] = [
      ...curveRows(curveOf(t, v, (i) => i === droopIndex), x.map, yMap, 'voltage', { p: 0 }),
      ...curveRows(curveOf([first, last], [-data.budgetV, -data.budgetV]), x.map, yMap, 'budget', { p: 1 }),
      ...curveRows(curveOf([first, last], [data.budgetV, data.budgetV]), x.map, yMap, 'budget', { p: 2 }),
      ...(data.finalV !== null ? curveRows(curveOf([first, last], [data.finalV, data.finalV]), x.map, yMap, 'final', { p: 3 }) : []),
    ];
    const droop = { f: data.droop.atS, v: -data.droop.droopV };
    const request: LabelRequest = {
      x: x.map.toPx(droop.f),
      y: VOLTAGE_FRAME.height - yMap.toPx(droop.v),
      text: `−${formatEng(data.droop.droopV, 'V')} at ${formatEng(data.droop.atS, 's')}`,
      fontSize: FONT_SIZE.note,
      required: true,
      candidates: BELOW_FIRST,
    };
    const obstacle = { xs: Array.from(t, (ti) => x.map.toPx(ti)), ys: Array.from(v, (vi) => VOLTAGE_FRAME.height - yMap.toPx(vi)) };
    const level = (y: number) => ({ xs: [0, VOLTAGE_FRAME.width], ys: [VOLTAGE_FRAME.height - yMap.toPx(y), VOLTAGE_FRAME.height - yMap.toPx(y)] });
    const [at] = placeLabels([request], VOLTAGE_FRAME, [obstacle, level(-data.budgetV), level(data.budgetV)]);
    const labels: Row[] = at ? [{ ...droop, t: request.text, dx: at.dx, dy: at.dy, al: at.align, bl: at.baseline }] : [];
    const items: KeyItem[] = [
      { kind: 'line', style: { s: 'voltage' }, text: `v(t) for a ${formatEng(data.stepA, 'A')} step` },
      { kind: 'line', style: { s: 'budget' }, text: `budget ±${formatEng(data.budgetV, 'V')}` },
      ...(data.finalV !== null ? [{ kind: 'line' as const, style: { s: 'final' }, text: `final ${formatEng(data.finalV, 'V')}` }] : []),
      { kind: 'point', color: RESONANCE_MARK, text: 'deepest dip' },
      { kind: 'band', text: `load ramp, ${formatEng(data.riseS, 's')}` },
    ];
    const key = layoutKey(items, VOLTAGE_FRAME.width);
    return {
      frame: frameForKey(VOLTAGE_FRAME, key),
      params: { ...x.binding.params, ...axisBinding('y', y.domain, y.ticks).params },
      datasets: {
        ...x.binding.datasets,
        ...axisBinding('y', y.domain, y.ticks).datasets,
        band: [{ f: first, f2: data.riseS }],
        bandEdges: [{ f: data.riseS }],
        zero: [{ v: 0 }],
        curves,
        points: [droop],
        labels,
        ...key.datasets,
      },
    };
  },
};

export const loadShareChart: ChartDefinition<LoadStepChartData> = {
  name: 'load-share',
  frame: SHARE_FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y_SHARE),
        ...bandLayers(X),
        referenceLineLayer('zero', Y_SHARE, { color: ZERO_LINE, width: 0.8 }),
        curveLayer('branches', X, Y_SHARE, overlayEncoding(BRANCH_WIDTH), 'p'),
        frameLayer(),
        ...keyLayers(overlayEncoding(BRANCH_WIDTH)),
      ],
    } as never;
  },
  bind(data) {
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
    const y = linearAxisTicks(lo - pad, hi + pad, '', 5);
    const yMap = linearAxis(y.domain, SHARE_FRAME.height);
    const branches: Row[] = [];
    data.branches.forEach((b, k) => branches.push(...curveRows(curveOf(data.timesS, b.share), x.map, yMap, 'branch', { ...overlayStyle(k), p: k })));
    const key = layoutKey(
      [...data.branches.map((b, k) => ({ kind: 'line' as const, style: overlayStyle(k), text: b.label })), { kind: 'band' as const, text: 'load ramp' }],
      SHARE_FRAME.width,
    );
    return {
      frame: frameForKey(SHARE_FRAME, key),
      params: { ...x.binding.params, ...axisBinding('y', y.domain, y.ticks).params },
      datasets: {
        ...x.binding.datasets,
        ...axisBinding('y', y.domain, y.ticks).datasets,
        band: [{ f: data.timesS[0], f2: data.riseS }],
        bandEdges: [{ f: data.riseS }],
        zero: [{ v: 0 }],
        branches,
        ...key.datasets,
      },
    };
  },
};

/** Render both charts. */
export async function renderLoadStepCharts(data: LoadStepChartData): Promise<{ voltage: ChartOutput; share: ChartOutput }> {
  const text = describeLoadStep(data);
  return { voltage: await renderChart(loadStepChart, data, text.voltage), share: await renderChart(loadShareChart, data, text.share) };
}
