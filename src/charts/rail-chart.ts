// Chart: a power rail's impedance |Z| against its target on log-log axes, the impedance of each branch
// (a group of placed capacitors, the regulator, the plane) as thin curves, the rail's anti-resonance peaks
// marked and labelled (in the target's colour where they exceed it), and the rail's frequency band shaded.
// Input is plain data, so the rail engine and the charts only share this interface.

import type { ChartText } from '../present/chart-descriptions.js';
import { AXIS_TITLE, KEY_TEXT, bandKeyText, pointText, railSpreadKeyText, targetKeyText } from '../present/chart-words.js';
import { describeRail } from '../present/plan-chart-descriptions.js';
import { MAX_DECADES, frequencyAxis, logValueAxis } from './axes.js';
import { curveObstacle, curveRows, envelopeRows, mergeCurve, toPlot } from './curves.js';
import { frame, PLOT_WIDTH } from './frame.js';
import type { KeyItem } from './key.js';
import { ABOVE_FIRST } from './labels.js';
import { placeMarkLabels, shown } from './mark-labels.js';
import { overlayEncoding, overlayStyle } from './overlay.js';
import { INK, RAIL_TOTAL, TARGET_LINE } from './palette.js';
import { bandWithin, rangeBand } from './part-marks.js';
import { renderChart, type ChartOutput, type Row } from './render.js';
import { positiveExtent } from './scales.js';
import { colouredPointLayer, curveLayer, envelopeLayer, keyLayers, placedLabelLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

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

function targetAt(data: RailChartData, i: number): number {
  return typeof data.target === 'number' ? data.target : data.target[i];
}

export const railChart = xyChart<RailChartData>({
  name: 'rail',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.impedance },
  keyStyle: seriesEncoding(SERIES),
  // Rail curves and branch curves have scales of their own (fixed domains, so nothing is merged).
  resolve: { scale: { color: 'independent', strokeDash: 'independent', strokeWidth: 'independent' } },
  band: true,
  marks: (X, Y) => [
    envelopeLayer('spread', X, Y),
    curveLayer('branches', X, Y, overlayEncoding(BRANCH_WIDTH), 'p'),
    curveLayer('curves', X, Y, seriesEncoding(SERIES)),
    colouredPointLayer('peaks', X, Y, 48),
    placedLabelLayer('labels', X, Y, INK),
  ],
  keyExtra: () => [{ ...keyLayers(overlayEncoding(BRANCH_WIDTH)).find((l) => (l.data as { name: string }).name === 'keyLines')!, data: { name: 'keyBranchLines' } }],
  draw(data) {
    const n = data.frequencies.length;
    const f = Float64Array.from(data.frequencies);
    const x = frequencyAxis(f[0], f[n - 1], FRAME.width);
    const target = Float64Array.from({ length: n }, (_, i) => targetAt(data, i));
    // The rail and its target set the range (branches far above them are cut off at the top); half a
    // decade of headroom holds the peak labels.
    const envelope = data.envelope ? [data.envelope.minOhm, data.envelope.maxOhm] : [];
    const [lo, hi] = positiveExtent([data.totalOhm, target, data.peaks.map((p) => p.impedanceOhm), ...envelope], MAX_DECADES);
    const branchLow = positiveExtent(data.branches.map((b) => b.ohm), MAX_DECADES)[0];
    const y = logValueAxis(Math.max(Math.min(lo, branchLow), hi / 10 ** MAX_DECADES), hi * 10 ** 0.5, FRAME.height, 'Ω');

    const total = mergeCurve(f, (i) => data.totalOhm[i], data.peaks.map((p) => ({ f: p.frequencyHz, v: p.impedanceOhm })), true);
    const targetCurve = mergeCurve(f, (i) => target[i], [], true);
    const branches: Row[] = [];
    data.branches.forEach((b, k) => branches.push(...curveRows(mergeCurve(f, (i) => b.ohm[i], [], true), x.map, y.map, 'branch', { ...overlayStyle(k), p: k })));

    const targetNear = (hz: number) => target[Math.min(n - 1, Math.max(0, lowerIndex(f, hz)))];
    const peaks = [...data.peaks].sort((a, b) => b.impedanceOhm - a.impedanceOhm);
    const requests = peaks.map((p, k) => ({
      at: { f: p.frequencyHz, v: p.impedanceOhm },
      ...toPlot(x.map, y.map, p.frequencyHz, p.impedanceOhm),
      text: pointText(p.impedanceOhm, p.frequencyHz),
      required: k === 0,
      candidates: ABOVE_FIRST,
    }));
    // Labels keep clear of the rail, its target and every branch curve.
    const branchCurves = data.branches.map((b) => mergeCurve(f, (i) => b.ohm[i], [], true));
    const placed = placeMarkLabels(requests, FRAME, [total, targetCurve, ...branchCurves].map((c) => curveObstacle(c, x.map, y.map)));
    // A rail is drawn over exactly its band: shading it would tint the whole plot.
    const band = bandWithin(data.band, f[0], f[n - 1]);
    const key: KeyItem[] = [
      { kind: 'line', style: { s: 'total' }, text: KEY_TEXT.railMagnitude },
      { kind: 'line', style: { s: 'target' }, text: targetKeyText(typeof data.target === 'number' ? data.target : undefined) },
      ...peakKey(peaks, targetNear),
      ...(band ? [{ kind: 'band' as const, text: bandKeyText(band) }] : []),
      ...(data.envelope ? [{ kind: 'spread' as const, text: railSpreadKeyText(data.envelope.corners) }] : []),
      ...data.branches.map((b, k) => ({ kind: 'line' as const, style: { ...overlayStyle(k), branch: true }, text: b.label })),
    ];
    return {
      x,
      y,
      band: rangeBand(band),
      datasets: {
        branches,
        spread: data.envelope ? envelopeRows(f, data.envelope.minOhm, data.envelope.maxOhm, x.map, y.map) : [],
        curves: [...curveRows(total, x.map, y.map, 'total'), ...curveRows(targetCurve, x.map, y.map, 'target')],
        peaks: peaks.map((p) => ({ f: p.frequencyHz, v: p.impedanceOhm, color: peakColor(p, targetNear) })),
        labels: shown(placed.labels),
      },
      key,
      // Branch symbols are drawn with the branch scales: they go to a dataset of their own.
      keyDatasets: (k) => ({ keyLines: k.keyLines.filter((r) => r.branch !== true), keyBranchLines: k.keyLines.filter((r) => r.branch === true) }),
    };
  },
});

type Peak = RailChartData['peaks'][number];

/** A peak above the target is drawn in the target's colour. */
function peakColor(p: Peak, targetNear: (hz: number) => number): string {
  return p.impedanceOhm > targetNear(p.frequencyHz) ? TARGET_LINE.color : INK;
}

function peakKey(peaks: readonly Peak[], targetNear: (hz: number) => number): KeyItem[] {
  const over = peaks.some((p) => peakColor(p, targetNear) !== INK);
  const under = peaks.some((p) => peakColor(p, targetNear) === INK);
  return [
    ...(under ? [{ kind: 'point' as const, color: INK, text: KEY_TEXT.peak }] : []),
    ...(over ? [{ kind: 'point' as const, color: TARGET_LINE.color, text: KEY_TEXT.peakOverTarget }] : []),
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
