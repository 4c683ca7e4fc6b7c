// Chart: a power rail's impedance |Z| against its target on log-log axes, the impedance of each branch
// (a group of placed capacitors, the regulator, the plane) as thin curves, the rail's anti-resonance peaks
// marked and labelled (in the target's colour where they exceed it), and the rail's frequency band shaded.
// Input is plain data, so the rail engine and the charts only share this interface.

import { formatEng } from '../units/format.js';
import { describeRail } from '../present/plan-chart-descriptions.js';
import { frameForKey, layoutKey, type KeyItem } from './key.js';
import { ABOVE_FIRST, placeLabels, type LabelRequest } from './labels.js';
import { overlayEncoding, overlayStyle } from './overlay.js';
import { FONT_SIZE, INK, PLOT_WIDTH, RAIL_TOTAL, TARGET_LINE, frame } from './palette.js';
import { curveRows, envelopeRows, frequencyAxis, mergeCurve, toPlot, Y_TICK_SPACING } from './part-data.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText, type Row } from './render.js';
import { logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import { axisBinding, axisParams, bandLayers, curveLayer, envelopeLayer, frameLayer, gridLayers, keyLayers, placedLabelLayer, position, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';

/** What the rail chart draws; all values in SI base units (Hz, Ω). */
export interface RailChartData {
  /** The rail's name, for the title and description (e.g. "VDD_CORE"). */
  rail?: string;
  /** Ascending sweep frequencies. */
  frequencies: ArrayLike<number>;
  /** |Z| of the rail at each frequency. */
  totalOhm: ArrayLike<number>;
  /** Target impedance: one value, or one per frequency. */
  target: number | ArrayLike<number>;
  /** |Z| of each branch alone (e.g. "12 × CAP-0402-100N"), at each frequency. */
  branches: readonly { label: string; ohm: ArrayLike<number> }[];
  /** Anti-resonance peaks of the total. */
  peaks: readonly { frequencyHz: number; impedanceOhm: number }[];
  /** The frequency band the target applies to. */
  band: { fromHz: number; toHz: number } | null;
  /** Least and greatest |Z| of the rail over the corners of its parts' spreads, at each frequency. */
  envelope?: { minOhm: ArrayLike<number>; maxOhm: ArrayLike<number>; corners: number } | null;
}

const SERIES: SeriesScale = { keys: ['total', 'target'], styles: [RAIL_TOTAL, TARGET_LINE] };
const FRAME = frame(PLOT_WIDTH, 300, 28, 42);
const BRANCH_WIDTH = 0.9;
const MAX_DECADES = 12;
const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'log', 'Impedance |Z|');

function targetAt(data: RailChartData, i: number): number {
  return typeof data.target === 'number' ? data.target : data.target[i];
}

export const railChart: ChartDefinition<RailChartData> = {
  name: 'rail',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      // Rail curves and branch curves have scales of their own (fixed domains, so nothing is merged).
      resolve: { scale: { color: 'independent', strokeDash: 'independent', strokeWidth: 'independent' } },
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        ...bandLayers(X),
        envelopeLayer('spread', X, Y),
        curveLayer('branches', X, Y, overlayEncoding(BRANCH_WIDTH), 'p'),
        curveLayer('curves', X, Y, seriesEncoding(SERIES)),
        {
          data: { name: 'peaks' },
          mark: { type: 'point', shape: 'circle', size: 48, filled: true, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true },
          encoding: { x: X, y: Y, color: { field: 'color', type: 'nominal', scale: null } },
        },
        placedLabelLayer('labels', X, Y, INK),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
        { ...keyLayers(overlayEncoding(BRANCH_WIDTH)).find((l) => (l.data as { name: string }).name === 'keyLines')!, data: { name: 'keyBranchLines' } },
      ],
    } as never;
  },
  bind(data) {
    const n = data.frequencies.length;
    const f = Float64Array.from(data.frequencies);
    const fa = frequencyAxis(f[0], f[n - 1], FRAME.width);
    const target = Float64Array.from({ length: n }, (_, i) => targetAt(data, i));
    // The rail and its target set the range (branches far above them are cut off at the top); half a
    // decade of headroom holds the peak labels.
    const envelope = data.envelope ? [data.envelope.minOhm, data.envelope.maxOhm] : [];
    const [lo, hi] = positiveExtent([data.totalOhm, target, data.peaks.map((p) => p.impedanceOhm), ...envelope], MAX_DECADES);
    const branchLow = positiveExtent(data.branches.map((b) => b.ohm), MAX_DECADES)[0];
    const yDomain = paddedLogDomain(Math.max(Math.min(lo, branchLow), hi / 10 ** MAX_DECADES), hi * 10 ** 0.5);
    const yMap = logAxis(yDomain, FRAME.height);
    const ya = axisBinding('y', yDomain, logTicks(yDomain, FRAME.height, 'Ω', Y_TICK_SPACING));

    const total = mergeCurve(f, (i) => data.totalOhm[i], data.peaks.map((p) => ({ f: p.frequencyHz, v: p.impedanceOhm })), true);
    const targetCurve = mergeCurve(f, (i) => target[i], [], true);
    const curves = [...curveRows(total, fa.map, yMap, 'total'), ...curveRows(targetCurve, fa.map, yMap, 'target')];
    const branches: Row[] = [];
    data.branches.forEach((b, k) => branches.push(...curveRows(mergeCurve(f, (i) => b.ohm[i], [], true), fa.map, yMap, 'branch', { ...overlayStyle(k), p: k })));

    const targetNear = (hz: number) => target[Math.min(n - 1, Math.max(0, lowerIndex(f, hz)))];
    const peaks = [...data.peaks].sort((a, b) => b.impedanceOhm - a.impedanceOhm);
    const requests: LabelRequest[] = peaks.map((p, k) => ({
      ...toPlot(fa.map, yMap, p.frequencyHz, p.impedanceOhm),
      text: `${formatEng(p.impedanceOhm, 'Ω')} at ${formatEng(p.frequencyHz, 'Hz')}`,
      fontSize: FONT_SIZE.note,
      required: k === 0,
      candidates: ABOVE_FIRST,
    }));
    const obstacles = [total, targetCurve].map((c) => ({
      xs: c.f.map((x) => fa.map.toPx(x)),
      ys: c.v.map((v) => (Number.isFinite(v) ? FRAME.height - yMap.toPx(v) : NaN)),
    }));
    const placements = placeLabels(requests, FRAME, obstacles);
    const labels: Row[] = [];
    peaks.forEach((p, k) => {
      const at = placements[k];
      if (at) labels.push({ f: p.frequencyHz, v: p.impedanceOhm, t: requests[k].text, dx: at.dx, dy: at.dy, al: at.align, bl: at.baseline });
    });

    const constantTarget = typeof data.target === 'number' ? ` ${formatEng(data.target, 'Ω')}` : '';
    const items: KeyItem[] = [
      { kind: 'line', style: { s: 'total' }, text: 'rail |Z|' },
      { kind: 'line', style: { s: 'target' }, text: `target${constantTarget}` },
      ...peakKey(peaks, targetNear),
      ...(data.band ? [{ kind: 'band' as const, text: `band ${formatEng(data.band.fromHz, 'Hz')} – ${formatEng(data.band.toHz, 'Hz')}` }] : []),
      ...(data.envelope ? [{ kind: 'spread' as const, text: `rail |Z| over ${data.envelope.corners.toLocaleString('en-GB')} corners` }] : []),
      ...data.branches.map((b, k) => ({ kind: 'line' as const, style: { ...overlayStyle(k), branch: true }, text: b.label })),
    ];
    const key = layoutKey(items, FRAME.width);
    // Branch symbols are drawn with the branch scales: move them to their own dataset.
    const keyLines = key.datasets.keyLines.filter((r) => r.branch !== true);
    const keyBranchLines = key.datasets.keyLines.filter((r) => r.branch === true);
    return {
      frame: frameForKey(FRAME, key),
      params: { ...fa.params, ...ya.params },
      datasets: {
        ...fa.datasets,
        ...ya.datasets,
        band: data.band ? [{ f: data.band.fromHz, f2: data.band.toHz }] : [],
        bandEdges: data.band ? [{ f: data.band.fromHz }, { f: data.band.toHz }] : [],
        branches,
        spread: data.envelope ? envelopeRows(f, data.envelope.minOhm, data.envelope.maxOhm) : [],
        curves,
        peaks: peaks.map((p) => ({ f: p.frequencyHz, v: p.impedanceOhm, color: peakColor(p, targetNear) })),
        labels,
        ...key.datasets,
        keyLines,
        keyBranchLines,
      },
    };
  },
};

type Peak = RailChartData['peaks'][number];

/** A peak above the target is drawn in the target's colour. */
function peakColor(p: Peak, targetNear: (hz: number) => number): string {
  return p.impedanceOhm > targetNear(p.frequencyHz) ? TARGET_LINE.color : INK;
}

function peakKey(peaks: readonly Peak[], targetNear: (hz: number) => number): KeyItem[] {
  const over = peaks.some((p) => peakColor(p, targetNear) !== INK);
  const under = peaks.some((p) => peakColor(p, targetNear) === INK);
  return [
    ...(under ? [{ kind: 'point' as const, color: INK, text: 'peak' }] : []),
    ...(over ? [{ kind: 'point' as const, color: TARGET_LINE.color, text: 'peak above target' }] : []),
  ];
}

/** Index of the last frequency ≤ hz. */
function lowerIndex(f: Float64Array, hz: number): number {
  let lo = 0;
  let hi = f.length - 1;
  while (hi > lo) {
    const mid = (lo + hi + 1) >> 1;
    if (f[mid] <= hz) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Render a rail chart. */
export function renderRailChart(data: RailChartData, text?: ChartText): Promise<ChartOutput> {
  return renderChart(railChart, data, text ?? describeRail(data));
}
