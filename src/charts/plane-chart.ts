// Chart: the path of Z = R + jX in the complex plane as frequency sweeps, R across, X up. Both axes use the
// signed-log scale s(v) = sign(v)·log10(1 + |v|/c) (scales.ts), with c the power of ten at or below the
// part's least |Z|: linear within about ±c, logarithmic beyond, so a path spanning many decades of
// reactance, through zero at each resonance, stays readable. Each decade of frequency is marked and
// labelled on the path, and arrowheads between the marks show the direction of increasing frequency:
// from capacitive (X < 0, below the zero line) to inductive (X > 0, above it) for a capacitor.

import { impedanceAt } from '../circuit/impedance.js';
import { AXIS_TITLE, KEY_TEXT, SIGN_NOTE, decadeMarkText } from '../present/chart-words.js';
import { levelObstacle, mergeCurve } from './curves.js';
import { halfFrame } from './frame.js';
import type { Placement } from './labels.js';
import { placeMarkLabels, shown, type MarkLabel } from './mark-labels.js';
import { FONT_SIZE, INK, INK_SOFT, PART_SERIES, RESONANCE_MARK, ZERO_LINE } from './palette.js';
import { resonanceLabels, resonancesByImportance, type PartChartInput } from './part-marks.js';
import { finiteExtent, partPlaneConstant, planeDomain } from './plane-scale.js';
import type { Row } from './render.js';
import { linearAxis, signedLog, signedLogTicks } from './scales.js';
import { simplifyPolyline } from './simplify.js';
import { curveLayer, pixelTextLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

const SERIES: SeriesScale = { keys: ['path'], styles: [PART_SERIES.path] };
const FRAME = halfFrame(170);
/** Decade marks closer than this (px) share a label. */
const SAME_SPOT_PX = 4;

export const planeChart = xyChart<PartChartInput>({
  name: 'plane',
  frame: FRAME,
  x: { name: 'r', field: 'x', scale: 'linear', title: AXIS_TITLE.planeResistance },
  y: { name: 'y', field: 'v', scale: 'linear', title: AXIS_TITLE.planeReactance },
  keyStyle: seriesEncoding(SERIES),
  zeroLine: { color: ZERO_LINE, width: 1 },
  marks: (X, Y) => [
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
  ],
  draw(input) {
    const { frequencies } = input;
    const { resistanceOhm: re, reactanceOhm: im } = input.columns;
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
    const marks: MarkLabel[] = [];
    for (let k = 0; k < decades.length; ) {
      const head = px(decades[k].r, decades[k].x);
      let last = k;
      while (last + 1 < decades.length) {
        const p = px(decades[last + 1].r, decades[last + 1].x);
        if (Math.hypot(p.x - head.x, p.y - head.y) > SAME_SPOT_PX) break;
        last++;
      }
      const { r, x } = decades[k];
      marks.push({ at: { x: s(r), v: s(x) }, ...px(r, x), text: decadeMarkText(decades[k].f, decades[last].f), candidates: DECADE_PLACES });
      k = last + 1;
    }

    const resonances = resonanceLabels(input, (r) => ({ at: { x: s(r.impedanceOhm), v: 0 }, ...px(r.impedanceOhm, 0) }));
    const zeroY = FRAME.height - yMap.toPx(0);
    const notes = [
      { x: FRAME.width, y: zeroY, text: SIGN_NOTE.planeInductive, candidates: NOTE_ABOVE },
      { x: FRAME.width, y: zeroY, text: SIGN_NOTE.planeCapacitive, candidates: NOTE_BELOW },
    ];
    const path = { xs: kept.map((i) => xs[i]), ys: kept.map((i) => ys[i]) };
    const placed = placeMarkLabels([...resonances, ...marks], FRAME, [path, levelObstacle(0, rMap, yMap)], notes);
    const ordered = resonancesByImportance(input);
    return {
      x: { domain: rDomain, ticks: signedLogTicks(rDomain, c, FRAME.width, 'Ω', 62) },
      y: { domain: yDomain, ticks: signedLogTicks(yDomain, c, FRAME.height, 'Ω', 20) },
      datasets: {
        curves,
        arrows,
        decades: decades.map((d) => ({ x: s(d.r), v: s(d.x) })),
        points: ordered.map((r) => ({ x: s(r.impedanceOhm), v: 0 })),
        decadeLabels: shown(placed.labels.slice(resonances.length)),
        labels: shown(placed.labels.slice(0, resonances.length)),
        notes: placed.notes,
      },
      key: [
        { kind: 'line', style: { s: 'path' }, text: KEY_TEXT.path },
        { kind: 'point', color: INK, text: KEY_TEXT.decade },
        ...(ordered.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: KEY_TEXT.resonance }] : []),
      ],
    };
  },
});

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

/**
 * Where the sign notes may go, anchored at the right end of the zero line: beside the line at its right or
 * left end or in the middle, then further from it, so that a path hugging the line at one end (an inductor's,
 * a bead's) still leaves them a place.
 */
function notePlaces(side: -1 | 1): Placement[] {
  const baseline = side < 0 ? 'bottom' : 'top';
  return [4, 18, 32].flatMap((d): Placement[] => [
    { dx: -6, dy: side * d, align: 'right', baseline },
    { dx: -FRAME.width + 6, dy: side * d, align: 'left', baseline },
    { dx: -FRAME.width / 2, dy: side * d, align: 'center', baseline },
  ]);
}

const NOTE_ABOVE = notePlaces(-1);
const NOTE_BELOW = notePlaces(1);
