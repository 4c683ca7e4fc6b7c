// Chart: a capacitor's complex plane drawn as its admittance Y = 1/Z = G + jB on linear axes, G across, B up.
//
// Why this plane. A capacitor's model is a series resonator, ESR + ESL + C (its leakage acts far below any
// sweep): Z = R + jX with R constant, so the path of Z is a vertical line, correct and empty. Its admittance
// traces the resonance circle: Y = 1/(R + jX) lies on the circle of diameter 1/R through the origin, since
// |Y − 1/(2R)| = 1/(2R) for every X (inversion maps the line Re Z = R onto that circle; any circuit-analysis
// text on series resonance). Far below the SRF Y ≈ jωC sits near the origin above the axis (B > 0,
// capacitive); it runs clockwise to the rightmost point at the SRF, G = 1/ESR, B = 0, and back to the origin
// below the axis (inductive) far above it. The top and bottom of the circle, where B = ±G, are where
// |X| = R: the half-power frequencies f1 and f2 (|Y|² half its peak), whose spacing gives the resonance's
// Q = f0/(f2 − f1). So one picture shows ESR (the diameter), the SRF (the turning point), how sharp the
// resonance is, and where each decade of frequency falls on it. A parallel resonator (an inductor's or a
// bead's self-resonance) is the dual: its Z traces the circle, so those parts keep the impedance plane.

import { admittanceAt as modelAdmittanceAt, halfPowerFrequencies as halfPower } from '../analysis/half-power.js';
import { AXIS_TITLE, KEY_TEXT, SIGN_NOTE, decadeMarkText, halfPowerLabel } from '../present/chart-words.js';
import { linearValueAxis } from './axes.js';
import { halfFrame } from './frame.js';
import type { Placement } from './labels.js';
import { placeMarkLabels, shown, type MarkLabel } from './mark-labels.js';
import { FONT_SIZE, INK, INK_SOFT, PART_SERIES, RESONANCE_MARK, ZERO_LINE } from './palette.js';
import { resonanceLabels, type PartChartInput } from './part-marks.js';
import type { Row } from './render.js';
import { simplifyPolyline } from './simplify.js';
import { curveLayer, pixelTextLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

const SERIES: SeriesScale = { keys: ['path'], styles: [PART_SERIES.path] };
const FRAME = halfFrame(170);
/** Decade marks closer than this (px) share a label. */
const SAME_SPOT_PX = 6;
/** The colour of the half-power points. */
const HALF_POWER_MARK = '#2f7f6b';

export const admittanceCircleChart = xyChart<PartChartInput>({
  name: 'admittance-circle',
  frame: FRAME,
  x: { name: 'g', field: 'x', scale: 'linear', title: AXIS_TITLE.circleConductance },
  y: { name: 'b', field: 'v', scale: 'linear', title: AXIS_TITLE.circleSusceptance },
  keyStyle: seriesEncoding(SERIES),
  zeroLine: { color: ZERO_LINE, width: 1 },
  marks: (X, Y) => [
    curveLayer('curves', X, Y, seriesEncoding(SERIES)),
    pointLayer('decades', X, Y, INK),
    pointLayer('halfPower', X, Y, HALF_POWER_MARK, 'diamond'),
    pointLayer('points', X, Y),
    placedLabelLayer('decadeLabels', X, Y, INK),
    placedLabelLayer('halfPowerLabels', X, Y, HALF_POWER_MARK),
    placedLabelLayer('labels', X, Y),
    pixelTextLayer('notes', INK_SOFT, FONT_SIZE.note, { fontStyle: 'italic' }),
  ],
  draw(input) {
    const source = { frequencies: input.frequencies, z: input.z, network: input.part.network };
    const admittanceAt = (_: PartChartInput, f: number) => modelAdmittanceAt(source, f);
    const { conductanceS: g, susceptanceS: b } = input.columns;
    const n = g.length;
    let gMax = 0;
    let bMax = 0;
    for (let i = 0; i < n; i++) {
      if (Number.isFinite(g[i])) gMax = Math.max(gMax, g[i]);
      if (Number.isFinite(b[i])) bMax = Math.max(bMax, Math.abs(b[i]));
    }
    const srf = input.selfResonance;
    if (srf) gMax = Math.max(gMax, 1 / srf.impedanceOhm);
    // From G = 0 (a hair above it, so the axis does not start a step below zero): the circle touches the origin.
    const x = linearValueAxis(gMax * 1e-3, gMax * 1.04, FRAME.width, 'S', 3);
    // Room above and below the circle for the half-power labels.
    const y = linearValueAxis(-bMax * 1.3, bMax * 1.3, FRAME.height, 'S', 4);
    const px = (gv: number, bv: number) => ({ x: x.map.toPx(gv), y: FRAME.height - y.map.toPx(bv) });

    // A sharp resonance goes round most of the circle within a few sweep points (a Q of 30 between two points
    // 2.3% apart): there the path takes extra points from the model, so the circle is drawn round, not a polygon.
    const { g: pathG, b: pathB } = withPointsNearResonance(input, g, b, admittanceAt, input.selfResonance?.frequencyHz);
    const xs = Array.from(pathG, (v) => x.map.toPx(v));
    const ys = Array.from(pathB, (v) => FRAME.height - y.map.toPx(v));
    const kept = simplifyPolyline(xs, ys);
    const curves: Row[] = kept.map((i, k) => ({ x: pathG[i], v: pathB[i], s: 'path', i: k }));

    const f = input.frequencies;
    const decades: { f: number; g: number; b: number }[] = [];
    for (let d = Math.ceil(Math.log10(f[0]) - 1e-9); 10 ** d <= f[f.length - 1] * (1 + 1e-12); d++) {
      const fd = Number(`1e${d}`);
      const [gd, bd] = admittanceAt(input, fd);
      decades.push({ f: fd, g: gd, b: bd });
    }
    // Far from the SRF the decades crowd at the origin: those on one spot share a label ("100 Hz – 100 kHz").
    const marks: MarkLabel[] = [];
    for (let k = 0; k < decades.length; ) {
      const head = px(decades[k].g, decades[k].b);
      let last = k;
      while (last + 1 < decades.length) {
        const p = px(decades[last + 1].g, decades[last + 1].b);
        if (Math.hypot(p.x - head.x, p.y - head.y) > SAME_SPOT_PX) break;
        last++;
      }
      marks.push({ at: { x: decades[k].g, v: decades[k].b }, ...head, text: decadeMarkText(decades[k].f, decades[last].f), candidates: AROUND_MARK });
      k = last + 1;
    }

    const half = srf ? halfPower(source, srf.frequencyHz) : null;
    const halfPoints = (half ?? []).map((fh) => {
      const [gh, bh] = admittanceAt(input, fh);
      return { f: fh, g: gh, b: bh };
    });
    // A decade that falls on a half-power point (within a spot) and would be labelled the same ("1 GHz")
    // keeps its dot; the half-power label names it, rather than a second "1 GHz" set apart from the first.
    const decadeLabels = marks.filter((m) => !halfPoints.some((h) => halfPowerLabel(h.f) === m.text && Math.hypot(px(h.g, h.b).x - m.x, px(h.g, h.b).y - m.y) <= SAME_SPOT_PX));
    const halfLabels: MarkLabel[] = halfPoints.map((h) => ({ at: { x: h.g, v: h.b }, ...px(h.g, h.b), text: halfPowerLabel(h.f), required: true, candidates: h.b > 0 ? ABOVE_MARK : BELOW_MARK }));
    const resonances = srf
      ? resonanceLabels({ resonances: [srf], selfResonance: srf }, (r) => ({ at: { x: 1 / r.impedanceOhm, v: 0 }, ...px(1 / r.impedanceOhm, 0) }), () => RESONANCE_PLACES)
      : [];
    const zeroY = FRAME.height - y.map.toPx(0);
    const notes = [
      { x: 0, y: zeroY, text: SIGN_NOTE.circleCapacitive, candidates: notePlaces(-1, zeroY) },
      { x: 0, y: zeroY, text: SIGN_NOTE.circleInductive, candidates: notePlaces(1, zeroY) },
    ];
    const path = { xs: kept.map((i) => xs[i]), ys: kept.map((i) => ys[i]) };
    const zeroLine = { xs: [0, FRAME.width], ys: [zeroY, zeroY] };
    const placed = placeMarkLabels([...resonances, ...halfLabels, ...decadeLabels], FRAME, [path, zeroLine], notes);
    const nR = resonances.length;
    const nH = halfLabels.length;
    // Both halves named on the plot, or, where the circle and its labels leave no room for one, both in the key.
    const onPlot = placed.notes.length === notes.length;
    return {
      x,
      y,
      datasets: {
        curves,
        decades: decades.map((d) => ({ x: d.g, v: d.b })),
        halfPower: halfPoints.map((h) => ({ x: h.g, v: h.b })),
        points: srf ? [{ x: 1 / srf.impedanceOhm, v: 0 }] : [],
        labels: shown(placed.labels.slice(0, nR)),
        halfPowerLabels: shown(placed.labels.slice(nR, nR + nH)),
        decadeLabels: shown(placed.labels.slice(nR + nH)),
        notes: onPlot ? placed.notes : [],
      },
      key: [
        { kind: 'line', style: { s: 'path' }, text: onPlot ? KEY_TEXT.admittancePath : `${KEY_TEXT.admittancePath}; ${KEY_TEXT.circleHalves}` },
        { kind: 'point', color: INK, text: KEY_TEXT.decade },
        ...(srf ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: KEY_TEXT.resonanceAdmittance }] : []),
        ...(halfPoints.length ? [{ kind: 'point' as const, color: HALF_POWER_MARK, shape: 'diamond', text: KEY_TEXT.halfPower }] : []),
      ],
    };
  },
});

/** Points added within a factor of this of the SRF, and how many a decade. */
const NEAR_RESONANCE = 1.25;
const NEAR_PER_DECADE = 4000;

/** The sweep's admittance with the model's at NEAR_PER_DECADE points a decade within NEAR_RESONANCE of `f0`, in frequency order. */
function withPointsNearResonance(input: PartChartInput, g: ArrayLike<number>, b: ArrayLike<number>, admittanceAt: (input: PartChartInput, f: number) => [number, number], f0: number | undefined): { g: number[]; b: number[] } {
  const f = input.frequencies;
  if (f0 === undefined) return { g: Array.from(g), b: Array.from(b) };
  const [from, to] = [f0 / NEAR_RESONANCE, f0 * NEAR_RESONANCE];
  const n = Math.ceil(Math.log10(to / from) * NEAR_PER_DECADE);
  const extra = Array.from({ length: n + 1 }, (_, k) => from * (to / from) ** (k / n));
  const out = { g: [] as number[], b: [] as number[] };
  let k = 0;
  for (let i = 0; i <= f.length; i++) {
    while (k < extra.length && (i === f.length || extra[k] < f[i])) {
      const [ge, be] = admittanceAt(input, extra[k++]);
      out.g.push(ge);
      out.b.push(be);
    }
    if (i < f.length) {
      out.g.push(g[i]);
      out.b.push(b[i]);
    }
  }
  return out;
}

const AROUND_MARK: Placement[] = [
  { dx: -7, dy: 0, align: 'right', baseline: 'middle' },
  { dx: 7, dy: 0, align: 'left', baseline: 'middle' },
  { dx: -6, dy: -5, align: 'right', baseline: 'bottom' },
  { dx: -6, dy: 5, align: 'right', baseline: 'top' },
  { dx: 6, dy: -5, align: 'left', baseline: 'bottom' },
  { dx: 6, dy: 5, align: 'left', baseline: 'top' },
  // Further out, where marks crowd near the origin.
  { dx: 14, dy: -12, align: 'left', baseline: 'bottom' },
  { dx: 14, dy: 12, align: 'left', baseline: 'top' },
  { dx: 18, dy: 0, align: 'left', baseline: 'middle' },
];
const ABOVE_MARK: Placement[] = [
  { dx: 0, dy: -7, align: 'center', baseline: 'bottom' },
  { dx: 7, dy: -5, align: 'left', baseline: 'bottom' },
  { dx: -7, dy: -5, align: 'right', baseline: 'bottom' },
  { dx: 8, dy: 0, align: 'left', baseline: 'middle' },
];
const BELOW_MARK: Placement[] = [
  { dx: 0, dy: 7, align: 'center', baseline: 'top' },
  { dx: 7, dy: 5, align: 'left', baseline: 'top' },
  { dx: -7, dy: 5, align: 'right', baseline: 'top' },
  { dx: 8, dy: 0, align: 'left', baseline: 'middle' },
];
/** The SRF is the circle's rightmost point: its label goes inside the circle, left of it. */
const RESONANCE_PLACES: Placement[] = [
  { dx: -7, dy: -5, align: 'right', baseline: 'bottom' },
  { dx: -7, dy: 5, align: 'right', baseline: 'top' },
  { dx: -8, dy: 0, align: 'right', baseline: 'middle' },
  { dx: -40, dy: -5, align: 'right', baseline: 'bottom' },
];
/**
 * Where a sign note may go, from the zero line at `zeroY`: beside it, then in the plot's corners on its side,
 * which the circle leaves empty (it touches the plot's left edge only at the zero line and its top and bottom
 * are its middle).
 */
function notePlaces(side: -1 | 1, zeroY: number): Placement[] {
  const baseline = side < 0 ? 'bottom' : 'top';
  const corner = side < 0 ? -zeroY + 3 : FRAME.height - zeroY - 3;
  const cornerBaseline = side < 0 ? 'top' : 'bottom';
  return [
    ...[4, 18, 32].flatMap((d): Placement[] => [
      { dx: FRAME.width / 2, dy: side * d, align: 'center', baseline },
      { dx: 6, dy: side * d, align: 'left', baseline },
      { dx: FRAME.width - 6, dy: side * d, align: 'right', baseline },
    ]),
    { dx: 6, dy: corner, align: 'left', baseline: cornerBaseline },
    { dx: FRAME.width - 6, dy: corner, align: 'right', baseline: cornerBaseline },
  ];
}
