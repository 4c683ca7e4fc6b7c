// Chart: admittance Y = 1/Z = G + jB against frequency on log-log axes. B changes sign at every resonance, so
// it is drawn as |B| with its sign shown by line style: solid where B > 0 (capacitive), dashed where B < 0
// (inductive); the line breaks where B passes through zero. G = R/(R² + X²) and B = −X/(R² + X²) (any
// circuit text, e.g. Alexander & Sadiku, ch. 9).

import { isSelfResonance } from '../analysis/resonance.js';
import { resonanceLabel } from '../present/resonance-words.js';
import { frameForKey, layoutKey } from './key.js';
import { ABOVE_FIRST, BELOW_FIRST, placeLabels, type LabelRequest } from './labels.js';
import { FONT_SIZE, PART_SERIES, PLOT_WIDTH, RESONANCE_MARK, frame } from './palette.js';
import {
  bandData,
  curveRows,
  mergeCurve,
  resonancesByImportance,
  sweepAxis,
  toPlot,
  Y_TICK_SPACING,
  type Curve,
  type PartChartInput,
} from './part-data.js';
import type { ChartDefinition, Row } from './render.js';
import { logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import {
  axisBinding,
  axisParams,
  bandLayers,
  curveLayer,
  frameLayer,
  gridLayers,
  keyLayers,
  seriesEncoding,
  placedLabelLayer,
  pointLayer,
  position,
  type SeriesScale,
} from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';

const SERIES: SeriesScale = {
  keys: ['g', 'bc', 'bl'],
  styles: [PART_SERIES.conductance, PART_SERIES.susceptanceCapacitive, PART_SERIES.susceptanceInductive],
};
const FRAME = frame(PLOT_WIDTH, 250, 28, 42);
const MAX_DECADES = 12;
const LABEL_ROOM = 10 ** 0.5;

const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'log', 'Conductance G, susceptance |B|');

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

export const admittanceChart: ChartDefinition<PartChartInput> = {
  name: 'admittance',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        ...bandLayers(X),
        curveLayer('curves', X, Y, seriesEncoding(SERIES), 'g'),
        pointLayer('points', X, Y),
        placedLabelLayer('labels', X, Y),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(input) {
    const fa = sweepAxis(input.frequencies, FRAME.width);
    const { re, im } = input.z;
    const g = (i: number) => re[i] / (re[i] * re[i] + im[i] * im[i]);
    const b = (i: number) => -im[i] / (re[i] * re[i] + im[i] * im[i]);
    // At a resonance X = 0: G = 1/R exactly and B = 0 (the |B| line breaks there).
    const gCurve = mergeCurve(input.frequencies, g, input.resonances.map((r) => ({ f: r.frequencyHz, v: 1 / r.impedanceOhm })), true);
    const bCurve = mergeCurve(input.frequencies, b, input.resonances.map((r) => ({ f: r.frequencyHz, v: 0 })), false);
    const runs = signRuns(bCurve);

    let [lo, hi] = positiveExtent([gCurve.v, ...runs.map((r) => r.curve.v)], MAX_DECADES);
    // Room for resonance labels: G = 1/R peaks at a series resonance (label above), dips at a parallel one.
    if (input.resonances.some((r) => r.type === 'series')) hi *= LABEL_ROOM;
    if (input.resonances.some((r) => r.type === 'parallel')) lo /= LABEL_ROOM;
    const yDomain = paddedLogDomain(lo, hi);
    const yMap = logAxis(yDomain, FRAME.height);
    const ya = axisBinding('y', yDomain, logTicks(yDomain, FRAME.height, 'S', Y_TICK_SPACING));

    const curves: Row[] = [...curveRows(gCurve, fa.map, yMap, 'g', { g: 0 })];
    runs.forEach((r, k) => curves.push(...curveRows(r.curve, fa.map, yMap, r.sign > 0 ? 'bc' : 'bl', { g: k + 1 })));

    const ordered = resonancesByImportance(input);
    const requests: LabelRequest[] = ordered.map((r) => ({
      ...toPlot(fa.map, yMap, r.frequencyHz, 1 / r.impedanceOhm),
      text: resonanceLabel(r, input.selfResonance),
      fontSize: FONT_SIZE.note,
      required: isSelfResonance(r, input.selfResonance),
      candidates: r.type === 'series' ? ABOVE_FIRST : BELOW_FIRST,
    }));
    const obstacles = [gCurve, ...runs.map((r) => r.curve)].map((c) => ({
      xs: c.f.map((f) => fa.map.toPx(f)),
      ys: c.v.map((v) => (Number.isFinite(v) ? FRAME.height - yMap.toPx(v) : NaN)),
    }));
    const placements = placeLabels(requests, FRAME, obstacles);
    const labels: Row[] = [];
    ordered.forEach((r, k) => {
      const p = placements[k];
      if (p) labels.push({ f: r.frequencyHz, v: 1 / r.impedanceOhm, t: requests[k].text, dx: p.dx, dy: p.dy, al: p.align, bl: p.baseline });
    });

    const band = bandData(input);
    const key = layoutKey(
      [
        { kind: 'line', style: { s: 'g' }, text: 'G' },
        { kind: 'line', style: { s: 'bc' }, text: '|B|, B > 0 capacitive' },
        { kind: 'line', style: { s: 'bl' }, text: '|B|, B < 0 inductive' },
        ...(band.key ? [band.key] : []),
      ],
      FRAME.width,
    );
    return {
      frame: frameForKey(FRAME, key),
      params: { ...fa.params, ...ya.params },
      datasets: {
        ...fa.datasets,
        ...ya.datasets,
        band: band.band,
        bandEdges: band.bandEdges,
        curves,
        points: ordered.map((r) => ({ f: r.frequencyHz, v: 1 / r.impedanceOhm })),
        labels,
        ...key.datasets,
      },
    };
  },
};
