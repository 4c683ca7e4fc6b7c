// Chart: the phase of Z against frequency (log f, −90° … +90°), with the zero line, resonances (where the
// phase crosses 0°) marked, and the usable band shaded.

import { isSelfResonance } from '../analysis/resonance.js';
import { resonanceLabel } from '../present/resonance-words.js';
import { frameForKey, layoutKey } from './key.js';
import { placeLabels, type LabelRequest, type Placement } from './labels.js';
import { FONT_SIZE, INK_SOFT, PART_SERIES, PLOT_WIDTH, RESONANCE_MARK, ZERO_LINE, frame } from './palette.js';
import {
  bandData,
  curveRows,
  mergeCurve,
  resonancesByImportance,
  sweepAxis,
  toPlot,
  type PartChartInput,
} from './part-data.js';
import type { ChartDefinition, Row } from './render.js';
import { linearAxis, linearTicks } from './scales.js';
import {
  axisBinding,
  axisParams,
  bandLayers,
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

const SERIES: SeriesScale = { keys: ['phase'], styles: [PART_SERIES.phase] };
const FRAME = frame(PLOT_WIDTH, 220, 28, 42);
/** ±90° plus a margin, so a curve at ±90° is not hidden under the plot's outline. */
const DOMAIN: [number, number] = [-99, 99];
const DEG_PER_RAD = 180 / Math.PI;

const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'linear', 'Phase of Z');

/** Degrees with a true minus sign: "−90°", "0°", "90°". */
export function degreesLabel(v: number): string {
  return `${v < 0 ? '−' : ''}${Math.abs(v)}°`;
}

export const phaseChart: ChartDefinition<PartChartInput> = {
  name: 'phase',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        ...bandLayers(X),
        referenceLineLayer('zero', Y, { color: ZERO_LINE, width: 1 }),
        curveLayer('curves', X, Y, seriesEncoding(SERIES)),
        pointLayer('points', X, Y),
        placedLabelLayer('labels', X, Y),
        pixelTextLayer('notes', INK_SOFT, FONT_SIZE.note, { fontStyle: 'italic' }),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(input) {
    const fa = sweepAxis(input.frequencies, FRAME.width);
    const yMap = linearAxis(DOMAIN, FRAME.height);
    const ya = axisBinding('y', DOMAIN, { ...linearTicks([-90, 90], 30, degreesLabel), minor: [-75, -45, -15, 15, 45, 75] });
    const { re, im } = input.z;
    // At a resonance X = 0 and R > 0, so the phase is exactly 0°.
    const exact = input.resonances.map((r) => ({ f: r.frequencyHz, v: 0 }));
    const curve = mergeCurve(input.frequencies, (i) => Math.atan2(im[i], re[i]) * DEG_PER_RAD, exact, false);
    const curves = curveRows(curve, fa.map, yMap, 'phase');
    const obstacle = { xs: curve.f.map((f) => fa.map.toPx(f)), ys: curve.v.map((v) => FRAME.height - yMap.toPx(v)) };

    const ordered = resonancesByImportance(input);
    const requests: LabelRequest[] = ordered.map((r) => ({
      ...toPlot(fa.map, yMap, r.frequencyHz, 0),
      text: resonanceLabel(r, input.selfResonance),
      fontSize: FONT_SIZE.note,
      required: isSelfResonance(r, input.selfResonance),
      candidates: BESIDE_CROSSING,
    }));
    // Which sign means what, written beside the zero line at whichever end the curve leaves free.
    const noteRequests: LabelRequest[] = [
      { x: 0, y: FRAME.height / 2, text: '↑ inductive (X > 0)', fontSize: FONT_SIZE.note, candidates: NOTE_ABOVE },
      { x: 0, y: FRAME.height / 2, text: '↓ capacitive (X < 0)', fontSize: FONT_SIZE.note, candidates: NOTE_BELOW },
    ];
    const placements = placeLabels([...requests, ...noteRequests], FRAME, [obstacle]);
    const labels: Row[] = [];
    ordered.forEach((r, k) => {
      const p = placements[k];
      if (p) labels.push({ f: r.frequencyHz, v: 0, t: requests[k].text, dx: p.dx, dy: p.dy, al: p.align, bl: p.baseline });
    });
    const notes: Row[] = [];
    noteRequests.forEach((n, k) => {
      const p = placements[requests.length + k];
      if (p) notes.push({ x: n.x + p.dx, y: n.y + p.dy, t: n.text, al: p.align, bl: p.baseline });
    });

    const band = bandData(input);
    const key = layoutKey(
      [
        { kind: 'line', style: { s: 'phase' }, text: 'phase of Z = R + jX' },
        ...(ordered.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: 'resonance (0°)' }] : []),
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
        zero: [{ v: 0 }],
        curves,
        points: ordered.map((r) => ({ f: r.frequencyHz, v: 0 })),
        labels,
        notes,
        ...key.datasets,
      },
    };
  },
};

const BESIDE_CROSSING: Placement[] = [
  { dx: 6, dy: -4, align: 'left', baseline: 'bottom' },
  { dx: -6, dy: 4, align: 'right', baseline: 'top' },
  { dx: 6, dy: 4, align: 'left', baseline: 'top' },
  { dx: -6, dy: -4, align: 'right', baseline: 'bottom' },
];

const NOTE_ABOVE: Placement[] = [
  { dx: 6, dy: -4, align: 'left', baseline: 'bottom' },
  { dx: PLOT_WIDTH - 6, dy: -4, align: 'right', baseline: 'bottom' },
  { dx: PLOT_WIDTH / 2, dy: -4, align: 'center', baseline: 'bottom' },
];

const NOTE_BELOW: Placement[] = [
  { dx: 6, dy: 4, align: 'left', baseline: 'top' },
  { dx: PLOT_WIDTH - 6, dy: 4, align: 'right', baseline: 'top' },
  { dx: PLOT_WIDTH / 2, dy: 4, align: 'center', baseline: 'top' },
];
