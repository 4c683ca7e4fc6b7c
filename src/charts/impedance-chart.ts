// Chart: |Z| and R against frequency on log-log axes, resonances marked and labelled, usable band shaded.

import { isSelfResonance } from '../analysis/resonance.js';
import { resonanceLabel } from '../present/resonance-words.js';
import { frameForKey, layoutKey } from './key.js';
import { ABOVE_FIRST, BELOW_FIRST, placeLabels, type LabelRequest } from './labels.js';
import { FONT_SIZE, PART_SERIES, PLOT_WIDTH, RATED_MARK, RESONANCE_MARK, frame } from './palette.js';
import {
  bandData,
  envelopeRows,
  curveRows,
  sweepAxis,
  mergeCurve,
  resonancesByImportance,
  toPlot,
  Y_TICK_SPACING,
  type PartChartInput,
} from './part-data.js';
import type { ChartBinding, ChartDefinition, Row } from './render.js';
import { logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import { axisBinding, axisParams, bandLayers, curveLayer, envelopeLayer, frameLayer, gridLayers, keyLayers, placedLabelLayer, seriesEncoding, pointLayer, position, type SeriesScale } from './spec-parts.js';
import { CHART_CONFIG } from './theme.js';
import { formatEng } from '../units/format.js';

const SERIES: SeriesScale = { keys: ['mag', 'res'], styles: [PART_SERIES.magnitude, PART_SERIES.resistance] };
const FRAME = frame(PLOT_WIDTH, 250, 28, 42);
/** At most this many decades of Ω; lower values leave the plot at the bottom. */
const MAX_DECADES = 12;
/** Half a decade of headroom beside a resonance, for its label. */
const LABEL_ROOM = 10 ** 0.5;

const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'log', 'Impedance |Z|, resistance R');

export const impedanceChart: ChartDefinition<PartChartInput> = {
  name: 'impedance',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        ...bandLayers(X),
        envelopeLayer('spread', X, Y),
        curveLayer('curves', X, Y, seriesEncoding(SERIES)),
        pointLayer('points', X, Y),
        // The rated point, larger than a resonance dot: on a bead it often sits close to the SRF.
        { ...pointLayer('rated', X, Y, RATED_MARK, 'diamond'), mark: { type: 'point', shape: 'diamond', size: 90, filled: true, color: RATED_MARK, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true } },
        placedLabelLayer('labels', X, Y),
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(input) {
    const fa = sweepAxis(input.frequencies, FRAME.width);
    const { re, im } = input.z;
    const magnitude = (i: number) => Math.hypot(re[i], im[i]);
    const rated = ratedPoint(input);
    const spread = input.spread ? [input.spread.min, input.spread.max] : [];
    let [lo, hi] = positiveExtent([input.resonances.map((r) => r.impedanceOhm), Float64Array.from(input.frequencies, (_, i) => magnitude(i)), re, rated ? [rated.v] : [], ...spread], MAX_DECADES);
    // Room for resonance labels: below a dip, above a peak.
    if (input.resonances.some((r) => r.type === 'series')) lo /= LABEL_ROOM;
    if (input.resonances.some((r) => r.type === 'parallel')) hi *= LABEL_ROOM;
    const yDomain = paddedLogDomain(lo, hi);
    const yMap = logAxis(yDomain, FRAME.height);
    const ya = axisBinding('y', yDomain, logTicks(yDomain, FRAME.height, 'Ω', Y_TICK_SPACING));

    // At a resonance X = 0, so |Z| = R = the resonance's impedance: both curves pass through it exactly.
    const exact = input.resonances.map((r) => ({ f: r.frequencyHz, v: r.impedanceOhm }));
    // |Z| also passes through each resonance's refined extremum (a lossy peak sits off its X = 0 point).
    const extrema = input.resonances.filter((r) => !r.extremum.atSweepEnd && r.extremum.frequencyHz !== r.frequencyHz).map((r) => ({ f: r.extremum.frequencyHz, v: r.extremum.impedanceOhm }));
    const mag = mergeCurve(input.frequencies, magnitude, [...exact, ...extrema], true);
    const res = mergeCurve(input.frequencies, (i) => re[i], exact, true);
    const curves = [...curveRows(mag, fa.map, yMap, 'mag'), ...curveRows(res, fa.map, yMap, 'res')];

    const ordered = resonancesByImportance(input);
    const requests: LabelRequest[] = ordered.map((r) => ({
      ...toPlot(fa.map, yMap, r.frequencyHz, r.impedanceOhm),
      text: resonanceLabel(r, input.selfResonance),
      fontSize: FONT_SIZE.note,
      required: isSelfResonance(r, input.selfResonance),
      // A series resonance is a dip: its label goes below; a parallel one is a peak: above.
      candidates: r.type === 'series' ? BELOW_FIRST : ABOVE_FIRST,
    }));
    const obstacles = [mag, res].map((c) => ({
      xs: c.f.map((f) => fa.map.toPx(f)),
      ys: c.v.map((v) => (Number.isFinite(v) ? FRAME.height - yMap.toPx(v) : NaN)),
    }));
    const placements = placeLabels(requests, FRAME, obstacles);
    const labels: Row[] = [];
    ordered.forEach((r, k) => {
      const p = placements[k];
      if (p) labels.push({ f: r.frequencyHz, v: r.impedanceOhm, t: requests[k].text, dx: p.dx, dy: p.dy, al: p.align, bl: p.baseline });
    });

    const band = bandData(input);
    const key = layoutKey(
      [
        { kind: 'line', style: { s: 'mag' }, text: '|Z|' },
        { kind: 'line', style: { s: 'res' }, text: input.part.behavesAs === 'capacitor' ? 'R (ESR)' : 'R' },
        ...(ordered.length > 0 ? [{ kind: 'point' as const, color: RESONANCE_MARK, text: 'resonance (X = 0)' }] : []),
        ...(rated ? [{ kind: 'point' as const, color: RATED_MARK, shape: 'diamond', text: `rated |Z| ${formatEng(rated.v, 'Ω')} at ${formatEng(rated.f, 'Hz')}` }] : []),
        ...(band.key ? [band.key] : []),
        ...(input.spread ? [{ kind: 'spread' as const, text: `|Z| over ${input.spread.corners} corners of the spread` }] : []),
      ],
      FRAME.width,
    );
    const binding: ChartBinding = {
      frame: frameForKey(FRAME, key),
      params: { ...fa.params, ...ya.params },
      datasets: {
        ...fa.datasets,
        ...ya.datasets,
        band: band.band,
        bandEdges: band.bandEdges,
        curves,
        points: input.resonances.map((r) => ({ f: r.frequencyHz, v: r.impedanceOhm })),
        rated: rated ? [rated] : [],
        spread: input.spread ? envelopeRows(input.spread.frequencies, input.spread.min, input.spread.max) : [],
        labels,
        ...key.datasets,
      },
    };
    return binding;
  },
};

/** A bead's rated impedance at its rated frequency, when that lies in the sweep: where the model should pass. */
function ratedPoint(input: PartChartInput): { f: number; v: number } | undefined {
  const { nominal, ratedAtHz, behavesAs } = input.part;
  const f = input.frequencies;
  if (behavesAs !== 'bead' || nominal === undefined || ratedAtHz === undefined) return undefined;
  if (!(ratedAtHz >= f[0] && ratedAtHz <= f[f.length - 1])) return undefined;
  return { f: ratedAtHz, v: nominal };
}
