// Chart: |Z| and R against frequency on log-log axes, resonances marked and labelled, usable band shaded.

import { AXIS_TITLE, KEY_TEXT, partSpreadKeyText, ratedKeyText, resistanceKeyText } from '../present/chart-words.js';
import { MAX_DECADES, logValueAxis, sweepAxis } from './axes.js';
import { curveObstacle, curveRows, envelopeRows, mergeCurve, toPlot } from './curves.js';
import { halfFrame } from './frame.js';
import { ABOVE_FIRST, BELOW_FIRST } from './labels.js';
import { placeMarkLabels, shown } from './mark-labels.js';
import { PART_SERIES, RATED_MARK, RESONANCE_MARK } from './palette.js';
import { bandData, bandEdgeObstacles, resonanceLabels, type PartChartInput } from './part-marks.js';
import { positiveExtent } from './scales.js';
import { curveLayer, envelopeLayer, placedLabelLayer, pointLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

const SERIES: SeriesScale = { keys: ['mag', 'res'], styles: [PART_SERIES.magnitude, PART_SERIES.resistance] };
const FRAME = halfFrame(160);
/** Half a decade of headroom beside a resonance, for its label. */
const LABEL_ROOM = 10 ** 0.5;
/** At least this much room (px) between a dip or peak and the plot's edge: a label's height and its gap. */
const LABEL_ROOM_PX = 20;

export const impedanceChart = xyChart<PartChartInput>({
  name: 'impedance',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.impedanceAndResistance },
  keyStyle: seriesEncoding(SERIES),
  band: true,
  marks: (X, Y) => [
    envelopeLayer('spread', X, Y),
    curveLayer('curves', X, Y, seriesEncoding(SERIES)),
    pointLayer('points', X, Y),
    // The rated point, larger than a resonance dot: on a bead it often sits close to the SRF.
    { ...pointLayer('rated', X, Y, RATED_MARK, 'diamond'), mark: { type: 'point', shape: 'diamond', size: 90, filled: true, color: RATED_MARK, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true } },
    placedLabelLayer('labels', X, Y),
  ],
  draw(input) {
    const x = sweepAxis(input.frequencies, FRAME.width);
    const { magnitudeOhm, resistanceOhm: re } = input.columns;
    const magnitude = (i: number) => magnitudeOhm[i];
    const rated = ratedPoint(input);
    const spread = input.spread ? [input.spread.min, input.spread.max] : [];
    let [lo, hi] = positiveExtent([input.resonances.map((r) => r.impedanceOhm), magnitudeOhm, re, rated ? [rated.v] : [], ...spread], MAX_DECADES);
    // Room for resonance labels: below a dip, above a peak; half a decade, or more where the axis spans so
    // many decades that half a decade is less than a label's height.
    const dips = input.resonances.filter((r) => r.type === 'series').map((r) => r.impedanceOhm);
    const peaks = input.resonances.filter((r) => r.type === 'parallel').map((r) => r.impedanceOhm);
    if (dips.length) lo /= LABEL_ROOM;
    if (peaks.length) hi *= LABEL_ROOM;
    let y = logValueAxis(lo, hi, FRAME.height, 'Ω');
    for (let round = 0; round < 3; round++) {
      const pxPerDecade = FRAME.height / Math.log10(y.domain[1] / y.domain[0]);
      const room = 10 ** (LABEL_ROOM_PX / pxPerDecade);
      const lowDip = Math.min(...dips);
      const highPeak = Math.max(...peaks);
      const short = (dips.length > 0 && lowDip / y.domain[0] < room) || (peaks.length > 0 && y.domain[1] / highPeak < room);
      if (!short) break;
      if (dips.length) lo = Math.min(lo, lowDip / room);
      if (peaks.length) hi = Math.max(hi, highPeak * room);
      y = logValueAxis(lo, hi, FRAME.height, 'Ω');
    }

    // At a resonance X = 0, so |Z| = R = the resonance's impedance: both curves pass through it exactly.
    const exact = input.resonances.map((r) => ({ f: r.frequencyHz, v: r.impedanceOhm }));
    // |Z| also passes through each resonance's refined extremum (a lossy peak sits off its X = 0 point).
    const extrema = input.resonances.filter((r) => !r.extremum.atSweepEnd && r.extremum.frequencyHz !== r.frequencyHz).map((r) => ({ f: r.extremum.frequencyHz, v: r.extremum.impedanceOhm }));
    const mag = mergeCurve(input.frequencies, magnitude, [...exact, ...extrema], true);
    const res = mergeCurve(input.frequencies, (i) => re[i], exact, true);

    // A series resonance is a dip: its label goes below; a parallel one is a peak: above.
    const requests = resonanceLabels(
      input,
      (r) => ({ at: { f: r.frequencyHz, v: r.impedanceOhm }, ...toPlot(x.map, y.map, r.frequencyHz, r.impedanceOhm) }),
      (r) => (r.type === 'series' ? BELOW_FIRST : ABOVE_FIRST),
    );
    const band = bandData(input);
    const placed = placeMarkLabels(requests, FRAME, [mag, res].map((c) => curveObstacle(c, x.map, y.map)), [], bandEdgeObstacles(band, x.map, FRAME.height));
    return {
      x,
      y,
      band,
      datasets: {
        curves: [...curveRows(mag, x.map, y.map, 'mag'), ...curveRows(res, x.map, y.map, 'res')],
        points: input.resonances.map((r) => ({ f: r.frequencyHz, v: r.impedanceOhm })),
        rated: rated ? [rated] : [],
        spread: input.spread ? envelopeRows(input.spread.frequencies, input.spread.min, input.spread.max, x.map, y.map) : [],
        labels: shown(placed.labels),
      },
      key: [
        { kind: 'line', style: { s: 'mag' }, text: KEY_TEXT.magnitude },
        { kind: 'line', style: { s: 'res' }, text: resistanceKeyText(input.part.behavesAs) },
        ...(input.resonances.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: KEY_TEXT.resonance }] : []),
        ...(rated ? [{ kind: 'point' as const, color: RATED_MARK, shape: 'diamond', text: ratedKeyText(rated.v, rated.f) }] : []),
        ...(band.key ? [band.key] : []),
        ...(input.spread ? [{ kind: 'spread' as const, text: partSpreadKeyText() }] : []),
      ],
    };
  },
});

/** A bead's rated impedance at its rated frequency, when that lies in the sweep: where the model should pass. */
function ratedPoint(input: PartChartInput): { f: number; v: number } | undefined {
  const { nominal, ratedAtHz, behavesAs } = input.part;
  const f = input.frequencies;
  if (behavesAs !== 'bead' || nominal === undefined || ratedAtHz === undefined) return undefined;
  if (!(ratedAtHz >= f[0] && ratedAtHz <= f[f.length - 1])) return undefined;
  return { f: ratedAtHz, v: nominal };
}
