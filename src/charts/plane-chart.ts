// Chart: the path of Z = R + jX in the complex plane as frequency sweeps, R across, X up. Both axes use the
// signed-log scale s(v) = sign(v)·log10(1 + |v|/c) (scales.ts), with c the power of ten at or below the
// part's least |Z|: linear within about ±c, logarithmic beyond, so a path spanning many decades of
// reactance, through zero at each resonance, stays readable. Each decade of frequency is marked and
// labelled on the path, and arrowheads between the marks show the direction of increasing frequency:
// from capacitive (X < 0, below the zero line) to inductive (X > 0, above it) for a capacitor.

import { isSelfResonance } from '../analysis/resonance.js';
import { resonanceLabel } from '../present/resonance-words.js';
import { impedanceAt } from '../circuit/impedance.js';
import { formatEng } from '../units/format.js';
import { frameForKey, layoutKey } from './key.js';
import { placeLabels, type LabelRequest, type Placement } from './labels.js';
import { FONT_SIZE, INK, INK_SOFT, PART_SERIES, PLOT_WIDTH, RESONANCE_MARK, ZERO_LINE, frame } from './palette.js';
import { mergeCurve, resonancesByImportance, type PartChartInput } from './part-data.js';
import type { ChartDefinition, Row } from './render.js';
import { decadeOf, linearAxis, signedLog, signedLogTicks } from './scales.js';
import { simplifyPolyline } from './simplify.js';
import {
  axisBinding,
  axisParams,
  curveLayer,
  frameLayer,
  gridLayers,
  keyLayers,
  seriesEncoding,
  pixelTextLayer,
  placedLabelLayer,
  pointLayer,
  position,
  referenceLineLayer,
  type SeriesScale,
} from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';

const SERIES: SeriesScale = { keys: ['path'], styles: [PART_SERIES.path] };
const FRAME = frame(PLOT_WIDTH, 300, 28, 42);
const X = position('x', 'r', 'linear', 'Resistance R (signed-log scale)');
const Y = position('v', 'y', 'linear', 'Reactance X (signed-log)');
/** Decade marks closer than this (px) share a label. */
const SAME_SPOT_PX = 4;
/** The linear zone never reaches below this fraction of the largest |Z| (a lossless part has min |Z| = 0). */
const MIN_LINEAR_ZONE = 1e-9;

/** The signed-log constant for a part: the power of ten at or below its least |Z|. */
export function planeConstant(magnitudes: ArrayLike<number>): number {
  let lo = Infinity;
  let hi = 0;
  for (let i = 0; i < magnitudes.length; i++) {
    const m = magnitudes[i];
    if (m > 0 && m < lo) lo = m;
    if (m > hi) hi = m;
  }
  if (!(hi > 0)) return 1;
  return 10 ** decadeOf(Math.max(lo, hi * MIN_LINEAR_ZONE));
}

/** The transformed domain covering `lo..hi` out to the next ±c·10^k, and never less than [0, s(10c)]. */
function planeDomain(lo: number, hi: number, c: number): [number, number] {
  const edge = (v: number) => (v === 0 ? 0 : Math.sign(v) * signedLog(c * 10 ** Math.max(1, Math.ceil(Math.log10(Math.abs(v) / c) - 1e-9)), c));
  const margin = 0.12;
  return [Math.min(0, edge(lo)) - margin, Math.max(edge(10 * c), edge(hi)) + margin];
}

/** The signed-log constant of a part's path: planeConstant of its |Z| over the sweep. */
export function partPlaneConstant(input: Pick<PartChartInput, 'frequencies' | 'z'>): number {
  const { re, im } = input.z;
  return planeConstant(Float64Array.from(input.frequencies, (_, i) => Math.hypot(re[i], im[i])));
}

export const planeChart: ChartDefinition<PartChartInput> = {
  name: 'plane',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('r'), ...axisParams('y')],
      layer: [
        ...gridLayers('r', 'x', X),
        ...gridLayers('y', 'y', Y),
        referenceLineLayer('zero', Y, { color: ZERO_LINE, width: 1 }),
        curveLayer('curves', X, Y, seriesEncoding(SERIES)),
        {
          data: { name: 'arrows' },
          mark: { type: 'point', shape: 'triangle-up', size: 58, filled: true, color: PART_SERIES.path.color, opacity: 1, clip: true },
          encoding: { x: X, y: Y, angle: { field: 'a', type: 'quantitative', scale: null } },
        },
        pointLayer('decades', X, Y, INK),
        pointLayer('points', X, Y),
        placedLabelLayer('decadeLabels', X, Y, INK),
        placedLabelLayer('labels', X, Y),
        pixelTextLayer('notes', INK_SOFT, FONT_SIZE.note, { fontStyle: 'italic' }),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(input) {
    const { frequencies } = input;
    const { re, im } = input.z;
    const c = partPlaneConstant(input);
    const s = (v: number) => signedLog(v, c);

    const rCurve = mergeCurve(frequencies, (i) => re[i], input.resonances.map((r) => ({ f: r.frequencyHz, v: r.impedanceOhm })), false);
    const xCurve = mergeCurve(frequencies, (i) => im[i], input.resonances.map((r) => ({ f: r.frequencyHz, v: 0 })), false);
    const sr = rCurve.v.map(s);
    const sx = xCurve.v.map(s);
    const rDomain = planeDomain(...finiteExtent(rCurve.v), c);
    const yDomain = planeDomain(...finiteExtent(xCurve.v), c);
    const rMap = linearAxis(rDomain, FRAME.width);
    const yMap = linearAxis(yDomain, FRAME.height);
    const px = (r: number, x: number) => ({ x: rMap.toPx(s(r)), y: FRAME.height - yMap.toPx(s(x)) });
    const ra = axisBinding('r', rDomain, signedLogTicks(rDomain, c, FRAME.width, 'Ω', 62));
    const ya = axisBinding('y', yDomain, signedLogTicks(yDomain, c, FRAME.height, 'Ω', 20));

    const xs = sr.map((v) => rMap.toPx(v));
    const ys = sx.map((v) => FRAME.height - yMap.toPx(v));
    const kept = simplifyPolyline(xs, ys, undefined, (i) => rCurve.keep[i]);
    const curves: Row[] = kept.map((i, k) => ({ x: sr[i], v: sx[i], s: 'path', i: k }));

    // Decade marks, at exactly computed impedances where the model is at hand.
    const zAt = (f: number): [number, number] => (input.part.network ? impedanceAt(input.part.network, f) : interpolated(frequencies, re, im, f));
    const decades: { f: number; r: number; x: number }[] = [];
    for (let d = Math.ceil(Math.log10(frequencies[0]) - 1e-9); 10 ** d <= frequencies[frequencies.length - 1] * (1 + 1e-12); d++) {
      const f = Number(`1e${d}`);
      const [r, x] = zAt(f);
      decades.push({ f, r, x });
    }
    // Arrowheads halfway (in log f) between decade marks, pointing along the path on screen.
    const arrows: Row[] = [];
    for (let k = 1; k < decades.length; k++) {
      const f = Math.sqrt(decades[k - 1].f * decades[k].f);
      const [r0, x0] = zAt(f / 1.1);
      const [r1, x1] = zAt(f * 1.1);
      const a = px(r0, x0);
      const b = px(r1, x1);
      if (Math.hypot(b.x - a.x, b.y - a.y) < 0.5) continue; // the path barely moves here: no direction to show
      const [r, x] = zAt(f);
      arrows.push({ x: s(r), v: s(x), a: (Math.atan2(b.x - a.x, -(b.y - a.y)) * 180) / Math.PI });
    }

    // Decades that land on (nearly) the same spot, as a resistor's do over most of its sweep, share one
    // label: "1 kHz – 10 MHz".
    const marks: { r: number; x: number; text: string }[] = [];
    for (let k = 0; k < decades.length; ) {
      const head = px(decades[k].r, decades[k].x);
      let last = k;
      while (last + 1 < decades.length) {
        const p = px(decades[last + 1].r, decades[last + 1].x);
        if (Math.hypot(p.x - head.x, p.y - head.y) > SAME_SPOT_PX) break;
        last++;
      }
      const text = last === k ? formatEng(decades[k].f, 'Hz') : `${formatEng(decades[k].f, 'Hz')} – ${formatEng(decades[last].f, 'Hz')}`;
      marks.push({ r: decades[k].r, x: decades[k].x, text });
      k = last + 1;
    }

    const ordered = resonancesByImportance(input);
    const requests: LabelRequest[] = [
      ...ordered.map((r) => ({ ...px(r.impedanceOhm, 0), text: resonanceLabel(r, input.selfResonance), fontSize: FONT_SIZE.note, required: isSelfResonance(r, input.selfResonance) })),
      ...marks.map((m) => ({ ...px(m.r, m.x), text: m.text, fontSize: FONT_SIZE.note, candidates: DECADE_PLACES })),
    ];
    const obstacle = { xs: kept.map((i) => xs[i]), ys: kept.map((i) => ys[i]) };
    const zeroY = FRAME.height - yMap.toPx(0);
    const noteRequests: LabelRequest[] = [
      { x: FRAME.width, y: zeroY, text: 'inductive (X > 0) ↑', fontSize: FONT_SIZE.note, candidates: NOTE_ABOVE },
      { x: FRAME.width, y: zeroY, text: 'capacitive (X < 0) ↓', fontSize: FONT_SIZE.note, candidates: NOTE_BELOW },
    ];
    const zeroLine = { xs: [0, FRAME.width], ys: [zeroY, zeroY] };
    const placements = placeLabels([...requests, ...noteRequests], FRAME, [obstacle, zeroLine]);
    const labels: Row[] = [];
    const decadeLabels: Row[] = [];
    requests.forEach((q, k) => {
      const p = placements[k];
      if (!p) return;
      const isResonance = k < ordered.length;
      const at = isResonance ? { x: s(ordered[k].impedanceOhm), v: 0 } : { x: s(marks[k - ordered.length].r), v: s(marks[k - ordered.length].x) };
      (isResonance ? labels : decadeLabels).push({ ...at, t: q.text, dx: p.dx, dy: p.dy, al: p.align, bl: p.baseline });
    });
    const notes: Row[] = [];
    noteRequests.forEach((n, k) => {
      const p = placements[requests.length + k];
      if (p) notes.push({ x: n.x + p.dx, y: n.y + p.dy, t: n.text, al: p.align, bl: p.baseline });
    });

    const key = layoutKey(
      [
        { kind: 'line', style: { s: 'path' }, text: 'Z = R + jX (arrows: rising f)' },
        { kind: 'point', color: INK, text: 'decade of frequency' },
        ...(ordered.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: 'resonance (X = 0)' }] : []),
      ],
      FRAME.width,
    );
    return {
      frame: frameForKey(FRAME, key),
      params: { ...ra.params, ...ya.params },
      datasets: {
        ...ra.datasets,
        ...ya.datasets,
        zero: [{ v: 0 }],
        curves,
        arrows,
        decades: decades.map((d) => ({ x: s(d.r), v: s(d.x) })),
        points: ordered.map((r) => ({ x: s(r.impedanceOhm), v: 0 })),
        decadeLabels,
        labels,
        notes,
        ...key.datasets,
      },
    };
  },
};

/** [min(0, …), max(0, …)] of the finite values. */
function finiteExtent(values: readonly number[]): [number, number] {
  let lo = 0;
  let hi = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}

/** Z at `f` by linear interpolation in log f between sweep points (when no model is given). */
function interpolated(frequencies: Float64Array, re: Float64Array, im: Float64Array, f: number): [number, number] {
  const n = frequencies.length;
  if (f <= frequencies[0]) return [re[0], im[0]];
  if (f >= frequencies[n - 1]) return [re[n - 1], im[n - 1]];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (frequencies[mid] <= f) lo = mid;
    else hi = mid;
  }
  const t = Math.log(f / frequencies[lo]) / Math.log(frequencies[hi] / frequencies[lo]);
  return [re[lo] + t * (re[hi] - re[lo]), im[lo] + t * (im[hi] - im[lo])];
}

const DECADE_PLACES: Placement[] = [
  { dx: 7, dy: 0, align: 'left', baseline: 'middle' },
  { dx: -7, dy: 0, align: 'right', baseline: 'middle' },
  { dx: 6, dy: -5, align: 'left', baseline: 'bottom' },
  { dx: -6, dy: -5, align: 'right', baseline: 'bottom' },
  { dx: 6, dy: 5, align: 'left', baseline: 'top' },
  { dx: -6, dy: 5, align: 'right', baseline: 'top' },
];

const NOTE_ABOVE: Placement[] = [
  { dx: -6, dy: -4, align: 'right', baseline: 'bottom' },
  { dx: -PLOT_WIDTH + 6, dy: -4, align: 'left', baseline: 'bottom' },
];

const NOTE_BELOW: Placement[] = [
  { dx: -6, dy: 4, align: 'right', baseline: 'top' },
  { dx: -PLOT_WIDTH + 6, dy: 4, align: 'left', baseline: 'top' },
];
