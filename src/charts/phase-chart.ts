// Chart: the phase of Z against frequency (log f, −90° … +90°), with the zero line, resonances (where the
// phase crosses 0°) marked, and the usable band shaded.

import { AXIS_TITLE, KEY_TEXT, SIGN_NOTE, degreesLabel } from '../present/chart-words.js';
import { sweepAxis } from './axes.js';
import { curveObstacle, curveRows, mergeCurve, toPlot } from './curves.js';
import { halfFrame } from './frame.js';
import type { Placement } from './labels.js';
import { placeMarkLabels, shown } from './mark-labels.js';
import { FONT_SIZE, INK_SOFT, PART_SERIES, RESONANCE_MARK, ZERO_LINE } from './palette.js';
import { bandData, bandEdgeObstacles, resonanceLabels, resonancesByImportance, type PartChartInput } from './part-marks.js';
import { linearAxis, linearTicks } from './scales.js';
import { curveLayer, pixelTextLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

const SERIES: SeriesScale = { keys: ['phase'], styles: [PART_SERIES.phase] };
const FRAME = halfFrame(120);
/** ±90° plus a margin, so a curve at ±90° is not hidden under the plot's outline. */
const DOMAIN: [number, number] = [-99, 99];

export const phaseChart = xyChart<PartChartInput>({
  name: 'phase',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'linear', title: AXIS_TITLE.phase },
  keyStyle: seriesEncoding(SERIES),
  band: true,
  zeroLine: { color: ZERO_LINE, width: 1 },
  marks: (X, Y) => [
    curveLayer('curves', X, Y, seriesEncoding(SERIES)),
    pointLayer('points', X, Y),
    placedLabelLayer('labels', X, Y),
    pixelTextLayer('notes', INK_SOFT, FONT_SIZE.note, { fontStyle: 'italic' }),
  ],
  draw(input) {
    const x = sweepAxis(input.frequencies, FRAME.width);
    const yMap = linearAxis(DOMAIN, FRAME.height);
    // At a resonance X = 0 and R > 0, so the phase is exactly 0°.
    const exact = input.resonances.map((r) => ({ f: r.frequencyHz, v: 0 }));
    const curve = mergeCurve(input.frequencies, (i) => input.columns.phaseDeg[i], exact, false);
    const requests = resonanceLabels(input, (r) => ({ at: { f: r.frequencyHz, v: 0 }, ...toPlot(x.map, yMap, r.frequencyHz, 0) }), () => BESIDE_CROSSING);
    // Which sign means what, written beside the zero line where the curve and the labels leave room; where
    // they leave none for one of them (a bead's curve fills the upper half), both go in the key instead.
    const notes = [
      { x: 0, y: FRAME.height / 2, text: SIGN_NOTE.phaseInductive, candidates: NOTE_ABOVE },
      { x: 0, y: FRAME.height / 2, text: SIGN_NOTE.phaseCapacitive, candidates: NOTE_BELOW },
    ];
    const band = bandData(input);
    const placed = placeMarkLabels(requests, FRAME, [curveObstacle(curve, x.map, yMap)], notes, bandEdgeObstacles(band, x.map, FRAME.height));
    const ordered = resonancesByImportance(input);
    const onPlot = placed.notes.length === notes.length;
    return {
      x,
      y: { domain: DOMAIN, ticks: { ...linearTicks([-90, 90], 30, degreesLabel), minor: [-75, -45, -15, 15, 45, 75] } },
      band,
      datasets: {
        curves: curveRows(curve, x.map, yMap, 'phase'),
        points: ordered.map((r) => ({ f: r.frequencyHz, v: 0 })),
        labels: shown(placed.labels),
        notes: onPlot ? placed.notes : [],
      },
      key: [
        { kind: 'line', style: { s: 'phase' }, text: onPlot ? KEY_TEXT.phase : `${KEY_TEXT.phase}; ${KEY_TEXT.phaseSides}` },
        ...(ordered.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: KEY_TEXT.phaseResonance }] : []),
        ...(band.key ? [band.key] : []),
      ],
    };
  },
});

const BESIDE_CROSSING: Placement[] = [
  { dx: 6, dy: -4, align: 'left', baseline: 'bottom' },
  { dx: -6, dy: 4, align: 'right', baseline: 'top' },
  { dx: 6, dy: 4, align: 'left', baseline: 'top' },
  { dx: -6, dy: -4, align: 'right', baseline: 'bottom' },
];

/**
 * Where a sign note may go: beside the zero line at the left, the right or the middle, then a line further
 * from it at each, then two: on its own side of the line, wherever the curve and the resonance labels leave
 * room (with a label at the SRF and a dip above it, a network's "capacitive" found none beside the line).
 */
const noteSpots = (side: 1 | -1): Placement[] =>
  [4, 20, 36].flatMap((gap) => [
    { dx: 6, dy: side * gap, align: 'left' as const, baseline: side < 0 ? ('bottom' as const) : ('top' as const) },
    { dx: FRAME.width - 6, dy: side * gap, align: 'right' as const, baseline: side < 0 ? ('bottom' as const) : ('top' as const) },
    { dx: FRAME.width / 2, dy: side * gap, align: 'center' as const, baseline: side < 0 ? ('bottom' as const) : ('top' as const) },
  ]);

const NOTE_ABOVE = noteSpots(-1);
const NOTE_BELOW = noteSpots(1);
