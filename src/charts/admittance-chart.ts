// Chart: admittance Y = 1/Z = G + jB against frequency on log-log axes. B changes sign at every resonance, so
// it is drawn as |B| with its sign shown by line style: solid where B > 0 (capacitive), dashed where B < 0
// (inductive); the line breaks where B passes through zero. G = R/(R² + X²) and B = −X/(R² + X²) (any
// circuit text, e.g. Alexander & Sadiku, ch. 9).

import { AXIS_TITLE, KEY_TEXT } from '../present/chart-words.js';
import { MAX_DECADES, logValueAxis, sweepAxis } from './axes.js';
import { curveObstacle, curveRows, mergeCurve, toPlot, type Curve } from './curves.js';
import { halfFrame } from './frame.js';
import { ABOVE_FIRST, BELOW_FIRST } from './labels.js';
import { placeMarkLabels, shown } from './mark-labels.js';
import { PART_SERIES } from './palette.js';
import { bandData, bandEdgeObstacles, resonanceLabels, resonancesByImportance, type PartChartInput } from './part-marks.js';
import type { Row } from './render.js';
import { positiveExtent } from './scales.js';
import { curveLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

const SERIES: SeriesScale = {
  keys: ['g', 'bc', 'bl'],
  styles: [PART_SERIES.conductance, PART_SERIES.susceptanceCapacitive, PART_SERIES.susceptanceInductive],
};
const FRAME = halfFrame(160);
const LABEL_ROOM = 10 ** 0.5;

/** Split a curve into runs of one sign; zeros and gaps end a run. Values become magnitudes. */
export function signRuns(curve: Curve): { sign: 1 | -1; curve: Curve }[] {
  const runs: { sign: 1 | -1; curve: Curve }[] = [];
  let current: { sign: 1 | -1; curve: Curve } | null = null;
  curve.v.forEach((v, i) => {
    const sign = v > 0 ? 1 : v < 0 ? -1 : 0;
    if (sign === 0 || Number.isNaN(v)) {
      current = null;
      return;
    }
    if (!current || current.sign !== sign) {
      current = { sign, curve: { f: [], v: [], keep: [] } };
      runs.push(current);
      // The run starts at a sign change: keep its first point so the break stays where it is.
      current.curve.keep.push(true);
    } else {
      current.curve.keep.push(curve.keep[i]);
    }
    current.curve.f.push(curve.f[i]);
    current.curve.v.push(Math.abs(v));
  });
  for (const r of runs) r.curve.keep[r.curve.keep.length - 1] = true;
  return runs;
}

export const admittanceChart = xyChart<PartChartInput>({
  name: 'admittance',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.admittance },
  keyStyle: seriesEncoding(SERIES),
  band: true,
  marks: (X, Y) => [curveLayer('curves', X, Y, seriesEncoding(SERIES), 'g'), pointLayer('points', X, Y), placedLabelLayer('labels', X, Y)],
  draw(input) {
    const x = sweepAxis(input.frequencies, FRAME.width);
    const { conductanceS, susceptanceS } = input.columns;
    const g = (i: number) => conductanceS[i];
    const b = (i: number) => susceptanceS[i];
    // At a resonance X = 0: G = 1/R exactly and B = 0 (the |B| line breaks there).
    const gCurve = mergeCurve(input.frequencies, g, input.resonances.map((r) => ({ f: r.frequencyHz, v: 1 / r.impedanceOhm })), true);
    const bCurve = mergeCurve(input.frequencies, b, input.resonances.map((r) => ({ f: r.frequencyHz, v: 0 })), false);
    const runs = signRuns(bCurve);

    let [lo, hi] = positiveExtent([gCurve.v, ...runs.map((r) => r.curve.v)], MAX_DECADES);
    // Room for resonance labels: G = 1/R peaks at a series resonance (label above), dips at a parallel one.
    if (input.resonances.some((r) => r.type === 'series')) hi *= LABEL_ROOM;
    if (input.resonances.some((r) => r.type === 'parallel')) lo /= LABEL_ROOM;
    const y = logValueAxis(lo, hi, FRAME.height, 'S');

    const curves: Row[] = [...curveRows(gCurve, x.map, y.map, 'g', { g: 0 })];
    runs.forEach((r, k) => curves.push(...curveRows(r.curve, x.map, y.map, r.sign > 0 ? 'bc' : 'bl', { g: k + 1 })));
    const requests = resonanceLabels(
      input,
      (r) => ({ at: { f: r.frequencyHz, v: 1 / r.impedanceOhm }, ...toPlot(x.map, y.map, r.frequencyHz, 1 / r.impedanceOhm) }),
      (r) => (r.type === 'series' ? ABOVE_FIRST : BELOW_FIRST),
    );
    const band = bandData(input);
    const placed = placeMarkLabels(requests, FRAME, [gCurve, ...runs.map((r) => r.curve)].map((c) => curveObstacle(c, x.map, y.map)), [], bandEdgeObstacles(band, x.map, FRAME.height));
    return {
      x,
      y,
      band,
      datasets: {
        curves,
        points: resonancesByImportance(input).map((r) => ({ f: r.frequencyHz, v: 1 / r.impedanceOhm })),
        labels: shown(placed.labels),
      },
      key: [
        { kind: 'line', style: { s: 'g' }, text: KEY_TEXT.conductance },
        { kind: 'line', style: { s: 'bc' }, text: KEY_TEXT.susceptanceCapacitive },
        { kind: 'line', style: { s: 'bl' }, text: KEY_TEXT.susceptanceInductive },
        ...(band.key ? [band.key] : []),
      ],
    };
  },
});
